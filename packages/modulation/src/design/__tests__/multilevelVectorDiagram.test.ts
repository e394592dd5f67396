import { describe, expect, it } from 'vitest';
import { threeLevelSpaceVectorTrajectory } from '../../multilevel/space-vector/threeLevelSpaceVectorTrajectory.js';
import { threeLevelVectorDiagram } from '../../multilevel/space-vector/threeLevelVectorDiagram.js';
import { analyseDesign } from '../analyseDesign.js';
import type { InverterDesign } from '../InverterDesign.js';

const sv = (sampling: 'symmetric' | 'asymmetric'): InverterDesign => ({
  vdc: 800,
  fundamentalFrequency: 50,
  carrierFrequency: 50 * 24,
  modulation: {
    method: 'multilevel-space-vector',
    m: 0.8,
    topology: 'npc',
    sampling,
    smallVectorSplit: 0.3,
  },
  load: { r: 8, l: 0.01 },
});

describe('analyseDesign: the three-level space-vector diagram in the report', () => {
  it.each(['symmetric', 'asymmetric'] as const)(
    'is the library’s diagram and trajectory of the design’s modulation (%s sampling)',
    (sampling) => {
      const figures = analyseDesign(sv(sampling)).multilevel?.vectorDiagram;
      if (!figures) throw new Error('expected a vector diagram');
      expect(figures.diagram).toEqual(threeLevelVectorDiagram());
      const trajectory = threeLevelSpaceVectorTrajectory({
        m: 0.8,
        frequencyRatio: 24,
        sampling,
        smallVectorSplit: 0.3,
      });
      expect(figures.trajectory).toEqual(trajectory);
      // One sample a switching period, two with asymmetric sampling (its size is bounded by mf).
      expect(figures.trajectory).toHaveLength(sampling === 'asymmetric' ? 48 : 24);
    },
  );

  it('applies the nearest three vectors: each sample lies in the triangle of its applied states', () => {
    // Nearest-three-vector selection (Celanovic and Boroyevich, IEEE Trans. Power Electron., 2000):
    // the reference is a convex combination of the vectors applied in its switching period.
    const figures = analyseDesign(sv('symmetric')).multilevel?.vectorDiagram;
    if (!figures) throw new Error('expected a vector diagram');
    const where = new Map(
      Object.values(figures.diagram)
        .flat()
        .flatMap((p) => p.states.map((state) => [state, p] as const)),
    );
    for (const sample of figures.trajectory) {
      const points = [...new Set(sample.states.map((state) => where.get(state)))];
      expect(points).toHaveLength(3);
      const [p, q, r] = points as unknown as [
        { alpha: number; beta: number },
        { alpha: number; beta: number },
        { alpha: number; beta: number },
      ];
      const det = (q.alpha - p.alpha) * (r.beta - p.beta) - (r.alpha - p.alpha) * (q.beta - p.beta);
      const u =
        ((sample.alpha - p.alpha) * (r.beta - p.beta) -
          (r.alpha - p.alpha) * (sample.beta - p.beta)) /
        det;
      const v =
        ((q.alpha - p.alpha) * (sample.beta - p.beta) -
          (sample.alpha - p.alpha) * (q.beta - p.beta)) /
        det;
      expect(Math.min(u, v, 1 - u - v)).toBeGreaterThan(-1e-12);
      // The reference's length m/√3 of vdc (Holmes and Lipo 2003, ch. 11).
      expect(Math.hypot(sample.alpha, sample.beta)).toBeCloseTo(0.8 / Math.sqrt(3), 12);
    }
  });

  it('is null for a multilevel carrier design', () => {
    const report = analyseDesign({
      ...sv('symmetric'),
      modulation: {
        method: 'multilevel-carrier',
        topology: 'npc',
        levels: 3,
        carriers: 'pd',
        phaseCount: 3,
        ma: 0.9,
      },
    });
    expect(report.multilevel?.vectorDiagram).toBeNull();
  });
});
