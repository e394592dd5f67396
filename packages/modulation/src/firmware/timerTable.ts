import { TAU } from '../math.js';
import { ParameterRangeError, ParameterTypeError } from '../validation/errors.js';
import { assertNumberInRange, assertOneOf } from '../validation/assertions.js';
import { dutyFromReference } from './dutyFromReference.js';
import { complementaryCompares } from './complementaryCompares.js';
import { legReferences } from './legReferences.js';
import {
  TIMER_ZERO_SEQUENCES,
  type CountingMode,
  type DeadTimeMethod,
  type TimerChannel,
  type TimerModulation,
  type TimerTable,
  type TimerTableOptions,
  type TimerWarning,
} from './timerTableTypes.js';

/** Relative tolerance for "is an integer" tests on frequency ratios (floating-point input). */
const RATIO_TOLERANCE = 1e-9;

/** How far past ±1 a reference may round and still be a clamp at the rail, not overmodulation. */
const RAIL_TOLERANCE = 1e-12;

/** Fewest timer counts a carrier period may hold (below this the duty has no resolution). */
const MIN_PERIOD_COUNTS = 2;

/**
 * Most entries a timer table may hold per fundamental period (each entry holds a compare value per
 * channel): bounds the work and the size of the answer; a controller's table is far shorter.
 */
export const MAX_TIMER_TABLE_LENGTH = 65_536;

/**
 * Timer compare values for a regular-sampled sine modulation: what a controller loads into
 * its PWM timer, per channel (inverter leg), with complementary outputs and dead time.
 *
 * Conventions (common practice: timer reference manuals describe edge- and centre-aligned
 * PWM; from memory). All channels are active-high: the high-side switch is on while the
 * counter is below the compare value, and the compare match turns it off.
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
 *   sampling or compare-offset dead time with edge-aligned counting.
 */
