import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { spaceVectorSequence, ZERO_VECTOR_CLAMPINGS } from '../index.js';
import type { LegDuties, ZeroVectorClamping } from '../index.js';
import { assertInDelta } from '../../testing/assertInDelta.js';

/**
 * Sinusoidal phase references (per unit of vdc) for a space vector of index m and angle γ:
 * va = (m/√3)·cos γ, vb, vc lagging by 2π/3, 4π/3 (space-vector angle of a positive-sequence
 * set; Holmes and Lipo 2003, ch. 5).
 */
function references(m: number, gamma: number): [number, number, number] {
  const amplitude = m / Math.sqrt(3);
  return [0, 1, 2].map((i) => amplitude * Math.cos(gamma - (2 * Math.PI * i) / 3)) as [
    number,
    number,
    number,
  ];
}

const duties = ({ a, b, c }: LegDuties) => [a, b, c];

describe('spaceVectorSequence', () => {
  it('centred space vector gives the duties of min-max zero-sequence injection', () => {
    // Holmes and Lipo 2003, ch. 5: the centred space vector (equal 000/111 split) equals
    // carrier PWM with v0 = −(max + min)/2 added to the three sinusoidal references; a leg's
    // duty is 1/2 + (v + v0)/vdc. Computed here from the references, not from dwell times.
    for (let m = 0; m <= 1; m += 0.125) {
      for (let gamma = -3.2; gamma < 6.5; gamma += 0.05) {
        const v = references(m, gamma);
        const v0 = -(Math.max(...v) + Math.min(...v)) / 2;
        const got = duties(spaceVectorSequence({ m, theta: gamma }).duties);
        v.forEach((vx, leg) =>
          assertInDelta(got[leg] as number, 0.5 + vx + v0, 1e-14, `leg ${leg}`),
        );
      }
    }
  });

  it('realises the reference line voltages with any sequence and zero split', () => {
    // Volt-second balance (van der Broeck et al. 1988): the zero vectors add the same voltage to
    // every leg, so duty differences are the line references (va − vb)/vdc whatever the split.
    const options = [
      { sequence: 'seven-segment' as const, zeroSplit: 0.2 },
      { sequence: 'seven-segment' as const, zeroSplit: 1 },
      ...ZERO_VECTOR_CLAMPINGS.map((clamping) => ({ sequence: 'five-segment' as const, clamping })),
    ];
    for (const option of options) {
      for (let gamma = 0.01; gamma < 6.3; gamma += 0.1) {
        const [va, vb, vc] = references(0.83, gamma);
        const [a, b, c] = duties(spaceVectorSequence({ m: 0.83, theta: gamma }, option).duties) as [
          number,
          number,
          number,
        ];
        assertInDelta(a - b, va - vb, 1e-14, `${JSON.stringify(option)} ab`);
        assertInDelta(b - c, vb - vc, 1e-14, `${JSON.stringify(option)} bc`);
      }
    }
  });

  it('orders states so that each change switches one leg, seven and five segments', () => {
    // Minimum-switching sequences: adjacent states differ in one leg (Holmes and Lipo ch. 5).
    const differ = (x: string, y: string) => [...x].filter((bit, i) => bit !== y[i]).length;
    for (const sequence of ['seven-segment', 'five-segment'] as const) {
      for (let gamma = 0.05; gamma < 6.3; gamma += 0.3) {
        const { states, durations } = spaceVectorSequence({ m: 0.7, theta: gamma }, { sequence });
        expect(states.length).toBe(sequence === 'seven-segment' ? 7 : 5);
        expect(durations.length).toBe(states.length);
        for (let i = 1; i < states.length; i++) {
          expect(differ(states[i - 1] as string, states[i] as string)).toBe(1);
        }
        expect(states[0]).toBe(states[states.length - 1]); // symmetric: starts and ends alike
      }
    }
    const sector1 = spaceVectorSequence({ m: 0.7, theta: 0.3 });
    expect(sector1.states).toEqual(['000', '100', '110', '111', '110', '100', '000']);
    expect(sector1.sector).toBe(1);
  });

  it('clamps the leg each DPWM variant names (one leg does not switch)', () => {
    // DPWM definitions by clamping interval (Holmes and Lipo 2003, ch. 7; Hava, Kerkman, Lipo
    // 1998, DPWM0/2 from memory): dpwm-min clamps the lowest phase low, dpwm-max the highest
    // high, dpwm1 the phase of largest |reference| to its sign's rail; dpwm2 clamps phase a
    // high for γ in (0, π/3) (60° after its peak), dpwm0 for γ in (−π/3, 0) (60° before).
    const clamped = (clamping: ZeroVectorClamping, gamma: number) => {
      const d = duties(
        spaceVectorSequence({ m: 0.6, theta: gamma }, { sequence: 'five-segment', clamping })
          .duties,
      );
      // A clamped leg's duty is a sum of durations: 0 or 1 up to rounding.
      const legs = d
        .map((x, leg) => ({ x: Math.round(x), leg, off: Math.abs(x - Math.round(x)) }))
        .filter(({ off }) => off < 1e-14)
        .map(({ x, leg }) => ({ x, leg }));
      expect(legs.length, `${clamping} at ${gamma}`).toBe(1);
      return legs[0] as { x: number; leg: number };
    };
    for (let gamma = 0.02; gamma < 6.28; gamma += 0.07) {
      const v = references(0.6, gamma);
      const high = v.indexOf(Math.max(...v));
      const low = v.indexOf(Math.min(...v));
      expect(clamped('dpwm-max', gamma)).toEqual({ x: 1, leg: high });
      expect(clamped('dpwm-min', gamma)).toEqual({ x: 0, leg: low });
      const largest = Math.abs(v[high] as number) >= Math.abs(v[low] as number) ? high : low;
      expect(clamped('dpwm1', gamma)).toEqual({ x: largest === high ? 1 : 0, leg: largest });
      const other = largest === high ? low : high;
      expect(clamped('dpwm3', gamma)).toEqual({ x: other === high ? 1 : 0, leg: other });
    }
    for (let gamma = 0.02; gamma < Math.PI / 3; gamma += 0.1) {
      expect(clamped('dpwm2', gamma)).toEqual({ x: 1, leg: 0 });
      expect(clamped('dpwm0', -gamma)).toEqual({ x: 1, leg: 0 });
    }
  });

  it('property: durations ≥ 0 sum to 1 and duties lie in [0, 1]', () => {
    // Fractions of one switching period (definition).
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.double({ min: -50, max: 50, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.constantFrom('seven-segment' as const, 'five-segment' as const),
        fc.constantFrom(...ZERO_VECTOR_CLAMPINGS),
        (m, theta, zeroSplit, sequence, clamping) => {
          const result = spaceVectorSequence({ m, theta }, { sequence, zeroSplit, clamping });
          expect(Math.min(...result.durations)).toBeGreaterThanOrEqual(0);
          assertInDelta(
            result.durations.reduce((s, d) => s + d, 0),
            1,
            1e-15,
          );
          for (const d of duties(result.duties)) {
            expect(d).toBeGreaterThanOrEqual(0);
            expect(d).toBeLessThanOrEqual(1 + 1e-15);
          }
        },
      ),
      { numRuns: 2000 },
    );
  });

  it('names the bad option', () => {
    const reference = { m: 0.5, theta: 1 };
    expect(() => spaceVectorSequence(reference, { sequence: 'nine' as never })).toThrow(
      /^sequence must be/,
    );
    expect(() => spaceVectorSequence(reference, { zeroSplit: 1.5 })).toThrow(/^zeroSplit must be/);
    expect(() => spaceVectorSequence(reference, { clamping: 'x' as never })).toThrow(
      /^clamping must be/,
    );
  });
});
