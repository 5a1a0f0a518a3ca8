import { AppError } from '../errors/app-error';
import { RenderGate } from './render-gate';

/** A render that finishes when the test says so. */
function heldRender(): { promise: Promise<string>; finish: () => void; started: boolean } {
  const held = { started: false, finish: () => undefined as void, promise: undefined as unknown as Promise<string> };
  held.promise = new Promise<string>((resolve) => {
    held.finish = () => resolve('done');
  });
  return held;
}

describe('RenderGate', () => {
  it('when more renders arrive than may run, then the extra ones wait and run as slots free, and past the queue one is refused with 429', async () => {
    const gate = new RenderGate(1, 1);
    const first = heldRender();
    const second = heldRender();
    const running = gate.run(() => {
      first.started = true;
      return first.promise;
    });
    const waiting = gate.run(() => {
      second.started = true;
      return second.promise;
    });

    const refused = gate.run(async () => 'never').catch((error: unknown) => error);
    await Promise.resolve();
    const startedBeforeFinish = second.started;
    first.finish();
    await running;
    await new Promise((resolve) => setImmediate(resolve));
    const startedAfterFinish = second.started;
    second.finish();

    expect(first.started).toBe(true);
    expect(startedBeforeFinish).toBe(false);
    expect(startedAfterFinish).toBe(true);
    expect(await waiting).toBe('done');
    const error = (await refused) as AppError;
    expect(error).toBeInstanceOf(AppError);
    expect([error.status, error.code]).toEqual([429, 'rate_limited']);
  });

  it('when a render fails, then its slot is freed for the next one', async () => {
    const gate = new RenderGate(1, 0);

    const failed = await gate.run(async () => Promise.reject(new Error('bad pixels'))).catch((error: Error) => error.message);
    const next = await gate.run(async () => 'next');

    expect(failed).toBe('bad pixels');
    expect(next).toBe('next');
  });
});
