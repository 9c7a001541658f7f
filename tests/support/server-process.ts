import { spawn, type ChildProcess } from "node:child_process";
import path from "node:path";

/** The real server as a separate process (`server/serve.ts`), for crash and multi-instance tests. */
export async function startServerProcess(
  env: Record<string, string>,
): Promise<{ child: ChildProcess; url: string; output: () => string }> {
  const child = spawn(process.execPath, ["--import", "tsx", path.resolve("server/serve.ts")], {
    env: { ...process.env, LOG_LEVEL: "info", ...env },
    stdio: ["ignore", "pipe", "pipe"],
  });
  let seen = "";
  const port = await new Promise<number>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`server did not start: ${seen.slice(-2000)}`)), 30_000);
    const onData = (chunk: Buffer) => {
      seen += chunk.toString();
      const match = /"port":(\d+),"msg":"server ready"/.exec(seen);
      if (match) {
        clearTimeout(timer);
        resolve(Number(match[1]));
      }
    };
    child.stdout!.on("data", onData);
    child.stderr!.on("data", onData);
    child.once("exit", (code) => reject(new Error(`server exited with ${code}: ${seen.slice(-2000)}`)));
  });
  return { child, url: `http://127.0.0.1:${port}`, output: () => seen };
}

export function stopProcess(child: ChildProcess, signal: NodeJS.Signals = "SIGTERM"): Promise<void> {
  return new Promise((resolve) => {
    if (child.exitCode !== null) return resolve();
    child.once("exit", () => resolve());
    child.kill(signal);
  });
}
