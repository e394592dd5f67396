import { TAU } from '../math.js';
import { ParameterRangeError } from '../validation/errors.js';
import { complementaryCompares } from './complementaryCompares.js';
import { multilevelTimerPlan, type PlannedCounter } from './multilevelTimerPlan.js';
import {
  multilevelTimerTableInputs,
  type MultilevelTimerTableInputs,
} from './multilevelTimerTableInputs.js';
import type {
  MultilevelTimerCounter,
  MultilevelTimerLeg,
  MultilevelTimerTable,
  MultilevelTimerTableOptions,
} from './multilevelTimerTableTypes.js';
import { RATIO_TOLERANCE } from './timerTableInputs.js';
import { timerTableTiming, type TimerTiming } from './timerTableTiming.js';
import type { TimerWarning } from './timerTableTypes.js';

export { MAX_MULTILEVEL_TIMER_VALUES } from './multilevelTimerTableInputs.js';

/**
 * Timer compare values for every switch of a multilevel leg under regular-sampled carrier PWM
 * (the modulation of `multilevelCarrier`): one up-down counter per carrier, and per leg one
 * compare value per entry for each complementary pair of switches, with dead time.
 *
 * Conventions (timer practice is common practice, from memory; the carriers are those of
 * `multilevelCarrier`, Holmes and Lipo, 2003, ch. 11):
 * - Each carrier is a centre-aligned counter running P → 0 → P per carrier period, `P =
 *   timerClock/(2·carrierFrequency)` rounded; counter value c stands for the carrier 2c/P − 1, so
 *   a pair's main switch is on while the counter is below `round(duty·P)`, duty being the held
 *   reference's place in the carrier's band (level-shifted) or (1 ± r)/2 (phase-shifted).
 * - A carrier delayed by d carrier radians (the POD/APOD carriers in opposition, d = π; the
 *   phase-shifted cells, d = k·2π/(levels − 1) or k·π/cells) is the same counter started
 *   P·d/π ticks later: `counters[k].offsetTicks`, rounded to whole ticks.
 * - Each counter's entry 0 starts at its first peak at or after θ = 0 (`startTick`; the carrier
 *   of `carrierPhase` 0 has a valley at θ = π/2), and its compare values load at its own peaks
 *   (and valleys, for `'regular-asymmetric'`). Entry i holds the reference sampled at the
 *   instant its first update begins (Bowes, 1975: regular sampling), so with the default table
 *   length the switches equal `multilevelCarrier`'s regular-sampled ones, edges to the tick.
 * - Pairs (Holmes and Lipo, 2003, ch. 11; common practice): NPC and T-type S1/S3 (upper band)
 *   and S2/S4 (lower band; in a T-type leg S2 then stays on with S1 and S3 with S4, as in
 *   `multilevelCarrier`); flying capacitor each
 *   cell's upper/lower; cascaded each half-bridge's upper/lower. Dead time `D = ceil(deadTime·timerClock)` ticks, by the timer's dead-time
 *   generator (every turn-on delayed by D) or by compare offsets (main `compare − floor(D/2)`,
 *   complement `compare + D − floor(D/2)`, the complement on while the counter is at or above it).
 *
 * @throws ParameterRangeError / ParameterTypeError naming the field: the modulation's fields as
 *   `multilevelCarrier` checks them (`modulation.levels`, …) and a sampling other than regular;
 *   a carrier/fundamental ratio that is not a whole mf, or an `mf` that differs from it; an
 *   edge-aligned counter; a period that does not fit the counter; a dead time of half a carrier
 *   period or more; a table longer than the bounds (given or by default) or not dividing the
 *   updates; compare-offset dead time where a pair switches at a counter peak or valley.
 */
