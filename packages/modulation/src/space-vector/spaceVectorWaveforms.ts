import { EDGE_EPSILON, HALF_PI, TAU } from '../math.js';
import { assertNumberInRange, assertOneOf } from '../validation/assertions.js';
import { starVoltages } from '../three-phase/starVoltages.js';
import type { Waveform } from '../waveform/Waveform.js';
import { waveformFromTransitions, type Transition } from '../waveform/waveformFromTransitions.js';
import { applyOvermodulation } from './applyOvermodulation.js';
import { halfPeriodSequence, type HalfPeriodOptions } from './halfPeriodSequence.js';
import { locateSector } from './locateSector.js';
import { OVERMODULATION_METHODS, overmodulationSetting } from './overmodulationSetting.js';
import { rationalFrequencyRatio } from './rationalFrequencyRatio.js';
import { spaceVector } from './spaceVector.js';
import { SPACE_VECTOR_SEQUENCES, ZERO_VECTOR_CLAMPINGS } from './spaceVectorSequence.js';
import { spaceVectorIndices } from './spaceVectorIndices.js';
import type {
  OvermodulationMethod,
  OvermodulationMode,
  SpaceVectorSequenceKind,
  SwitchingState,
  ZeroVectorClamping,
} from './spaceVectorTypes.js';

/** Most switching periods in one repeating span (bounds the edges, ≤ 6 per leg per period). */
export const MAX_SPACE_VECTOR_PERIODS = 100_000;

/** Regular sampling of the reference: once per switching period, or twice (each half). */
export type SpaceVectorSampling = 'symmetric' | 'asymmetric';

/** The space-vector samplings, in the order the API and the dashboard list them. */
export const SPACE_VECTOR_SAMPLINGS: readonly SpaceVectorSampling[] = ['symmetric', 'asymmetric'];

/** Options of {@link spaceVectorWaveforms}. Give exactly one of `m` and `ma`. */
export interface SpaceVectorWaveformOptions {
  /** Modulation index m = √3·|V1|/vdc, in [0, 2√3/π]; 1 ends the linear range. */
  m?: number;
  /** Or the carrier-style index ma = 2·|V1|/vdc = 2m/√3, in [0, 4/π]. */
  ma?: number;
  /** DC link voltage, volts, > 0; legs switch between +vdc/2 and −vdc/2. */
  vdc: number;
  /**
   * Switching periods per fundamental period, ≥ 1; any ratio p/q with q ≤
   * `maxFundamentalPeriods` (see the returned `fundamentalOrder`).
   */
  frequencyRatio: number;
  /** @default 'seven-segment' */
  sequence?: SpaceVectorSequenceKind;
  /** @default 'symmetric' */
  sampling?: SpaceVectorSampling;
  /** Seven-segment share of t0 on '000'. @default 0.5 */
  zeroSplit?: number;
  /** Five-segment zero-vector choice. @default 'dpwm1' */
  clamping?: ZeroVectorClamping;
  /** Shaping beyond m = 1. @default 'two-mode' */
  overmodulation?: OvermodulationMethod;
  /** Largest q tried for a non-integer ratio p/q. @default 64 */
  maxFundamentalPeriods?: number;
}

/** The three-phase output of space-vector modulation over one repeating span. */
export interface SpaceVectorWaveforms {
  /** Leg-to-DC-midpoint voltages, levels ±vdc/2. */
  a: Waveform;
  b: Waveform;
  c: Waveform;
  /** Line-to-line voltages a − b, b − c, c − a, levels 0 and ±vdc. */
  ab: Waveform;
  bc: Waveform;
  ca: Waveform;
  /** Phase voltages of a balanced star load, a − (a + b + c)/3 etc.: 0, ±vdc/3, ±2vdc/3. */
  an: Waveform;
  bn: Waveform;
  cn: Waveform;
  /** The modulation index used, m, and the same as ma = 2m/√3. */
  m: number;
  ma: number;
  /** Overmodulation mode for this m. */
  mode: OvermodulationMode;
  /**
   * Fundamental periods in the span the waveforms cover (q); the fundamental is harmonic order
   * `fundamentalOrder` of these waveforms, and orders that are not multiples of it are
   * sub-harmonics of the fundamental. 1 for an integer frequency ratio.
   */
  fundamentalOrder: number;
  /** Switching periods in the span, N = fundamentalOrder · frequencyRatio. */
  switchingPeriods: number;
}

/**
 * Three-phase space-vector PWM, regular sampled, as exact waveforms (no time sampling).
 *
 * Reference: phase a (m·vdc/√3)·sin θ, b and c lagging by 2π/3 and 4π/3 (positive sequence), so
 * its space vector has angle θ − π/2 and a harmonic phase of 0 means "in phase with the
 * reference", as elsewhere in the library. Switching period k spans [k, k + 1)·2π/N of the
 * span. Sampling `'symmetric'` takes one sample at the period's start, used for the whole
 * symmetric sequence (the pulse is centred half a period later: S. R. Bowes, Proc. IEE, 1975,
 * regular sampling); `'asymmetric'` takes a second sample at the middle, used for the second
 * half. Each sample goes through the overmodulation shaping (none for m ≤ 1), then
 * {@link spaceVector} and the 7- or 5-segment sequence; so the volt-seconds of each (half)
 * period equal the sampled reference's (van der Broeck et al., IEEE Trans. Ind. Appl., 1988;
 * Holmes and Lipo 2003, ch. 5).
 *
 * Samples on the π/6 grid (every sector middle when N is a multiple of 6, every boundary when
 * it is a multiple of 12, and θ = 0 always) follow the one rule of {@link spaceVectorSequence}:
 * the later sector, the second half. With N a multiple of 3 the three legs are then exactly one
 * waveform 2π/3 apart (no triplen line harmonics), and with N even and DPWM0–3 the waveforms
 * are half-wave symmetric (no even harmonics). DPWMMIN/MAX are not half-wave symmetric
 * (DPWMMAX at θ + π is DPWMMIN at θ negated), nor is the seven-segment sequence at even N (it
 * equals carrier PWM with min-max injection, even sidebands included).
 *
 * Non-integer frequency ratio: the pattern repeats only after q fundamental periods, where q is
 * the smallest integer (≤ maxFundamentalPeriods) making N = q·frequencyRatio whole (to 1e−9).
 * The returned waveforms cover that whole span on [0, 2π); their order-q harmonic is the
 * fundamental and other orders n are at n/q of the fundamental frequency. Exact for any
 * rational ratio; an irrational one (no finite span) throws.
 *
 * @throws ParameterRangeError naming the field (`m`, `ma`, `vdc`, `frequencyRatio`, …)
 */