export function timerTable(options: TimerTableOptions): TimerTable {
  const {
    modulation,
    fundamentalFrequency,
    carrierFrequency,
    sampling = 'regular-symmetric',
    timerClock,
    countingMode = 'centre-aligned',
    counterBits = 16,
    deadTime = 0,
    vdc = 1,
  } = options;
  const checkedModulation = checkModulation(modulation);
  assertNumberInRange('fundamentalFrequency', fundamentalFrequency, {
    min: 0,
    minExclusive: true,
    max: 1e6,
  });
  assertNumberInRange('timerClock', timerClock, { min: 0, minExclusive: true, max: 1e11 });
  assertNumberInRange('carrierFrequency', carrierFrequency, {
    min: 0,
    minExclusive: true,
    max: timerClock / 2,
  });
  assertOneOf('sampling', sampling, ['regular-symmetric', 'regular-asymmetric'] as const);
  assertOneOf('countingMode', countingMode, ['edge-aligned', 'centre-aligned'] as const);
  assertNumberInRange('counterBits', counterBits, { min: 8, max: 32, integer: true });
  assertNumberInRange('deadTime', deadTime, { min: 0 });
  assertNumberInRange('vdc', vdc, { min: 0, minExclusive: true });
  const deadTimeMethod: DeadTimeMethod =
    options.deadTimeMethod ??
    (countingMode === 'centre-aligned' ? 'compare-offset' : 'dead-time-register');
  assertOneOf('deadTimeMethod', deadTimeMethod, ['compare-offset', 'dead-time-register'] as const);
  if (countingMode === 'edge-aligned' && sampling === 'regular-asymmetric') {
    throw new ParameterRangeError(
      'sampling',
      "'regular-symmetric' when countingMode is 'edge-aligned' (asymmetric sampling needs an up-down counter)",
      sampling,
    );
  }
  if (countingMode === 'edge-aligned' && deadTimeMethod === 'compare-offset') {
    throw new ParameterRangeError(
      'deadTimeMethod',
      "'dead-time-register' when countingMode is 'edge-aligned' (an up-counter has no second edge to offset at its reset)",
      deadTimeMethod,
    );
  }
  const warnings: TimerWarning[] = [];

  const carrierPeriods = integerRatio(carrierFrequency, fundamentalFrequency);
  const updatesPerFundamental = carrierPeriods * (sampling === 'regular-asymmetric' ? 2 : 1);
  if (options.tableLength === undefined && updatesPerFundamental > MAX_TIMER_TABLE_LENGTH) {
    // The default (one entry per compare update) would size the table from the two frequencies
    // alone; refuse before any work rather than build millions of rows.
    throw new ParameterRangeError(
      'tableLength',
      `given when carrierFrequency/fundamentalFrequency${sampling === 'regular-asymmetric' ? ' × 2' : ''} (${updatesPerFundamental} compare updates per period) exceeds ${MAX_TIMER_TABLE_LENGTH}: a divisor of ${updatesPerFundamental} up to ${MAX_TIMER_TABLE_LENGTH}`,
      undefined,
    );
  }
  const tableLength = options.tableLength ?? updatesPerFundamental;
  assertNumberInRange('tableLength', tableLength, {
    min: 1,
    max: Math.min(updatesPerFundamental, MAX_TIMER_TABLE_LENGTH),
    integer: true,
  });
  if (updatesPerFundamental % tableLength !== 0) {
    throw new ParameterRangeError(
      'tableLength',
      `a divisor of ${updatesPerFundamental} (compare updates per fundamental period)`,
      tableLength,
    );
  }

  const timing = periodTiming(countingMode, timerClock, carrierFrequency, counterBits);
  if (
    Math.abs(timing.exactTicks - timing.ticksPerCarrierPeriod) >
    RATIO_TOLERANCE * timing.exactTicks
  ) {
    warnings.push({
      field: 'timerClock',
      message: `timerClock/carrierFrequency is not a whole number of ${countingMode === 'centre-aligned' ? 'double ' : ''}counts; the period register is rounded and the carrier runs at ${realised(timerClock, timing.ticksPerCarrierPeriod)} Hz`,
    });
  }
  const carrierPeriodSeconds = 1 / carrierFrequency;
  if (deadTime >= carrierPeriodSeconds / 2) {
    throw new ParameterRangeError(
      'deadTime',
      `a time in seconds ≥ 0 and < half the carrier period (${carrierPeriodSeconds / 2} s)`,
      deadTime,
    );
  }
  const deadTimeCounts = Math.ceil(deadTime * timerClock - RATIO_TOLERANCE);
  if (2 * deadTimeCounts >= timing.ticksPerCarrierPeriod) {
    throw new ParameterRangeError(
      'deadTime',
      `shorter than half the carrier period in counts (${timing.ticksPerCarrierPeriod / 2} ticks); got ${deadTimeCounts} ticks`,
      deadTime,
    );
  }

  const entryAngles = Array.from(
    { length: tableLength },
    (_, i) => ((i + 0.5) * TAU) / tableLength,
  );
  const references = entryAngles.map((theta) => legReferences(theta, checkedModulation));
  const channelCount = (references[0] as number[]).length;
  const full = timing.fullScaleCounts;
  let overmodulated = 0;
  let maxError = 0;
  const channels: TimerChannel[] = [];
  for (let k = 0; k < channelCount; k++) {
    const duty = references.map((r) => {
      const value = r[k] as number;
      // A clamped reference is s + (1 − s), an ulp either side of the rail: not overmodulation.
      if (value > 1 + RAIL_TOLERANCE || value < -1 - RAIL_TOLERANCE) overmodulated++;
      return dutyFromReference(value);
    });
    const compare = duty.map((d) => Math.round(d * full));
    duty.forEach((d, i) => {
      maxError = Math.max(maxError, Math.abs((compare[i] as number) - d * full));
    });
    const { highSide, lowSide } = complementaryCompares(
      compare,
      full,
      deadTimeMethod === 'compare-offset' ? deadTimeCounts : 0,
    );
    channels.push({
      name: CHANNEL_NAMES[k] as string,
      description: describeChannel(checkedModulation, k),
      duty,
      compare,
      highSide,
      lowSide,
    });
  }
  if (overmodulated > 0) {
    warnings.push({
      field: 'modulation.ma',
      message: `${overmodulated} references beyond ±1 (overmodulation) were clamped to 0 or 100 % duty`,
    });
  }
  if (
    countingMode === 'edge-aligned' &&
    full > 2 ** counterBits - 1 &&
    channels.some((c) => c.compare.includes(full))
  ) {
    for (const c of channels)
      for (const list of [c.compare, c.highSide, c.lowSide])
        list.forEach((v, i) => {
          if (v > 2 ** counterBits - 1) list[i] = 2 ** counterBits - 1;
        });
    warnings.push({
      field: 'counterBits',
      message: `100 % duty needs compare ${full}, which a ${counterBits}-bit register cannot hold; clamped to ${2 ** counterBits - 1}`,
    });
  }
  const narrow = narrowPulseCount(
    channels,
    full,
    timing.ticksPerCarrierPeriod / full,
    deadTimeCounts,
  );
  if (deadTimeCounts > 0 && narrow.count > 0) {
    warnings.push({
      field: 'deadTime',
      message: `${narrow.count} pulses are shorter than the dead time (${deadTimeCounts} ticks = ${deadTimeCounts / timerClock} s; shortest ${narrow.shortest} ticks) and are swallowed by it: the fundamental and THD change (see deadTimeEffect)`,
    });
  }

  const ticksPerFundamental = timing.ticksPerCarrierPeriod * carrierPeriods;
  return {
    parameters: {
      modulation:
        checkedModulation.method === 'sine-triangle'
          ? { method: 'sine-triangle', scheme: checkedModulation.scheme, ma: checkedModulation.ma }
          : {
              method: 'three-phase',
              zeroSequence: checkedModulation.zeroSequence ?? 'none',
              ma: checkedModulation.ma,
            },
      fundamentalFrequency,
      carrierFrequency,
      sampling,
      timerClock,
      countingMode,
      counterBits,
      deadTime,
      deadTimeMethod,
      tableLength,
      vdc,
    },
    units: UNITS,
    conventions: conventionLines(countingMode, sampling, deadTimeMethod),
    periodRegister: timing.periodRegister,
    fullScaleCounts: full,
    ticksPerCarrierPeriod: timing.ticksPerCarrierPeriod,
    realisedCarrierFrequency: timerClock / timing.ticksPerCarrierPeriod,
    realisedFundamentalFrequency: timerClock / ticksPerFundamental,
    carrierPeriodsPerFundamental: carrierPeriods,
    updatesPerFundamental,
    updatesPerEntry: updatesPerFundamental / tableLength,
    deadTimeCounts,
    realisedDeadTime: deadTimeCounts / timerClock,
    entryAngles,
    channels,
    quantisationStep: vdc / full,
    maxQuantisationError: (maxError * vdc) / full,
    warnings,
  };
}

