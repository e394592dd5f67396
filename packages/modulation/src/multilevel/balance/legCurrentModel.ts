import { TAU, wrapAngle } from '../../math.js';
import { assertFiniteArray, assertNumberInRange } from '../../validation/assertions.js';
import { ParameterRangeError, ParameterTypeError } from '../../validation/errors.js';
import type { MultilevelWaveforms } from '../MultilevelTypes.js';
import type { MultilevelPhaseCurrents } from './MultilevelPhaseCurrents.js';

/** The largest current magnitude accepted, A (as the loss model's reference current bound). */
const MAX_CURRENT = 1e6;

/**
 * The most samples a phase current may hold: 2^20, eight times the design report's finest grid,
 * so that the pieces of a period stay in the low millions.
 */
const MAX_CURRENT_SAMPLES = 1 << 20;

/** Two numbers that describe a current on one piece [a, b]; sums of them describe sums. */
export type PieceCoefficients = readonly [number, number];

/**
 * Internal: the current out of each leg of a multilevel bridge, in a form whose pieces integrate
 * exactly. On any piece [a, b] with no knot inside, a leg's current (and any weighted sum of the
 * legs' currents) is described by two coefficients: for sinusoids (α, β) with
 * i = α·sin θ + β·cos θ, for samples the values (i(a), i(b)) of the linear interpolation.
 */
export interface LegCurrentModel {
  /** Angles in [0, 2π), ascending: sample angles and every leg current's zero crossings. */
  knots: number[];
  /** Coefficients of leg k's current on [a, b] (0 ≤ a < b ≤ 2π, no knot strictly inside). */
  coefficients(leg: number, a: number, b: number): PieceCoefficients;
  /** ∫_a^b i dθ, ampere-radians. */
  integral(c: PieceCoefficients, a: number, b: number): number;
  /** ∫_a^b i² dθ, ampere²-radians. */
  squareIntegral(c: PieceCoefficients, a: number, b: number): number;
  /** The angles strictly inside (a, b) at which the described current equals `level`, A. */
  crossings(c: PieceCoefficients, a: number, b: number, level: number): number[];
  /** Leg k's current at θ, A. */
  valueAt(leg: number, theta: number): number;
}

/**
 * Internal: validates `currents` against the bridge of `waveforms` (see
 * {@link MultilevelPhaseCurrents}) and builds the {@link LegCurrentModel}.
 * @throws ParameterTypeError / ParameterRangeError naming `currents`, `currents[k]`,
 *   `currents.peakCurrent` or `currents.currentAngle`
 */
export function legCurrentModel(
  waveforms: MultilevelWaveforms,
  currents: MultilevelPhaseCurrents,
): LegCurrentModel {
  const { phaseCount, legs } = waveforms;
  // Single-phase full bridge: the bridge current leaves leg a and returns through leg b.
  const signs = legs.map((_, k) => (phaseCount === 1 && k === 1 ? -1 : 1));
  const phaseOf = (leg: number): number => (phaseCount === 1 ? 0 : leg);
  if (isSampled(currents)) return sampledModel(currents, phaseCount, signs, phaseOf);
  if (typeof currents !== 'object' || currents === null) {
    throw new ParameterTypeError(
      'currents',
      'an array of sampled phase currents or an object { peakCurrent, currentAngle }',
      currents,
    );
  }
  const { peakCurrent, currentAngle = 0 } = currents;
  assertNumberInRange('currents.peakCurrent', peakCurrent, { min: 0, max: MAX_CURRENT });
  assertNumberInRange('currents.currentAngle', currentAngle, { min: -Math.PI, max: Math.PI });
  return sinusoidalModel(
    legs.map((_, k) => {
      const shift = (phaseOf(k) * TAU) / 3 + currentAngle;
      // I·sin(θ − shift) = I·cos(shift)·sin θ − I·sin(shift)·cos θ
      const amplitude = (signs[k] as number) * peakCurrent;
      return [amplitude * Math.cos(shift), -amplitude * Math.sin(shift)] as const;
    }),
  );
}

function isSampled(
  currents: MultilevelPhaseCurrents,
): currents is readonly (Float64Array | readonly number[])[] {
  return Array.isArray(currents);
}

