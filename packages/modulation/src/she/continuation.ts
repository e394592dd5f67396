/**
 * Natural-parameter continuation of one SHE solution in the fundamental (internal to she/):
 * a tangent predictor α + Δm·J⁻¹e₁ (differentiating F(α, m) = 0, whose first equation is
 * g₁(α) − m), a Newton corrector, and step halving when the corrector fails or moves an angle
 * by more than `maxAngleStep` (E. L. Allgower and K. Georg, *Introduction to Numerical
 * Continuation Methods*, 1990/2003, ch. 2, from memory). The jump limit keeps the corrector on
 * the branch it started from.
 */
import { newtonSolve, newtonStep } from './newtonSolve.js';
import { isOrderedInQuarter } from './orderedStep.js';
import { rejection, type SearchSettings } from './sheSearch.js';
import { systemJacobian, withTarget, type SheSystem } from './sheSystem.js';

export interface ContinuationSettings extends SearchSettings {
  maxHalvings: number;
  maxAngleStep: number;
}

export interface ContinuationCounter {
  iterations: number;
}

function largestChange(a: readonly number[], b: readonly number[]): number {
  let change = 0;
  for (let k = 0; k < a.length; k++)
    change = Math.max(change, Math.abs((a[k] as number) - (b[k] as number)));
  return change;
}

/** Tangent predictor; falls back to the previous angles when it would leave the ordered region. */
function predict(
  system: SheSystem,
  angles: readonly number[],
  deltaM: number,
  maxAngleStep: number,
): number[] {
  const e1 = system.orders.map((_, j) => (j === 0 ? -1 : 0));
  // newtonStep solves J·δ = −rhs, so −e₁ as the "residual" gives J⁻¹e₁.
  const tangent = newtonStep(systemJacobian(system, angles), e1);
  if (tangent === null) return [...angles];
  const predicted = angles.map((a, k) => a + deltaM * (tangent[k] as number));
  return isOrderedInQuarter(predicted, system.blockSize) &&
    largestChange(predicted, angles) <= maxAngleStep
    ? predicted
    : [...angles];
}

/** The solution at fundamental `to` on the branch through `angles` at `from`, or null. */
export function continueSolution(
  system: SheSystem,
  angles: readonly number[],
  from: number,
  to: number,
  settings: ContinuationSettings,
  counter: ContinuationCounter,
  depth = 0,
): number[] | null {
  const target = withTarget(system, to);
  const start = predict(system, angles, to - from, settings.maxAngleStep);
  const outcome = newtonSolve(target, start, {
    maxIterations: 25,
    stopNorm: 4e-16 * (system.count + 1),
  });
  counter.iterations += outcome.iterations;
  if (
    rejection(target, outcome, settings) === '' &&
    largestChange(outcome.angles, angles) <= settings.maxAngleStep
  ) {
    return outcome.angles;
  }
  if (depth >= settings.maxHalvings) return null;
  const middle = (from + to) / 2;
  const halfway = continueSolution(system, angles, from, middle, settings, counter, depth + 1);
  return halfway === null
    ? null
    : continueSolution(system, halfway, middle, to, settings, counter, depth + 1);
}
