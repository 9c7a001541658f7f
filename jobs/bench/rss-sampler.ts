import { readFileSync } from "node:fs";

/** Resident set size of a process in MB, from /proc/<pid>/status (VmRSS is in kB). */
export function readRssMb(pid: number): number {
  const match = /VmRSS:\s+(\d+) kB/.exec(readFileSync(`/proc/${pid}/status`, "utf8"));
  return match ? Number(match[1]) / 1024 : Number.NaN;
}

/** Samples a process's RSS every `everyMs` until stopped; keeps the peak. */
export function sampleRss(pid: number, everyMs = 50) {
  let peak = readRssMb(pid);
  const timer = setInterval(() => {
    try {
      peak = Math.max(peak, readRssMb(pid));
    } catch {
      clearInterval(timer);
    }
  }, everyMs);
  return {
    peak: () => peak,
    stop: () => {
      clearInterval(timer);
      return peak;
    },
  };
}
