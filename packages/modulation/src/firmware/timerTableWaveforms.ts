import { TAU } from '../math.js';
import { assertNumberInRange, assertOneOf } from '../validation/assertions.js';
import { ParameterTypeError } from '../validation/errors.js';
import type { Waveform } from '../waveform/Waveform.js';
import { subtractWaveforms } from '../waveform/subtractWaveforms.js';
import { waveformFromTransitions, type Transition } from '../waveform/waveformFromTransitions.js';
import { channelCurrentPhases } from './channelCurrentPhases.js';
import { applyMinimumPulse } from './narrowPulses.js';
import {
  TICK_TOLERANCE,
  complementCyclic,
  insidePieces,
  mergeCyclic,
  shrinkIntervals,
  splitAtPeriod,
  type Interval,
} from './pulseTrain.js';
import type { CompareSense, NarrowPulseAction, TimerTable } from './timerTableTypes.js';

/** Options of {@link timerTableWaveforms}. */
export interface TimerTableWaveformOptions {
  /**
   * `'quantised'`: the table's rounded compare values; `'ideal'`: the unrounded duty·fullScale.
   * @default 'quantised'
   */
  counts?: 'quantised' | 'ideal';
  /** Insert the table's dead time. @default true */
  includeDeadTime?: boolean;
  /**
   * Phase lag of the load current behind sin θ, radians: leg a (A) carries
   * `sin(θ − currentAngle)` (out of the leg is positive), leg b/c lag a further 2π/3, 4π/3;
   * H-bridge leg B carries the opposite current. Only its sign matters.
   * @default 0
   */
  currentAngle?: number;
  /**
   * Overrides `currentAngle`: the sign (> 0 out of the leg) of channel `channel`'s current at
   * angle `theta` (radians). Zero means no current (the leg is taken at the DC midpoint).
   */
  currentSign?: (channel: number, theta: number) => number;
  /** Minimum pulse width applied to each channel's ideal gate pulses before dead time. */
  minimumPulse?: { width: number; action: NarrowPulseAction };
  /**
   * Device on-state voltage drops, volts ≥ 0 (threshold model, as `vce0` and `vf0` of an IGBT):
   * the conducting transistor takes `transistor` and the conducting diode `diode` from the leg
   * voltage, in the direction that opposes the current. @default none (ideal switches)
   */
  onStateDrop?: { transistor: number; diode: number };
}

/** Result of {@link timerTableWaveforms}. */
export interface TimerTableWaveforms {
  /** Leg-to-DC-midpoint voltage of each channel, levels ±vdc/2 (0 only with no current). */
  legs: Waveform[];
  /** H-bridge output vAB (levels ±vdc, 0) or the line-to-line voltages vab, vbc, vca. */
  outputs: Waveform[];
  /** Names of `outputs`, e.g. `['vAB']` or `['vab', 'vbc', 'vca']`. */
  outputNames: string[];
  /** Pulses changed by `minimumPulse` (0 without it). */
  adjustedPulses: number;
}

/**
 * The voltages a timer table actually produces, exact (edges at the timer ticks), so the exact
 * `harmonics` and `thd` can quantify quantisation, dead time and minimum pulse width.
 *
 * Model: ideal switches. Each channel's ideal gate signal follows the counting convention and
 * each entry's compare sense of {@link timerTable}; the high side is on over that signal's on-pulses and the low side over
 * its off-pulses, each shortened by the dead time ('dead-time-register': every turn-on delayed
 * by D ticks; 'compare-offset': both edges moved by floor(D/2) and D − floor(D/2)). While
 * neither switch is on, the freewheeling diode sets the leg: current out of the leg (> 0) →
 * negative rail, into the leg → positive rail (the average-value dead-time model of T. Murai,
 * T. Watanabe, S. Miyairi, "Waveform distortion and correction circuit for PWM inverters with
 * switching lag-times", IEEE Trans. Ind. Appl., 1987, from memory, rests on the same rule).
 * Angles: 0..2π over the realised fundamental period (the table's ticks per fundamental).
 */
