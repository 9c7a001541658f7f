import { AppError } from "../http/app-error.ts";

/**
 * At most `concurrent` bcrypt operations at once, and at most `queued` waiting behind them. A hash at cost 12 holds a
 * libuv thread for a quarter of a second; without a bound, a burst of anonymous requests fills the thread pool and a
 * real sign-in waits behind all of it. Beyond the queue the request is refused at once (503) instead of waiting.
 */
export class HashSlots {
  private running = 0;
  private readonly waiting: (() => void)[] = [];

  constructor(
    private concurrent: number,
    private queued: number,
  ) {}

  resize(concurrent: number, queued: number): void {
    this.concurrent = concurrent;
    this.queued = queued;
    while (this.running < this.concurrent && this.waiting.length) this.waiting.shift()!();
  }

  get stats() {
    return { running: this.running, waiting: this.waiting.length };
  }

  async run<T>(work: () => Promise<T>): Promise<T> {
    if (this.running >= this.concurrent) {
      if (this.waiting.length >= this.queued) {
        throw new AppError("unavailable", "The server is busy checking passwords; try again in a moment");
      }
      await new Promise<void>((resolve) => this.waiting.push(resolve));
    }
    this.running += 1;
    try {
      return await work();
    } finally {
      this.running -= 1;
      this.waiting.shift()?.();
    }
  }
}