const CHANNEL_NAMES = ['a', 'b', 'c'];

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
  highSide: 'counts',
  lowSide: 'counts',
  quantisationStep: 'V',
  maxQuantisationError: 'V',
};

function checkModulation(modulation: unknown): TimerModulation {
  if (typeof modulation !== 'object' || modulation === null) {
    throw new ParameterTypeError(
      'modulation',
      "an object { method: 'sine-triangle' | 'three-phase', ma, ... }",
      modulation,
    );
  }
  const m = modulation as Record<string, unknown>;
  assertOneOf('modulation.method', m.method, ['sine-triangle', 'three-phase'] as const);
  assertNumberInRange('modulation.ma', m.ma, { min: 0, minExclusive: true, max: 4 });
  if (m.method === 'sine-triangle') {
    assertOneOf('modulation.scheme', m.scheme, ['bipolar', 'unipolar'] as const);
    return { method: 'sine-triangle', scheme: m.scheme, ma: m.ma };
  }
  const zeroSequence = m.zeroSequence ?? 'none';
  assertOneOf('modulation.zeroSequence', zeroSequence, TIMER_ZERO_SEQUENCES);
  return { method: 'three-phase', zeroSequence, ma: m.ma };
}

function integerRatio(carrierFrequency: number, fundamentalFrequency: number): number {
  const ratio = carrierFrequency / fundamentalFrequency;
  const rounded = Math.round(ratio);
  if (rounded < 3 || Math.abs(ratio - rounded) > RATIO_TOLERANCE * ratio) {
    throw new ParameterRangeError(
      'carrierFrequency/fundamentalFrequency',
      'an integer ≥ 3 (the table holds whole carrier periods per fundamental period)',
      ratio,
    );
  }
  return rounded;
}

