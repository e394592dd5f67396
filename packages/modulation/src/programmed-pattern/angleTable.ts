import { optimalPulseSweep } from '../she/optimalPulseSweep.js';
import { sheSweep } from '../she/sheSweep.js';
import { ParameterRangeError } from '../validation/errors.js';
import type { AngleTable, AngleTableOptions, AngleTableRow } from './angleTableTypes.js';
import { measurePattern } from './measurePattern.js';
import {
  assertMaRange,
  assertRows,
  assertStartAngles,
  maScale,
  patternCount,
  resolvePattern,
  type ResolvedPattern,
} from './resolveAngleTable.js';

/** One point a sweep returned: angles where solved, and whether it continued the previous one. */
interface BranchPoint {
  angles: number[] | null;
  continued: boolean;
}

/**
 * A table of first-quarter switching angles for a controller: `rows` evenly spaced values of
 * the modulation index from `ma.from` to `ma.to`, each row solved exactly on one branch of
 * selective harmonic elimination (H. S. Patel and R. G. Hoft, IEEE Trans. Ind. Appl., 1973;
 * followed by continuation, {@link sheSweep}) or on one family of optimal pulse patterns
 * ({@link optimalPulseSweep}), with the row's fundamental, eliminated-order residuals and
 * whole-waveform WTHD measured on the library's exact spectrum of the waveform.
 *
 * ma = V₁/(L·vdc), L = 1 (bipolar) or N (staircase); see {@link AngleTable}. The table
 * follows the branch found first at `ma.from` (from `angles` when given). Rows where that branch
 * has no solution (it turns back, or leaves (0, π/2)) are `solved: false` and listed in
 * `gaps`: no other branch is spliced in, and nothing is interpolated across them. For an
 * optimal pattern the family is followed on a grid of at most 0.02 in ma (the optimiser has no
 * step control of its own) and a row reached by a fresh search anywhere since the row before
 * (the followed optimum vanished) is marked `continued: false`: the angles may jump there.
 *
 * @throws ParameterRangeError / ParameterTypeError naming the field: a bad pattern
 *   (`pattern.kind`, `pattern.eliminate`, ...), `ma.from`/`ma.to` outside (0, 4/π) or not
 *   ascending, `rows` outside 2..1024, bad `angles`, and `ma.from` where the pattern has no
 *   solution (the table must start on its branch)
 */
export function angleTable(options: AngleTableOptions): AngleTable {
  const pattern = resolvePattern(options.pattern);
  const { ma, rows, angles } = options;
  assertMaRange(ma);
  assertRows('rows', rows);
  const count = patternCount(pattern);
  assertStartAngles(angles, count);
  const scale = maScale(pattern);
  const grid = Array.from(
    { length: rows },
    (_, i) => ma.from + ((ma.to - ma.from) * i) / (rows - 1),
  );
  const fundamentals = { from: ma.from * scale, to: ma.to * scale, points: rows };
  const points = followBranch(pattern, count, fundamentals, angles, scale);
  if (points[0]?.angles === null) {
    throw new ParameterRangeError(
      'ma.from',
      `a modulation index at which the pattern has a solution (none found at ${ma.from}; choose a range on a branch the sweep shows)`,
      ma.from,
    );
  }
  const tableRows = grid.map((value, i): AngleTableRow => {
    const point = points[i] as BranchPoint;
    if (point.angles === null) {
      return {
        ma: value,
        solved: false,
        angles: [],
        fundamental: null,
        residuals: [],
        worstResidual: null,
        wthd: null,
        continued: false,
      };
    }
    const figures = measurePattern(pattern, point.angles);
    return {
      ma: value,
      solved: true,
      angles: [...point.angles],
      ...figures,
      continued: point.continued,
    };
  });
  const gaps = findGaps(tableRows);
  return {
    parameters: { pattern, ma: { from: ma.from, to: ma.to }, rows, count },
    step: (ma.to - ma.from) / (rows - 1),
    rows: tableRows,
    gaps,
    conventions: CONVENTIONS,
    message: tableMessage(tableRows, gaps),
  };
}

