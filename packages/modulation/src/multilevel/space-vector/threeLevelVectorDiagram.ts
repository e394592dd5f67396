import {
  latticePoint,
  stateAlphaBeta,
  stateName,
  vectorKind,
  type LegLevels,
} from './threeLevelLattice.js';
import type {
  ThreeLevelSwitchingState,
  ThreeLevelVectorKind,
} from './threeLevelSpaceVectorTypes.js';

/** One point of the three-level vector diagram and the switching states that produce it. */
export interface ThreeLevelDiagramVector {
  /** Space vector's components normalised to vdc (Clarke transform, amplitude-invariant). */
  alpha: number;
  beta: number;
  /** Every state at this point: three for the zero vector, two for a small one, else one. */
  states: ThreeLevelSwitchingState[];
}

/** The 19 points of the three-level hexagon, grouped by length class. */
export type ThreeLevelVectorDiagram = Record<ThreeLevelVectorKind, ThreeLevelDiagramVector[]>;

/**
 * The 27 switching states of a three-level three-phase bridge placed in the αβ plane, normalised
 * to vdc: v = (2/3)·(va + a·vb + a²·vc), a = e^{j2π/3}, each leg at −vdc/2, 0 or +vdc/2. They
 * fall on 19 points: the zero vector (`NNN`, `OOO`, `PPP`), six small vectors of length 1/3 (two
 * states each, P-type first), six medium ones of 1/√3 and six large ones of 2/3 (Holmes and
 * Lipo 2003, ch. 11; Celanovic and Boroyevich, IEEE Trans. Power Electron., 2000). Each group
 * is ordered by angle from the phase-a axis, the states of a point from highest legs to lowest.
 * For the dashboard's vector diagram.
 */
export function threeLevelVectorDiagram(): ThreeLevelVectorDiagram {
  const diagram: ThreeLevelVectorDiagram = { zero: [], small: [], medium: [], large: [] };
  const byPoint = new Map<string, ThreeLevelDiagramVector>();
  const kinds = new Map<string, ThreeLevelVectorKind>();
  for (const a of [1, 0, -1]) {
    for (const b of [1, 0, -1]) {
      for (const c of [1, 0, -1]) {
        const levels: LegLevels = [a, b, c];
        const point = latticePoint(levels);
        const key = `${point.g},${point.h}`;
        const existing = byPoint.get(key);
        if (existing === undefined) {
          byPoint.set(key, { ...stateAlphaBeta(levels), states: [stateName(levels)] });
          kinds.set(key, vectorKind(point));
        } else {
          existing.states.push(stateName(levels));
        }
      }
    }
  }
  for (const [key, vector] of byPoint) {
    diagram[kinds.get(key) as ThreeLevelVectorKind].push(vector);
  }
  const angle = ({ alpha, beta }: ThreeLevelDiagramVector) => {
    const raw = Math.atan2(beta, alpha);
    // Round so that the phase-a axis (β a hair below 0) sorts first, not last.
    return raw < -1e-12 ? raw + 2 * Math.PI : Math.max(raw, 0);
  };
  for (const group of Object.values(diagram)) group.sort((x, y) => angle(x) - angle(y));
  return diagram;
}
