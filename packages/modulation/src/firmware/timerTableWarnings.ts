import { RATIO_TOLERANCE, type TimerTableInputs } from './timerTableInputs.js';
import type { TimerChannels } from './timerTableChannels.js';
import type { TimerTiming } from './timerTableTiming.js';
import type { TimerChannel, TimerWarning } from './timerTableTypes.js';

/**
 * Internal to timerTable: what the controller will do differently from the ideal, each naming the
 * field to change: a period register rounded (the carrier runs off frequency), references clamped
 * (overmodulation), 100 % duty clamped to the register, pulses swallowed by the dead time.
 */
export function timerTableWarnings(
  inputs: TimerTableInputs,
  timing: TimerTiming,
  rows: TimerChannels,
): TimerWarning[] {
  const { countingMode, timerClock, counterBits } = inputs;
  const { deadTimeCounts, fullScaleCounts: full, ticksPerCarrierPeriod } = timing;
  const warnings: TimerWarning[] = [];
  if (Math.abs(timing.exactTicks - ticksPerCarrierPeriod) > RATIO_TOLERANCE * timing.exactTicks) {
    warnings.push({
      field: 'timerClock',
      message: `timerClock/carrierFrequency is not a whole number of ${countingMode === 'centre-aligned' ? 'double ' : ''}counts; the period register is rounded and the carrier runs at ${timerClock / ticksPerCarrierPeriod} Hz`,
    });
  }
  if (rows.overmodulated > 0) {
    warnings.push({
      field: 'modulation.ma',
      message: `${rows.overmodulated} references beyond ±1 (overmodulation) were clamped to 0 or 100 % duty`,
    });
  }
  if (rows.clampedToRegister) {
    warnings.push({
      field: 'counterBits',
      message: `100 % duty needs compare ${full}, which a ${counterBits}-bit register cannot hold; clamped to ${2 ** counterBits - 1}`,
    });
  }
  const narrow = narrowPulseCount(
    rows.channels,
    full,
    ticksPerCarrierPeriod / full,
    deadTimeCounts,
  );
  if (deadTimeCounts > 0 && narrow.count > 0) {
    warnings.push({
      field: 'deadTime',
      message: `${narrow.count} pulses are shorter than the dead time (${deadTimeCounts} ticks = ${deadTimeCounts / timerClock} s; shortest ${narrow.shortest} ticks) and are swallowed by it: the fundamental and THD change (see deadTimeEffect)`,
    });
  }
  return warnings;
}

/**
 * Pulses (high or low side) shorter than the dead time, counted per compare value: a high
 * pulse lasts compare·ticksPerCount ticks, a low one (full − compare)·ticksPerCount (exact for
 * symmetric sampling, the half-pulse pair for asymmetric). Next to a change of compare sense (the
 * reduced common-mode methods) the leg switches at the update event, and the pulses there lie in
 * one half period only: compare·ticksPerCount/2 and (full − compare)·ticksPerCount/2.
 */
function narrowPulseCount(
  channels: TimerChannel[],
  full: number,
  ticksPerCount: number,
  deadTimeCounts: number,
): { count: number; shortest: number } {
  let count = 0;
  let shortest = Infinity;
  for (const channel of channels) {
    const { compare, sense } = channel;
    compare.forEach((c, i) => {
      const previous = sense[(i + sense.length - 1) % sense.length];
      const next = sense[(i + 1) % sense.length];
      const halves = sense[i] !== previous || sense[i] !== next ? 2 : 1;
      for (const width of [(c * ticksPerCount) / halves, ((full - c) * ticksPerCount) / halves]) {
        if (width > 0 && width < deadTimeCounts) {
          count++;
          shortest = Math.min(shortest, width);
        }
      }
    });
  }
  return { count, shortest };
}