export function timerTableWaveforms(
  table: TimerTable,
  options: TimerTableWaveformOptions = {},
): TimerTableWaveforms {
  const {
    counts = 'quantised',
    includeDeadTime = true,
    currentAngle = 0,
    currentSign,
    minimumPulse,
    onStateDrop,
  } = options;
  if (onStateDrop !== undefined) {
    assertNumberInRange('onStateDrop.transistor', onStateDrop.transistor, { min: 0, max: 1e4 });
    assertNumberInRange('onStateDrop.diode', onStateDrop.diode, { min: 0, max: 1e4 });
  }
  const drops = onStateDrop ?? { transistor: 0, diode: 0 };
  assertOneOf('counts', counts, ['quantised', 'ideal'] as const);
  assertNumberInRange('currentAngle', currentAngle, { min: -1e6, max: 1e6 });
  if (currentSign !== undefined && typeof currentSign !== 'function') {
    throw new ParameterTypeError(
      'currentSign',
      'a function (channel, theta) => number',
      currentSign,
    );
  }
  const period = table.ticksPerCarrierPeriod * table.carrierPeriodsPerFundamental;
  let minimumTicks = 0;
  if (minimumPulse !== undefined) {
    assertNumberInRange('minimumPulse.width', minimumPulse.width, {
      min: 0,
      max: 1 / table.realisedCarrierFrequency,
    });
    assertOneOf('minimumPulse.action', minimumPulse.action, ['drop', 'clamp'] as const);
    minimumTicks = minimumPulse.width * table.parameters.timerClock;
  }
  const deadTicks = includeDeadTime ? table.deadTimeCounts : 0;
  const [highDelay, highAdvance, lowDelay, lowAdvance] =
    table.parameters.deadTimeMethod === 'compare-offset'
      ? [
          Math.floor(deadTicks / 2),
          Math.floor(deadTicks / 2),
          deadTicks - Math.floor(deadTicks / 2),
          deadTicks - Math.floor(deadTicks / 2),
        ]
      : [deadTicks, 0, deadTicks, 0];
  const vdc = table.parameters.vdc;
  const currentPhases = channelCurrentPhases(table, currentAngle);
  let adjustedPulses = 0;
  const legs = table.channels.map((channel, k) => {
    const values =
      counts === 'ideal' ? channel.duty.map((d) => d * table.fullScaleCounts) : channel.compare;
    let on = idealGate(table, values, channel.sense, period);
    if (minimumTicks > 0) {
      const adjusted = applyMinimumPulse(on, period, minimumTicks, minimumPulse?.action ?? 'drop');
      on = adjusted.on;
      adjustedPulses += adjusted.adjusted;
    }
    const high = splitAtPeriod(shrinkIntervals(on, highDelay, highAdvance, period), period);
    const low = splitAtPeriod(
      shrinkIntervals(complementCyclic(on, period), lowDelay, lowAdvance, period),
      period,
    );
    const phase = currentPhases[k] as number;
    const sign =
      currentSign === undefined
        ? (theta: number) => Math.sign(Math.sin(theta - phase))
        : (theta: number) => currentSign(k, theta);
    const crossings =
      currentSign === undefined
        ? [0, 1].map((n) => (period * ((((phase + n * Math.PI) / TAU) % 1) + 1)) % period)
        : [];
    return legWaveform(high, low, crossings, period, { vdc, sign, drops });
  });
  return { legs, ...outputsOf(table, legs), adjustedPulses };
}

/**
 * On-pulses (ticks) of a channel's ideal gate signal from its compare values (high-side on-time
 * in counts per update) and senses: `'below'` on while the counter is below the value, `'above'`
 * on while it is above full − value (the inverted carrier: the same time, mirrored in the half
 * period about its centre).
 */
