import { locateSector, SECTOR_ANGLE } from '../../space-vector/locateSector.js';
import { HEXAGON_VERTEX_M } from '../../space-vector/spaceVectorLimits.js';
import { assertNumberInRange } from '../../validation/assertions.js';
import { ParameterRangeError, ParameterTypeError } from '../../validation/errors.js';
import {
  latticePoint,
  negativeForm,
  rotateLatticePoint,
  stateName,
  vectorKind,
  type LatticePoint,
  type LegLevels,
} from './threeLevelLattice.js';
import type {
  ThreeLevelReference,
  ThreeLevelRegion,
  ThreeLevelSelectedVector,
  ThreeLevelSpaceVectorSelection,
} from './threeLevelSpaceVectorTypes.js';

/** Lattice sums above the hexagon's edge by no more than this are rounding, not errors. */
const HEXAGON_TOLERANCE = 1e-12;

/** A triangle vertex in the frame of sector 1 with its dwell time. */
interface Vertex {
  point: LatticePoint;
  dwell: number;
}

/**
 * The nearest three vectors of a reference in the three-level hexagon, their dwell times as
 * fractions of the switching period, and the redundant small vector's two forms with the split.
 *
 * Method (nearest-three-vector selection; N. Celanovic and D. Boroyevich, IEEE Trans. Power
 * Electron., 2000, and the g-h lattice of their 2001 paper; Holmes and Lipo 2003, ch. 11, from
 * memory): in the sector k = ⌊θ/(π/3)⌋ + 1, with θ' the angle within it, the reference has
 * lattice coordinates g = 2m·sin(π/3 − θ'), h = 2m·sin θ' in units of the small vector vdc/3
 * along the sector's first large vector and the one π/3 further (twice the two-level dwell
 * times t1, t2). The sector's four unit triangles (see {@link ThreeLevelRegion}) are region 1
 * when g + h < 1, else region 2 when g ≥ 1 in the sector's first half, region 4 when h ≥ 1 in
 * its second half, else region 3. The dwell times are the reference's barycentric coordinates
 * in its triangle, so Σ dwell·vector = Vref exactly and they sum to 1:
 * region 1: zero 1 − g − h, first small g, second small h; region 2: small 2 − g − h, large
 * g − 1, medium h; region 3: first small 1 − h, second small 1 − g, medium g + h − 1; region 4:
 * small 2 − g − h, medium g, large h − 1.
 *
 * Redundant small vector: every triangle has a small vector as a vertex; the one used is the
 * small vector of the reference's half of the sector (the sector's first in [0, π/6), its second
 * in [π/6, π/3)), the nearer one. Its dwell is split between the P-type form (legs at P and O)
 * and the N-type form (legs at O and N) as `smallVectorSplit` : 1 − `smallVectorSplit`. This
 * choice and the sequence built on it match level-shifted PD carriers with the zero sequence
 * of B. P. McGrath, D. G. Holmes and T. A. Lipo, IEEE Trans. Power Electron., 2003.
 *
 * Range: as for two levels, m ≤ 1 is the linear range at every angle; up to the hexagon's edge,
 * m ≤ 1/cos(θ' − π/6) (2/√3 at a large vector), one switching period can realise it; beyond
 * throws. Boundaries of sectors and halves follow the two-level rule (half-open, angles within
 * about 1e-12 rad of the π/6 grid taken as on it).
 *
 * @param reference - `{ m, theta, smallVectorSplit }`, see {@link ThreeLevelReference}
 * @throws ParameterTypeError when reference is not an object
 * @throws ParameterRangeError naming `m`, `theta` or `smallVectorSplit` and the allowed range
 */
