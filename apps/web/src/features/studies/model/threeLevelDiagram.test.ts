import { analyseDesign, type InverterDesign } from '@pulsewright/modulation';
import { describe, expect, it } from 'vitest';
import { threeLevelDiagramSegments } from './threeLevelDiagram';

const design: InverterDesign = {
  vdc: 800,
  fundamentalFrequency: 50,
  carrierFrequency: 1200,
  modulation: { method: 'multilevel-space-vector', ma: 0.9, sampling: 'symmetric' },
  load: { r: 10, l: 0.01 },
};

describe('threeLevelDiagramSegments', () => {
  it('gives the 42 sides of the hexagon’s 24 triangles of the report’s 19 points', () => {
    const data = analyseDesign(design).multilevel?.vectorDiagram;
    if (!data) throw new Error('a three-level space-vector design has a diagram');
    const points = Object.values(data.diagram).flat();
    // 6 sectors of 4 regions (Celanovic and Boroyevich 2000): 24 triangles on 19 points, so
    // by Euler's formula V − E + F = 2 with F = 24 + 1 the sides number 19 + 25 − 2 = 42.
    expect(points).toHaveLength(19);
    expect(points.reduce((n, p) => n + p.states.length, 0)).toBe(27);
    const segments = threeLevelDiagramSegments(data.diagram);
    expect(segments).toHaveLength(42);
    // The hexagon's outer sides join large and medium vectors: 12 of them, each vdc/3 long.
    const outer = segments.filter(
      (s) => Math.hypot(s.from.alpha, s.from.beta) > 0.5 && Math.hypot(s.to.alpha, s.to.beta) > 0.5,
    );
    expect(outer).toHaveLength(12);
  });
});
