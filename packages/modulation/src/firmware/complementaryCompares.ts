/**
 * Internal: the high- and low-side compare values of one channel from its compare values
 * (counts) for the 'compare-offset' dead time of {@link timerTable}: high side
 * compare − floor(D/2), low side compare + (D − floor(D/2)), so both edges of every pulse get D
 * ticks with neither switch on; 0 and 100 % duty (no edge in that update) keep one switch on and
 * need no dead time. With D = 0 (or the dead-time-register method) both equal the compare value.
 */
export function complementaryCompares(
  compare: number[],
  full: number,
  deadTimeCounts: number,
): { highSide: number[]; lowSide: number[] } {
  const before = Math.floor(deadTimeCounts / 2);
  const after = deadTimeCounts - before;
  const highSide: number[] = [];
  const lowSide: number[] = [];
  for (const c of compare) {
    if (deadTimeCounts === 0 || c <= 0 || c >= full) {
      // No edge in this update (0 or 100 % duty): one switch stays on, no dead time needed.
      highSide.push(c);
      lowSide.push(c);
    } else {
      highSide.push(Math.max(0, c - before));
      lowSide.push(Math.min(full, c + after));
    }
  }
  return { highSide, lowSide };
}