export function threeLevelSpaceVector(
  reference: ThreeLevelReference,
): ThreeLevelSpaceVectorSelection {
  if (typeof reference !== 'object' || reference === null) {
    throw new ParameterTypeError(
      'reference',
      'an object { m, theta, smallVectorSplit }',
      reference,
    );
  }
  const { m, theta, smallVectorSplit = 0.5 } = reference;
  assertNumberInRange('m', m, { min: 0, max: HEXAGON_VERTEX_M });
  assertNumberInRange('theta', theta);
  assertNumberInRange('smallVectorSplit', smallVectorSplit, { min: 0, max: 1 });
  const { sector, angle, secondHalf } = locateSector(theta);
  let g = 2 * m * Math.sin(SECTOR_ANGLE - angle);
  let h = 2 * m * Math.sin(angle);
  if (g + h > 2 + HEXAGON_TOLERANCE) {
    const limit = 1 / Math.cos(angle - SECTOR_ANGLE / 2);
    throw new ParameterRangeError(
      'm',
      `a finite number in [0, ${limit}] at theta = ${theta} rad (inside the hexagon; m ≤ 1 is ` +
        'the linear range at every angle)',
      m,
    );
  }
  if (g + h > 2) {
    const scale = 2 / (g + h);
    g *= scale;
    h *= scale;
  }
  const { region, pivot, others } = sectorTriangle(g, h, secondHalf);
  const turn = (point: LatticePoint) => rotateLatticePoint(point, sector - 1);
  return orderedSelection(
    sector,
    region,
    { ...pivot, point: turn(pivot.point) },
    [
      { ...others[0], point: turn(others[0].point) },
      { ...others[1], point: turn(others[1].point) },
    ],
    smallVectorSplit,
  );
}

/** Region, redundant small vector and the other two vertices, in the frame of sector 1. */
function sectorTriangle(
  g: number,
  h: number,
  secondHalf: boolean,
): { region: ThreeLevelRegion; pivot: Vertex; others: [Vertex, Vertex] } {
  const at = (pg: number, ph: number, dwell: number): Vertex => ({
    point: { g: pg, h: ph },
    dwell,
  });
  if (g + h < 1) {
    const zero = at(0, 0, 1 - g - h);
    const first = at(1, 0, g);
    const second = at(0, 1, h);
    return secondHalf
      ? { region: 1, pivot: second, others: [first, zero] }
      : { region: 1, pivot: first, others: [second, zero] };
  }
  if (!secondHalf && g >= 1) {
    return { region: 2, pivot: at(1, 0, 2 - g - h), others: [at(2, 0, g - 1), at(1, 1, h)] };
  }
  if (secondHalf && h >= 1) {
    return { region: 4, pivot: at(0, 1, 2 - g - h), others: [at(1, 1, g), at(0, 2, h - 1)] };
  }
  const first = at(1, 0, 1 - h);
  const second = at(0, 1, 1 - g);
  const medium = at(1, 1, g + h - 1);
  return secondHalf
    ? { region: 3, pivot: second, others: [first, medium] }
    : { region: 3, pivot: first, others: [second, medium] };
}

/**
 * The selection with states: from the small vector's N-type form, each of the other two vertices
 * is one leg raised by one level (a unit triangle of the lattice always allows this order), then
 * the third leg raised gives the P-type form.
 */
function orderedSelection(
  sector: number,
  region: ThreeLevelRegion,
  pivot: Vertex,
  others: [Vertex, Vertex],
  split: number,
): ThreeLevelSpaceVectorSelection {
  const negative = negativeForm(pivot.point);
  const positive: LegLevels = [negative[0] + 1, negative[1] + 1, negative[2] + 1];
  const [x, y] = others;
  const viaX = raiseTo(negative, x.point);
  const [firstVertex, secondVertex] = viaX === undefined ? [y, x] : [x, y];
  const first = viaX ?? raiseTo(negative, y.point);
  const second = first === undefined ? undefined : raiseTo(first, secondVertex.point);
  if (first === undefined || second === undefined) {
    throw new Error('unreachable: the three vertices form a unit triangle of the lattice');
  }
  const vector = (levels: LegLevels, dwell: number): ThreeLevelSelectedVector => ({
    kind: vectorKind(latticePoint(levels)),
    states: [stateName(levels)],
    dwell,
  });
  return {
    sector,
    region,
    vectors: [
      { kind: 'small', states: [stateName(negative), stateName(positive)], dwell: pivot.dwell },
      vector(first, firstVertex.dwell),
      vector(second, secondVertex.dwell),
    ],
    redundant: {
      positive: stateName(positive),
      negative: stateName(negative),
      positiveDwell: split * pivot.dwell,
      negativeDwell: (1 - split) * pivot.dwell,
    },
  };
}

/** The state one leg higher than `levels` whose vector sits at `target`, if there is one. */
function raiseTo(levels: LegLevels, target: LatticePoint): LegLevels | undefined {
  for (let leg = 0; leg < 3; leg++) {
    if (levels[leg] === 1) continue;
    const raised: LegLevels = [...levels];
    raised[leg] = (raised[leg] as number) + 1;
    const point = latticePoint(raised);
    if (point.g === target.g && point.h === target.h) return raised;
  }
  return undefined;
}