export function spaceVectorWaveforms(options: SpaceVectorWaveformOptions): SpaceVectorWaveforms {
  const { a, b, c, ...indicesAndSpan } = spaceVectorLegs(options);
  const star = starVoltages([a, b, c]);
  // The fields in the order they always had (legs, lines, phases, then the indices and span).
  return {
    a,
    b,
    c,
    ab: star.lines[0],
    bc: star.lines[1],
    ca: star.lines[2],
    an: star.phases[0],
    bn: star.phases[1],
    cn: star.phases[2],
    ...indicesAndSpan,
  };
}

/** What {@link spaceVectorLegs} gives: the legs and the span, without the star's voltages. */
export type SpaceVectorLegs = Omit<SpaceVectorWaveforms, 'ab' | 'bc' | 'ca' | 'an' | 'bn' | 'cn'>;

/**
 * The legs of {@link spaceVectorWaveforms} alone, with its indices and span, for a caller that
 * combines them itself (the design report, through `starVoltages`). Internal: not in the
 * package's exports.
 * @throws ParameterRangeError as {@link spaceVectorWaveforms}
 */
export function spaceVectorLegs({
  m,
  ma,
  vdc,
  frequencyRatio,
  sequence = 'seven-segment',
  sampling = 'symmetric',
  zeroSplit = 0.5,
  clamping = 'dpwm1',
  overmodulation = 'two-mode',
  maxFundamentalPeriods = 64,
}: SpaceVectorWaveformOptions): SpaceVectorLegs {
  const { m: index, ma: maUsed } = spaceVectorIndices({ m, ma });
  assertNumberInRange('vdc', vdc, { min: 0, minExclusive: true });
  assertOneOf('sequence', sequence, SPACE_VECTOR_SEQUENCES);
  assertOneOf('sampling', sampling, SPACE_VECTOR_SAMPLINGS);
  assertNumberInRange('zeroSplit', zeroSplit, { min: 0, max: 1 });
  assertOneOf('clamping', clamping, ZERO_VECTOR_CLAMPINGS);
  assertOneOf('overmodulation', overmodulation, OVERMODULATION_METHODS);
  assertNumberInRange('maxFundamentalPeriods', maxFundamentalPeriods, {
    min: 1,
    max: 10_000,
    integer: true,
  });
  const span = rationalFrequencyRatio(
    frequencyRatio,
    maxFundamentalPeriods,
    MAX_SPACE_VECTOR_PERIODS,
  );
  const setting = overmodulationSetting(index, { method: overmodulation });
  const options: HalfPeriodOptions = { sequence, zeroSplit, clamping };
  const { switchingPeriods: n, fundamentalPeriods: q } = span;
  // First half of the sequence for a sample at fraction `cycle` of the fundamental period. The
  // sector, its half and the dwell times all come from the vector actually applied (after any
  // overmodulation shaping), each located by the one rule of locateSector.
  const halfAt = (cycle: number) => {
    const applied = applyOvermodulation(setting, TAU * cycle - HALF_PI);
    return halfPeriodSequence(
      spaceVector(applied),
      locateSector(applied.theta).secondHalf,
      options,
    );
  };
  const legs: Transition[][] = [[], [], []];
  const width = TAU / n;
  for (let k = 0; k < n; k++) {
    const first = halfAt(((q * k) % n) / n);
    const second = sampling === 'symmetric' ? first : halfAt(((2 * q * k + q) % (2 * n)) / (2 * n));
    const states = [...first.states, ...[...second.states].reverse()];
    const durations = [...first.durations, ...[...second.durations].reverse()];
    let elapsed = 0;
    states.forEach((state, i) => {
      const duration = durations[i] as number;
      // A segment too short to be an edge is left out rather than pushed: pushed, rounding
      // could place it a hair after the next period's first transition, where it would win.
      if (duration * width >= EDGE_EPSILON)
        pushState(legs, k * width + elapsed * width, state, vdc);
      elapsed += duration;
    });
  }
  const [a, b, c] = legs.map((transitions) => waveformFromTransitions(transitions)) as [
    Waveform,
    Waveform,
    Waveform,
  ];
  return {
    a,
    b,
    c,
    m: index,
    ma: maUsed,
    mode: setting.mode,
    fundamentalOrder: q,
    switchingPeriods: n,
  };
}

function pushState(legs: Transition[][], angle: number, state: SwitchingState, vdc: number): void {
  for (let leg = 0; leg < 3; leg++) {
    (legs[leg] as Transition[]).push({ angle, level: state[leg] === '1' ? vdc / 2 : -vdc / 2 });
  }
}
