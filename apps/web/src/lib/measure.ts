/** Runs `task` and returns its result with the wall time it took, in milliseconds. */
export function timed<T>(task: () => T): { value: T; milliseconds: number } {
  const start = performance.now();
  const value = task();
  return { value, milliseconds: performance.now() - start };
}