function sinusoidalModel(legs: readonly PieceCoefficients[]): LegCurrentModel {
  const knots = new Set<number>();
  for (const [alpha, beta] of legs) {
    if (alpha === 0 && beta === 0) continue;
    // α·sin θ + β·cos θ = 0 at θ = atan2(−β, α) + nπ.
    const zero = Math.atan2(-beta, alpha);
    knots.add(wrapAngle(zero));
    knots.add(wrapAngle(zero + Math.PI));
  }
  return {
    knots: [...knots].sort((x, y) => x - y),
    coefficients: (leg) => legs[leg] as PieceCoefficients,
    integral: ([alpha, beta], a, b) =>
      alpha * (Math.cos(a) - Math.cos(b)) + beta * (Math.sin(b) - Math.sin(a)),
    squareIntegral([alpha, beta], a, b) {
      const half = (Math.sin(2 * b) - Math.sin(2 * a)) / 4;
      const sinSquares = (b - a) / 2 - half;
      const cosSquares = (b - a) / 2 + half;
      const cross = (Math.sin(b) ** 2 - Math.sin(a) ** 2) / 2;
      return alpha * alpha * sinSquares + 2 * alpha * beta * cross + beta * beta * cosSquares;
    },
    crossings([alpha, beta], a, b, level) {
      // α·sin θ + β·cos θ = R·sin(θ + ψ) = level at θ = asin(level/R) − ψ or π − asin(level/R) − ψ.
      const r = Math.hypot(alpha, beta);
      if (r === 0 || Math.abs(level) > r) return [];
      const psi = Math.atan2(beta, alpha);
      const base = Math.asin(level / r);
      const found: number[] = [];
      for (const root of [base - psi, Math.PI - base - psi]) {
        for (const turn of [-TAU, 0, TAU, 2 * TAU]) {
          const z = root + turn;
          if (z > a && z < b) found.push(z);
        }
      }
      return found;
    },
    valueAt(leg, theta) {
      const [alpha, beta] = legs[leg] as PieceCoefficients;
      return alpha * Math.sin(theta) + beta * Math.cos(theta);
    },
  };
}

function sampledModel(
  currents: readonly unknown[],
  phaseCount: 1 | 3,
  signs: readonly number[],
  phaseOf: (leg: number) => number,
): LegCurrentModel {
  if (currents.length !== phaseCount) {
    throw new ParameterRangeError(
      'currents.length',
      `${phaseCount} (one sampled current per phase)`,
      currents.length,
    );
  }
  const size = (currents[0] as { length?: unknown } | undefined)?.length;
  currents.forEach((samples, k) => {
    assertFiniteArray(`currents[${k}]`, samples, 4, MAX_CURRENT_SAMPLES);
    if (samples.length !== size) {
      throw new ParameterRangeError(
        `currents[${k}].length`,
        `${String(size)} (the length of currents[0])`,
        samples.length,
      );
    }
  });
  const count = size as number;
  const step = TAU / count;
  const legs = signs.map((sign, k) => {
    const samples = currents[phaseOf(k)] as ArrayLike<number>;
    const values = new Float64Array(count);
    for (let j = 0; j < count; j++) {
      const value = samples[j] as number;
      if (Math.abs(value) > MAX_CURRENT) {
        throw new ParameterRangeError(
          `currents[${phaseOf(k)}][${j}]`,
          `a current within ±${MAX_CURRENT} A`,
          value,
        );
      }
      values[j] = sign * value;
    }
    return values;
  });
  // The sample angles are ascending; the zero crossings are few: sort those and merge.
  const zeros: number[] = [];
  for (const values of legs) {
    for (let j = 0; j < count; j++) {
      const v0 = values[j] as number;
      const v1 = values[(j + 1) % count] as number;
      if ((v0 < 0 && v1 > 0) || (v0 > 0 && v1 < 0)) zeros.push((j + v0 / (v0 - v1)) * step);
    }
  }
  zeros.sort((x, y) => x - y);
  const knots: number[] = [];
  let z = 0;
  for (let j = 0; j < count; j++) {
    const angle = j * step;
    while (z < zeros.length && (zeros[z] as number) < angle) knots.push(zeros[z++] as number);
    knots.push(angle);
  }
  while (z < zeros.length) knots.push(zeros[z++] as number);
  const valueAt = (leg: number, theta: number): number => {
    const values = legs[leg] as Float64Array;
    const position = wrapAngle(theta) / step;
    const j = Math.min(count - 1, Math.floor(position));
    const v0 = values[j] as number;
    return v0 + ((values[(j + 1) % count] as number) - v0) * (position - j);
  };
  return {
    knots,
    coefficients: (leg, a, b) => [valueAt(leg, a), valueAtEnd(legs[leg] as Float64Array, a, b)],
    integral: ([fa, fb], a, b) => ((b - a) * (fa + fb)) / 2,
    squareIntegral: ([fa, fb], a, b) => ((b - a) * (fa * fa + fa * fb + fb * fb)) / 3,
    crossings([fa, fb], a, b, level) {
      const x = fa - level;
      const y = fb - level;
      if ((x < 0 && y > 0) || (x > 0 && y < 0)) {
        const z = a + ((b - a) * x) / (x - y);
        return z > a && z < b ? [z] : [];
      }
      return [];
    },
    valueAt,
  };

  /** The interpolated value at b, from the sample interval that holds (a, b). */
  function valueAtEnd(values: Float64Array, a: number, b: number): number {
    const j = Math.min(count - 1, Math.floor((a + b) / 2 / step));
    const v0 = values[j] as number;
    return v0 + ((values[(j + 1) % count] as number) - v0) * (b / step - j);
  }
}
