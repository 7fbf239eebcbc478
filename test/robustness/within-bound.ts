/**
 * `work`, or a rejection naming `what` when it has not settled within `ms`. Work that blocks the event
 * loop keeps the timer from firing, so a result that comes back later than `ms` is refused as well.
 */
export const withinBound = async <T>(work: Promise<T>, ms: number, what: string): Promise<T> => {
  const started = performance.now();
  let timer: NodeJS.Timeout | undefined;
  const bound = new Promise<never>((_resolve, reject) => {
    timer = setTimeout(() => reject(new Error(`${what} did not finish within ${ms} ms`)), ms);
  });
  try {
    const result = await Promise.race([work, bound]);
    const took = performance.now() - started;
    if (took > ms) throw new Error(`${what} took ${Math.round(took)} ms, beyond its bound of ${ms} ms (the event loop was blocked)`);
    return result;
  } finally {
    clearTimeout(timer);
  }
};
