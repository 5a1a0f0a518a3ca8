/**
 * Checks `read` every `intervalMs` until `isDone` holds for what it returned, and returns that. After
 * `timeoutMs` it throws with `describe` of the last value: a poll that runs out must fail its test, never
 * return as if the wait had ended well.
 */
export async function pollUntil<T>(
  read: () => Promise<T>,
  isDone: (value: T) => boolean,
  options: { timeoutMs: number; intervalMs: number; describe: (last: T) => string },
): Promise<T> {
  const deadline = Date.now() + options.timeoutMs;
  for (;;) {
    const value = await read();
    if (isDone(value)) return value;
    if (Date.now() > deadline) throw new Error(`${options.describe(value)} after ${options.timeoutMs} ms`);
    await new Promise((resolve) => setTimeout(resolve, options.intervalMs));
  }
}
