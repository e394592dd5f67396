/** Validation and resolution of the options {@link solveShe} and {@link sheSweep} share (internal). */
import { ParameterRangeError } from '../validation/errors.js';
import { assertNumberInRange, assertOneOf } from '../validation/assertions.js';
import { SHE_KINDS, type SheKind } from './SheKind.js';
import { assertOddOrders, resolveCount } from './validateShe.js';
import type { SearchSettings } from './sheSearch.js';

/** Solver settings common to the SHE entry points; every field optional. */
export interface SheSolverSettings {
  /**
   * Seeded starts tried when the given angles fail (or, without angles, in all).
   * @default 24
   */
  starts?: number;
  /** Seed of the deterministic start generator. @default 1 */
  seed?: number;
  /** Newton iterations per start. @default 60 */
  maxIterations?: number;
  /**
   * Accept a solution when each eliminated amplitude and the fundamental's error are at most
   * this fraction of the fundamental.
   * @default 1e-10
   */
  tolerance?: number;
  /**
   * Reject solutions with two angles, or an angle and 0 or π/2, closer than this (radians): a
   * pulse that narrow has merged.
   * @default 1e-6
   */
  minimumSpacing?: number;
}

/** The solver settings, validated and with their defaults. */
export interface ResolvedSolverSettings {
  starts: number;
  seed: number;
  search: SearchSettings;
}

export interface ResolvedSheBase extends ResolvedSolverSettings {
  kind: SheKind;
  vdc: number;
  count: number;
  eliminate: number[];
}

/** Validates {@link SheSolverSettings} and fills in their defaults. */
export function resolveSolverSettings(options: SheSolverSettings): ResolvedSolverSettings {
  const { starts = 24, seed = 1, maxIterations = 60 } = options;
  const { tolerance = 1e-10, minimumSpacing = 1e-6 } = options;
  assertNumberInRange('starts', starts, { min: 0, max: 10_000, integer: true });
  assertNumberInRange('seed', seed, { integer: true });
  assertNumberInRange('maxIterations', maxIterations, { min: 1, max: 10_000, integer: true });
  assertNumberInRange('tolerance', tolerance, { min: 0, minExclusive: true, max: 1e-3 });
  assertNumberInRange('minimumSpacing', minimumSpacing, { min: 0, max: 0.1 });
  return { starts, seed, search: { maxIterations, tolerance, minimumSpacing } };
}

export function resolveSheBase(
  options: {
    kind: unknown;
    vdc: unknown;
    angles?: unknown;
    count?: unknown;
    eliminate: unknown;
  } & SheSolverSettings,
): ResolvedSheBase {
  const { kind, vdc, angles, count, eliminate } = options;
  assertOneOf('kind', kind, SHE_KINDS);
  assertNumberInRange('vdc', vdc, { min: 0, minExclusive: true });
  const resolvedCount = resolveCount(angles, count);
  assertOddOrders('eliminate', eliminate);
  return {
    kind,
    vdc,
    count: resolvedCount,
    eliminate: [...eliminate],
    ...resolveSolverSettings(options),
  };
}

/** Asserts eliminate has count − equations entries left for the fundamental (a square system). */
export function assertSquare(
  eliminate: readonly number[],
  count: number,
  withFundamental: boolean,
): void {
  const wanted = withFundamental ? count - 1 : count;
  if (eliminate.length !== wanted) {
    throw new ParameterRangeError(
      'eliminate.length',
      withFundamental
        ? `count − 1 = ${wanted} (one equation per angle; the fundamental takes one)`
        : `count = ${wanted} when no fundamental is given (one equation per angle)`,
      eliminate.length,
    );
  }
}
