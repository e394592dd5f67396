/** Options shared by {@link optimalPulsePattern} and {@link optimalPulseSweep} (internal). */
import { ParameterRangeError, ParameterTypeError } from '../validation/errors.js';
import { assertNumberInRange, assertOneOf } from '../validation/assertions.js';
import { patternWeights } from './sheModel.js';
import { SHE_KINDS, type OrderWeight, type PulseObjective, type SheKind } from './SheKind.js';
import { MAX_SHE_ORDER, resolveCount } from './validateShe.js';
import type { PulseProblem, PulseSettings } from './pulseOptimizer.js';

/** Settings common to the optimal-pattern entry points; every field optional. */
export interface PulseSolverSettings {
  /**
   * `'wthd'`: minimise √(Σ (V_n/n)²)/V₁ (weights 1/n²); `'thd'`: √(Σ V_n²)/V₁ (weights 1);
   * both over the odd orders 3..maxOrder. Ignored when `weights` is given.
   * @default 'wthd'
   */
  objective?: PulseObjective;
  /** Minimise √(Σ w·V_n²)/V₁ over these odd orders instead of `objective`. */
  weights?: OrderWeight[];
  /** Highest order in the `objective` sum (odd orders 3..maxOrder), 3..10000. @default 99 */
  maxOrder?: number;
  /** Seeded starts tried (after the given angles). @default 12 */
  starts?: number;
  /** Seed of the deterministic start generator. @default 1 */
  seed?: number;
  /** Iterations per start. @default 200 */
  maxIterations?: number;
  /** Reject optima with angles closer than this (radians), or to 0 or π/2. @default 1e-6 */
  minimumSpacing?: number;
}

export interface ResolvedPulseBase {
  kind: SheKind;
  vdc: number;
  count: number;
  orders: number[];
  orderWeights: number[];
  starts: number;
  seed: number;
  settings: PulseSettings;
}

export function resolvePulseBase(
  options: { kind: unknown; vdc: unknown; angles?: unknown; count?: unknown } & PulseSolverSettings,
): ResolvedPulseBase {
  const { kind, vdc, angles, count, objective = 'wthd', weights, maxOrder = 99 } = options;
  const { starts = 12, seed = 1, maxIterations = 200, minimumSpacing = 1e-6 } = options;
  assertOneOf('kind', kind, SHE_KINDS);
  assertNumberInRange('vdc', vdc, { min: 0, minExclusive: true });
  const resolvedCount = resolveCount(angles, count);
  assertOneOf('objective', objective, ['wthd', 'thd'] as const);
  assertNumberInRange('maxOrder', maxOrder, { min: 3, max: MAX_SHE_ORDER, integer: true });
  assertNumberInRange('starts', starts, { min: 0, max: 10_000, integer: true });
  assertNumberInRange('seed', seed, { integer: true });
  assertNumberInRange('maxIterations', maxIterations, { min: 1, max: 100_000, integer: true });
  assertNumberInRange('minimumSpacing', minimumSpacing, { min: 0, max: 0.1 });
  let orders: number[] = [];
  let orderWeights: number[] = [];
  if (weights !== undefined) {
    if (!Array.isArray(weights) || weights.length === 0) {
      throw new ParameterTypeError('weights', 'a non-empty array of { order, weight }', weights);
    }
    weights.forEach((entry: unknown, i) => {
      if (typeof entry !== 'object' || entry === null)
        throw new ParameterTypeError(`weights[${i}]`, 'an object { order, weight }', entry);
      const { order, weight } = entry as Partial<OrderWeight>;
      assertNumberInRange(`weights[${i}].order`, order, {
        min: 3,
        max: MAX_SHE_ORDER,
        integer: true,
      });
      if (order % 2 === 0 || orders.includes(order)) {
        throw new ParameterRangeError(
          `weights[${i}].order`,
          'an odd order ≥ 3 not listed before',
          order,
        );
      }
      assertNumberInRange(`weights[${i}].weight`, weight, { min: 0 });
      orders.push(order);
      orderWeights.push(weight);
    });
    if (!orderWeights.some((w) => w > 0))
      throw new ParameterRangeError('weights', 'at least one weight > 0', 0);
  } else {
    for (let n = 3; n <= maxOrder; n += 2) orders.push(n);
    orderWeights = orders.map((n) => (objective === 'wthd' ? 1 / (n * n) : 1));
  }
  orders = [...orders];
  return {
    kind,
    vdc,
    count: resolvedCount,
    orders,
    orderWeights,
    starts,
    seed,
    settings: { maxIterations, minimumSpacing },
  };
}

export function pulseProblem(base: ResolvedPulseBase, target: number): PulseProblem {
  return {
    weights: patternWeights(base.kind, base.count),
    count: base.count,
    orders: base.orders,
    orderWeights: base.orderWeights,
    target,
  };
}
