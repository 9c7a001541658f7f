import { describe, expect, it } from "vitest";
import {
  CHILD_MEMORY_BYTES,
  createJobQueue,
  renderDpi,
  runBounded,
} from "../../../server/credentials/extraction/render-bounds.ts";

describe("render resolution", () => {
  it("keeps the asked resolution for a letter page", () => {
    expect(renderDpi({ widthPt: 612, heightPt: 792 }, 110, 8_000_000)).toBe(110);
  });

  it("lowers it so a 200 in page stays within the pixel cap", () => {
    const dpi = renderDpi({ widthPt: 14_400, heightPt: 14_400 }, 110, 8_000_000);

    expect(dpi).toBe(14);
    expect((200 * dpi) ** 2).toBeLessThanOrEqual(8_000_000);
  });
});

describe("the shared queue", () => {
  it("runs at most its limit at once and refuses beyond its waiting line", async () => {
    const queue = createJobQueue(2, 3);
    let running = 0;
    let peak = 0;
    const job = () =>
      queue.run(async () => {
        running += 1;
        peak = Math.max(peak, running);
        await new Promise((r) => setTimeout(r, 20));
        running -= 1;
      });

    const results = await Promise.allSettled([job(), job(), job(), job(), job(), job()]);

    expect(peak).toBe(2);
    expect(results.filter((r) => r.status === "fulfilled")).toHaveLength(5);
    const refused = results.find((r) => r.status === "rejected") as PromiseRejectedResult;
    expect(refused.reason.code).toBe("unavailable");
    expect(queue.active).toBe(0);
  });
});

describe("the child's memory cap", () => {
  it("runs every child with its address space limited", async () => {
    const kib = await runBounded("/bin/sh", ["-c", "ulimit -v"], { timeoutMs: 5_000 });

    expect(Number(kib.trim())).toBe(CHILD_MEMORY_BYTES / 1024);
  });
});
