import { TAU } from '../math.js';
import type { MultilevelSwitch } from '../multilevel/MultilevelTypes.js';
import type { Waveform } from '../waveform/Waveform.js';
import { waveformFromTransitions } from '../waveform/waveformFromTransitions.js';
import type { MultilevelTimerPair, MultilevelTimerTable } from './multilevelTimerTableTypes.js';
import {
  complementCyclic,
  mergeCyclic,
  shrinkIntervals,
  splitAtPeriod,
  type Interval,
} from './pulseTrain.js';

/** Options of {@link multilevelTimerSwitches}. */
export interface MultilevelTimerSwitchOptions {
  /** Insert the table's dead time. @default true */
  includeDeadTime?: boolean;
}

/** Result of {@link multilevelTimerSwitches}: each leg's switches, named as in the table. */
export interface MultilevelTimerSwitches {
  legs: { name: string; switches: MultilevelSwitch[] }[];
}

/**
 * The gate signals a multilevel timer table produces, exact (edges at the timer's ticks, angle
 * 2π·tick/(ticks per fundamental period), θ = 0 at tick 0), one fundamental period: per leg,
 * every switch's 0/1 waveform, main and complement of each pair in the table's order.
 *
 * Model: each counter runs P → 0 → P from its `startTick`, loading entry ⌊u/updatesPerEntry⌋ at
 * the start of update u; a main switch is on while its counter is below its compare value, a
 * complement while the counter is at or above its own (the conventions of
 * {@link multilevelTimerTable}). Without dead time both come from `compare`, complementary. With
 * it: `'compare-offset'` reads `mainCompare` and `complementCompare` as they are;
 * `'dead-time-register'` delays every turn-on of either switch by `deadTimeCounts` ticks (a pulse
 * no longer than that vanishes), as a timer's dead-time generator does.
 */
export function multilevelTimerSwitches(
  table: MultilevelTimerTable,
  options: MultilevelTimerSwitchOptions = {},
): MultilevelTimerSwitches {
  const { includeDeadTime = true } = options;
  const period = table.ticksPerCarrierPeriod * table.carrierPeriodsPerFundamental;
  const D = includeDeadTime ? table.deadTimeCounts : 0;
  const offset = D > 0 && table.parameters.deadTimeMethod === 'compare-offset';
  const toWaveform = (on: Interval[]): Waveform => {
    const pieces = splitAtPeriod(on, period);
    if (pieces.length === 0) return { edges: [0], levels: [0] };
    return waveformFromTransitions([
      { angle: 0, level: 0 },
      ...pieces.flatMap(([start, end]) => [
        { angle: (TAU * start) / period, level: 1 },
        { angle: (TAU * end) / period, level: 0 },
      ]),
    ]);
  };
  return {
    legs: table.legs.map((leg) => ({
      name: leg.name,
      switches: leg.pairs.flatMap((pair): MultilevelSwitch[] => {
        const ideal = onIntervals(table, pair, pair.compare, true, period);
        const main = offset
          ? onIntervals(table, pair, pair.mainCompare, true, period)
          : shrinkIntervals(ideal, D, 0, period);
        const complement = offset
          ? onIntervals(table, pair, pair.complementCompare, false, period)
          : shrinkIntervals(complementCyclic(ideal, period), D, 0, period);
        return [
          { name: pair.main, on: toWaveform(main) },
          { name: pair.complement, on: toWaveform(complement) },
        ];
      }),
    })),
  };
}

/**
 * Ticks (cyclic over the fundamental period) during which the counter is below (`below`) or at
 * or above each update's value, values clamped to [0, P].
 */
function onIntervals(
  table: MultilevelTimerTable,
  pair: MultilevelTimerPair,
  values: readonly number[],
  below: boolean,
  period: number,
): Interval[] {
  const P = table.fullScaleCounts;
  const start = table.counters[pair.counter]?.startTick ?? 0;
  const asymmetric = table.parameters.modulation.sampling === 'regular-asymmetric';
  const raw: Interval[] = [];
  for (let h = 0; h < 2 * table.carrierPeriodsPerFundamental; h++) {
    const update = asymmetric ? h : Math.floor(h / 2);
    const c = Math.min(
      P,
      Math.max(0, values[Math.floor(update / table.updatesPerEntry)] as number),
    );
    const t0 = start + h * P;
    // Even halves count down from P (below c once past P − c ticks), odd halves up from 0.
    const falling = h % 2 === 0;
    if (below) raw.push(falling ? [t0 + P - c, t0 + P] : [t0, t0 + c]);
    else raw.push(falling ? [t0, t0 + P - c] : [t0 + c, t0 + P]);
  }
  return mergeCyclic(raw, period);
}
