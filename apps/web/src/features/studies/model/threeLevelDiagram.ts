import {
  designModulation,
  threeLevelSpaceVectorTrajectory,
  threeLevelVectorDiagram,
  type InverterDesign,
  type ThreeLevelTrajectorySample,
  type ThreeLevelVectorDiagram,
} from '@pulsewright/modulation';

/** A segment between two neighbouring points of the diagram (per unit of vdc). */
export interface DiagramSegment {
  from: { alpha: number; beta: number };
  to: { alpha: number; beta: number };
}

/** What the three-level vector diagram draws, all from the library. */
export interface ThreeLevelDiagramData {
  /** The 19 points (27 states) by length class, per unit of vdc. */
  diagram: ThreeLevelVectorDiagram;
  /** The sides of the diagram's triangles: points one small-vector length (vdc/3) apart. */
  segments: DiagramSegment[];
  /** The sampled reference and the states selected in each switching period. */
  trajectory: ThreeLevelTrajectorySample[];
}

/** The small vectors' length, per unit of vdc: the side of every triangle of the hexagon. */
const SIDE = 1 / 3;

/**
 * The vector diagram of a design under three-level space vector (the library's
 * `threeLevelVectorDiagram` and `threeLevelSpaceVectorTrajectory` of the design's modulation, as
 * `designModulation` completes it); null for any other method and for a design the library
 * refuses (the preview names the field).
 */
export function threeLevelDiagramOf(design: InverterDesign): ThreeLevelDiagramData | null {
  if (design.modulation.method !== 'multilevel-space-vector') return null;
  let trajectory: ThreeLevelTrajectorySample[];
  try {
    const modulation = designModulation(design);
    if (modulation.method !== 'multilevel-space-vector') return null;
    trajectory = threeLevelSpaceVectorTrajectory(modulation);
  } catch {
    return null;
  }
  const diagram = threeLevelVectorDiagram();
  const points = Object.values(diagram).flat();
  const segments: DiagramSegment[] = [];
  points.forEach((from, i) =>
    points.slice(i + 1).forEach((to) => {
      if (Math.abs(Math.hypot(from.alpha - to.alpha, from.beta - to.beta) - SIDE) < 1e-9)
        segments.push({ from, to });
    }),
  );
  return { diagram, segments, trajectory };
}
