/**
 * Damped Newton–Raphson for the SHE system (internal to she/): Newton step from the analytic
 * Jacobian solved with ml-matrix (LU, SVD least squares when singular), the step limited to
 * keep the angles ordered in (0, π/2) ({@link maxOrderedStep}) and to at most `maxStep`
 * radians, then an Armijo backtracking line search on ½‖F‖² (Nocedal and Wright,
 * *Numerical Optimization*, 2006, §11.2). Method: Patel and Hoft, IEEE Trans. Ind. Appl., 1973.
 */
import { Matrix, solve } from 'ml-matrix';
import { evaluateSystem, systemJacobian, type SheSystem } from './sheSystem.js';
import { maxOrderedStep } from './orderedStep.js';

export interface NewtonSettings {
  maxIterations: number;
  /** Stop once ‖F‖∞ is at or below this (normalised units of 4vdc/π). */
  stopNorm: number;
}

export interface NewtonOutcome {
  angles: number[];
  /** ‖F‖∞ at the returned angles, normalised to 4vdc/π. */
  residualNorm: number;
  iterations: number;
  /** Why it stopped. */
  stop: 'converged' | 'stalled' | 'iterations';
}

const MAX_STEP = 0.5;
const ARMIJO = 1e-4;
const MAX_BACKTRACKS = 30;

/** Solves J·δ = −F; SVD least squares when J is singular; null when no finite step exists. */
export function newtonStep(jacobian: number[][], residual: readonly number[]): number[] | null {
  const left = new Matrix(jacobian);
  const right = Matrix.columnVector(residual.map((r) => -r));
  let step: number[];
  try {
    step = solve(left, right).getColumn(0);
  } catch {
    step = solve(left, right, true).getColumn(0);
  }
  return step.every(Number.isFinite) ? step : null;
}

function infinityNorm(values: readonly number[]): number {
  let norm = 0;
  for (const v of values) norm = Math.max(norm, Math.abs(v));
  return norm;
}

function squaredNorm(values: readonly number[]): number {
  let sum = 0;
  for (const v of values) sum += v * v;
  return sum;
}

/** Damped Newton from `start` (ordered in (0, π/2)); never leaves the ordered region. */
export function newtonSolve(
  system: SheSystem,
  start: readonly number[],
  settings: NewtonSettings,
): NewtonOutcome {
  let angles = [...start];
  const residual = new Array<number>(system.orders.length);
  const trial = new Array<number>(system.orders.length);
  evaluateSystem(system, angles, residual);
  for (let iteration = 0; iteration < settings.maxIterations; iteration++) {
    const norm = infinityNorm(residual);
    if (norm <= settings.stopNorm)
      return { angles, residualNorm: norm, iterations: iteration, stop: 'converged' };
    const step = newtonStep(systemJacobian(system, angles), residual);
    if (step === null)
      return { angles, residualNorm: norm, iterations: iteration, stop: 'stalled' };
    const longest = infinityNorm(step);
    // A step below rounding of the angles cannot lower F further.
    if (longest < 1e-16)
      return { angles, residualNorm: norm, iterations: iteration, stop: 'stalled' };
    let t = Math.min(
      maxOrderedStep(angles, step, system.blockSize),
      longest > MAX_STEP ? MAX_STEP / longest : 1,
    );
    const merit = squaredNorm(residual);
    let accepted: number[] | null = null;
    for (let b = 0; b < MAX_BACKTRACKS && t > 0; b++, t /= 2) {
      const candidate = angles.map((a, k) => a + t * (step[k] as number));
      evaluateSystem(system, candidate, trial);
      // Newton direction: d(½‖F‖²)/dt = −‖F‖² at t = 0.
      if (squaredNorm(trial) <= (1 - 2 * ARMIJO * t) * merit) {
        accepted = candidate;
        break;
      }
    }
    if (accepted === null)
      return { angles, residualNorm: norm, iterations: iteration + 1, stop: 'stalled' };
    angles = accepted;
    for (let j = 0; j < trial.length; j++) residual[j] = trial[j] as number;
  }
  const norm = infinityNorm(residual);
  return {
    angles,
    residualNorm: norm,
    iterations: settings.maxIterations,
    stop: norm <= settings.stopNorm ? 'converged' : 'iterations',
  };
}
