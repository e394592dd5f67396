import { timerTableChannels } from './timerTableChannels.js';
import {
  isReducedCommonMode,
  timerTableInputs,
  type TimerTableInputs,
} from './timerTableInputs.js';
import { timerTableTiming } from './timerTableTiming.js';
import { timerTableWarnings } from './timerTableWarnings.js';
import type { TimerTable, TimerTableOptions } from './timerTableTypes.js';

export { MAX_TIMER_TABLE_LENGTH } from './timerTableInputs.js';

/**
 * Timer compare values for a regular-sampled sine modulation: what a controller loads into
 * its PWM timer, per channel (inverter leg), with complementary outputs and dead time.
 *
 * Conventions (common practice: timer reference manuals describe edge- and centre-aligned
 * PWM; from memory). All channels are active-high: the high-side switch is on while the
 * counter is below the compare value, and the compare match turns it off; except the entries
 * whose compare sense is `'above'` (the middle phase of the reduced common-mode methods `azspwm1`
 * and `nspwm`, A. M. Hava and E. Ün, IEEE Trans. Power Electronics, 2009), where it is on while
 * the counter is above `full − compare`: the reference against the inverted carrier. Firmware
 * switches the channel's compare polarity at the update event that loads such an entry (see
 * {@link CompareSense}); these tables need centre-aligned counting, asymmetric sampling, the
 * default length and, with a dead time, the dead-time generator (`'dead-time-register'`).
 * - `'edge-aligned'`: up-counting 0…TOP, `TOP = timerClock/carrierFrequency − 1` (rounded),
 *   `compare = round(duty·(TOP + 1))`; the high-side pulse starts at each counter reset.
 * - `'centre-aligned'`: up-down counting P→0→P per carrier period (compare values loaded at
 *   the counter peak), `P = timerClock/(2·carrierFrequency)` (rounded),
 *   `compare = round(duty·P)`; the high-side pulse is centred on the counter valley. With
 *   `'regular-asymmetric'` sampling entry 2j governs the down-counting half and 2j + 1 the
 *   up-counting half of carrier period j.
 * - duty = (1 + r)/2 with r the leg reference in units of vdc/2 ({@link legReferences}).
 * - The table holds `tableLength` entries per fundamental period; entry i is sampled at
 *   θᵢ = (i + ½)·2π/tableLength, the centre of the interval it governs (a precomputed table
 *   has no computation delay, so unlike on-line regular sampling, Bowes 1975, there is no
 *   half-period lag). Each entry is used for `updatesPerEntry` consecutive updates.
 * - Dead time `D = ceil(deadTime·timerClock)` ticks. `'compare-offset'`: high side
 *   `compare − floor(D/2)`, low side `compare + (D − floor(D/2))`, the low side on while the
 *   counter is at or above its value, so both edges of every pulse get D ticks with neither
 *   switch on; 0 and 100 % duty keep one switch on throughout. `'dead-time-register'`: high
 *   and low side equal the compare value and the timer's dead-time generator delays each
 *   turn-on by D ticks (its register encoding is timer-specific).
 *
 * @throws ParameterRangeError naming the field: a non-integer carrier/fundamental ratio, a
 *   period that does not fit the counter or has fewer than 2 counts, a table longer than
 *   {@link MAX_TIMER_TABLE_LENGTH} (given or by default), a dead time of half a
 *   carrier period or more, a table length that does not divide the period, asymmetric
 *   sampling or compare-offset dead time with edge-aligned counting; for `azspwm1`/`nspwm`
 *   edge-aligned counting, symmetric sampling, another table length, or compare-offset dead
 *   time with a dead time.
 */
