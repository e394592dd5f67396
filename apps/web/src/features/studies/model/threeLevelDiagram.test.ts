import type { InverterDesign } from '@pulsewright/modulation';
import { describe, expect, it } from 'vitest';
import { threeLevelDiagramOf } from './threeLevelDiagram';

const design: InverterDesign = {
  vdc: 800,
  fundamentalFrequency: 50,
  carrierFrequency: 1200,
  modulation: { method: 'multilevel-space-vector', ma: 0.9, sampling: 'symmetric' },
  load: { r: 10, l: 0.01 },
};

describe('threeLevelDiagramOf', () => {
  it('gives the 27 states on 19 points and the 42 sides of the hexagon’s 24 triangles', () => {
    const data = threeLevelDiagramOf(design);
    if (!data) throw new Error('a three-level space-vector design has a diagram');
    const points = Object.values(data.diagram).flat();
    // 6 sectors of 4 regions (Celanovic and Boroyevich 2000): 24 triangles on 19 points, so
    // by Euler's formula V − E + F = 2 with F = 24 + 1 the sides number 19 + 25 − 2 = 42.
    expect(points).toHaveLength(19);
    expect(points.reduce((n, p) => n + p.states.length, 0)).toBe(27);
    expect(data.segments).toHaveLength(42);
  });

  it('samples the reference once a switching period with symmetric sampling, on a circle of m/√3', () => {
    const data = threeLevelDiagramOf(design);
    if (!data) throw new Error('a three-level space-vector design has a diagram');
    // frequencyRatio = 1200/50 = 24 switching periods; m = √3·ma/2 (ma = 2m/√3).
    expect(data.trajectory).toHaveLength(24);
    const m = (Math.sqrt(3) * 0.9) / 2;
    for (const s of data.trajectory)
      expect(Math.hypot(s.alpha, s.beta)).toBeCloseTo(m / Math.sqrt(3), 12);
  });

  it('is null for another method and for a design the library refuses', () => {
    expect(
      threeLevelDiagramOf({ ...design, modulation: { method: 'three-phase', ma: 0.9 } }),
    ).toBeNull();
    expect(
      threeLevelDiagramOf({
        ...design,
        modulation: { method: 'multilevel-space-vector', ma: 0.9, smallVectorSplit: 2 },
      }),
    ).toBeNull();
  });
});
