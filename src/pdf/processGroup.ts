import { readdirSync, readFileSync } from "node:fs";
import { setTimeout as sleep } from "node:timers/promises";

/**
 * Chromium is started as the leader of its own process group (puppeteer spawns it detached), and
 * its zygotes, renderers and utility processes stay in that group. Killing the group, rather than
 * the one process puppeteer knows, is what leaves no orphans behind when the browser is killed
 * mid-render or hangs. Linux only: read from /proc; elsewhere the group looks empty.
 */

/** Live (not zombie) processes whose process group id is `pgid`. */
export function liveGroupMembers(pgid: number): number[] {
  let names: string[];
  try {
    names = readdirSync("/proc");
  } catch {
    return [];
  }
  const members: number[] = [];
  for (const name of names) {
    if (!/^\d+$/.test(name)) continue;
    const stat = readStat(name);
    if (stat && stat.pgrp === pgid && stat.state !== "Z") members.push(Number(name));
  }
  return members;
}

/**
 * SIGKILL the whole group. Only while a member lives: the kernel cannot hand a group id to
 * anyone else while a process still belongs to it, so this never reaches a stranger's processes.
 */
export function killProcessGroup(pgid: number): void {
  if (liveGroupMembers(pgid).length === 0) return;
  try {
    process.kill(-pgid, "SIGKILL");
  } catch {
    // ESRCH: the last member left between the look and the kill.
  }
}

/** Resolves true once no live member remains, false if some are still there after `timeout_ms`. */
export async function waitForGroupExit(pgid: number, timeout_ms: number): Promise<boolean> {
  const deadline = Date.now() + timeout_ms;
  while (liveGroupMembers(pgid).length > 0) {
    if (Date.now() > deadline) return false;
    await sleep(20);
  }
  return true;
}

function readStat(pid: string): { state: string; pgrp: number } | null {
  try {
    const text = readFileSync(`/proc/${pid}/stat`, "utf8");
    // The command name sits in parentheses and may itself hold spaces or parentheses.
    const fields = text.slice(text.lastIndexOf(")") + 2).split(" ");
    return { state: fields[0], pgrp: Number(fields[2]) };
  } catch {
    return null;
  }
}
