import type {
  ThreeLevelLegState,
  ThreeLevelSwitchingState,
  ThreeLevelVectorKind,
} from './threeLevelSpaceVectorTypes.js';

/**
 * A point of the three-level vector lattice in 60° coordinates (g, h): the space vector
 * (vdc/3)·(g + h·e^{jπ/3}). A state with leg levels (sa, sb, sc) ∈ {−1, 0, 1}³ (N, O, P) sits at
 * g = sa − sb, h = sb − sc (the g-h coordinates of N. Celanovic and D. Boroyevich, "A fast
 * space-vector modulation algorithm for multilevel three-phase converters", IEEE Trans. Ind.
 * Appl., 2001, from memory). Internal helper of the three-level space-vector functions.
 */
export interface LatticePoint {
  g: number;
  h: number;
}

/** Leg levels −1, 0, 1 of legs a, b, c. */
export type LegLevels = [number, number, number];

const LETTERS: Record<number, ThreeLevelLegState> = { [-1]: 'N', 0: 'O', 1: 'P' };

/** The state's name, for example [1, 0, −1] → `PON`. */
export function stateName([a, b, c]: LegLevels): ThreeLevelSwitchingState {
  return `${LETTERS[a] as ThreeLevelLegState}${LETTERS[b] as ThreeLevelLegState}${LETTERS[c] as ThreeLevelLegState}`;
}

/** Where a state's space vector sits in the lattice. */
export function latticePoint([a, b, c]: LegLevels): LatticePoint {
  return { g: a - b, h: b - c };
}

/** Turns a lattice point by `sixths`·π/3 about the origin: (g, h)·e^{jπ/3} = (−h, g + h). */
export function rotateLatticePoint(point: LatticePoint, sixths: number): LatticePoint {
  let { g, h } = point;
  for (let k = 0; k < sixths; k++) [g, h] = [-h, g + h];
  return { g, h };
}

/**
 * Length class of a lattice point inside the hexagon: the hexagonal distance
 * d = max(|g|, |h|, |g + h|) is 0 (zero), 1 (small) or 2, which is a large vector on the six
 * axes (one of g, h, g + h zero) and a medium one between them.
 */
export function vectorKind({ g, h }: LatticePoint): ThreeLevelVectorKind {
  const distance = Math.max(Math.abs(g), Math.abs(h), Math.abs(g + h));
  if (distance === 0) return 'zero';
  if (distance === 1) return 'small';
  return g === 0 || h === 0 || g + h === 0 ? 'large' : 'medium';
}

/**
 * The form of a lattice point whose highest leg is at O (legs at O and N): the N-type form of a
 * small vector, `OOO` for the zero vector. Legs from g = sa − sb, h = sb − sc.
 */
export function negativeForm({ g, h }: LatticePoint): LegLevels {
  const c = -Math.max(0, h, g + h);
  return [c + g + h, c + h, c];
}

/** Space vector of a state normalised to vdc, by the Clarke transform (2/3)·(va + a·vb + a²·vc). */
export function stateAlphaBeta([a, b, c]: LegLevels): { alpha: number; beta: number } {
  // Legs at s·vdc/2: α = (2/3)(va − vb/2 − vc/2), β = (vb − vc)/√3.
  return { alpha: (a - (b + c) / 2) / 3, beta: (b - c) / (2 * Math.sqrt(3)) };
}
