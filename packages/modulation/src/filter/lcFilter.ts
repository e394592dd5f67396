import { TAU } from '../math.js';
import { ParameterRangeError } from '../validation/errors.js';
import { assertLcFilter } from './assertLcFilter.js';
import type { LcFilterOptions } from './LcFilterOptions.js';
import { lcFilterTransfer } from './lcFilterTransfer.js';

/** Figures of merit of an LC output filter; a plain serialisable object. */
export interface LcFilterCharacteristics {
  /** Undamped resonance of l with c, 1/(2π√(LC)), hertz. */
  resonanceFrequency: number;
  /** Characteristic impedance √(L/C), ohms. */
  characteristicImpedance: number;
  /**
   * Damping ratio ζ of the unloaded filter where it is second order: rDamping/(2Z₀) for
   * `'series-with-capacitor'`, Z₀/(2·rDamping) for `'parallel-with-inductor'`; `null` for
   * `'parallel-rc'` (third order; read `peakGain` instead).
   */
  dampingRatio: number | null;
  /** |H| at `resonanceFrequency`, with the load; `null` when infinite (undamped, unloaded). */
  gainAtResonance: number | null;
  /** Largest |H| over frequency, with the load (≥ 1); `null` when infinite. */
  peakGain: number | null;
  /** Frequency of `peakGain`, hertz; `null` when the gain is infinite. */
  peakFrequency: number | null;
}

const SCAN_POINTS = 801;
const SCAN_DECADES = 2;

/**
 * Resonance, characteristic impedance, damping and peaking of an LC output filter (standard
 * circuit analysis of the second-order LC divider: ω₀ = 1/√(LC), Z₀ = √(L/C); for the
 * series-R–C branch H = (1 + jωR_dC)/(1 − ω²LC + jωR_dC), so 2ζ/ω₀ = R_dC).
 *
 * The peak gain is found numerically: |H| on 801 log-spaced frequencies over f₀/100…100·f₀,
 * then golden-section refinement around the largest (relative frequency tolerance 1e−10).
 *
 * @param filter - the filter (henries, farads, ohms)
 * @throws ParameterRangeError / ParameterTypeError naming the field; also when valid but
 *   extreme values (e.g. subnormal l·c) would make a figure non-finite: it names `l`, `c`,
 *   `rDamping` or `loadR` instead of returning NaN or ∞
 */
export function lcFilter(filter: LcFilterOptions): LcFilterCharacteristics {
  assertLcFilter(filter);
  return assertFiniteCharacteristics(filter, characteristicsOf(filter));
}

/**
 * Returns `result` when every figure is finite or `null`; otherwise throws naming the option
 * furthest from 1 in orders of magnitude (l·c and l/c are checked by assertLcFilter already).
 */
function assertFiniteCharacteristics(
  filter: LcFilterOptions,
  result: LcFilterCharacteristics,
): LcFilterCharacteristics {
  const bad = (Object.keys(result) as (keyof LcFilterCharacteristics)[]).find((key) => {
    const value = result[key];
    return value !== null && !Number.isFinite(value);
  });
  if (bad === undefined) return result;
  const candidates: [string, number | undefined][] = [
    ['l', filter.l],
    ['c', filter.c],
    ['rDamping', filter.rDamping],
    ['cDamping', filter.cDamping],
    ['loadR', filter.loadR],
  ];
  const magnitude = (x: number | undefined): number =>
    x !== undefined && x > 0 ? Math.abs(Math.log10(x)) : -1;
  const [field, value] = candidates.reduce((a, b) => (magnitude(b[1]) > magnitude(a[1]) ? b : a));
  throw new ParameterRangeError(
    field,
    `a less extreme finite number (it makes ${bad} non-finite in double precision)`,
    value,
  );
}

function characteristicsOf(filter: LcFilterOptions): LcFilterCharacteristics {
  const { l, c, rDamping = 0, dampingPlacement = 'series-with-capacitor', loadR } = filter;
  const resonanceFrequency = 1 / (TAU * Math.sqrt(l * c));
  const characteristicImpedance = Math.sqrt(l / c);
  const dampingRatio =
    dampingPlacement === 'series-with-capacitor'
      ? rDamping / (2 * characteristicImpedance)
      : dampingPlacement === 'parallel-with-inductor'
        ? characteristicImpedance / (2 * rDamping)
        : null;
  const undamped =
    dampingPlacement === 'series-with-capacitor' && rDamping === 0 && loadR === undefined;
  if (undamped) {
    return {
      resonanceFrequency,
      characteristicImpedance,
      dampingRatio,
      gainAtResonance: null,
      peakGain: null,
      peakFrequency: null,
    };
  }
  const gain = (frequency: number): number => {
    const h = lcFilterTransfer(filter, TAU * frequency);
    return Math.hypot(h.re, h.im);
  };
  const peak = findPeak(gain, resonanceFrequency);
  return {
    resonanceFrequency,
    characteristicImpedance,
    dampingRatio,
    gainAtResonance: gain(resonanceFrequency),
    peakGain: peak.gain,
    peakFrequency: peak.frequency,
  };
}

/** Maximum of `gain` over f₀·10^[−2, 2]: a log scan, then golden section on log frequency. */
function findPeak(
  gain: (f: number) => number,
  centre: number,
): { gain: number; frequency: number } {
  const logAt = (k: number): number =>
    Math.log(centre) + Math.LN10 * SCAN_DECADES * ((2 * k) / (SCAN_POINTS - 1) - 1);
  let best = 0;
  let bestGain = gain(Math.exp(logAt(0)));
  for (let k = 1; k < SCAN_POINTS; k++) {
    const scanned = gain(Math.exp(logAt(k)));
    if (scanned > bestGain) {
      best = k;
      bestGain = scanned;
    }
  }
  // H(0) = 1 is the peak when the response falls monotonically (heavily damped).
  if (best === 0) return { gain: Math.max(1, gain(Math.exp(logAt(0)))), frequency: 0 };
  let low = logAt(Math.max(0, best - 1));
  let high = logAt(Math.min(SCAN_POINTS - 1, best + 1));
  const ratio = (Math.sqrt(5) - 1) / 2;
  let a = high - ratio * (high - low);
  let b = low + ratio * (high - low);
  let ga = gain(Math.exp(a));
  let gb = gain(Math.exp(b));
  while (high - low > 1e-10) {
    if (ga > gb) {
      high = b;
      b = a;
      gb = ga;
      a = high - ratio * (high - low);
      ga = gain(Math.exp(a));
    } else {
      low = a;
      a = b;
      ga = gb;
      b = low + ratio * (high - low);
      gb = gain(Math.exp(b));
    }
  }
  const frequency = Math.exp(0.5 * (low + high));
  return { gain: gain(frequency), frequency };
}
