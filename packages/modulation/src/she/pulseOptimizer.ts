/**
 * The optimiser behind optimal pulse patterns (internal to she/).
 *
 * Problem: minimise f(α) = Σ_n w_n·g_n(α)² over first-quarter angles ordered in (0, π/2),
 * subject to c(α) = g₁(α) − m = 0, where g_n = b_n/(4vdc/π) ({@link normalisedCoefficient}).
 *
 * Method (a feasible-path Newton method on the KKT conditions, J. Nocedal and S. J. Wright,
 * *Numerical Optimization*, 2nd ed., 2006, §18.1 and §15.4, from memory): every iterate is
 * kept on the constraint by a restoration along ∇c (Newton on the single equation c = 0); the
 * step solves the KKT system [H_L + μI, a; aᵀ, 0]·[δ; ν] = [−∇f; 0] with the exact Lagrangian
 * Hessian H_L = ∇²f − λ∇²c (analytic: the g_n are separable, so their Hessians are diagonal)
 * and the least-squares multiplier λ = ∇f·a/‖a‖²; μ ≥ 0 grows until H_L + μI is positive
 * definite on the tangent space a⊥, so δ descends; then backtracking (Armijo) on f after
 * restoration, with the fraction-to-boundary rule keeping the angles ordered. Converged means
 * a projected gradient at rounding level and a positive definite reduced Hessian: a strict
 * local minimum.
 */
import { CholeskyDecomposition, Matrix, solve } from 'ml-matrix';
import {
  coefficientCurvature,
  coefficientGradient,
  normalisedCoefficient,
  type PatternWeights,
} from './sheModel.js';
import { maxOrderedStep, smallestGap } from './orderedStep.js';

export interface PulseProblem {
  weights: PatternWeights;
  count: number;
  /** Odd orders ≥ 3 in the objective, with their weights w_n ≥ 0. */
  orders: number[];
  orderWeights: number[];
  /** Wanted normalised fundamental m = V₁/(4vdc/π). */
  target: number;
}

export interface PulseOutcome {
  angles: number[];
  /** f(α) = Σ w_n g_n² at the returned angles. */
  value: number;
  converged: boolean;
  iterations: number;
  /** Why it stopped, in words ('' when converged). */
  reason: string;
}

export interface PulseSettings {
  maxIterations: number;
  minimumSpacing: number;
}

export function objectiveValue(problem: PulseProblem, angles: readonly number[]): number {
  let value = 0;
  problem.orders.forEach((order, i) => {
    const g = normalisedCoefficient(problem.weights, angles, order);
    value += (problem.orderWeights[i] as number) * g * g;
  });
  return value;
}

interface Derivatives {
  value: number;
  gradient: number[];
  hessian: number[][];
}

function objectiveDerivatives(problem: PulseProblem, angles: readonly number[]): Derivatives {
  const n = angles.length;
  const gradient = new Array<number>(n).fill(0);
  const hessian = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  const grad = new Array<number>(n);
  const curv = new Array<number>(n);
  let value = 0;
  problem.orders.forEach((order, i) => {
    const w = problem.orderWeights[i] as number;
    if (w === 0) return;
    const g = normalisedCoefficient(problem.weights, angles, order);
    coefficientGradient(problem.weights, angles, order, grad);
    coefficientCurvature(problem.weights, angles, order, curv);
    value += w * g * g;
    for (let k = 0; k < n; k++) {
      const gk = grad[k] as number;
      gradient[k] = (gradient[k] as number) + 2 * w * g * gk;
      const row = hessian[k] as number[];
      for (let j = 0; j < n; j++) row[j] = (row[j] as number) + 2 * w * gk * (grad[j] as number);
      row[k] = (row[k] as number) + 2 * w * g * (curv[k] as number);
    }
  });
  return { value, gradient, hessian };
}

function dot(a: readonly number[], b: readonly number[]): number {
  let sum = 0;
  for (let k = 0; k < a.length; k++) sum += (a[k] as number) * (b[k] as number);
  return sum;
}

/** Moves `angles` onto c(α) = 0 along ∇c, staying ordered; null when it cannot. */
export function restoreFundamental(
  problem: PulseProblem,
  angles: readonly number[],
): number[] | null {
  let current = [...angles];
  const a = new Array<number>(current.length);
  const stop = 4e-16 * (problem.count + 1);
  for (let iteration = 0; iteration < 40; iteration++) {
    const c = normalisedCoefficient(problem.weights, current, 1) - problem.target;
    if (Math.abs(c) <= stop) return current;
    coefficientGradient(problem.weights, current, 1, a);
    const norm2 = dot(a, a);
    if (!(norm2 > 0)) return null;
    const step = a.map((ak) => (-c * ak) / norm2);
    const t = maxOrderedStep(current, step);
    current = current.map((x, k) => x + t * (step[k] as number));
  }
  return null;
}