interface PeriodTiming {
  exactTicks: number;
  ticksPerCarrierPeriod: number;
  periodRegister: number;
  fullScaleCounts: number;
}

function periodTiming(
  mode: CountingMode,
  clock: number,
  carrier: number,
  bits: number,
): PeriodTiming {
  const maxCount = 2 ** bits;
  if (mode === 'edge-aligned') {
    const exact = clock / carrier;
    const ticks = Math.round(exact);
    if (ticks > maxCount || ticks < MIN_PERIOD_COUNTS) {
      throw new ParameterRangeError(
        'timerClock/carrierFrequency',
        `${MIN_PERIOD_COUNTS} to 2^${bits} = ${maxCount} counts for a ${bits}-bit edge-aligned counter (TOP = ticks − 1 ≤ ${maxCount - 1}); use a prescaler, a wider counter or another carrier frequency`,
        exact,
      );
    }
    return {
      exactTicks: exact,
      ticksPerCarrierPeriod: ticks,
      periodRegister: ticks - 1,
      fullScaleCounts: ticks,
    };
  }
  const exactPeriod = clock / (2 * carrier);
  const period = Math.round(exactPeriod);
  if (period > maxCount - 1 || period < MIN_PERIOD_COUNTS) {
    throw new ParameterRangeError(
      'timerClock/(2·carrierFrequency)',
      `${MIN_PERIOD_COUNTS} to ${maxCount - 1} counts for a ${bits}-bit centre-aligned counter (period register P ≤ 2^${bits} − 1); use a prescaler, a wider counter or another carrier frequency`,
      exactPeriod,
    );
  }
  return {
    exactTicks: 2 * exactPeriod,
    ticksPerCarrierPeriod: 2 * period,
    periodRegister: period,
    fullScaleCounts: period,
  };
}

function realised(clock: number, ticks: number): number {
  return clock / ticks;
}

/**
 * Pulses (high or low side) shorter than the dead time, counted per compare value: a high
 * pulse lasts compare·ticksPerCount ticks, a low one (full − compare)·ticksPerCount (exact for
 * symmetric sampling, the half-pulse pair for asymmetric).
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
    for (const c of channel.compare) {
      for (const width of [c * ticksPerCount, (full - c) * ticksPerCount]) {
        if (width > 0 && width < deadTimeCounts) {
          count++;
          shortest = Math.min(shortest, width);
        }
      }
    }
  }
  return { count, shortest };
}

function conventionLines(
  mode: CountingMode,
  sampling: string,
  deadTimeMethod: DeadTimeMethod,
): string[] {
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
  lines.push(
    deadTimeMethod === 'compare-offset'
      ? 'Dead time by compare offset: high side on while counter < highSide; low side on while counter >= lowSide; lowSide - highSide = deadTimeCounts at every edge; at 0 or 100 % duty one switch stays on.'
      : 'Dead time by the timer dead-time generator: highSide = lowSide = compare (the low side is the complementary output); program deadTimeCounts ticks into the dead-time register (its encoding is timer-specific).',
    'Dead-time ticks are rounded up, so the realised dead time is never shorter than requested.',
  );
  return lines;
}

function describeChannel(modulation: TimerModulation, k: number): string {
  if (modulation.method === 'three-phase')
    return `leg ${'abc'[k]} (phase ${'abc'[k]}, reference at −${2 * k}π/3)`;
  if (modulation.scheme === 'bipolar') {
    return "leg A; drive leg B high side from this channel's low-side output and leg B low side from its high-side output (diagonal pairs switch together)";
  }
  return k === 0 ? 'leg A, reference +ma·sin θ' : 'leg B, reference −ma·sin θ';
}
