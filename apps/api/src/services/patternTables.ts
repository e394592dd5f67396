import {
  angleTable,
  angleTableMidpointErrors,
  angleTableRowsForTarget,
  angleTableToCHeader,
  angleTableToCsv,
  angleTableToJson,
  optimalPulseSweep,
  patternCompareEvents,
  ParameterRangeError,
  type AngleTableErrorMetric,
  type AngleTablePattern,
  type PatternCompareEventsOptions,
  type PulseObjective,
  type SheKind,
  type StoredPattern,
} from '@pulsewright/modulation';
import type { TimerDownload } from './compute.js';
import type { CostEstimate } from './cost.js';
import { asBadRequest, callLibrary } from './library.js';

/**
 * Programmed patterns for controllers (issue 17): angle tables over a range of ma, the compare
 * events of a stored pattern, and the chunks of an optimal-pattern sweep job. Each is one call
 * of the library; pure, so it runs on the request thread or in a compute worker alike.
 */

/** POST /api/v1/angle-tables: `rows`, or a `target` the fewest rows must meet. */
export interface AngleTableRequest {
  pattern: AngleTablePattern;
  ma: { from: number; to: number };
  rows?: number;
  target?: { metric: AngleTableErrorMetric; value: number };
  maxRows?: number;
  angles?: number[];
  fractionBits?: number;
  timerClock: number;
  fundamentalFrequency: number;
  prefix?: string;
}

/** The table, its midpoint errors and fixed-point values in the chosen format. */
export function computeAngleTable(
  request: AngleTableRequest,
  format: 'json' | 'csv' | 'c-header',
): TimerDownload {
  const { pattern, ma, rows, target, maxRows, angles, prefix = 'angle_table' } = request;
  const fixedPoint = {
    timerClock: request.timerClock,
    fundamentalFrequency: request.fundamentalFrequency,
    ...(request.fractionBits === undefined ? {} : { fractionBits: request.fractionBits }),
  };
  return callLibrary('', () => {
    const start = angles === undefined ? {} : { angles };
    let table;
    let midpointErrors;
    if (target !== undefined) {
      const chosen = angleTableRowsForTarget({
        pattern,
        ma,
        target,
        ...start,
        ...(maxRows === undefined ? {} : { maxRows }),
      });
      table = chosen.table;
      midpointErrors = chosen.midpointErrors;
    } else {
      table = angleTable({ pattern, ma, rows: rows ?? 32, ...start });
      midpointErrors = angleTableMidpointErrors(table);
    }
    if (format === 'csv') {
      return {
        body: angleTableToCsv(table, { midpointErrors, fixedPoint }),
        contentType: 'text/csv; charset=utf-8',
        fileName: `${prefix}.csv`,
      };
    }
    if (format === 'c-header') {
      return {
        body: angleTableToCHeader(table, { ...fixedPoint, prefix, midpointErrors }),
        contentType: 'text/x-c; charset=utf-8',
        fileName: `${prefix}.h`,
      };
    }
    return {
      body: angleTableToJson(table, { midpointErrors, fixedPoint }),
      contentType: 'application/json; charset=utf-8',
      fileName: `${prefix}.json`,
    };
  });
}

/** POST /api/v1/pattern-compare-events. */
export interface PatternEventsRequest extends PatternCompareEventsOptions {
  pattern: StoredPattern;
}

/** The library's patternCompareEvents; a bad pattern field is named `pattern.<field>`. */
export function computePatternEvents(request: PatternEventsRequest) {
  const { pattern, ...options } = request;
  const patternFields = ['kind', 'vdc', 'angles'];
  try {
    return patternCompareEvents(pattern, options);
  } catch (error) {
    const field = (error as { field?: unknown }).field;
    const inPattern =
      typeof field === 'string' &&
      patternFields.some(
        (f) => field === f || field.startsWith(`${f}[`) || field.startsWith(`${f}.`),
      );
    throw asBadRequest(inPattern ? 'pattern.' : '', error);
  }
}

/**
 * Units per SHE point per angle²: a multi-start search at its worst (services/cost.ts), and a
 * continued point, a tenth of it (measured about 2·10³ × count² a point with the midpoints).
 */