/** True when K is positive definite on the tangent space {d : a·d = 0}. */
function positiveOnTangent(k: number[][], a: readonly number[]): boolean {
  const n = a.length;
  const norm2 = dot(a, a);
  const projector = Array.from({ length: n }, (_, i) =>
    Array.from(
      { length: n },
      (_, j) => (i === j ? 1 : 0) - ((a[i] as number) * (a[j] as number)) / norm2,
    ),
  );
  const p = new Matrix(projector);
  const reduced = p.mmul(new Matrix(k)).mmul(p).to2DArray();
  // Fill the normal direction with a positive curvature so only the tangent space is tested.
  // (ml-matrix's add/abs work in place, so the test matrix is built from plain arrays.)
  const fill = Math.max(1, ...reduced.map((row) => Math.max(...row.map(Math.abs))));
  const test = reduced.map((row) => row.map(() => 0));
  for (let i = 0; i < n; i++) {
    for (let j = 0; j <= i; j++) {
      const symmetric = ((reduced[i]?.[j] as number) + (reduced[j]?.[i] as number)) / 2;
      const value = symmetric + (fill * (a[i] as number) * (a[j] as number)) / norm2;
      (test[i] as number[])[j] = value;
      (test[j] as number[])[i] = value;
    }
  }
  return new CholeskyDecomposition(test).isPositiveDefinite();
}

function kktStep(
  k: number[][],
  a: readonly number[],
  gradient: readonly number[],
): number[] | null {
  const n = a.length;
  const rows = k.map((row, i) => [...row, a[i] as number]);
  rows.push([...a, 0]);
  const rhs = Matrix.columnVector([...gradient.map((g) => -g), 0]);
  let x: number[];
  try {
    x = solve(new Matrix(rows), rhs).getColumn(0);
  } catch {
    x = solve(new Matrix(rows), rhs, true).getColumn(0);
  }
  const step = x.slice(0, n);
  return step.every(Number.isFinite) ? step : null;
}

/** Minimises the weighted harmonic objective from `start`, see the file comment. */
export function optimisePulses(
  problem: PulseProblem,
  start: readonly number[],
  settings: PulseSettings,
): PulseOutcome {
  const restored = restoreFundamental(problem, start);
  if (restored === null) {
    return {
      angles: [...start],
      value: Infinity,
      converged: false,
      iterations: 0,
      reason: 'the start could not be moved onto the wanted fundamental',
    };
  }
  let angles = restored;
  const weightSum = problem.orderWeights.reduce((s, w) => s + w, 0);
  const a = new Array<number>(angles.length);
  const curvature = new Array<number>(angles.length);
  let mu = 0;
  for (let iteration = 0; iteration < settings.maxIterations; iteration++) {
    const { value, gradient, hessian } = objectiveDerivatives(problem, angles);
    coefficientGradient(problem.weights, angles, 1, a);
    coefficientCurvature(problem.weights, angles, 1, curvature);
    const lambda = dot(gradient, a) / dot(a, a);
    const projected = gradient.map((g, k) => g - lambda * (a[k] as number));
    const stationarity = Math.max(...projected.map(Math.abs));
    const lagrangian = hessian.map((row, k) =>
      row.map((h, j) => (j === k ? h - lambda * (curvature[k] as number) : h)),
    );
    const tolerance = 1e-9 * 4 * Math.sqrt(value * weightSum) + 1e-14 * weightSum;
    if (stationarity <= tolerance) {
      const minimum = positiveOnTangent(lagrangian, a);
      const spaced = smallestGap(angles) >= settings.minimumSpacing;
      const reason = !minimum
        ? 'a stationary point that is not a minimum (a saddle) was reached'
        : spaced
          ? ''
          : 'the optimum has two angles merging (a pulse of zero width), so fewer angles would do';
      return { angles, value, converged: reason === '', iterations: iteration, reason };
    }
    const scale = Math.max(1e-12, ...lagrangian.map((row) => Math.max(...row.map(Math.abs))));
    mu = mu === 0 ? 0 : mu / 10;
    let shifted = lagrangian;
    for (let tries = 0; tries < 40; tries++) {
      shifted = lagrangian.map((row, k) => row.map((h, j) => (j === k ? h + mu : h)));
      if (positiveOnTangent(shifted, a)) break;
      mu = mu === 0 ? 1e-8 * scale : mu * 10;
    }
    const step = kktStep(shifted, a, gradient);
    const slope = step === null ? 0 : dot(gradient, step);
    if (step === null || !(slope < 0)) {
      return {
        angles,
        value,
        converged: false,
        iterations: iteration,
        reason: 'no descent direction was found',
      };
    }
    const longest = Math.max(...step.map(Math.abs));
    let t = Math.min(maxOrderedStep(angles, step), longest > 0.3 ? 0.3 / longest : 1);
    let accepted: number[] | null = null;
    for (let b = 0; b < 50 && accepted === null; b++, t /= 2) {
      const candidate = restoreFundamental(
        problem,
        angles.map((x, k) => x + t * (step[k] as number)),
      );
      if (candidate !== null && objectiveValue(problem, candidate) <= value + 1e-4 * t * slope)
        accepted = candidate;
    }
    if (accepted === null) {
      // Rounding floor: f cannot be lowered measurably; accept if nearly stationary.
      const near = stationarity <= 1e3 * tolerance && positiveOnTangent(lagrangian, a);
      return {
        angles,
        value,
        converged: near,
        iterations: iteration + 1,
        reason: near ? '' : 'the line search could not lower the objective',
      };
    }
    angles = accepted;
  }
  return {
    angles,
    value: objectiveValue(problem, angles),
    converged: false,
    iterations: settings.maxIterations,
    reason: 'the iteration limit was reached',
  };
}
