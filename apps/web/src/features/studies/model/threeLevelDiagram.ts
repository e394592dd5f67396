import type { StudyReport } from '../../../lib/api';

/** The report's three-level vector diagram (`multilevel.vectorDiagram`). */
export type ThreeLevelDiagramData = NonNullable<
  NonNullable<StudyReport['multilevel']>['vectorDiagram']
>;

/** A point of the diagram, per unit of vdc. */
interface DiagramPoint {
  alpha: number;
  beta: number;
}

/** A segment between two neighbouring points of the diagram (per unit of vdc). */
export interface DiagramSegment {
  from: DiagramPoint;
  to: DiagramPoint;
}

/** The small vectors' length, per unit of vdc: the side of every triangle of the hexagon. */
const SIDE = 1 / 3;

/**
 * The sides of the three-level hexagon's triangles, for drawing the report's diagram: every pair
 * of its points one small-vector length (vdc/3) apart.
 */
export function threeLevelDiagramSegments(
  diagram: ThreeLevelDiagramData['diagram'],
): DiagramSegment[] {
  const points = Object.values(diagram).flat();
  const segments: DiagramSegment[] = [];
  points.forEach((from, i) =>
    points.slice(i + 1).forEach((to) => {
      if (Math.abs(Math.hypot(from.alpha - to.alpha, from.beta - to.beta) - SIDE) < 1e-9)
        segments.push({ from, to });
    }),
  );
  return segments;
}