function idealGate(
  table: TimerTable,
  values: readonly number[],
  sense: readonly CompareSense[],
  period: number,
): Interval[] {
  const full = table.fullScaleCounts;
  const perEntry = table.updatesPerEntry;
  const raw: Interval[] = [];
  const entryOf = (update: number): number => Math.floor(update / perEntry);
  const valueAt = (update: number): number =>
    Math.min(full, Math.max(0, values[entryOf(update)] as number));
  if (table.parameters.countingMode === 'edge-aligned') {
    for (let j = 0; j < table.carrierPeriodsPerFundamental; j++) {
      const start = j * full;
      raw.push([start, start + valueAt(j)]);
    }
  } else {
    const asymmetric = table.parameters.sampling === 'regular-asymmetric';
    for (let h = 0; h < 2 * table.carrierPeriodsPerFundamental; h++) {
      const start = h * full;
      const update = asymmetric ? h : Math.floor(h / 2);
      const c = valueAt(update);
      // Down-counting half (counter P → 0): below the value once it falls under c, above
      // full − c until it does; the up-counting half mirrors each.
      const late = (h % 2 === 0) === (sense[entryOf(update)] !== 'above');
      raw.push(late ? [start + full - c, start + full] : [start, start + c]);
    }
  }
  return mergeCyclic(raw, period);
}

/**
 * A leg's voltage from its switches' on-intervals and the current's sign. While neither switch is
 * on, the diode the current forces on sets the leg (out of the leg, > 0: the lower diode, the
 * negative rail; into it: the upper). The conducting device's on-state drop opposes the current:
 * out of the leg the leg sits a transistor drop below the positive rail or a diode drop below the
 * negative one; into the leg a diode drop above the positive rail or a transistor drop above the
 * negative one.
 */
function legWaveform(
  high: readonly Interval[],
  low: readonly Interval[],
  crossings: readonly number[],
  period: number,
  leg: {
    vdc: number;
    sign: (theta: number) => number;
    drops: { transistor: number; diode: number };
  },
): Waveform {
  const { vdc, sign, drops } = leg;
  const points = [0, ...high.flat(), ...low.flat(), ...crossings]
    .filter((t) => t >= 0 && t < period)
    .sort((a, b) => a - b);
  const breaks: number[] = [];
  for (const t of points)
    if (breaks.length === 0 || t - (breaks[breaks.length - 1] as number) > TICK_TOLERANCE)
      breaks.push(t);
  const transitions: Transition[] = breaks.map((t, i) => {
    const next = i + 1 < breaks.length ? (breaks[i + 1] as number) : period + (breaks[0] as number);
    const middle = ((t + next) / 2) % period;
    const highOn = insidePieces(high, middle);
    const lowOn = insidePieces(low, middle);
    if (highOn && lowOn)
      throw new Error(`internal error: both switches of a leg on at tick ${middle}`);
    const s = sign((TAU * middle) / period);
    // Which rail the leg is on: the switch that is on, else the diode the current forces on.
    const upper = highOn || (!lowOn && s < 0);
    const lower = lowOn || (!highOn && s > 0);
    // The conducting device: a transistor when its switch is on and the current goes its way.
    const transistor = (highOn && s > 0) || (lowOn && s < 0);
    const drop = s === 0 ? 0 : transistor ? drops.transistor : drops.diode;
    const level = upper
      ? vdc / 2 - Math.sign(s) * drop
      : lower
        ? -vdc / 2 - Math.sign(s) * drop
        : 0;
    return { angle: (TAU * t) / period, level };
  });
  return waveformFromTransitions(transitions);
}

function outputsOf(
  table: TimerTable,
  legs: Waveform[],
): { outputs: Waveform[]; outputNames: string[] } {
  const { modulation } = table.parameters;
  const [a, b, c] = legs as [Waveform, Waveform, Waveform];
  if (modulation.method === 'three-phase') {
    return {
      outputs: [subtractWaveforms(a, b), subtractWaveforms(b, c), subtractWaveforms(c, a)],
      outputNames: ['vab', 'vbc', 'vca'],
    };
  }
  if (modulation.scheme === 'bipolar') {
    // Leg B's switches are leg A's complement, so vB = −vA at every instant (dead time too:
    // leg B carries the opposite current): vAB = 2·vA.
    return {
      outputs: [{ edges: [...a.edges], levels: a.levels.map((v) => 2 * v) }],
      outputNames: ['vAB'],
    };
  }
  return { outputs: [subtractWaveforms(a, b)], outputNames: ['vAB'] };
}
