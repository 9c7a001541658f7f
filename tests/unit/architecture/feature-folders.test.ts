import { readdirSync, statSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";

// A client feature is named after the server domain whose routes it calls, so that a reader who finds a
// screen's request finds its route, policy and service under the same name in server/.
const root = join(import.meta.dirname, "..", "..", "..");
const foldersOf = (dir: string) =>
  readdirSync(join(root, dir)).filter((name) => statSync(join(root, dir, name)).isDirectory());

describe("client feature folders", () => {
  it("each names a server domain", () => {
    const serverDomains = new Set(foldersOf("server"));
    const strays = foldersOf("src/features").filter((feature) => !serverDomains.has(feature));
    expect(strays).toEqual([]);
  });
});
