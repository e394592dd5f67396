/**
 * Multi-start search for SHE solutions (internal to she/): runs {@link newtonSolve} from each
 * start, accepts an outcome whose residual is small relative to the fundamental and whose
 * angles stay apart, and optionally keeps every distinct solution (for sweeps that follow
 * several branches).
 */
import { newtonSolve, type NewtonOutcome } from './newtonSolve.js';
import { normalisedCoefficient } from './sheModel.js';
import { smallestGap } from './orderedStep.js';
import type { SheSystem } from './sheSystem.js';

export interface SearchSettings {
  maxIterations: number;
  /** Accept when every equation's residual ≤ tolerance·|g₁| (relative to the fundamental). */
  tolerance: number;
  /** Reject solutions with two angles (or an angle and 0 or π/2) closer than this, radians. */
  minimumSpacing: number;
}

export interface SearchOutcome {
  /** Accepted solutions, distinct, in the order found. */
  solutions: number[][];
  /** The attempt with the smallest residual relative to the fundamental (accepted or not). */
  best: NewtonOutcome;
  /** Why the best attempt was not accepted, in words ('' when it was). */
  reason: string;
  iterations: number;
  tried: number;
}

/** Two solutions are the same when no angle differs by more than this (radians). */
export const SAME_SOLUTION = 1e-7;

/** Floor of the acceptance threshold: rounding of g_n sums is about 1e-15 (normalised units). */
const ROUNDING_FLOOR = 1e-14;

/** The outcome's residual relative to its fundamental |g₁|. */
export function relativeResidual(system: SheSystem, outcome: NewtonOutcome): number {
  const g1 = Math.abs(normalisedCoefficient(system.weights, outcome.angles, 1));
  return g1 > 0 ? outcome.residualNorm / g1 : Infinity;
}

/** '' when the outcome is an acceptable solution, else the reason in plain words. */
export function rejection(
  system: SheSystem,
  outcome: NewtonOutcome,
  settings: SearchSettings,
): string {
  const g1 = normalisedCoefficient(system.weights, outcome.angles, 1);
  if (!(g1 > 0)) return 'the closest attempt has no fundamental in phase with sin θ';
  if (outcome.residualNorm > Math.max(settings.tolerance * g1, ROUNDING_FLOOR)) {
    return `the closest attempt leaves a residual of ${(outcome.residualNorm / g1).toExponential(2)} of the fundamental`;
  }
  if (smallestGap(outcome.angles, system.blockSize) < settings.minimumSpacing) {
    return 'the only solutions found have two angles merging (a pulse of zero width), so fewer angles would do';
  }
  return '';
}

export function isSameSolution(a: readonly number[], b: readonly number[]): boolean {
  return a.every((angle, k) => Math.abs(angle - (b[k] as number)) <= SAME_SOLUTION);
}

/** Runs Newton from each start; stops at the first solution unless `all` is set. */
export function searchSolutions(
  system: SheSystem,
  starts: readonly (readonly number[])[],
  settings: SearchSettings,
  all: boolean,
): SearchOutcome {
  const solutions: number[][] = [];
  let best: NewtonOutcome | null = null;
  let bestScore = Infinity;
  let iterations = 0;
  let tried = 0;
  for (const start of starts) {
    tried++;
    const outcome = newtonSolve(system, start, {
      maxIterations: settings.maxIterations,
      stopNorm: 4e-16 * (system.count + 1),
    });
    iterations += outcome.iterations;
    const accepted = rejection(system, outcome, settings) === '';
    const score = accepted ? -1 : relativeResidual(system, outcome);
    if (best === null || score < bestScore) {
      best = outcome;
      bestScore = score;
    }
    if (accepted) {
      if (!solutions.some((s) => isSameSolution(s, outcome.angles))) solutions.push(outcome.angles);
      if (!all) break;
    }
  }
  const chosen = best as NewtonOutcome;
  return {
    solutions,
    best: chosen,
    reason: rejection(system, chosen, settings),
    iterations,
    tried,
  };
}