const SHE_FRESH_PER_ANGLE_SQUARED = 4e4;
const SHE_CONTINUED_PER_ANGLE_SQUARED = 4e3;
/**
 * Units per optimiser iteration per objective order per angle² (measured: a point of 6 angles to
 * order 199 took 5–60 ms, i.e. up to 1.2·10⁷ units over at most 200 iterations × 100 orders × 36).
 */
const OPTIMAL_PER_ITERATION = 2;
const OPTIMAL_ITERATIONS = 200;
const OPTIMAL_STARTS = 13;
/** Bytes of one row of an angle table per angle, JSON with its midpoint errors (about 6 numbers). */
const ANGLE_TABLE_BYTES_PER_ANGLE_ROW = 150;

function patternCount(pattern: AngleTablePattern): number {
  return pattern.method === 'selective-harmonic-elimination'
    ? pattern.eliminate.length + 1
    : pattern.count;
}

/** Work of one solved point of a pattern: [first point (multi-start), each further point]. */
function pointWork(pattern: AngleTablePattern): [number, number] {
  const n = patternCount(pattern);
  if (pattern.method === 'selective-harmonic-elimination') {
    return [SHE_FRESH_PER_ANGLE_SQUARED * n * n, SHE_CONTINUED_PER_ANGLE_SQUARED * n * n];
  }
  const orders = ((pattern.maxOrder ?? 99) + 1) / 2;
  const one = OPTIMAL_PER_ITERATION * OPTIMAL_ITERATIONS * orders * n * n;
  return [one * OPTIMAL_STARTS, one];
}

/**
 * An angle table: a sweep of `rows` points and one solve at each of the rows − 1 midpoints; for a
 * target, the tables tried (doubling to maxRows, then bisection: about (4 + 2·log₂ maxRows)
 * rows' worth of points in all).
 */
export function angleTableCost(request: AngleTableRequest): CostEstimate {
  const count = patternCount(request.pattern);
  const [first, next] = pointWork(request.pattern);
  const optimal = request.pattern.method === 'optimal-pattern';
  const countField = optimal ? 'pattern.count' : 'pattern.eliminate';
  // The library follows an optimal family on a grid of at most 0.02 in ma between points
  // (angleTable), so each optimal table solves up to span/0.02 points besides its rows.
  const between = optimal ? Math.ceil((request.ma.to - request.ma.from) / 0.02) : 0;
  if (request.target !== undefined) {
    const maxRows = request.maxRows ?? 256;
    const tables = Math.ceil(Math.log2(maxRows)) * 2;
    const points = maxRows * (4 + 2 * Math.log2(maxRows)) + tables * between;
    return {
      work: tables * first + points * next,
      basis: `about ${Math.round(points)} points of ${count} angles over the tables tried (up to maxRows = ${maxRows})`,
      fields: ['maxRows', countField],
      responseBytes: maxRows * count * ANGLE_TABLE_BYTES_PER_ANGLE_ROW,
      responseFields: ['maxRows'],
    };
  }
  const rows = request.rows ?? 32;
  return {
    work: first + (2 * rows - 1 + between) * next,
    basis: `${rows} rows and ${rows - 1} midpoints of ${count} angles${between > 0 ? `, the family followed through up to ${between} points between them` : ''}`,
    fields: ['rows', countField],
    responseBytes: rows * count * ANGLE_TABLE_BYTES_PER_ANGLE_ROW,
    responseFields: ['rows'],
  };
}

/** Compare events: the period's edges, then the exact spectrum of three waveforms. */
export function patternEventsCost(request: PatternEventsRequest): CostEstimate {
  const edges = 4 * request.pattern.angles.length * 4;
  const orders = Math.max(1, ...(request.orders ?? [])) + 1;
  return {
    work: edges * orders * 3 + edges * 100,
    basis: `${edges} edges × ${orders} orders, three waveforms`,
    fields: ['orders', 'pattern.angles'],
    responseBytes: edges * 4 * 40,
    responseFields: ['pattern.angles'],
  };
}

