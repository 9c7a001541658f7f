import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";

// CPU seconds spent by a process (and by the PostgreSQL cluster: the postmaster, its live backends and the children it
// has reaped), read from /proc. On a machine shared with other work, the CPU a request costs is the figure a change
// moves; requests per second also move with whatever else runs.
const TICKS_PER_SECOND = 100;

function statFields(pid: number): string[] | null {
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, "utf8");
    // The command name sits in parentheses and may hold spaces: fields are counted after its closing one.
    return stat.slice(stat.lastIndexOf(")") + 2).split(" ");
  } catch {
    return null;
  }
}

/** utime + stime (own) and cutime + cstime (reaped children), in seconds; fields 14 to 17 of /proc/PID/stat. */
function cpuOf(pid: number, withReaped: boolean): number {
  const f = statFields(pid);
  if (!f) return 0;
  const ticks = Number(f[11]) + Number(f[12]) + (withReaped ? Number(f[13]) + Number(f[14]) : 0);
  return ticks / TICKS_PER_SECOND;
}

export function processCpuSeconds(pid: number): number {
  return cpuOf(pid, false);
}

/** The postmaster's pid from the data folder, then the postmaster with every live child and the reaped ones. */
export function clusterCpuSeconds(dataDir: string): number {
  const postmaster = Number(readFileSync(path.join(dataDir, "postmaster.pid"), "utf8").split("\n")[0]);
  let total = cpuOf(postmaster, true);
  for (const entry of readdirSync("/proc")) {
    if (!/^\d+$/.test(entry)) continue;
    const f = statFields(Number(entry));
    if (f && Number(f[1]) === postmaster) total += cpuOf(Number(entry), false);
  }
  return total;
}
