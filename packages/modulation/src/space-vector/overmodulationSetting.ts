import { assertNumberInRange, assertOneOf } from '../validation/assertions.js';
import { SECTOR_ANGLE } from './locateSector.js';
import {
  HEXAGON_TRAJECTORY_M,
  HEXAGON_VERTEX_M,
  LINEAR_LIMIT_M,
  SIX_STEP_M,
} from './spaceVectorLimits.js';
import type { OvermodulationMethod, OvermodulationMode } from './spaceVectorTypes.js';
import { modeOneFundamental, modeTwoFundamental } from './trajectoryFundamental.js';

/** Overmodulation methods accepted by the space-vector functions. */
export const OVERMODULATION_METHODS: readonly OvermodulationMethod[] = [
  'two-mode',
  'hexagon-limit',
];

/** Bisection steps: halves a bracket of width ≤ π/6 to below 1e−16. */
const BISECTION_STEPS = 60;

/** Options of {@link overmodulationSetting}. */
export interface OvermodulationSettingOptions {
  /** @default 'two-mode' */
  method?: OvermodulationMethod;
}

/** The reference shaping chosen for one commanded modulation index. */
export interface OvermodulationSetting {
  /** Commanded modulation index m = √3·|V1|/vdc of the wanted fundamental. */
  m: number;
  mode: OvermodulationMode;
  /**
   * Mode I (and magnitude-limited): radius, in m units, of the circle whose parts outside the
   * hexagon are replaced by the hexagon; equals m in the linear range.
   */
  radius: number;
  /** Mode II: holding angle αh in radians, [0, π/6]; 0 otherwise, π/6 for six-step. */
  holdingAngle: number;
}

/**
 * How a commanded modulation index is realised beyond the linear range, through to six-step.
 *
 * Method `'two-mode'` (J. Holtz, W. Lotzkat, A. M. Khambadkone, "On continuous control of PWM
 * inverters in the overmodulation range including the six-step mode", IEEE Trans. Power
 * Electron., 1993):
 * - m ≤ 1: linear.
 * - 1 < m ≤ (3/π)·ln 3 ≈ 1.0490: mode I. The reference runs at uniform angle on a circle of
 *   radius r > m, clipped to the hexagon; r is solved so that the trajectory's fundamental
 *   equals m.
 * - (3/π)·ln 3 < m < 2√3/π ≈ 1.1027: mode II. The vector stays on the hexagon and is held at
 *   each vertex for the holding angle αh, solved so the fundamental equals m.
 * - m = 2√3/π: six-step (αh = π/6).
 * The fundamentals are those of the continuous trajectory (infinite frequency ratio; mode I in
 * closed form, mode II by Simpson's rule to ~1e−13), each solved by bisection to ~1e−15.
 * Holtz et al. fit these relations piecewise; solving them is our choice. At a finite frequency
 * ratio the generated waveform's fundamental differs slightly; see overmodulationGainCurve.
 *
 * Method `'hexagon-limit'`: the vector is clipped to the hexagon (radius = m), angle kept, no
 * compensation (common practice); its fundamental is that of the clipped circle of radius m,
 * below m, and stays below (3/π)·ln 3 (the whole hexagon) however large m is.
 *
 * @param m - commanded modulation index in [0, 2√3/π]
 * @throws ParameterRangeError naming `m` or `method`
 */
export function overmodulationSetting(
  m: number,
  { method = 'two-mode' }: OvermodulationSettingOptions = {},
): OvermodulationSetting {
  assertNumberInRange('m', m, { min: 0, max: SIX_STEP_M });
  assertOneOf('method', method, OVERMODULATION_METHODS);
  if (m <= LINEAR_LIMIT_M) return { m, mode: 'linear', radius: m, holdingAngle: 0 };
  if (method === 'hexagon-limit')
    return { m, mode: 'magnitude-limited', radius: m, holdingAngle: 0 };
  if (m <= HEXAGON_TRAJECTORY_M) {
    const radius = bisect(modeOneFundamental, m, LINEAR_LIMIT_M, HEXAGON_VERTEX_M);
    return { m, mode: 'overmodulation-i', radius, holdingAngle: 0 };
  }
  if (m >= SIX_STEP_M) {
    return { m, mode: 'six-step', radius: HEXAGON_VERTEX_M, holdingAngle: SECTOR_ANGLE / 2 };
  }
  const holdingAngle = bisect(modeTwoFundamental, m, 0, SECTOR_ANGLE / 2);
  return { m, mode: 'overmodulation-ii', radius: HEXAGON_VERTEX_M, holdingAngle };
}

/** The x in [low, high] where the increasing function f reaches target. */
function bisect(f: (x: number) => number, target: number, low: number, high: number): number {
  let a = low;
  let b = high;
  for (let i = 0; i < BISECTION_STEPS; i++) {
    const middle = (a + b) / 2;
    if (f(middle) < target) a = middle;
    else b = middle;
  }
  return (a + b) / 2;
}
