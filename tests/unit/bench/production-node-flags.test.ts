import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { PRODUCTION_NODE_FLAGS } from "../../../jobs/bench/bench-settings.ts";

// The bench measures the server as `npm run serve` starts it, so the heap limits must be the same in both places.
describe("production heap limits", () => {
  it("are the flags of the serve script, ahead of the server entry", () => {
    const pkg = JSON.parse(
      readFileSync(path.resolve(import.meta.dirname, "../../../package.json"), "utf8"),
    ) as {
      scripts: Record<string, string>;
    };
    expect(pkg.scripts.serve).toBe(`node ${PRODUCTION_NODE_FLAGS} --import tsx server/serve.ts`);
    expect(PRODUCTION_NODE_FLAGS).toMatch(/--max-old-space-size=\d+/);
  });
});