export function multilevelTimerTable(options: MultilevelTimerTableOptions): MultilevelTimerTable {
  const inputs = multilevelTimerTableInputs(options);
  const timing = timerTableTiming(inputs);
  const plan = multilevelTimerPlan(inputs);
  const { modulation, tableLength, updatesPerFundamental, timerClock, deadTimeMethod } = inputs;
  const P = timing.fullScaleCounts;
  const ticksPerUpdate = timing.ticksPerCarrierPeriod / (updatesPerFundamental / modulation.mf);
  const updatesPerEntry = updatesPerFundamental / tableLength;
  const ticksPerFundamental = timing.ticksPerCarrierPeriod * modulation.mf;
  let maxOffsetRoundingTicks = 0;
  const counters: MultilevelTimerCounter[] = plan.counters.map((counter) => {
    const exact = exactStartTick(counter, inputs, timing);
    const startTick = Math.round(exact) % timing.ticksPerCarrierPeriod;
    maxOffsetRoundingTicks = Math.max(maxOffsetRoundingTicks, Math.abs(Math.round(exact) - exact));
    return {
      name: counter.name,
      carrierDelay: counter.delay,
      offsetTicks: 0,
      startTick,
      entryAngles: Array.from({ length: tableLength }, (_, i) => {
        const tick = exact + i * updatesPerEntry * ticksPerUpdate;
        return ((TAU * tick) / ticksPerFundamental) % TAU;
      }),
    };
  });
  const first = counters[0] as MultilevelTimerCounter;
  for (const counter of counters) {
    counter.offsetTicks =
      (counter.startTick - first.startTick + timing.ticksPerCarrierPeriod) %
      timing.ticksPerCarrierPeriod;
  }
  let maxCompareRoundingTicks = 0;
  const compareOffset = deadTimeMethod === 'compare-offset' ? timing.deadTimeCounts : 0;
  const legs: MultilevelTimerLeg[] = plan.legs.map((leg) => ({
    name: leg.name,
    pairs: leg.pairs.map((pair) => {
      const angles = (counters[pair.counter] as MultilevelTimerCounter).entryAngles;
      const duty = angles.map((theta) => pair.duty(leg.reference(theta)));
      const compare = duty.map((d) => Math.round(d * P));
      duty.forEach((d, i) => {
        maxCompareRoundingTicks = Math.max(
          maxCompareRoundingTicks,
          Math.abs((compare[i] as number) - d * P),
        );
      });
      const { highSide, lowSide } = complementaryCompares(compare, P, compareOffset);
      return {
        main: pair.main,
        complement: pair.complement,
        counter: pair.counter,
        description: pair.description,
        duty,
        compare,
        mainCompare: highSide,
        complementCompare: lowSide,
      };
    }),
  }));
  if (compareOffset > 0) assertNoEdgeAtUpdates(legs, inputs, P);
  return {
    parameters: {
      modulation: { ...modulation },
      fundamentalFrequency: inputs.fundamentalFrequency,
      carrierFrequency: inputs.carrierFrequency,
      timerClock,
      countingMode: inputs.countingMode,
      counterBits: inputs.counterBits,
      deadTime: inputs.deadTime,
      deadTimeMethod,
      tableLength,
    },
    units: UNITS,
    conventions: conventionLines(inputs),
    periodRegister: timing.periodRegister,
    fullScaleCounts: P,
    ticksPerCarrierPeriod: timing.ticksPerCarrierPeriod,
    realisedCarrierFrequency: timerClock / timing.ticksPerCarrierPeriod,
    realisedFundamentalFrequency: timerClock / ticksPerFundamental,
    carrierPeriodsPerFundamental: modulation.mf,
    updatesPerFundamental,
    updatesPerEntry,
    deadTimeCounts: timing.deadTimeCounts,
    realisedDeadTime: timing.deadTimeCounts / timerClock,
    counters,
    legs,
    maxOffsetRoundingTicks,
    maxCompareRoundingTicks,
    warnings: warningsOf(inputs, timing, legs, maxOffsetRoundingTicks),
  };
}

/**
 * The tick (from θ = 0, not rounded) of a counter's first peak: the carrier's peaks lie at
 * carrier angle (2j + 1)π, θ = π/2 + ((2j + 1)π + carrierPhase + delay)/mf (the alignment of
 * `triangleCarrier`), and one fundamental period holds mf·2P ticks.
 */
function exactStartTick(
  counter: PlannedCounter,
  inputs: MultilevelTimerTableInputs,
  timing: TimerTiming,
): number {
  const { mf, carrierPhase } = inputs.modulation;
  const P = timing.fullScaleCounts;
  const tick = P * (mf / 2 + 1 + (carrierPhase + counter.delay) / Math.PI);
  const period = timing.ticksPerCarrierPeriod;
  return ((tick % period) + period) % period;
}

/**
 * Compare offsets blank only edges inside an update. A pair whose switch state at the end of one
 * update differs from that at the start of the next (a band's duty reaching 0 or 100 %) switches
 * exactly at the counter peak or valley, where no offset can separate the two switches.
 */
function assertNoEdgeAtUpdates(
  legs: MultilevelTimerLeg[],
  inputs: MultilevelTimerTableInputs,
  P: number,
): void {
  const asymmetric = inputs.modulation.sampling === 'regular-asymmetric';
  const perEntry = inputs.updatesPerFundamental / inputs.tableLength;
  for (const leg of legs) {
    for (const pair of leg.pairs) {
      const compareAt = (u: number): number =>
        pair.compare[
          Math.floor(
            (((u % inputs.updatesPerFundamental) + inputs.updatesPerFundamental) %
              inputs.updatesPerFundamental) /
              perEntry,
          )
        ] as number;
      // Symmetric or a down-counting half starts at a peak (on only at 100 %); an up-counting
      // half starts at a valley (on unless 0 %). Each ends where the next starts.
      const startsOn = (u: number): boolean =>
        asymmetric && u % 2 === 1 ? compareAt(u) > 0 : compareAt(u) >= P;
      const endsOn = (u: number): boolean =>
        asymmetric && u % 2 === 0 ? compareAt(u) > 0 : compareAt(u) >= P;
      for (let u = 0; u < inputs.updatesPerFundamental; u++) {
        if (endsOn(u - 1) !== startsOn(u)) {
          throw new ParameterRangeError(
            'deadTimeMethod',
            `'dead-time-register' for this modulation (pair ${pair.main}/${pair.complement} of ${leg.name} switches at the start of update ${u}, a counter ${asymmetric && u % 2 === 1 ? 'valley' : 'peak'}, where a compare offset cannot insert the dead time)`,
            'compare-offset',
          );
        }
      }
    }
  }
}

