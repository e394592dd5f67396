/**
 * Types of a switching-angle table for a controller ({@link angleTable}). Plain, serialisable
 * data: no NaN (a value that does not exist is `null`), no functions.
 *
 * Units: angles in radians of the fundamental (first quarter, ascending in (0, π/2)),
 * voltages in peak volts, the modulation index ma and every error as a ratio.
 *
 * The modulation index of a programmed pattern is ma = V₁/(L·vdc), L = 1 for a bipolar
 * (two-level, ±vdc) pattern and L = N (the number of cells) for a staircase: the same ma a
 * sine-triangle H-bridge output has for the same fundamental (V₁ = ma·vdc in its linear range;
 * the glossary's ma). A square wave's 4/π is the limit no pattern reaches.
 */
import type { PulseObjective, SheKind } from '../she/SheKind.js';

/** A pattern that eliminates chosen orders (selective harmonic elimination). */
export interface EliminationTablePattern {
  method: 'selective-harmonic-elimination';
  kind: SheKind;
  /** DC source voltage, volts (> 0): the bipolar level or each staircase cell's step. */
  vdc: number;
  /** N − 1 distinct odd orders ≥ 3 to null at every row; N = eliminate.length + 1 angles. */
  eliminate: number[];
}

/** A pattern that minimises a weighted distortion with a chosen number of angles. */
export interface OptimalTablePattern {
  method: 'optimal-pattern';
  kind: SheKind;
  /** DC source voltage, volts (> 0). */
  vdc: number;
  /** Number of first-quarter angles N, 1..64. */
  count: number;
  /** @default 'wthd' */
  objective?: PulseObjective;
  /** Highest order of the objective's sum, odd orders 3..maxOrder. @default 99 */
  maxOrder?: number;
}

/** The pattern a table follows: one solution branch (or one family of optima) across ma. */
export type AngleTablePattern = EliminationTablePattern | OptimalTablePattern;

/** Options of {@link angleTable}. */
export interface AngleTableOptions {
  pattern: AngleTablePattern;
  /** The modulation-index range of the rows, evenly spaced, `from` < `to`, both in (0, 4/π). */
  ma: { from: number; to: number };
  /** Number of rows, 2..{@link MAX_ANGLE_TABLE_ROWS}. */
  rows: number;
  /**
   * First-quarter angles at `ma.from` to start from (a point picked on a branch); the table
   * follows the branch they lead to. Without them, the first solution a seeded search finds.
   */
  angles?: number[];
}

/** The remaining amplitude of one order, peak volts, from the exact spectrum. */
export interface AngleTableResidual {
  order: number;
  amplitude: number;
}

/** One row of the table. */
export interface AngleTableRow {
  /** The row's modulation index (grid value). */
  ma: number;
  /** False where the followed branch has no solution (a gap): no angles, never interpolated. */
  solved: boolean;
  /** First-quarter angles, radians, ascending in (0, π/2); empty where not solved. */
  angles: number[];
  /** Fundamental of the row's waveform, peak volts, exact spectrum (null where not solved). */
  fundamental: number | null;
  /** Remaining amplitude of each eliminated order (empty for an optimal pattern). */
  residuals: AngleTableResidual[];
  /** Largest residual / fundamental (null for an optimal pattern or where not solved). */
  worstResidual: number | null;
  /** WTHD of the whole waveform, exact (every order), ratio; null where not solved. */
  wthd: number | null;
  /**
   * True when the row was reached from the previous one along the same branch or family;
   * false for the first row and where the optimum had to be searched afresh (the angles may
   * jump there: the interval before it is not interpolated).
   */
  continued: boolean;
}

/** The outcome of {@link angleTable}. */
export interface AngleTable {
  /** Every input, defaults filled in. */
  parameters: {
    pattern: Required<EliminationTablePattern> | Required<OptimalTablePattern>;
    ma: { from: number; to: number };
    rows: number;
    /** Number of first-quarter angles per row. */
    count: number;
  };
  /** The ma step between rows. */
  step: number;
  rows: AngleTableRow[];
  /** Runs of rows without a solution, as ma ranges and row indices (inclusive). */
  gaps: { from: number; to: number; firstRow: number; lastRow: number }[];
  /** The conventions, one sentence each (copied into the C header). */
  conventions: string[];
  /** A summary in plain words, naming the gaps and jumps. */
  message: string;
}

/** The error of linear interpolation on one interval between neighbouring rows. */
export interface AngleTableInterval {
  /** ma of the rows at the interval's ends. */
  from: number;
  to: number;
  /** False across a gap or a jump: a controller must not interpolate there. */
  interpolable: boolean;
  /** Why not, in words ('' when interpolable). */
  reason: string;
  /** The exact pattern at the midpoint, angles in radians (empty where not interpolable). */
  exactAngles: number[];
  /** The linearly interpolated angles at the midpoint (empty where not interpolable). */
  interpolatedAngles: number[];
  /** Largest |V_n|/V₁ over the eliminated orders for the interpolated angles (null: none eliminated). */
  worstResidual: number | null;
  /** (V₁ interpolated − V₁ wanted)/V₁ wanted at the midpoint. */
  fundamentalError: number | null;
  /** WTHD of the interpolated angles minus that of the exact pattern at the midpoint. */
  wthdChange: number | null;
}

/** The outcome of {@link angleTableMidpointErrors}. */
export interface AngleTableMidpointErrors {
  intervals: AngleTableInterval[];
  /** Largest of each error over the interpolable intervals (null when there is none). */
  worstResidual: number | null;
  worstFundamentalError: number | null;
  worstWthdChange: number | null;
}

/** The midpoint error a target applies to. */
export type AngleTableErrorMetric = 'eliminated-residual' | 'fundamental-error' | 'wthd-change';

/** The metrics, for validation and for the API's schema. */
export const ANGLE_TABLE_ERROR_METRICS: readonly AngleTableErrorMetric[] = [
  'eliminated-residual',
  'fundamental-error',
  'wthd-change',
];

/** The most rows a table may have (bounds the cost of one table). */
export const MAX_ANGLE_TABLE_ROWS = 1024;
