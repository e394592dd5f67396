import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { spaceVector, HEXAGON_VERTEX_M } from '../index.js';
import { ParameterRangeError } from '../../validation/errors.js';
import { assertInDelta } from '../../testing/assertInDelta.js';

const vdc = 600;

/**
 * Space vector of a switching state, by the Clarke (space-vector) transform
 * v = (2/3)·(va + a·vb + a²·vc), a = e^{j2π/3}, with legs at ±vdc/2 (van der Broeck et al.,
 * IEEE Trans. Ind. Appl., 1988; Holmes and Lipo 2003, ch. 5). Computed here independently of
 * the library's vector table.
 */
function stateVector(state: string): [number, number] {
  const legs = [...state].map((bit) => (bit === '1' ? vdc / 2 : -vdc / 2));
  let re = 0;
  let im = 0;
  legs.forEach((v, i) => {
    re += (2 / 3) * v * Math.cos((2 * Math.PI * i) / 3);
    im += (2 / 3) * v * Math.sin((2 * Math.PI * i) / 3);
  });
  return [re, im];
}

/** The active vectors bounding sector k, found as the states nearest its edges' angles. */
function boundingStates(sector: number): [string, string] {
  const states = ['100', '110', '010', '011', '001', '101'];
  const at = (angle: number) =>
    states.find((s) => {
      const [re, im] = stateVector(s);
      return Math.abs(Math.atan2(im, re) - Math.atan2(Math.sin(angle), Math.cos(angle))) < 1e-9;
    }) as string;
  return [at(((sector - 1) * Math.PI) / 3), at((sector * Math.PI) / 3)];
}

describe('spaceVector dwell times', () => {
  it('reproduces the reference vector as t1·Vk + t2·Vk+1 (volt-second balance)', () => {
    // Σ t_i·V_i = Vref with |Vref| = m·vdc/√3 (van der Broeck et al. 1988, m = √3|Vref|/vdc).
    for (let m = 0.05; m <= 1; m += 0.19) {
      for (let theta = -7; theta < 7; theta += 0.137) {
        const { sector, t1, t2 } = spaceVector({ m, theta });
        const [first, second] = boundingStates(sector);
        const [re1, im1] = stateVector(first);
        const [re2, im2] = stateVector(second);
        const magnitude = (m * vdc) / Math.sqrt(3);
        assertInDelta(t1 * re1 + t2 * re2, magnitude * Math.cos(theta), 1e-9 * vdc, `re ${theta}`);
        assertInDelta(t1 * im1 + t2 * im2, magnitude * Math.sin(theta), 1e-9 * vdc, `im ${theta}`);
      }
    }
  });

  it('numbers sectors 1…6 from 0, π/3, … and wraps any angle', () => {
    // Sector k spans [(k−1)π/3, kπ/3) (docs/architecture.md; Holmes and Lipo ch. 5).
    for (let k = 1; k <= 6; k++) {
      const middle = ((k - 0.5) * Math.PI) / 3;
      expect(spaceVector({ m: 0.5, theta: middle }).sector).toBe(k);
      expect(spaceVector({ m: 0.5, theta: middle + 4 * Math.PI }).sector).toBe(k);
      expect(spaceVector({ m: 0.5, theta: middle - 2 * Math.PI }).sector).toBe(k);
    }
  });

  it('ends the linear range at m = 1, |Vref| = vdc/√3: t0 = 0 at mid-sector', () => {
    // Linear limit: the inscribed circle of the hexagon touches its side at mid-sector
    // (Holmes and Lipo 2003 ch. 5; docs/references.md).
    for (let k = 0; k < 6; k++) {
      const { t0, t1, t2 } = spaceVector({ m: 1, theta: ((k + 0.5) * Math.PI) / 3 });
      assertInDelta(t0, 0, 1e-15, 't0');
      assertInDelta(t1, 0.5, 1e-15, 't1');
      assertInDelta(t2, 0.5, 1e-15, 't2');
    }
    // Anywhere else on the circle some zero-vector time is left: t0 = 1 − cos(θ' − π/6).
    const { t0 } = spaceVector({ m: 1, theta: 0.2 });
    assertInDelta(t0, 1 - Math.cos(0.2 - Math.PI / 6), 1e-15);
  });

  it('accepts m up to the hexagon and refuses vectors beyond it, naming m', () => {
    // At a vertex the active vector alone is applied: |V1| = 2vdc/3, m = 2/√3 (Holmes and Lipo).
    const vertex = spaceVector({ m: HEXAGON_VERTEX_M, theta: 0 });
    assertInDelta(vertex.t1, 1, 1e-15);
    expect(() => spaceVector({ m: 1.01, theta: Math.PI / 6 })).toThrow(ParameterRangeError);
    expect(() => spaceVector({ m: 1.01, theta: Math.PI / 6 })).toThrow(
      /^m must be .*overmodulatedReference/,
    );
    expect(() => spaceVector({ m: -0.1, theta: 0 })).toThrow(/^m must be/);
    expect(() => spaceVector({ m: Number.NaN, theta: 0 })).toThrow(RangeError);
    expect(() => spaceVector({ m: 0.5, theta: Number.POSITIVE_INFINITY })).toThrow(
      /^theta must be/,
    );
    expect(() => spaceVector({ m: '0.5', theta: 0 } as never)).toThrow(TypeError);
    expect(() => spaceVector(null as never)).toThrow(/^reference must be/);
  });

  it('property: t1, t2, t0 ≥ 0 and sum to 1 for 0 ≤ m ≤ 1 at any angle', () => {
    // Dwell times are fractions of one switching period (van der Broeck et al. 1988).
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 1, noNaN: true }),
        fc.double({ min: -1e3, max: 1e3, noNaN: true }),
        (m, theta) => {
          const { sector, t1, t2, t0 } = spaceVector({ m, theta });
          expect(sector).toBeGreaterThanOrEqual(1);
          expect(sector).toBeLessThanOrEqual(6);
          expect(Math.min(t1, t2, t0)).toBeGreaterThanOrEqual(0);
          assertInDelta(t1 + t2 + t0, 1, 4e-16);
        },
      ),
      { numRuns: 2000 },
    );
  });
});
