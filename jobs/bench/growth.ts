import { spawnSync } from "node:child_process";
import { readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import { benchSettings } from "./bench-settings.ts";

/** Scales the growth mode runs (`npm run bench -- --growth`); BENCH_GROWTH_SCALES="0.3,1" to run fewer. */
const SCALES = (process.env.BENCH_GROWTH_SCALES ?? "0.3,1,3").split(",").map(Number);

export type GrowthPoint = { scale: number; technicians: number; figures: Record<string, number> };

/**
 * Each scale in a child process of its own (the data set's sizes are fixed when its module loads): seeds that scale's
 * database when absent, then times the directory statements, routing, the queue and the lapse job (jobs/bench/
 * growth-point.ts). Prints how each figure grows: the exponent k of time ~ size^k, from the smallest to the largest
 * scale (1 = linear; per 10x data the time grows 10^k times).
 */
export async function runGrowth(say: (line: string) => void, dir: string): Promise<void> {
  const points: GrowthPoint[] = [];
  for (const scale of SCALES) {
    const file = path.join(dir, `growth-point-${scale}.json`);
    say(`Growth: scale ${scale}...`);
    const child = spawnSync(
      process.execPath,
      [
        "--import",
        "tsx",
        path.join(benchSettings.root, "jobs/bench/growth-point.ts"),
        "--scale",
        String(scale),
        file,
      ],
      { stdio: "inherit", cwd: benchSettings.root },
    );
    if (child.status !== 0) throw new Error(`growth point at scale ${scale} failed`);
    points.push(JSON.parse(readFileSync(file, "utf8")) as GrowthPoint);
  }
  const first = points[0]!;
  const last = points[points.length - 1]!;
  const names = Object.keys(first.figures);
  const lines = [
    `| figure (ms) | ${points.map((p) => `scale ${p.scale} (${p.technicians} technicians)`).join(" | ")} | exponent |`,
    `|---|${points.map(() => "---:").join("|")}|---:|`,
  ];
  for (const name of names) {
    const a = first.figures[name]!;
    const b = last.figures[name]!;
    const exponent = Math.log(b / a) / Math.log(last.technicians / first.technicians);
    lines.push(
      `| ${name} | ${points.map((p) => (p.figures[name] ?? NaN).toFixed(2)).join(" | ")} | ${exponent.toFixed(2)} |`,
    );
  }
  const table = lines.join("\n");
  writeFileSync(path.join(dir, "growth.md"), `${table}\n`);
  say(`\n${table}\n\nPlans at each size: ${dir}/plans-directory-x<scale>.txt`);
}
