import { TAU } from '../math.js';
import { buildSheWaveform } from '../she/buildSheWaveform.js';
import { SHE_KINDS, type SheKind } from '../she/SheKind.js';
import { assertFirstQuarterAngles, assertOddOrders } from '../she/validateShe.js';
import { harmonics } from '../spectrum/harmonics.js';
import { assertNumberInRange, assertOneOf } from '../validation/assertions.js';
import { ParameterRangeError, ParameterTypeError } from '../validation/errors.js';
import { combineWaveforms } from '../waveform/combineWaveforms.js';
import type { Waveform } from '../waveform/Waveform.js';
import { waveformFromTransitions, type Transition } from '../waveform/waveformFromTransitions.js';

/** A stored programmed pattern: first-quarter angles of a {@link SheKind} pattern. */
export interface StoredPattern {
  kind: SheKind;
  /** DC source voltage, volts (> 0): the bipolar bus, or each staircase cell's source. */
  vdc: number;
  /** First-quarter angles, radians, strictly ascending in (0, π/2). */
  angles: number[];
}

/** Options of {@link patternCompareEvents}. */
export interface PatternCompareEventsOptions {
  /** Fundamental (output) frequency, Hz (> 0). */
  fundamentalFrequency: number;
  /** Timer input clock after the prescaler, Hz (> 0). */
  timerClock: number;
  /** Dead time before each device turns on, seconds (≥ 0). @default 0 */
  deadTime?: number;
  /**
   * Lag of the load current behind sin θ, radians: the current sin(θ − currentAngle) flows out
   * of leg A (of every cell) into the load and back into leg B. Only its sign at each edge
   * matters. @default 0
   */
  currentAngle?: number;
  /** Odd orders ≥ 3 whose amplitudes are reported (the eliminated ones). @default [] */
  orders?: number[];
}

/** One change of a device's gate command. */
export interface CompareEvent {
  /** Timer ticks from the start of the fundamental period, 0..ticksPerPeriod − 1. */
  tick: number;
  /** The gate command from this tick on. */
  state: 'on' | 'off';
}

/** The gate commands of one switching device over one fundamental period. */
export interface DeviceEvents {
  /** For example `leg A high side` or `cell 2 leg B low side`. */
  device: string;
  /** Events in ascending tick order. */
  events: CompareEvent[];
}

/** One output voltage's fundamental and reported orders, peak volts. */
export interface PatternOutputFigures {
  /** Fundamental in phase with sin θ, peak volts (b₁). */
  fundamental: number;
  /** Each order's amplitude, peak volts, and its ratio to |fundamental| (null when the fundamental is zero, e.g. every edge rounded onto one tick). */
  orders: { order: number; amplitude: number; relative: number | null }[];
}

/** The outcome of {@link patternCompareEvents}. */
export interface PatternCompareEvents {
  /** round(timerClock / fundamentalFrequency). */
  ticksPerPeriod: number;
  /** timerClock / ticksPerPeriod, Hz. */
  realisedFundamentalFrequency: number;
  /** Dead time in ticks, rounded up (never shorter than asked). */
  deadTimeTicks: number;
  /** deadTimeTicks / timerClock, s. */
  realisedDeadTime: number;
  devices: DeviceEvents[];
  /** The exact angles, ideal switches. */
  ideal: PatternOutputFigures;
  /** Edges at the nearest timer ticks, no dead time. */
  quantised: PatternOutputFigures;
  /** Edges at the ticks with the dead time, the leg following the current while both devices are off. */
  realised: PatternOutputFigures;
  /** realised − quantised fundamental, V: the dead-time effect. */
  deadTimeFundamentalChange: number;
  /** The output with dead time (bridge output, or the sum of the cells). */
  realisedWaveform: Waveform;
  /** Pulses shorter than the dead time, in words. */
  warnings: string[];
  /** The conventions, one sentence each. */
  conventions: string[];
}

/** A leg's ideal high intervals, radians: [start, end) with end possibly past 2π. */
interface Leg {
  name: string;
  /** +1 when the load current flows out of this leg, −1 into it. */
  currentSign: 1 | -1;
  high: [number, number][];
}

