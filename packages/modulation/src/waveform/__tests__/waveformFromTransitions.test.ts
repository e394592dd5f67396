import { describe, expect, it } from 'vitest';
import {
  EDGE_EPSILON,
  subtractWaveforms,
  waveformFromTransitions,
  waveformIntegral,
  waveformMean,
  waveformValueAt,
} from '../../index.js';

describe('waveformFromTransitions', () => {
  it('wraps, sorts and drops transitions that do not change the level', () => {
    const waveform = waveformFromTransitions([
      { angle: 4, level: -1 },
      { angle: -1, level: 1 }, // wraps to 2π − 1
      { angle: 1, level: 1 },
      { angle: 2, level: 1 },
    ]);
    // Cyclically the level is 1 from 2π − 1 round to 4, so the changes at 1 and 2 go.
    expect(waveform.levels).toEqual([-1, 1]);
    expect(waveform.edges[0]).toBe(4);
    expect(waveform.edges[1]).toBeCloseTo(2 * Math.PI - 1, 14);
  });

  it('keeps the later level of a cluster straddling 2π (regression: unipolar odd mf)', () => {
    const waveform = waveformFromTransitions([
      { angle: 2 * Math.PI - EDGE_EPSILON / 4, level: 5 },
      { angle: 0, level: 7 },
      { angle: 3, level: 5 },
    ]);
    expect(waveformValueAt(waveform, 0.5)).toBe(7);
    expect(waveformValueAt(waveform, 4)).toBe(5);
  });

  it('makes a constant signal from a single level', () => {
    expect(
      waveformFromTransitions([
        { angle: 2, level: 3 },
        { angle: 5, level: 3 },
      ]),
    ).toEqual({ edges: [0], levels: [3] });
  });
});

describe('waveform arithmetic', () => {
  const a = { edges: [0, Math.PI], levels: [1, -1] };
  const b = { edges: [Math.PI / 2, (3 * Math.PI) / 2], levels: [1, -1] };

  it('subtracts exactly: the difference of two square waves in quadrature', () => {
    const difference = subtractWaveforms(a, b);
    for (const theta of [0.1, 1.7, 3.3, 5]) {
      expect(waveformValueAt(difference, theta)).toBe(
        waveformValueAt(a, theta) - waveformValueAt(b, theta),
      );
    }
    expect(waveformMean(difference)).toBeCloseTo(0, 15);
  });

  it('integrates over any span, periods included', () => {
    // ∫ over one period of a ±1 square wave is 0; over (0, π/2) it is π/2.
    expect(waveformIntegral(a, 0, Math.PI / 2)).toBeCloseTo(Math.PI / 2, 14);
    expect(waveformIntegral(a, 0.3, 0.3 + 4 * Math.PI)).toBeCloseTo(0, 13);
    expect(waveformIntegral(a, 7, 7 + Math.PI / 2)).toBeCloseTo(
      waveformIntegral(a, 7 - 2 * Math.PI, 7 - 1.5 * Math.PI),
      13,
    );
  });
});
