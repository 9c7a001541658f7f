import { describe, expect, it } from "vitest";
import { formatFileSize } from "../../../src/lib/format-file-size.ts";

describe("file sizes as people read them", () => {
  it("counts small files in bytes, with the singular for one", () => {
    expect(formatFileSize(0)).toBe("0 bytes");
    expect(formatFileSize(1)).toBe("1 byte");
    expect(formatFileSize(812)).toBe("812 bytes");
  });

  it("uses binary kilobytes, one decimal below ten (common practice in file managers)", () => {
    expect(formatFileSize(1024)).toBe("1 KB");
    expect(formatFileSize(1536)).toBe("1.5 KB");
    expect(formatFileSize(14 * 1024 + 900)).toBe("14 KB");
  });

  it("never rounds a file just over the 10 MB limit down to look allowed, nor one under it up", () => {
    const limit = 10 * 1024 * 1024;

    expect(formatFileSize(limit - 1)).toBe("9.9 MB");
    expect(formatFileSize(limit)).toBe("10.0 MB");
    expect(formatFileSize(Math.round(2.35 * 1024 * 1024))).toBe("2.3 MB");
  });
});