/**
 * The compare events of every switching device over one fundamental period for a stored
 * quarter-wave pattern, like a carrier timer table's, and what timer rounding and dead time do
 * to the output, on the library's exact spectrum.
 *
 * Legs (common practice, from memory): a bipolar pattern drives an H-bridge whose leg A is high
 * while the pattern is +vdc and leg B is its complement; a staircase of N cells drives cell k's
 * leg A high on [α_k, π + α_k) and leg B high on [π − α_k, 2π − α_k), so the cell gives +vdc,
 * 0, −vdc, 0 with each leg switching once per half period (fundamental switching), and the
 * cells' outputs add. Each edge is rounded to the nearest tick of a timer counting the
 * fundamental period; a device turns on `deadTicks` after its partner turns off. While both
 * devices of a leg are off, the leg follows the load current's diode: low when the current
 * flows out of the leg, high when it flows in (the average-value picture of Murai et al., IEEE
 * Trans. Ind. Appl. 1987, made exact edge by edge), with the current's sign taken at the edge.
 * A pulse shorter than the dead time, or rounded to zero width, vanishes and is named in
 * `warnings`.
 *
 * @throws ParameterRangeError / ParameterTypeError naming the field: `kind`, `vdc`, `angles`,
 *   `fundamentalFrequency`, `timerClock` (fewer than 4 or more than 2^32 − 1 ticks a period),
 *   `deadTime` (negative, or a tenth of the period or more), `currentAngle`, `orders`
 */
export function patternCompareEvents(
  pattern: StoredPattern,
  options: PatternCompareEventsOptions,
): PatternCompareEvents {
  if (typeof pattern !== 'object' || pattern === null) {
    throw new ParameterTypeError('pattern', 'an object { kind, vdc, angles }', pattern);
  }
  const { kind, vdc, angles } = pattern;
  assertOneOf('kind', kind, SHE_KINDS);
  assertNumberInRange('vdc', vdc, { min: 0, minExclusive: true });
  assertFirstQuarterAngles('angles', angles);
  const { fundamentalFrequency, timerClock, deadTime = 0, currentAngle = 0, orders = [] } = options;
  assertNumberInRange('fundamentalFrequency', fundamentalFrequency, {
    min: 0,
    minExclusive: true,
    max: 1e6,
  });
  assertNumberInRange('timerClock', timerClock, { min: 0, minExclusive: true, max: 1e12 });
  const ticksPerPeriod = Math.round(timerClock / fundamentalFrequency);
  if (ticksPerPeriod < 4 || ticksPerPeriod > 2 ** 32 - 1) {
    throw new ParameterRangeError(
      'timerClock',
      `a clock giving 4 to 2^32 − 1 ticks per fundamental period at ${fundamentalFrequency} Hz`,
      timerClock,
    );
  }
  const period = ticksPerPeriod / timerClock;
  assertNumberInRange('deadTime', deadTime, { min: 0, max: period / 10, maxExclusive: true });
  assertNumberInRange('currentAngle', currentAngle, { min: -1e6, max: 1e6 });
  assertOddOrders('orders', orders);
  const deadTicks = Math.ceil(deadTime * timerClock - 1e-9);
  const legs = patternLegs(kind, vdc, angles);
  const toTick = (angle: number) => Math.round((angle / TAU) * ticksPerPeriod);
  const warnings: string[] = [];
  const devices: DeviceEvents[] = [];
  const quantisedLegs: Waveform[] = [];
  const realisedLegs: Waveform[] = [];
  for (const leg of legs) {
    const ticks = leg.high.map(([start, end]): [number, number] => [toTick(start), toTick(end)]);
    devices.push(...legDevices(leg.name, ticks, deadTicks, ticksPerPeriod));
    quantisedLegs.push(legWaveform(ticks, ticksPerPeriod, vdc));
    const current = (tick: number) =>
      leg.currentSign * Math.sin((tick / ticksPerPeriod) * TAU - currentAngle);
    const realised = ticks
      .map(([rise, fall]): [number, number] => [
        rise + (current(rise) > 0 ? deadTicks : 0),
        fall + (current(fall) < 0 ? deadTicks : 0),
      ])
      .filter(([rise, fall], i) => {
        if (fall > rise) return true;
        const [start, end] = ticks[i] as [number, number];
        const why =
          end === start ? 'rounds to zero width on the timer' : 'is shorter than the dead time';
        warnings.push(
          `${leg.name}: the pulse at tick ${start % ticksPerPeriod} ${why} and vanishes`,
        );
        return false;
      });
    realisedLegs.push(legWaveform(realised, ticksPerPeriod, vdc));
  }
  const output = (legWaveforms: Waveform[]) =>
    combineWaveforms(legWaveforms, (levels) => {
      let sum = 0;
      for (let i = 0; i < levels.length; i += 2)
        sum += (levels[i] as number) - (levels[i + 1] as number);
      return sum;
    });
  const maxOrder = Math.max(1, ...orders);
  const figures = (waveform: Waveform): PatternOutputFigures => {
    const spectrum = harmonics(waveform, maxOrder);
    const first = spectrum[1] as { amplitude: number; phase: number };
    const fundamental = first.amplitude * Math.cos(first.phase);
    return {
      fundamental,
      orders: orders.map((order) => {
        const amplitude = spectrum[order]?.amplitude ?? 0;
        return {
          order,
          amplitude,
          relative: fundamental === 0 ? null : amplitude / Math.abs(fundamental),
        };
      }),
    };
  };
  const realisedWaveform = output(realisedLegs);
  const quantised = figures(output(quantisedLegs));
  const realised = figures(realisedWaveform);
  return {
    ticksPerPeriod,
    realisedFundamentalFrequency: timerClock / ticksPerPeriod,
    deadTimeTicks: deadTicks,
    realisedDeadTime: deadTicks / timerClock,
    devices,
    ideal: figures(buildSheWaveform(kind, vdc, angles)),
    quantised,
    realised,
    deadTimeFundamentalChange: realised.fundamental - quantised.fundamental,
    realisedWaveform,
    warnings,
    conventions: [
      'Ticks count from the start of the fundamental period (theta = 0, the rising zero crossing of sin theta).',
      'Each edge is rounded to the nearest tick; a device turns on the dead time after its partner turns off.',
      'While both devices of a leg are off, the leg is low if the load current flows out of it and high if it flows in.',
      kind === 'bipolar'
        ? 'Bipolar: leg A is high while the pattern is +vdc; leg B is its complement.'
        : 'Staircase: cell k leg A is high on [alpha_k, pi + alpha_k), leg B on [pi - alpha_k, 2 pi - alpha_k); the cells add.',
    ],
  };
}

