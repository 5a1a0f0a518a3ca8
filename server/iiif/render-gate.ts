import { AppError, HTTP } from '../errors/app-error';

/**
 * At most `maxRunning` renders at once, with at most `maxWaiting` queued behind them; past that a request is
 * refused with 429 instead of piling up work. sharp decodes whole regions of a master, so a burst of
 * distinct IIIF requests would otherwise take every core from the rest of the app.
 */
export class RenderGate {
  private running = 0;
  private readonly waiting: (() => void)[] = [];

  constructor(
    private readonly maxRunning: number,
    private readonly maxWaiting: number,
  ) {}

  async run<T>(render: () => Promise<T>): Promise<T> {
    if (this.running >= this.maxRunning) {
      if (this.waiting.length >= this.maxWaiting) {
        throw new AppError(HTTP.tooManyRequests, 'rate_limited', 'Too many images are being rendered; try again in a moment.');
      }
      await new Promise<void>((resolve) => this.waiting.push(resolve));
    } else {
      this.running += 1;
    }
    try {
      return await render();
    } finally {
      // A waiting render takes over this slot, so running stays counted without a gap.
      const next = this.waiting.shift();
      if (next) next();
      else this.running -= 1;
    }
  }
}
