import { execFileSync, spawnSync } from "node:child_process";

export interface DebianTool {
  command: string;
  pkg: string;
}

const has = (command: string) => spawnSync("sh", ["-c", `command -v ${command}`]).status === 0;

/**
 * Installs Debian packages whose commands are missing (as root only). Returns the packages still
 * missing, so callers can explain what will not work rather than fail later.
 */
export function ensureDebianTools(
  tools: DebianTool[],
  say: (line: string) => void = () => undefined,
): string[] {
  const missing = tools.filter((t) => !has(t.command));
  if (missing.length === 0) return [];
  if (process.getuid?.() !== 0) return missing.map((t) => t.pkg);
  const pkgs = [...new Set(missing.map((t) => t.pkg))];
  say(`Installing Debian packages: ${pkgs.join(", ")} (one time)...`);
  try {
    execFileSync("apt-get", ["update", "-qq"], { stdio: "inherit" });
    execFileSync("apt-get", ["install", "-y", "-qq", ...pkgs], {
      stdio: "inherit",
      env: { ...process.env, DEBIAN_FRONTEND: "noninteractive" },
    });
  } catch {
    say(`Could not install ${pkgs.join(", ")}; continuing without them.`);
  }
  return tools.filter((t) => !has(t.command)).map((t) => t.pkg);
}

export const OCR_TOOLS: DebianTool[] = [
  { command: "tesseract", pkg: "tesseract-ocr" },
  { command: "pdftoppm", pkg: "poppler-utils" },
];
export const BROWSER_TOOLS: DebianTool[] = [{ command: "chromium", pkg: "chromium" }];