/** The legs and their ideal high intervals (radians) for a pattern. */
function patternLegs(kind: SheKind, vdc: number, angles: readonly number[]): Leg[] {
  if (kind === 'staircase') {
    return angles.flatMap((alpha, k): Leg[] => [
      { name: `cell ${k + 1} leg A`, currentSign: 1, high: [[alpha, Math.PI + alpha]] },
      { name: `cell ${k + 1} leg B`, currentSign: -1, high: [[Math.PI - alpha, TAU - alpha]] },
    ]);
  }
  const { edges, levels } = buildSheWaveform(kind, vdc, angles);
  const highA: [number, number][] = [];
  const highB: [number, number][] = [];
  edges.forEach((edge, i) => {
    const end = i + 1 < edges.length ? (edges[i + 1] as number) : (edges[0] as number) + TAU;
    ((levels[i] as number) > 0 ? highA : highB).push([edge, end]);
  });
  return [
    { name: 'leg A', currentSign: 1, high: mergeWrapped(highA) },
    { name: 'leg B', currentSign: -1, high: mergeWrapped(highB) },
  ];
}

/** Joins an interval ending at 2π with one starting at 0 (the waveform's edge at 0 splits it). */
function mergeWrapped(intervals: [number, number][]): [number, number][] {
  const first = intervals[0];
  const last = intervals[intervals.length - 1];
  if (
    intervals.length > 1 &&
    first !== undefined &&
    last !== undefined &&
    first[0] === 0 &&
    last[1] === TAU
  ) {
    return [...intervals.slice(1, -1), [last[0], TAU + first[1]]];
  }
  return intervals;
}

/** High-side and low-side gate events of one leg from its high intervals in ticks. */
function legDevices(
  name: string,
  high: [number, number][],
  deadTicks: number,
  ticksPerPeriod: number,
): DeviceEvents[] {
  const wrap = (tick: number) => ((tick % ticksPerPeriod) + ticksPerPeriod) % ticksPerPeriod;
  const sorted = (events: CompareEvent[]) => events.sort((a, b) => a.tick - b.tick);
  return [
    {
      device: `${name} high side`,
      events: sorted(
        high.flatMap(([rise, fall]): CompareEvent[] => [
          { tick: wrap(rise + deadTicks), state: 'on' },
          { tick: wrap(fall), state: 'off' },
        ]),
      ),
    },
    {
      device: `${name} low side`,
      events: sorted(
        high.flatMap(([rise, fall]): CompareEvent[] => [
          { tick: wrap(fall + deadTicks), state: 'on' },
          { tick: wrap(rise), state: 'off' },
        ]),
      ),
    },
  ];
}

/** A leg's voltage to the negative rail (0 or vdc) from high intervals in ticks, exact. */
function legWaveform(high: [number, number][], ticksPerPeriod: number, vdc: number): Waveform {
  if (high.length === 0) return { edges: [0], levels: [0] };
  const transitions: Transition[] = [];
  const toAngle = (tick: number) => (tick / ticksPerPeriod) * TAU;
  // Intervals are disjoint and ascending; a realised one may reach past the next start (the dead
  // time filled a short low gap): the later start then wins, which keeps the leg high through it.
  const ordered = [...high].sort((a, b) => a[0] - b[0]);
  ordered.forEach(([rise, fall], i) => {
    const next = ordered[(i + 1) % ordered.length] as [number, number];
    const nextRise = i + 1 < ordered.length ? next[0] : next[0] + ticksPerPeriod;
    transitions.push({ angle: toAngle(rise), level: vdc });
    if (fall < nextRise) transitions.push({ angle: toAngle(fall), level: 0 });
  });
  return waveformFromTransitions(transitions);
}
