import type { TimerChannel, TimerTable } from './timerTableTypes.js';

/**
 * Internal to compensateDeadTime: the counts to add to each entry of one channel for the edges
 * that fall on update events where the channel's compare sense changes (the reduced common-mode
 * methods `azspwm1`, `nspwm`; asymmetric sampling, one entry per half period of the up-down
 * counter). There the leg switches at the update itself, one pulse more than the per-period
 * model of {@link compensateDeadTime} counts, and the dead-time generator delays that turn-on
 * too. By the switching model of `timerTableWaveforms` (T. Murai et al., 1987, from memory): a
 * rising edge with the current out of the leg loses D ticks of high time (the lower diode holds
 * the leg low), so the pulse that starts there, in the entry after the update, gains D counts; a
 * falling edge with the current into the leg gains D ticks (the upper diode holds it high), so
 * the pulse that ends there, in the entry before, loses D counts. A clamped entry (0 or 100 %)
 * has no edge of its own to move and is left alone. All zeros for a table without sense changes.
 *
 * @param lag - lag of this channel's current behind sin θ, rad
 */
export function senseChangeCorrection(
  table: TimerTable,
  channel: Pick<TimerChannel, 'compare' | 'sense'>,
  lag: number,
): number[] {
  const { compare, sense } = channel;
  const full = table.fullScaleCounts;
  const length = compare.length;
  const extra = new Array<number>(length).fill(0);
  if (table.parameters.sampling !== 'regular-asymmetric' || table.updatesPerEntry !== 1)
    return extra;
  const dead = table.deadTimeCounts;
  // High at a counter extreme: 'below' is high at the valley unless 0 %, at the peak only at
  // 100 %; 'above' the other way round.
  const highAt = (i: number, atPeak: boolean): boolean => {
    const c = compare[i] as number;
    return (sense[i] === 'above') === atPeak ? c > 0 : c >= full;
  };
  const unclamped = (i: number): boolean =>
    (compare[i] as number) > 0 && (compare[i] as number) < full;
  for (let h = 0; h < length; h++) {
    const before = (h + length - 1) % length;
    if (sense[h] === sense[before]) continue;
    // Entry h starts at a counter peak when it counts down (even h), else at a valley.
    const atPeak = h % 2 === 0;
    const was = highAt(before, atPeak);
    const is = highAt(h, atPeak);
    if (was === is) continue;
    const current = Math.sin((h * 2 * Math.PI) / length - lag);
    if (is && current > 0 && unclamped(h)) extra[h] = (extra[h] as number) + dead;
    if (was && current < 0 && unclamped(before)) extra[before] = (extra[before] as number) - dead;
  }
  return extra;
}
