import type { CompareSense } from './timerTableTypes.js';

/**
 * Internal: the high- and low-side compare values of one channel, as the registers are loaded,
 * from its compare values (counts of high-side on-time per update) and senses, for the
 * 'compare-offset' dead time of {@link timerTable}.
 *
 * - `'below'` (high side on while the counter is below its value): high side
 *   compare − floor(D/2), low side (on at or above its value) compare + (D − floor(D/2)).
 * - `'above'` (high side on while the counter is above its value; the inverted carrier): the
 *   edge sits at v = full − compare; high side v + floor(D/2), low side (on below its value)
 *   v − (D − floor(D/2)).
 *
 * Either way both edges of every pulse get D ticks with neither switch on; 0 and 100 % duty (no
 * edge in that update) keep one switch on and need no dead time. With D = 0 (or the
 * dead-time-register method) both equal the edge's value. Entries without a sense are `'below'`.
 */
export function complementaryCompares(
  compare: readonly number[],
  full: number,
  deadTimeCounts: number,
  sense: readonly CompareSense[] = [],
): { highSide: number[]; lowSide: number[] } {
  const before = Math.floor(deadTimeCounts / 2);
  const after = deadTimeCounts - before;
  const highSide: number[] = [];
  const lowSide: number[] = [];
  compare.forEach((c, i) => {
    const above = sense[i] === 'above';
    const edge = above ? full - c : c;
    if (deadTimeCounts === 0 || c <= 0 || c >= full) {
      // No edge in this update (0 or 100 % duty): one switch stays on, no dead time needed.
      highSide.push(edge);
      lowSide.push(edge);
    } else if (above) {
      highSide.push(Math.min(full, edge + before));
      lowSide.push(Math.max(0, edge - after));
    } else {
      highSide.push(Math.max(0, edge - before));
      lowSide.push(Math.min(full, edge + after));
    }
  });
  return { highSide, lowSide };
}
