import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { renderVisibilityTable } from "../../../shared/visibility/visibility-table.ts";

const README = new URL("../../../README.md", import.meta.url);

describe("README's table of who sees what", () => {
  it("is exactly the table rendered from the shared visibility rule", () => {
    const text = readFileSync(README, "utf8");
    const match = /<!-- visibility-table:start -->\n([\s\S]*?)\n<!-- visibility-table:end -->/.exec(text);

    expect(match).not.toBeNull();
    expect(match![1]).toBe(renderVisibilityTable());
  });

  it("says a shop gets contact details only after the technician took its job", () => {
    const contact = renderVisibilityTable()
      .split("\n")
      .find((line) => line.startsWith("| Contact details"));

    expect(contact).toContain("| only a shop whose work order the technician accepted");
  });
});