export function timerTable(options: TimerTableOptions): TimerTable {
  const inputs = timerTableInputs(options);
  const timing = timerTableTiming(inputs);
  const rows = timerTableChannels(inputs, timing);
  const warnings = timerTableWarnings(inputs, timing, rows);
  const { modulation, timerClock, vdc, carrierPeriods, updatesPerFundamental, tableLength } =
    inputs;
  const full = timing.fullScaleCounts;
  const ticksPerFundamental = timing.ticksPerCarrierPeriod * carrierPeriods;
  return {
    parameters: {
      modulation:
        modulation.method === 'sine-triangle'
          ? { method: 'sine-triangle', scheme: modulation.scheme, ma: modulation.ma }
          : {
              method: 'three-phase',
              zeroSequence: modulation.zeroSequence ?? 'none',
              ma: modulation.ma,
            },
      fundamentalFrequency: inputs.fundamentalFrequency,
      carrierFrequency: inputs.carrierFrequency,
      sampling: inputs.sampling,
      timerClock,
      countingMode: inputs.countingMode,
      counterBits: inputs.counterBits,
      deadTime: inputs.deadTime,
      deadTimeMethod: inputs.deadTimeMethod,
      tableLength,
      vdc,
    },
    units: UNITS,
    conventions: conventionLines(inputs),
    periodRegister: timing.periodRegister,
    fullScaleCounts: full,
    ticksPerCarrierPeriod: timing.ticksPerCarrierPeriod,
    realisedCarrierFrequency: timerClock / timing.ticksPerCarrierPeriod,
    realisedFundamentalFrequency: timerClock / ticksPerFundamental,
    carrierPeriodsPerFundamental: carrierPeriods,
    updatesPerFundamental,
    updatesPerEntry: updatesPerFundamental / tableLength,
    deadTimeCounts: timing.deadTimeCounts,
    realisedDeadTime: timing.deadTimeCounts / timerClock,
    entryAngles: rows.entryAngles,
    channels: rows.channels,
    quantisationStep: vdc / full,
    maxQuantisationError: (rows.maxRoundingCounts * vdc) / full,
    warnings,
  };
}

const UNITS: Record<string, string> = {
  'modulation.ma': 'ratio (peak reference / (vdc/2))',
  fundamentalFrequency: 'Hz',
  carrierFrequency: 'Hz',
  timerClock: 'Hz',
  counterBits: 'bits',
  deadTime: 's',
  tableLength: 'entries per fundamental period',
  vdc: 'V',
  periodRegister: 'counts',
  fullScaleCounts: 'counts',
  ticksPerCarrierPeriod: 'timer ticks',
  realisedCarrierFrequency: 'Hz',
  realisedFundamentalFrequency: 'Hz',
  deadTimeCounts: 'timer ticks',
  realisedDeadTime: 's',
  entryAngles: 'rad',
  duty: 'fraction',
  compare: 'counts',
  sense: "'below' or 'above' (high side on while the counter is below or above highSide)",
  highSide: 'counts',
  lowSide: 'counts',
  quantisationStep: 'V',
  maxQuantisationError: 'V',
};

function conventionLines(inputs: TimerTableInputs): string[] {
  const { countingMode: mode, sampling, deadTimeMethod } = inputs;
  const lines = [
    'Outputs active-high: a high-side switch is on while the counter is below its compare value; the compare match turns it off.',
    mode === 'edge-aligned'
      ? 'Edge-aligned: the counter counts up 0..TOP and resets; TOP = ticks per carrier period - 1; compare = round(duty * (TOP + 1)); each high-side pulse starts at the counter reset.'
      : 'Centre-aligned: the counter counts P down to 0 and back up to P in each carrier period; compare values load at the counter peak; compare = round(duty * P); each high-side pulse is centred on the counter valley.',
    'duty = (1 + r)/2, r = leg reference in units of vdc/2 (sine, plus zero sequence for three-phase), clamped to [0, 1].',
    'Entry i is sampled at angle (i + 0.5) * 2*pi / tableLength of the fundamental, the centre of the interval it governs; each entry serves updatesPerEntry consecutive compare updates.',
  ];
  if (sampling === 'regular-asymmetric') {
    lines.push(
      'Asymmetric sampling: entry 2j is loaded for the down-counting half and entry 2j + 1 for the up-counting half of carrier period j.',
    );
  }
  const reduced = isReducedCommonMode(inputs.modulation);
  if (reduced) {
    lines.push(
      "Compare sense per entry and channel: 'below' = high side on while counter < highSide, low side while counter >= lowSide; 'above' = high side on while counter > highSide, low side while counter < lowSide (the middle phase against the inverted carrier, highSide = P - compare). Switch the channel's output polarity at the update event that loads the entry.",
      'The middle phase of entry i is the one at angle (i + 1) * pi / (carrier / fundamental), the end of its half period; the pulses are those of carrier PWM with regular-asymmetric sampling, a quarter carrier period earlier.',
    );
  }
  lines.push(
    deadTimeMethod === 'compare-offset'
      ? 'Dead time by compare offset: high side on while counter < highSide; low side on while counter >= lowSide; lowSide - highSide = deadTimeCounts at every edge; at 0 or 100 % duty one switch stays on.'
      : `Dead time by the timer dead-time generator: highSide = lowSide = compare${reduced ? " (P - compare for 'above' entries)" : ''} (the low side is the complementary output); program deadTimeCounts ticks into the dead-time register (its encoding is timer-specific).`,
    'Dead-time ticks are rounded up, so the realised dead time is never shorter than requested.',
  );
  return lines;
}
