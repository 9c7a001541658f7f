import { describe, expect, it } from "vitest";
import { HashSlots } from "../../../server/accounts/hash-slots.ts";
import { AppError } from "../../../server/http/app-error.ts";

function deferred() {
  let resolve!: () => void;
  const promise = new Promise<void>((r) => (resolve = r));
  return { promise, resolve };
}

describe("password hashing slots", () => {
  it("runs at most the configured number at once, queues the next ones and refuses beyond the queue with 503", async () => {
    const slots = new HashSlots(2, 2);
    const gates = Array.from({ length: 4 }, deferred);
    let running = 0;
    let most = 0;
    const work = (i: number) => async () => {
      running += 1;
      most = Math.max(most, running);
      await gates[i]!.promise;
      running -= 1;
      return i;
    };

    const started = gates.map((_, i) => slots.run(work(i)));
    const refused = await slots.run(work(0)).catch((err: unknown) => err);
    const whileFull = slots.stats;
    gates.forEach((g) => g.resolve());
    const done = await Promise.all(started);

    expect(whileFull).toEqual({ running: 2, waiting: 2 });
    expect(refused).toBeInstanceOf(AppError);
    expect((refused as AppError).status).toBe(503);
    expect(most).toBe(2);
    expect(done).toEqual([0, 1, 2, 3]);
    expect(slots.stats).toEqual({ running: 0, waiting: 0 });
  });
});
