import { describe, expect, it } from 'vitest';
import { combineWaveforms, threePhase, waveformValueAt, type Waveform } from '../../index.js';
import { EDGE_EPSILON } from '../../math.js';
import { starVoltages } from '../starVoltages.js';

const vdc = 600;

/** The seven waveforms as separate `combineWaveforms` calls of the legs each one reads. */
function combinedOneByOne([a, b, c]: [Waveform, Waveform, Waveform]) {
  const phase = (levels: readonly number[]) =>
    (2 * (levels[0] as number) - (levels[1] as number) - (levels[2] as number)) / 3;
  const line = (levels: readonly number[]) => (levels[0] as number) - (levels[1] as number);
  return {
    phases: [
      combineWaveforms([a, b, c], phase),
      combineWaveforms([b, c, a], phase),
      combineWaveforms([c, a, b], phase),
    ],
    lines: [
      combineWaveforms([a, b], line),
      combineWaveforms([b, c], line),
      combineWaveforms([c, a], line),
    ],
    commonMode: combineWaveforms(
      [a, b, c],
      (levels) => ((levels[0] as number) + (levels[1] as number) + (levels[2] as number)) / 3,
    ),
  };
}

describe('starVoltages', () => {
  it('equals each waveform combined from its own legs, bit for bit, for carrier legs', () => {
    for (const zeroSequence of ['none', 'min-max', 'dpwm1', 'nspwm'] as const) {
      const { legs } = threePhase({ ma: 0.9, mf: 21, vdc, zeroSequence });
      const triple: [Waveform, Waveform, Waveform] = [legs.a, legs.b, legs.c];
      expect(starVoltages(triple)).toEqual(combinedOneByOne(triple));
    }
  });

  it("keeps a line's edge where its own leg switches when the third leg switches a hair before", () => {
    // Leg c switches EDGE_EPSILON/2 before leg a: merged with c's edge, a's edge would move to
    // c's angle in the phases, but the line a−b never sees leg c.
    const a: Waveform = { edges: [1, 4], levels: [300, -300] };
    const b: Waveform = { edges: [2, 5], levels: [300, -300] };
    const c: Waveform = { edges: [1 - EDGE_EPSILON / 2, 3], levels: [300, -300] };
    const star = starVoltages([a, b, c]);
    expect(star).toEqual(combinedOneByOne([a, b, c]));
    expect(star.lines[0].edges).toContain(1);
    expect(star.phases[0].edges).not.toContain(1);
  });

  it('satisfies the star connection: phases sum to zero, lines are phase differences', () => {
    // Standard circuit analysis of a balanced star load fed by three legs.
    const { legs } = threePhase({ ma: 1.05, mf: 15, vdc, zeroSequence: 'third-harmonic' });
    const { phases, lines, commonMode } = starVoltages([legs.a, legs.b, legs.c]);
    for (let k = 0; k < 500; k++) {
      const theta = ((k + 0.37) / 500) * 2 * Math.PI;
      const [an, bn, cn] = phases.map((p) => waveformValueAt(p, theta)) as [number, number, number];
      const leg = [legs.a, legs.b, legs.c].map((w) => waveformValueAt(w, theta));
      expect(Math.abs(an + bn + cn)).toBeLessThan(1e-9);
      expect(waveformValueAt(lines[0], theta)).toBeCloseTo(an - bn, 9);
      expect(waveformValueAt(lines[2], theta)).toBeCloseTo(cn - an, 9);
      expect(waveformValueAt(commonMode, theta)).toBeCloseTo(leg.reduce((s, v) => s + v, 0) / 3, 9);
    }
  });
});
