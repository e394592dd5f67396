import { TAU } from '../../math.js';
import { assertNumberInRange } from '../../validation/assertions.js';
import { ParameterTypeError } from '../../validation/errors.js';
import { threeLevelSchedule } from './threeLevelSchedule.js';
import type { ThreeLevelModulationOptions } from './threeLevelSpaceVectorTypes.js';

/** Options of {@link threeLevelNeutralPointCurrent}. Give exactly one of `m` and `ma`. */
export interface ThreeLevelNeutralPointCurrentOptions extends ThreeLevelModulationOptions {
  /** Peak of the sinusoidal phase currents, amperes, in [0, 1e6]. */
  currentAmplitude: number;
  /**
   * Angle by which each phase current lags its phase voltage reference, radians in [−π, π]:
   * 0 for a resistive load, positive lagging (inductive), its cosine the displacement power
   * factor. @default 0
   */
  currentAngle?: number;
}

/** The neutral-point current of a three-level bridge under space-vector PWM. */
export interface ThreeLevelNeutralPointCurrent {
  /** Mean neutral-point current over each switching period k = 0 … N − 1, amperes. */
  periodAverages: number[];
  /** The fundamental angle of each switching period's middle, (k + 1/2)·2π/N radians. */
  periodAngles: number[];
  /** Mean over the whole fundamental period, amperes. */
  fundamentalAverage: number;
  /** Low-frequency ripple: the peak-to-peak of `periodAverages`, amperes. */
  ripple: number;
}

/**
 * The current a three-level NPC or T-type bridge draws from its DC midpoint under three-level
 * space-vector PWM ({@link threeLevelSpaceVectorWaveforms}, same options), for given sinusoidal
 * phase currents: ia = I·sin(θ − φ), ib and ic lagging by 2π/3 and 4π/3, φ = `currentAngle`,
 * θ the fundamental angle of the voltage reference (whose phase a is ∝ sin θ).
 *
 * The midpoint carries the current of every leg clamped to it (state O): i_np = Σ over legs at
 * O of the leg's current (N. Celanovic and D. Boroyevich, IEEE Trans. Power Electron., 2000).
 * Sign: positive flows out of the midpoint into the bridge, so it lowers the midpoint's
 * potential (discharges the lower capacitor, charges the upper one). Each switching period's
 * mean is exact for these currents (each state's interval integrated in closed form, the
 * currents not held constant), and the fundamental mean is the mean of those means.
 *
 * The small vector's two forms draw opposite currents (`POO` draws ib + ic = −ia, `ONN` draws
 * ia), so `smallVectorSplit` is the balancing lever: 0.5 draws no mean current over a fundamental
 * for a balanced load in the averaged model of Celanovic and Boroyevich (exactly so for even N,
 * the periods half a fundamental apart cancelling; here, with the currents varying within each
 * period, a residue that falls as 1/N², and as 1/N for odd N), and moving it off 0.5 draws a
 * mean current whose sign follows the split and the load's power factor.
 *
 * @throws ParameterRangeError naming `m`, `ma`, `frequencyRatio`, `sampling`,
 *   `smallVectorSplit`, `currentAmplitude` or `currentAngle` and the allowed range
 */
export function threeLevelNeutralPointCurrent(
  options: ThreeLevelNeutralPointCurrentOptions,
): ThreeLevelNeutralPointCurrent {
  if (typeof options !== 'object' || options === null) {
    throw new ParameterTypeError('options', 'an object', options);
  }
  const { currentAmplitude, currentAngle = 0 } = options;
  assertNumberInRange('currentAmplitude', currentAmplitude, { min: 0, max: 1e6 });
  assertNumberInRange('currentAngle', currentAngle, { min: -Math.PI, max: Math.PI });
  const { periods } = threeLevelSchedule(options);
  const width = TAU / periods.length;
  // ∫ I·sin(θ − ψ) dθ over [from, to] = I·(cos(from − ψ) − cos(to − ψ)), ψ the leg's lag.
  const lags = [0, 1, 2].map((leg) => currentAngle + (leg * TAU) / 3);
  const charge = (leg: number, from: number, to: number): number => {
    const lag = lags[leg] as number;
    return currentAmplitude * (Math.cos(from - lag) - Math.cos(to - lag));
  };
  const periodAverages = periods.map(({ states, durations }, k) => {
    let sum = 0;
    let start = k * width;
    states.forEach((state, i) => {
      const end = start + (durations[i] as number) * width;
      for (let leg = 0; leg < 3; leg++) if (state[leg] === 'O') sum += charge(leg, start, end);
      start = end;
    });
    return sum / width;
  });
  let total = 0;
  let highest = -Infinity;
  let lowest = Infinity;
  for (const value of periodAverages) {
    total += value;
    highest = Math.max(highest, value);
    lowest = Math.min(lowest, value);
  }
  return {
    periodAverages,
    periodAngles: periods.map((_, k) => (k + 0.5) * width),
    fundamentalAverage: total / periodAverages.length,
    ripple: highest - lowest,
  };
}
