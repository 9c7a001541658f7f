import { spawnSync } from "node:child_process";
import { existsSync, readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { gzipSync } from "node:zlib";

interface ManifestChunk {
  file: string;
  src?: string;
  isEntry?: boolean;
  imports?: string[];
  dynamicImports?: string[];
}

export interface ClientSize {
  signInRouteGzipKb: number;
  allJsGzipKb: number;
  signInFiles: string[];
}

/** Builds the client into the bench's own folder (with a manifest), unless a build is already there. */
export function buildClient(root: string, outDir: string, say: (l: string) => void): void {
  if (existsSync(path.join(outDir, ".vite", "manifest.json"))) return;
  say(`Building the client into ${outDir}...`);
  const built = spawnSync(
    path.join(root, "node_modules", ".bin", "vite"),
    ["build", "--manifest", "--outDir", outDir, "--emptyOutDir"],
    { cwd: root, encoding: "utf8" },
  );
  if (built.status !== 0) throw new Error(`vite build failed: ${built.stderr || built.stdout}`);
}

const gzipKb = (file: string) => gzipSync(readFileSync(file), { level: 9 }).length / 1024;

/**
 * The JS a first visit to /sign-in downloads: the entry chunk and its static imports, plus the lazily loaded route
 * modules on the way (the auth layout and the sign-in page) with their static imports. Sizes are gzip level 9.
 */
export function measureClientSize(outDir: string): ClientSize {
  const manifest = JSON.parse(readFileSync(path.join(outDir, ".vite", "manifest.json"), "utf8")) as Record<
    string,
    ManifestChunk
  >;
  const needed = new Set<string>();
  const visit = (key: string) => {
    const chunk = manifest[key];
    if (!chunk || needed.has(chunk.file)) return;
    needed.add(chunk.file);
    for (const i of chunk.imports ?? []) visit(i);
  };
  for (const [key, chunk] of Object.entries(manifest)) if (chunk.isEntry) visit(key);
  for (const route of ["src/app/routes/auth/auth-layout.tsx", "src/app/routes/auth/sign-in.tsx"]) {
    if (!manifest[route]) throw new Error(`${route} is not a chunk of the build`);
    visit(route);
  }
  const js = [...needed].filter((f) => f.endsWith(".js"));
  const assets = path.join(outDir, "assets");
  const all = readdirSync(assets).filter((f) => f.endsWith(".js"));
  const sum = (files: string[]) =>
    Math.round(files.reduce((n, f) => n + gzipKb(path.join(outDir, f)), 0) * 10) / 10;
  return {
    signInRouteGzipKb: sum(js),
    allJsGzipKb: sum(all.map((f) => path.join("assets", f))),
    signInFiles: js,
  };
}