function warningsOf(
  inputs: MultilevelTimerTableInputs,
  timing: TimerTiming,
  legs: MultilevelTimerLeg[],
  maxOffsetRoundingTicks: number,
): TimerWarning[] {
  const warnings: TimerWarning[] = [];
  if (
    Math.abs(timing.exactTicks - timing.ticksPerCarrierPeriod) >
    RATIO_TOLERANCE * timing.exactTicks
  ) {
    warnings.push({
      field: 'timerClock',
      message: `timerClock/carrierFrequency = ${timing.exactTicks} ticks is not an even whole number; the period register was rounded, so the carrier and fundamental frequencies differ slightly from those asked (see realisedCarrierFrequency).`,
    });
  }
  if (maxOffsetRoundingTicks > RATIO_TOLERANCE) {
    warnings.push({
      field: 'modulation.carrierPhase',
      message: `A counter's start is rounded to a whole tick (by up to ${maxOffsetRoundingTicks} ticks): the carriers' phase differs from the modulation's by that much.`,
    });
  }
  const D = timing.deadTimeCounts;
  const P = timing.fullScaleCounts;
  const halves = inputs.modulation.sampling === 'regular-asymmetric' ? 1 : 2;
  const narrow = legs.some((leg) =>
    leg.pairs.some((pair) =>
      pair.compare.some((c) => c > 0 && c < P && halves * Math.min(c, P - c) <= D),
    ),
  );
  if (D > 0 && narrow) {
    warnings.push({
      field: 'deadTime',
      message: `Some pulses are no longer than the dead time (${D} ticks): the dead time swallows them, so those switches do not turn on in those updates.`,
    });
  }
  return warnings;
}

const UNITS: Record<string, string> = {
  'modulation.ma': 'ratio (peak reference / half the leg output range)',
  'modulation.vdc': 'V',
  'modulation.carrierPhase': 'carrier rad',
  fundamentalFrequency: 'Hz',
  carrierFrequency: 'Hz',
  timerClock: 'Hz',
  counterBits: 'bits',
  deadTime: 's',
  tableLength: 'entries per fundamental period',
  periodRegister: 'counts',
  fullScaleCounts: 'counts',
  ticksPerCarrierPeriod: 'timer ticks',
  realisedCarrierFrequency: 'Hz',
  realisedFundamentalFrequency: 'Hz',
  deadTimeCounts: 'timer ticks',
  realisedDeadTime: 's',
  carrierDelay: 'carrier rad',
  offsetTicks: 'timer ticks',
  startTick: 'timer ticks',
  entryAngles: 'rad',
  duty: 'fraction',
  compare: 'counts',
  mainCompare: 'counts',
  complementCompare: 'counts',
  maxOffsetRoundingTicks: 'timer ticks',
  maxCompareRoundingTicks: 'timer ticks',
};

function conventionLines(inputs: MultilevelTimerTableInputs): string[] {
  const lines = [
    'Every carrier is a centre-aligned counter: it counts P down to 0 and back up to P in each carrier period; compare values load at its peaks.',
    'Each pair is one timer channel: the main switch is on while the counter is below its compare value, the complement while the counter is at or above its own; compare = round(duty * P).',
    "Level-shifted carriers: carrier b spans band b of the reference (bottom band first); the duty is the held reference's place in the band, clamped to [0, 1]. Phase-shifted carriers: duty = (1 + r)/2, or (1 - r)/2 for a cascaded cell's right leg.",
    'A carrier delayed by d carrier radians is a counter started P*d/pi ticks later: counter k (index from 0) starts at its peak offsetTicks after counter 0; startTick is the tick, counted from angle 0 of the fundamental, at which entry 0 of the counter begins.',
    'Entry i of a counter holds the reference sampled at the instant its first update begins (regular sampling, Bowes 1975); each entry serves updatesPerEntry consecutive updates.',
    "Complementary pairs (Holmes and Lipo 2003 ch. 11; common practice): NPC and T-type S1/S3 and S2/S4 (in a T-type leg S2 stays on with S1 and S3 with S4); flying capacitor each cell's upper/lower; cascaded each half-bridge's upper/lower.",
  ];
  if (inputs.modulation.sampling === 'regular-asymmetric') {
    lines.push(
      'Asymmetric sampling: entry 2j is loaded for the down-counting half and entry 2j + 1 for the up-counting half of carrier period j.',
    );
  }
  lines.push(
    inputs.deadTimeMethod === 'compare-offset'
      ? 'Dead time by compare offset: mainCompare = compare - floor(D/2), complementCompare = compare + D - floor(D/2); at 0 or 100 % duty one switch stays on.'
      : 'Dead time by the timer dead-time generator: mainCompare = complementCompare = compare; program deadTimeCounts ticks into the dead-time register (its encoding is timer-specific); it delays every turn-on.',
    'Dead-time ticks are rounded up, so the realised dead time is never shorter than requested.',
  );
  return lines;
}
