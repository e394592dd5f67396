import { assertSheSweepOptions } from './assertSheSweepOptions.js';
import { continueSolution, type ContinuationSettings } from './continuation.js';
import { isSameSolution, searchSolutions } from './sheSearch.js';
import { createSheSystem, withTarget } from './sheSystem.js';
import { seededStarts } from './seededStarts.js';
import { resolveSheBase, type SheSolverSettings } from './sheOptions.js';
import { fundamentalGrid } from './validateShe.js';
import type { FundamentalRange, SheKind } from './SheKind.js';

/** Options of {@link sheSweep}. */
export interface SheSweepOptions extends SheSolverSettings {
  /** Pattern family; conventions in {@link SheKind}. */
  kind: SheKind;
  /** DC source voltage, volts (> 0). */
  vdc: number;
  /**
   * Staircase only: each cell's DC source voltage, volts (> 0), one per angle (as
   * `cellVoltages` of {@link solveShe}).
   * @default every cell at vdc
   */
  cellVoltages?: number[];
  /** Initial guess at the first fundamental (radians, ascending in (0, π/2)); fixes N. */
  angles?: number[];
  /** Number of first-quarter angles N when no `angles` are given. */
  count?: number;
  /** N − 1 distinct odd orders ≥ 3 to null at every fundamental. */
  eliminate: number[];
  /** The fundamentals (peak volts) to solve at, evenly spaced, `from` may exceed `to`. */
  fundamentals: FundamentalRange;
  /** Halvings of a continuation step before a branch is given up. @default 8 */
  maxHalvings?: number;
  /**
   * Largest change of any angle (radians) accepted in one continuation sub-step; a larger
   * change is taken for a jump to another branch and the step is halved instead.
   * @default 0.1
   */
  maxAngleStep?: number;
  /** The most branches followed. @default 8 */
  maxBranches?: number;
  /** Called after each fundamental with the fraction done, 0..1. */
  onProgress?: (fraction: number) => void;
}

/** One point of a branch. `angles` is empty where `converged` is false. */
export interface SheSweepPoint {
  /** Peak volts. */
  fundamental: number;
  /** First-quarter angles in radians, ascending in (0, π/2). */
  angles: number[];
  converged: boolean;
}

/** One solution branch followed across the fundamental. */
export interface SheBranch {
  /** Consecutive grid points from where the branch was found; a last point with converged false marks where it was lost. */
  points: SheSweepPoint[];
  /** Why the branch stops, in words. */
  end: string;
}

/** A run of fundamentals (peak volts, grid values) at which no branch has a solution. */
export interface SheGap {
  from: number;
  to: number;
  points: number;
}

/** The outcome of {@link sheSweep}; plain data for charts. */
export interface SheSweepResult {
  branches: SheBranch[];
  /** Where no solution was found, in grid order. */
  gaps: SheGap[];
  /** Fraction of grid points at which at least one branch has a solution, 0..1. */
  solvedFraction: number;
  /** A summary in plain words, naming the gaps. */
  message: string;
  /** Newton iterations in all. */
  iterations: number;
}

interface ActiveBranch {
  branch: SheBranch;
  angles: number[];
  m: number;
  active: boolean;
}

/**
 * Follows selective-harmonic-elimination solution branches across a range of fundamentals
 * (method of H. S. Patel and R. G. Hoft, IEEE Trans. Ind. Appl., 1973, with natural-parameter
 * continuation). At the first fundamental, and wherever no branch is alive, a multi-start
 * Newton search (given angles first, then `starts` seeded guesses) finds the distinct
 * solutions; each is then followed point to point, seeded by a tangent predictor from the
 * previous solution, halving the step when the corrector fails. A branch that cannot be
 * followed further (it turns back at a fold or leaves the ordered region) ends with a point
 * marked `converged: false`; fundamentals where nothing is solved are listed in `gaps`.
 *
 * @throws ParameterRangeError / ParameterTypeError for invalid input (as {@link solveShe};
 *   `fundamentals.from`/`to` must lie in the achievable range, `eliminate` must hold N − 1 orders,
 *   `cellVoltages` one voltage > 0 per angle for a staircase)
 */
