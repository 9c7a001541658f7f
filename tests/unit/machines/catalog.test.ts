import { describe, expect, it } from "vitest";
import { catalogKey, findCatalogEntry, matchKeysFor } from "../../../shared/machines/catalog.ts";

const entries = [
  { name: "Vantor Machine Works", aliases: ["Vantor", "VMW"] },
  { name: "Halden Axis Systems", aliases: ["Halden"] },
];

describe("catalog matching (common practice: case- and white-space-insensitive names)", () => {
  it("treats case and runs of white space as the same name", () => {
    expect(catalogKey("  Vantor \t Machine   WORKS ")).toBe("vantor machine works");
  });

  it("finds an entry by its name or by an alias", () => {
    expect(findCatalogEntry(entries, "vantor")?.name).toBe("Vantor Machine Works");
    expect(findCatalogEntry(entries, "HALDEN axis  systems")?.name).toBe("Halden Axis Systems");
    expect(findCatalogEntry(entries, "Vant")).toBeNull();
    expect(findCatalogEntry(entries, "   ")).toBeNull();
  });

  it("matches every spelling of a known entry and only the typed one otherwise", () => {
    expect(matchKeysFor(entries, "VMW").sort()).toEqual(["vantor", "vantor machine works", "vmw"]);
    expect(matchKeysFor(entries, " Brisca ")).toEqual(["brisca"]);
  });
});
