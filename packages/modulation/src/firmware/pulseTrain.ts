/**
 * Internal helpers (not exported by the package): one fundamental period of a two-state gate
 * signal as on-intervals in timer ticks over a cyclic domain [0, period).
 *
 * An interval is [start, end] with 0 ≤ start < period and start < end ≤ start + period; only
 * the last one may run past `period` (it wraps round). Intervals are sorted and disjoint.
 */
export type Interval = [number, number];

/** Ticks closer than this are one instant (compare values are whole or fractional counts). */
export const TICK_TOLERANCE = 1e-9;

/**
 * Normalises intervals given in any order (starts may lie outside [0, period)), merges touching
 * or overlapping ones, and joins a pulse that runs across the end of the period.
 */
export function mergeCyclic(intervals: readonly Interval[], period: number): Interval[] {
  const shifted: Interval[] = [];
  for (const [start, end] of intervals) {
    if (end - start <= TICK_TOLERANCE) continue;
    if (end - start >= period - TICK_TOLERANCE) return [[0, period]];
    const offset = period * Math.floor(start / period);
    shifted.push([start - offset, end - offset]);
  }
  const pieces = splitAtPeriod(shifted, period);
  const merged: Interval[] = [];
  for (const [start, end] of pieces) {
    const last = merged[merged.length - 1];
    if (last !== undefined && start <= last[1] + TICK_TOLERANCE) last[1] = Math.max(last[1], end);
    else merged.push([start, end]);
  }
  const first = merged[0];
  const last = merged[merged.length - 1];
  if (
    first !== undefined &&
    last !== undefined &&
    merged.length > 1 &&
    first[0] <= TICK_TOLERANCE &&
    last[1] >= period - TICK_TOLERANCE
  ) {
    last[1] = period + first[1];
    merged.shift();
  }
  const only = merged[0];
  if (merged.length === 1 && only !== undefined && only[1] - only[0] >= period - TICK_TOLERANCE)
    return [[0, period]];
  return merged;
}

/** True when the intervals cover the whole period (the signal never turns off). */
export function isAlwaysOn(on: readonly Interval[], period: number): boolean {
  const only = on[0];
  return on.length === 1 && only !== undefined && only[1] - only[0] >= period - TICK_TOLERANCE;
}

/** The off-intervals between the on-intervals, same form. */
export function complementCyclic(on: readonly Interval[], period: number): Interval[] {
  if (on.length === 0) return [[0, period]];
  if (isAlwaysOn(on, period)) return [];
  const off: Interval[] = [];
  for (let i = 0; i < on.length; i++) {
    const current = on[i] as Interval;
    const next = i + 1 < on.length ? (on[i + 1] as Interval)[0] : (on[0] as Interval)[0] + period;
    let start = current[1];
    let end = next;
    if (start >= period) {
      start -= period;
      end -= period;
    }
    if (end - start > TICK_TOLERANCE) off.push([start, end]);
  }
  return off.sort((a, b) => a[0] - b[0]);
}

/**
 * Each interval shortened by `delayStart` at its start and `advanceEnd` at its end; those left
 * with no width vanish (a pulse swallowed by the dead time).
 */
export function shrinkIntervals(
  intervals: readonly Interval[],
  delayStart: number,
  advanceEnd: number,
  period: number,
): Interval[] {
  if (isAlwaysOn(intervals, period)) return [[0, period]];
  const result: Interval[] = [];
  for (const [start, end] of intervals) {
    let s = start + delayStart;
    let e = end - advanceEnd;
    if (e - s <= TICK_TOLERANCE) continue;
    if (s >= period) {
      s -= period;
      e -= period;
    }
    result.push([s, e]);
  }
  return result.sort((a, b) => a[0] - b[0]);
}

/** Splits wrapping intervals at `period` so every piece lies in [0, period]; sorted. */
export function splitAtPeriod(intervals: readonly Interval[], period: number): Interval[] {
  const pieces: Interval[] = [];
  for (const [start, end] of intervals) {
    if (end > period + TICK_TOLERANCE) {
      pieces.push([start, period], [0, end - period]);
    } else {
      pieces.push([start, Math.min(end, period)]);
    }
  }
  return pieces.sort((a, b) => a[0] - b[0]);
}

/** Whether `t` lies inside one of the sorted, split `pieces` (binary search). */
export function insidePieces(pieces: readonly Interval[], t: number): boolean {
  let low = 0;
  let high = pieces.length - 1;
  let found = -1;
  while (low <= high) {
    const middle = (low + high) >> 1;
    if ((pieces[middle] as Interval)[0] <= t) {
      found = middle;
      low = middle + 1;
    } else {
      high = middle - 1;
    }
  }
  if (found < 0) return false;
  return t < (pieces[found] as Interval)[1];
}