/** POST /api/v1/jobs/optimal-sweeps. */
export interface OptimalSweepInput {
  kind: SheKind;
  vdc: number;
  count: number;
  objective?: PulseObjective;
  maxOrder?: number;
  fundamental: { from: number; to: number; points: number };
  initialAngles?: number[];
}

export interface OptimalSweepPointResult {
  fundamental: number;
  angles: number[];
  converged: boolean;
  /** √(Σ w_n·V_n²)/V₁ of the objective; null where not converged. */
  objective: number | null;
  /** False where a fresh search was needed (the first point, or where the followed optimum vanished). */
  continued: boolean;
}

export interface OptimalSweepResult {
  points: OptimalSweepPointResult[];
  solvedFraction: number;
  iterations: number;
}

/** Points per chunk of an optimal-pattern sweep (a chunk is tens of milliseconds at most). */
const OPTIMAL_POINTS_PER_CHUNK = 5;

/** Chunks of an optimal-pattern sweep (at least one). */
export function optimalSweepChunkCount(input: OptimalSweepInput): number {
  return Math.max(1, Math.ceil(input.fundamental.points / OPTIMAL_POINTS_PER_CHUNK));
}

/**
 * Chunk `index` of an optimal-pattern sweep by the library's optimalPulseSweep over its share of
 * the grid, its first point followed from the optimum the chunks before ended on (`previous`), so
 * the job follows one family of optima exactly as one run of the library's sweep would.
 */
export function optimalSweepChunk(
  input: OptimalSweepInput,
  index: number,
  previous: number[] | undefined,
): { points: OptimalSweepPointResult[]; iterations: number } {
  const { from, to, points } = input.fundamental;
  const k0 = index * OPTIMAL_POINTS_PER_CHUNK;
  const k1 = Math.min(points, k0 + OPTIMAL_POINTS_PER_CHUNK) - 1;
  const at = (k: number) =>
    points === 1 ? from : k === points - 1 ? to : from + ((to - from) * k) / (points - 1);
  let part;
  try {
    part = optimalPulseSweep({
      kind: input.kind,
      vdc: input.vdc,
      count: input.count,
      objective: input.objective ?? 'wthd',
      maxOrder: input.maxOrder ?? 99,
      fundamentals: { from: at(k0), to: at(k1), points: k1 - k0 + 1 },
      ...(index === 0 && input.initialAngles ? { angles: input.initialAngles } : {}),
      ...(previous ? { previous } : {}),
    });
  } catch (error) {
    // The library names its grid `fundamentals`; the request calls it `fundamental`.
    if (error instanceof ParameterRangeError && error.field.startsWith('fundamentals.')) {
      const field = `fundamental.${error.field.slice('fundamentals.'.length)}`;
      throw asBadRequest('', new ParameterRangeError(field, error.allowed, error.value));
    }
    throw asBadRequest('', error);
  }
  return {
    points: part.points.map((p) => ({
      fundamental: p.fundamental,
      angles: p.angles,
      converged: p.converged,
      objective: p.converged ? p.objective : null,
      continued: p.continued,
    })),
    iterations: part.iterations,
  };
}

/** What the next chunk follows: the last point's optimum, when it has one (as the library's sweep). */
export function nextOptimalPrevious(points: OptimalSweepPointResult[]): number[] | undefined {
  const last = points[points.length - 1];
  return last?.converged ? last.angles : undefined;
}

/** An optimal-pattern sweep job: each point started from the previous optimum, at its worst. */
export function optimalSweepCost(input: OptimalSweepInput): CostEstimate {
  const pattern: AngleTablePattern = {
    method: 'optimal-pattern',
    kind: input.kind,
    vdc: input.vdc,
    count: input.count,
    ...(input.maxOrder === undefined ? {} : { maxOrder: input.maxOrder }),
  };
  const [first] = pointWork(pattern);
  const { points } = input.fundamental;
  return {
    work: points * first,
    basis: `${points} points × a ${input.count}-angle search to order ${input.maxOrder ?? 99} from ${OPTIMAL_STARTS} starts, at worst`,
    fields: ['fundamental.points', 'count', 'maxOrder'],
    responseBytes: points * (input.count + 4) * 20,
    responseFields: ['fundamental.points', 'count'],
  };
}