export function sheSweep(options: SheSweepOptions): SheSweepResult {
  assertSheSweepOptions(options);
  const base = resolveSheBase(options);
  const { kind, vdc, count, eliminate } = base;
  const {
    cellVoltages,
    fundamentals,
    maxHalvings = 8,
    maxAngleStep = 0.1,
    maxBranches = 8,
    onProgress,
  } = options;
  const scale = (4 * vdc) / Math.PI;
  const grid = fundamentalGrid(fundamentals);
  const system = createSheSystem(
    kind,
    count,
    eliminate,
    (grid[0] as number) / scale,
    cellVoltages?.map((v) => v / vdc),
  );
  const settings: ContinuationSettings = { ...base.search, maxHalvings, maxAngleStep };
  const counter = { iterations: 0 };
  const followed: ActiveBranch[] = [];
  const solved: boolean[] = [];
  grid.forEach((fundamental, i) => {
    const m = fundamental / scale;
    const here: number[][] = [];
    for (const entry of followed.filter((f) => f.active)) {
      const next = continueSolution(system, entry.angles, entry.m, m, settings, counter);
      if (next === null) {
        entry.active = false;
        entry.branch.points.push({ fundamental, angles: [], converged: false });
        entry.branch.end = `lost at ${fundamental.toPrecision(6)} V: the branch turns back or leaves (0, π/2) near here`;
      } else if (here.some((s) => isSameSolution(s, next))) {
        entry.active = false;
        entry.branch.end = `joins another branch at ${fundamental.toPrecision(6)} V`;
      } else {
        here.push(next);
        entry.angles = next;
        entry.m = m;
        entry.branch.points.push({ fundamental, angles: [...next], converged: true });
      }
    }
    if (here.length === 0 && followed.length < maxBranches) {
      const given = i === 0 && options.angles !== undefined ? [options.angles] : [];
      const starts = [...given, ...seededStarts(count, base.starts, base.seed + i)];
      // Every distinct solution only when more than one branch can still be taken up.
      const room = maxBranches - followed.length;
      const search = searchSolutions(withTarget(system, m), starts, base.search, room > 1);
      counter.iterations += search.iterations;
      for (const angles of search.solutions.slice(0, room)) {
        here.push(angles);
        followed.push({
          branch: {
            points: [{ fundamental, angles: [...angles], converged: true }],
            end: 'reaches the end of the range',
          },
          angles,
          m,
          active: true,
        });
      }
    }
    solved.push(here.length > 0);
    onProgress?.((i + 1) / grid.length);
  });
  const gaps = findGaps(grid, solved);
  const solvedCount = solved.filter(Boolean).length;
  return {
    branches: followed.map((f) => f.branch),
    gaps,
    solvedFraction: solvedCount / grid.length,
    message: sweepMessage(solvedCount, grid.length, followed.length, gaps),
    iterations: counter.iterations,
  };
}

function findGaps(grid: readonly number[], solved: readonly boolean[]): SheGap[] {
  const gaps: SheGap[] = [];
  let start = -1;
  for (let i = 0; i <= grid.length; i++) {
    const open = i < grid.length && solved[i] === false;
    if (open && start < 0) start = i;
    if (!open && start >= 0) {
      gaps.push({ from: grid[start] as number, to: grid[i - 1] as number, points: i - start });
      start = -1;
    }
  }
  return gaps;
}

function sweepMessage(
  solvedCount: number,
  total: number,
  branchCount: number,
  gaps: readonly SheGap[],
): string {
  const summary = `Solved at ${solvedCount} of ${total} fundamentals on ${branchCount} branch(es).`;
  if (gaps.length === 0) return summary;
  const ranges = gaps.map(
    (g) => `${g.from.toPrecision(5)}–${g.to.toPrecision(5)} V (${g.points} point(s))`,
  );
  return `${summary} No solution found at ${ranges.join(', ')}.`;
}
