/**
 * The process table as `ps` sees it: an outside count of Chromium processes, independent of the
 * code under test (which reads /proc itself).
 */
import { execFileSync } from "node:child_process";

export interface Proc {
  pid: number;
  ppid: number;
  pgid: number;
  stat: string;
  comm: string;
}

export function processTable(): Proc[] {
  const out = execFileSync("ps", ["-eo", "pid=,ppid=,pgid=,stat=,comm="], { encoding: "utf8" });
  return out
    .split("\n")
    .map((line) => line.trim().split(/\s+/))
    .filter((f) => f.length >= 5)
    .map(([pid, ppid, pgid, stat, ...comm]) => ({
      pid: Number(pid),
      ppid: Number(ppid),
      pgid: Number(pgid),
      stat,
      comm: comm.join(" "),
    }));
}

const alive = (p: Proc) => !p.stat.startsWith("Z");
const isChromium = (p: Proc) => /^chrom/i.test(p.comm);

/** Live Chromium processes anywhere below `root` in the process tree. */
export function chromiumBelow(root: number = process.pid): Proc[] {
  const table = processTable();
  const below = new Set([root]);
  for (let grew = true; grew; ) {
    grew = false;
    for (const p of table) {
      if (below.has(p.ppid) && !below.has(p.pid)) {
        below.add(p.pid);
        grew = true;
      }
    }
  }
  return table.filter((p) => p.pid !== root && below.has(p.pid) && alive(p) && isChromium(p));
}

/** Live processes of process group `pgid`, wherever they were reparented. */
export function liveInGroup(pgid: number): Proc[] {
  return processTable().filter((p) => p.pgid === pgid && alive(p));
}

/** Poll until `check` returns true or `timeout_ms` passes; returns the last answer. */
export async function eventually(check: () => boolean, timeout_ms = 5_000): Promise<boolean> {
  const deadline = Date.now() + timeout_ms;
  while (!check()) {
    if (Date.now() > deadline) return false;
    await new Promise((r) => setTimeout(r, 50));
  }
  return true;
}

/** The command line of process `pid`, or "" when it is gone. */
export function commandLine(pid: number): string {
  try {
    return execFileSync("ps", ["-ww", "-o", "args=", "-p", String(pid)], { encoding: "utf8" }).trim();
  } catch {
    return "";
  }
}