const CONVENTIONS = [
  'Angles are first-quarter switching angles in radians of the fundamental, ascending in (0, pi/2); the period follows by quarter-wave symmetry v(pi - theta) = v(theta) and half-wave symmetry v(theta + pi) = -v(theta).',
  'bipolar: the level changes sign at every angle and is +vdc next to theta = pi/2; staircase: 0 before the first angle, one vdc step up at each angle.',
  'ma = V1 / (L vdc) with L = 1 (bipolar) or the number of cells (staircase); rows are evenly spaced in ma.',
  'A controller interpolates linearly between neighbouring rows in ma, and never across a row marked not solved or an interval marked not interpolable.',
  'Fractions of the period: angle / (2 pi) in unsigned fixed point Q0.n (value / 2^n); ticks: round(angle / (2 pi) x timer ticks per fundamental period).',
];

function followBranch(
  pattern: ResolvedPattern,
  count: number,
  fundamentals: { from: number; to: number; points: number },
  angles: number[] | undefined,
  scale: number,
): BranchPoint[] {
  const start = angles === undefined ? {} : { angles };
  if (pattern.method === 'selective-harmonic-elimination') {
    const { kind, vdc, eliminate } = pattern;
    // One branch is tabulated: the sweep neither searches for nor follows others.
    const sweep = sheSweep({ kind, vdc, count, eliminate, fundamentals, maxBranches: 1, ...start });
    const branch = sweep.branches[0];
    const out: BranchPoint[] = [];
    for (let i = 0; i < fundamentals.points; i++) {
      // The first branch starts at the first grid point when anything is solved there.
      const point =
        branch !== undefined && branch.points[0]?.fundamental === fundamentals.from
          ? branch.points[i]
          : undefined;
      const solved = point?.converged === true;
      out.push({ angles: solved ? point.angles : null, continued: solved && i > 0 });
    }
    return out;
  }
  // The optimiser has no step control of its own: follow the family on a grid of at most
  // OPTIMAL_MA_STEP between points and keep every substeps-th point as a row.
  const { kind, vdc, objective, maxOrder } = pattern;
  const rows = fundamentals.points;
  const substeps = optimalSubsteps(fundamentals.to / scale - fundamentals.from / scale, rows);
  const sweep = optimalPulseSweep({
    kind,
    vdc,
    count,
    objective,
    maxOrder,
    fundamentals: { ...fundamentals, points: (rows - 1) * substeps + 1 },
    ...start,
  });
  return Array.from({ length: rows }, (_, i): BranchPoint => {
    const p = sweep.points[i * substeps];
    // A row continues the one before only when every point between them was followed.
    const between = sweep.points.slice(Math.max(1, (i - 1) * substeps + 1), i * substeps + 1);
    const continued = i > 0 && between.every((q) => q.converged && q.continued);
    return { angles: p?.converged === true ? p.angles : null, continued };
  });
}

/** The largest ma step between the points an optimal family is followed on. */
const OPTIMAL_MA_STEP = 0.02;

/** Points of the followed sweep per row interval, so that each step is at most OPTIMAL_MA_STEP. */
function optimalSubsteps(span: number, rows: number): number {
  return Math.max(1, Math.ceil(span / (rows - 1) / OPTIMAL_MA_STEP - 1e-9));
}

function findGaps(rows: readonly AngleTableRow[]): AngleTable['gaps'] {
  const gaps: AngleTable['gaps'] = [];
  let first = -1;
  for (let i = 0; i <= rows.length; i++) {
    const open = i < rows.length && rows[i]?.solved === false;
    if (open && first < 0) first = i;
    if (!open && first >= 0) {
      const from = (rows[first] as AngleTableRow).ma;
      const to = (rows[i - 1] as AngleTableRow).ma;
      gaps.push({ from, to, firstRow: first, lastRow: i - 1 });
      first = -1;
    }
  }
  return gaps;
}

function tableMessage(rows: readonly AngleTableRow[], gaps: AngleTable['gaps']): string {
  const solved = rows.filter((r) => r.solved).length;
  let message = `${solved} of ${rows.length} rows solved on one branch.`;
  if (gaps.length > 0) {
    const ranges = gaps.map(
      (g) => `ma ${g.from.toPrecision(5)}–${g.to.toPrecision(5)} (rows ${g.firstRow}–${g.lastRow})`,
    );
    message += ` No solution on the branch at ${ranges.join(', ')}: do not interpolate there.`;
  }
  const jumps = rows
    .map((r, i) => (i > 0 && r.solved && !r.continued && rows[i - 1]?.solved === true ? i : -1))
    .filter((i) => i > 0);
  if (jumps.length > 0)
    message += ` The angles jump before row(s) ${jumps.join(', ')}: do not interpolate there.`;
  return message;
}
