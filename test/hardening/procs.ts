/**
 * The server's processes as /proc shows them: its memory, and the Chromium processes under it
 * (by command line and parent chain; test/pdf/processes.ts has the process-group view).
 */
import { readdirSync, readFileSync } from "node:fs";

function read(path: string): string | undefined {
  try {
    return readFileSync(path, "utf8");
  } catch {
    return undefined;
  }
}

/** Resident memory of a process in bytes (VmRSS), or 0 when it is gone. */
export function residentBytes(pid: number): number {
  const m = /^VmRSS:\s+(\d+) kB/m.exec(read(`/proc/${pid}/status`) ?? "");
  return m ? Number(m[1]) * 1024 : 0;
}

interface Proc {
  pid: number;
  ppid: number;
  pgid: number;
  zombie: boolean;
  cmdline: string;
}

function table(): Proc[] {
  const out: Proc[] = [];
  for (const name of readdirSync("/proc")) {
    if (!/^\d+$/.test(name)) continue;
    const stat = read(`/proc/${name}/stat`);
    if (!stat) continue;
    // The command name sits in parentheses and may itself hold spaces or parentheses.
    const f = stat.slice(stat.lastIndexOf(")") + 2).split(" ");
    out.push({
      pid: Number(name),
      ppid: Number(f[1]),
      pgid: Number(f[2]),
      zombie: f[0] === "Z",
      cmdline: (read(`/proc/${name}/cmdline`) ?? "").replace(/\0/g, " "),
    });
  }
  return out;
}

const isChromium = (p: Proc) => !p.zombie && /chromium/i.test(p.cmdline);

/** Live Chromium processes whose parent chain leads to `root`. */
export function chromiumUnder(root: number): Proc[] {
  const all = table();
  const parent = new Map(all.map((p) => [p.pid, p.ppid]));
  const leadsToRoot = (pid: number) => {
    // Bounded by the table's size: a parent chain cannot be longer than the process count.
    for (let p = parent.get(pid), hops = 0; p !== undefined && hops < all.length; p = parent.get(p), hops++) if (p === root) return true;
    return false;
  };
  return all.filter((p) => isChromium(p) && leadsToRoot(p.pid));
}

/** The browser processes under `root`: the Chromium processes that lead their own process group. */
export function chromiumBrowsers(root: number): number[] {
  return chromiumUnder(root)
    .filter((p) => p.pgid === p.pid)
    .map((p) => p.pid);
}
