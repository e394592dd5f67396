import { sineTriangle } from '../carrier/sineTriangle.js';
import { sizeFilterInductance } from '../filter/sizeFilterInductance.js';
import type { DampingPlacement } from '../filter/LcFilterOptions.js';
import { harmonics } from '../spectrum/harmonics.js';
import { ParameterRangeError, ParameterTypeError } from '../validation/errors.js';
import { assertFiniteArray, assertNumberInRange, assertOneOf } from '../validation/assertions.js';
import type { LossOperatingPoint, SemiconductorDevice, SemiconductorLosses } from './lossTypes.js';
import { rippleInductance } from './rippleInductance.js';
import { semiconductorLosses } from './semiconductorLosses.js';
import { semiconductorLossesByIntegration } from './semiconductorLossesByIntegration.js';

/** The filter requirement that sets the inductance at each frequency. */
export type InductanceTarget =
  | {
      /** Peak-to-peak current ripple bound ({@link rippleInductance}). */
      target: 'ripple';
      /** Largest peak-to-peak ripple, A. */
      ripple: number;
    }
  | {
      /**
       * THD after an LC filter (H-bridge only): the natural-sampled sine-triangle spectrum
       * at mf = f/fundamentalFrequency, sized by the filter module's `sizeFilterInductance`.
       */
      target: 'thd';
      /** Largest THD after the filter, ratio. */
      maxThd: number;
      /** Filter capacitance, F. */
      c: number;
      rDamping?: number;
      dampingPlacement?: DampingPlacement;
      cDamping?: number;
      loadR?: number;
      /** Highest order of the spectrum. @default 3·mf + 10 */
      maxOrder?: number;
    };

/** Options of {@link switchingFrequencyTradeoff}. */
export interface SwitchingFrequencyTradeoffOptions extends Omit<
  LossOperatingPoint,
  'switchingFrequency'
> {
  device: SemiconductorDevice;
  filter: InductanceTarget;
  /** H-bridge scheme (sets the ripple bound and the THD spectrum). @default 'bipolar' */
  scheme?: 'bipolar' | 'unipolar';
  /** Fundamental frequency, Hz (THD target; loss integration for 'min-max'/overmodulation). @default 50 */
  fundamentalFrequency?: number;
}

/** Series for a chart: one entry per frequency, in the order given. */
export interface SwitchingFrequencyTradeoff {
  /** Carrier frequencies, Hz. */
  frequencies: number[];
  /** Semiconductor losses of the whole converter, W. */
  totalLoss: number[];
  conductionLoss: number[];
  switchingLoss: number[];
  /** Efficiency ratio (null where no power flows to the load). */
  efficiency: (number | null)[];
  /** Inductance meeting the filter target, H. */
  inductance: number[];
}

/**
 * The switching-frequency trade-off: semiconductor losses rising with the carrier frequency
 * ({@link semiconductorLosses}, closed form; by integration for 'min-max', the clamps or
 * beyond the linear range) against the output-filter inductance the target needs, which falls with it.
 *
 * @param frequencies - carrier frequencies, Hz, 1 to 1000 values
 */
export function switchingFrequencyTradeoff(
  frequencies: readonly number[],
  options: SwitchingFrequencyTradeoffOptions,
): SwitchingFrequencyTradeoff {
  assertFiniteArray('frequencies', frequencies, 1, 1000);
  frequencies.forEach((f, i) =>
    assertNumberInRange(`frequencies[${i}]`, f, { min: 0, minExclusive: true, max: 1e8 }),
  );
  const { device, filter, scheme = 'bipolar', fundamentalFrequency = 50, ...point } = options;
  assertOneOf('scheme', scheme, ['bipolar', 'unipolar'] as const);
  if (typeof filter !== 'object' || filter === null) {
    throw new ParameterTypeError('filter', "an object { target: 'ripple' | 'thd', ... }", filter);
  }
  assertOneOf('filter.target', filter.target, ['ripple', 'thd'] as const);
  const topology = point.topology ?? 'three-phase';
  if (filter.target === 'thd' && topology !== 'h-bridge') {
    throw new ParameterRangeError(
      'filter.target',
      "'ripple' for topology 'three-phase' (the THD target is sized on the H-bridge spectrum)",
      filter.target,
    );
  }
  const zeroSequence = point.zeroSequence ?? 'none';
  const linear =
    (zeroSequence === 'none' || zeroSequence === 'third-harmonic' || topology === 'h-bridge') &&
    point.ma <= (zeroSequence === 'none' || topology === 'h-bridge' ? 1 : 2 / Math.sqrt(3));
  const series: SwitchingFrequencyTradeoff = {
    frequencies: [...frequencies],
    totalLoss: [],
    conductionLoss: [],
    switchingLoss: [],
    efficiency: [],
    inductance: [],
  };
  frequencies.forEach((switchingFrequency, index) => {
    const operatingPoint = {
      ...point,
      zeroSequence: topology === 'h-bridge' ? ('none' as const) : zeroSequence,
      switchingFrequency,
    };
    const losses: SemiconductorLosses = linear
      ? semiconductorLosses(device, operatingPoint)
      : semiconductorLossesByIntegration(device, { ...operatingPoint, fundamentalFrequency });
    series.totalLoss.push(losses.total);
    series.conductionLoss.push(losses.conduction);
    series.switchingLoss.push(losses.switching);
    series.efficiency.push(losses.efficiency);
    series.inductance.push(
      inductanceFor(filter, {
        switchingFrequency,
        index,
        vdc: point.vdc,
        ma: point.ma,
        scheme,
        topology,
        fundamentalFrequency,
      }),
    );
  });
  return series;
}

function inductanceFor(
  filter: InductanceTarget,
  at: {
    switchingFrequency: number;
    index: number;
    vdc: number;
    ma: number;
    scheme: 'bipolar' | 'unipolar';
    topology: string;
    fundamentalFrequency: number;
  },
): number {
  if (filter.target === 'ripple') {
    const bridge = at.topology === 'h-bridge' ? at.scheme : 'half-bridge';
    return rippleInductance({
      vdc: at.vdc,
      switchingFrequency: at.switchingFrequency,
      ripple: filter.ripple,
      bridge,
    });
  }
  const ratio = at.switchingFrequency / at.fundamentalFrequency;
  const mf = Math.round(ratio);
  if (Math.abs(ratio - mf) > 1e-9 * ratio || mf < 3) {
    throw new ParameterRangeError(
      `frequencies[${at.index}]`,
      `an integer multiple (≥ 3) of fundamentalFrequency = ${at.fundamentalFrequency} Hz for the THD target`,
      at.switchingFrequency,
    );
  }
  const {
    maxThd,
    c,
    rDamping,
    dampingPlacement,
    cDamping,
    loadR,
    maxOrder = Math.min(100_000, 3 * mf + 10),
  } = filter;
  const spectrum = harmonics(
    sineTriangle({ scheme: at.scheme, ma: at.ma, mf, vdc: at.vdc }),
    maxOrder,
  );
  return sizeFilterInductance(spectrum, {
    c,
    maxThd,
    fundamentalFrequency: at.fundamentalFrequency,
    ...(rDamping !== undefined ? { rDamping } : {}),
    ...(dampingPlacement !== undefined ? { dampingPlacement } : {}),
    ...(cDamping !== undefined ? { cDamping } : {}),
    ...(loadR !== undefined ? { loadR } : {}),
  }).l;
}
