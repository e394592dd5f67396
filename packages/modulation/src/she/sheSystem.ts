/**
 * The square nonlinear system of selective harmonic elimination (internal to she/):
 * F_j(α) = g_{n_j}(α) − target_j, where g_n = b_n/(4vdc/π) ({@link normalisedCoefficient}),
 * the first equation optionally the fundamental (n = 1, target m = V₁/(4vdc/π)) and the
 * others the eliminated orders (target 0). The Jacobian is analytic:
 * ∂F_j/∂α_k = −σ_k·sin(n_j·α_k) (Patel and Hoft, 1973).
 */
import {
  coefficientGradient,
  normalisedCoefficient,
  patternWeights,
  type PatternWeights,
} from './sheModel.js';
import type { SheKind } from './SheKind.js';

export interface SheSystem {
  /** Unknown angles in all. */
  count: number;
  /** Angles per pattern: each block of this many is ordered in (0, π/2) on its own. */
  blockSize: number;
  weights: PatternWeights;
  /** Equation orders: [1, ...eliminate] with a fundamental target, else [...eliminate]. */
  orders: number[];
  /** Normalised targets, one per order. */
  targets: number[];
}

/** The system for `kind`; `cellScales` (staircase of unequal cells only) are V_k/vdc. */
export function createSheSystem(
  kind: SheKind,
  count: number,
  eliminate: readonly number[],
  target: number | undefined,
  cellScales?: readonly number[],
): SheSystem {
  return systemOfWeights(patternWeights(kind, count, cellScales), count, eliminate, target);
}

/**
 * The system over given weights (one σ_k per unknown angle), the angles ordered in blocks of
 * `blockSize`: several patterns solved jointly, for example the cells of a cascaded bridge.
 */
export function systemOfWeights(
  weights: PatternWeights,
  blockSize: number,
  eliminate: readonly number[],
  target: number | undefined,
): SheSystem {
  const count = weights.signs.length;
  if (target === undefined) {
    return { count, blockSize, weights, orders: [...eliminate], targets: eliminate.map(() => 0) };
  }
  return {
    count,
    blockSize,
    weights,
    orders: [1, ...eliminate],
    targets: [target, ...eliminate.map(() => 0)],
  };
}

/** The system with a new fundamental target (the first equation must be the fundamental). */
export function withTarget(system: SheSystem, target: number): SheSystem {
  return { ...system, targets: [target, ...system.targets.slice(1)] };
}

/** F(α) into `out`. */
export function evaluateSystem(system: SheSystem, angles: readonly number[], out: number[]): void {
  const { orders, targets, weights } = system;
  for (let j = 0; j < orders.length; j++) {
    out[j] = normalisedCoefficient(weights, angles, orders[j] as number) - (targets[j] as number);
  }
}

/** The Jacobian ∂F_j/∂α_k as rows. */
export function systemJacobian(system: SheSystem, angles: readonly number[]): number[][] {
  return system.orders.map((order) => {
    const row = new Array<number>(angles.length);
    coefficientGradient(system.weights, angles, order, row);
    return row;
  });
}
