import { TAU } from '../math.js';
import type { Harmonic } from '../spectrum/Harmonic.js';
import { thd } from '../spectrum/thd.js';
import { assertNumberInRange } from '../validation/assertions.js';
import { ParameterRangeError } from '../validation/errors.js';
import { assertLcFilter } from './assertLcFilter.js';
import type { LcFilterOptions } from './LcFilterOptions.js';
import { filteredSpectrum } from './filteredSpectrum.js';

/** Options of {@link sizeFilterInductance}: the filter without `l`, and the target. */
export interface SizeFilterInductanceOptions extends Omit<LcFilterOptions, 'l'> {
  /** Frequency of order 1, hertz, > 0. */
  fundamentalFrequency: number;
  /** Largest allowed THD after the filter, a ratio > 0 (0.05, not 5). @default none */
  maxThd?: number;
  /** Largest allowed single harmonic (order ≥ 2) over the filtered fundamental, a ratio > 0. @default none */
  maxIndividual?: number;
  /** Largest inductance searched, henries. @default the L that puts resonance at 2× the fundamental */
  lMax?: number;
  /** Smallest inductance searched, henries, < lMax. @default lMax·1e−8 */
  lMin?: number;
}

/** The smallest inductance that meets the target, with the filtered figures it gives. */
export interface FilterInductanceSizing {
  /** Henries. */
  l: number;
  /** 1/(2π√(LC)) with that l, hertz. */
  resonanceFrequency: number;
  /** THD after the filter, a ratio, over the orders the spectrum holds. */
  thd: number;
  /** Largest harmonic (order ≥ 2) over the filtered fundamental, a ratio. */
  worstIndividual: number;
  /** The order of `worstIndividual`. */
  worstOrder: number;
  /** |H| at the fundamental: the output fundamental over the input's, a ratio. */
  fundamentalGain: number;
}

/** Grid points per decade of the first pass; bisection then refines. */
const POINTS_PER_DECADE = 40;

/**
 * Sizes an LC output filter: the smallest series inductance, for the given capacitance and
 * damping, whose filtered spectrum ({@link filteredSpectrum}) meets `maxThd` and/or
 * `maxIndividual` (for example IEEE Std 519 voltage limits, 0.08 and 0.05; confirm the edition
 * and the local utility's rules).
 *
 * Method: |H| is evaluated on a log grid of 40 points per decade from lMin to lMax, the first
 * grid point that meets the target is taken, and the boundary is refined by bisection on log L
 * to a relative 1e−10. The metrics need not fall monotonically with L (resonance can lift a
 * low-order harmonic); the grid makes the result the smallest passing L to grid resolution.
 *
 * @param spectrum - the inverter's voltage harmonics (peak volts), with order 1 present
 * @param options - filter without `l` (farads, ohms), `fundamentalFrequency` (hertz) and target
 * @throws ParameterRangeError naming the target field when even lMax does not meet it
 */
export function sizeFilterInductance(
  spectrum: readonly Harmonic[],
  options: SizeFilterInductanceOptions,
): FilterInductanceSizing {
  const {
    fundamentalFrequency,
    maxThd,
    maxIndividual,
    lMax: lMaxOption,
    lMin: lMinOption,
    ...rest
  } = options ?? ({} as SizeFilterInductanceOptions);
  assertNumberInRange('fundamentalFrequency', fundamentalFrequency, { min: 0, minExclusive: true });
  assertNumberInRange('c', rest.c, { min: 0, minExclusive: true });
  if (maxThd === undefined && maxIndividual === undefined) {
    throw new ParameterRangeError(
      'maxThd',
      'a ratio > 0 (give maxThd, maxIndividual or both)',
      undefined,
    );
  }
  if (maxThd !== undefined) assertNumberInRange('maxThd', maxThd, { min: 0, minExclusive: true });
  if (maxIndividual !== undefined)
    assertNumberInRange('maxIndividual', maxIndividual, { min: 0, minExclusive: true });
  const lMax = lMaxOption ?? 1 / ((TAU * 2 * fundamentalFrequency) ** 2 * rest.c);
  assertNumberInRange('lMax', lMax, { min: 0, minExclusive: true });
  const lMin = lMinOption ?? lMax * 1e-8;
  assertNumberInRange('lMin', lMin, { min: 0, max: lMax, minExclusive: true, maxExclusive: true });
  assertLcFilter({ ...rest, l: lMax });

  const evaluate = (l: number): FilterInductanceSizing => {
    const filtered = filteredSpectrum(spectrum, { filter: { ...rest, l }, fundamentalFrequency });
    const fundamental = filtered.find((h) => h.order === 1);
    const input = spectrum.find((h) => h.order === 1);
    let worstIndividual = 0;
    let worstOrder = 0;
    for (const h of filtered) {
      if (h.order < 2 || fundamental === undefined) continue;
      const ratio = h.amplitude / fundamental.amplitude;
      if (ratio > worstIndividual) {
        worstIndividual = ratio;
        worstOrder = h.order;
      }
    }
    return {
      l,
      resonanceFrequency: 1 / (TAU * Math.sqrt(l * rest.c)),
      thd: thd(filtered),
      worstIndividual,
      worstOrder,
      fundamentalGain: (fundamental?.amplitude ?? NaN) / (input?.amplitude ?? NaN),
    };
  };
  const meets = (s: FilterInductanceSizing): boolean =>
    (maxThd === undefined || s.thd <= maxThd) &&
    (maxIndividual === undefined || s.worstIndividual <= maxIndividual);

  const steps = Math.max(1, Math.ceil(Math.log10(lMax / lMin) * POINTS_PER_DECADE));
  const lAt = (k: number): number => lMin * (lMax / lMin) ** (k / steps);
  let previous = lMin;
  for (let k = 0; k <= steps; k++) {
    const l = k === steps ? lMax : lAt(k);
    const sizing = evaluate(l);
    if (meets(sizing)) return k === 0 ? sizing : bisect(previous, l, evaluate, meets);
    previous = l;
  }
  const best = evaluate(lMax);
  const field = maxThd !== undefined && best.thd > maxThd ? 'maxThd' : 'maxIndividual';
  const reached = field === 'maxThd' ? best.thd : best.worstIndividual;
  throw new ParameterRangeError(
    field,
    `a target reachable with l ≤ lMax = ${lMax} H (that inductance gives ${reached})`,
    field === 'maxThd' ? maxThd : maxIndividual,
  );
}

/** Bisection on log L between a failing `low` and a passing `high`; returns the passing end. */
function bisect(
  low: number,
  high: number,
  evaluate: (l: number) => FilterInductanceSizing,
  meets: (s: FilterInductanceSizing) => boolean,
): FilterInductanceSizing {
  let passing = evaluate(high);
  while (high / low - 1 > 1e-10) {
    const middle = Math.sqrt(low * high);
    const sizing = evaluate(middle);
    if (meets(sizing)) {
      high = middle;
      passing = sizing;
    } else low = middle;
  }
  return passing;
}
