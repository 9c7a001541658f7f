import { spawn, type ChildProcess } from "node:child_process";
import { createServer } from "node:net";
import path from "node:path";
import { benchSettings } from "./bench-settings.ts";

export interface ChildServer {
  child: ChildProcess;
  url: string;
  pid: number;
  stop(): Promise<void>;
}

export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = createServer();
    s.once("error", reject);
    s.listen(0, "127.0.0.1", () => {
      const address = s.address();
      const port = typeof address === "object" && address ? address.port : 0;
      s.close(() => resolve(port));
    });
  });
}

/** Starts `node [nodeFlags] --import tsx <entry>` on a free port and waits until `healthPath` answers. */
export async function startChildServer(
  entry: string,
  env: Record<string, string>,
  healthPath: string,
  nodeFlags: string[] = [],
): Promise<ChildServer> {
  const port = await freePort();
  const args = [...nodeFlags, "--import", "tsx", path.resolve(benchSettings.root, entry)];
  const child = spawn(process.execPath, args, {
    cwd: benchSettings.root,
    env: { ...process.env, ...env, PORT: String(port), HOST: "127.0.0.1" },
    stdio: ["ignore", "ignore", "pipe"],
  });
  let stderr = "";
  child.stderr!.on("data", (c: Buffer) => {
    stderr = (stderr + c.toString()).slice(-4000);
  });
  const url = `http://127.0.0.1:${port}`;
  const deadline = Date.now() + 60_000;
  for (;;) {
    if (child.exitCode !== null) throw new Error(`${entry} exited with ${child.exitCode}: ${stderr}`);
    const ok = await fetch(url + healthPath).then(
      (r) => r.ok,
      () => false,
    );
    if (ok) break;
    if (Date.now() > deadline) throw new Error(`${entry} did not answer ${healthPath}: ${stderr}`);
    await new Promise((r) => setTimeout(r, 200));
  }
  const stop = () =>
    new Promise<void>((resolve) => {
      if (child.exitCode !== null || child.signalCode !== null) return resolve();
      child.once("exit", () => resolve());
      child.kill("SIGTERM");
    });
  return { child, url, pid: child.pid!, stop };
}
