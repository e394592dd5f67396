import { describe, expect, it } from 'vitest';
import { harmonics } from '../../spectrum/index.js';
import { solveShe, type SheResult } from '../index.js';
import { assertInDelta } from '../../testing/assertInDelta.js';

const deg = Math.PI / 180;

/** Checks a solution on the library's exact spectrum of the returned waveform, not the solver's model. */
function expectSolved(result: SheResult, fundamental: number | null): void {
  expect(result.converged, result.message).toBe(true);
  const maxOrder = Math.max(1, ...result.residual.map((r) => r.order));
  const spectrum = harmonics(result.waveform, maxOrder);
  const first = spectrum[1];
  const v1 = (first?.amplitude ?? NaN) * Math.cos(first?.phase ?? NaN);
  // Acceptance criteria of docs/references.md (Patel and Hoft, 1973, method): eliminated orders below
  // 1e-9 of the fundamental; the fundamental in phase with sin θ and met to 1e-9.
  expect(v1).toBeGreaterThan(0);
  if (fundamental !== null) assertInDelta(v1, fundamental, 1e-9 * fundamental, 'fundamental');
  for (const { order } of result.residual) {
    expect(spectrum[order]?.amplitude ?? NaN, `order ${order}`).toBeLessThan(1e-9 * v1);
  }
  result.angles.forEach((a, k) => {
    expect(a).toBeGreaterThan(k === 0 ? 0 : (result.angles[k - 1] as number));
    expect(a).toBeLessThan(Math.PI / 2);
  });
}

describe('solveShe closed cases', () => {
  const vdc = 48;

  it('staircase, one angle removing the 3rd harmonic: α = 30°', () => {
    // b₃ ∝ cos 3α = 0 with α in (0, π/2) gives α = π/6 (pen and paper; Patel and Hoft, 1973, form).
    const result = solveShe({ kind: 'staircase', vdc, count: 1, eliminate: [3] });
    expectSolved(result, null);
    assertInDelta(result.angles[0] ?? NaN, 30 * deg, 1e-12, 'α');
    assertInDelta(result.fundamental, ((4 * vdc) / Math.PI) * Math.cos(30 * deg), 1e-9 * vdc, 'V₁');
  });

  it('bipolar, one notch removing the 3rd harmonic: α = 20°', () => {
    // Our convention, one angle: −vdc on (0, α), +vdc on (α, π/2), so
    // b_n = (4vdc/(nπ))·(2cos nα − 1); b₃ = 0 ⇔ cos 3α = 1/2 ⇔ α = 20° (the only root in
    // (0, π/2)); then V₁ = (4vdc/π)(2cos 20° − 1) ≈ 1.1197·vdc (pen and paper). With the
    // opposite start (+vdc at 0+) the angle is the same and only the sign of every b_n flips.
    const result = solveShe({ kind: 'bipolar', vdc, count: 1, eliminate: [3] });
    expectSolved(result, ((4 * vdc) / Math.PI) * (2 * Math.cos(20 * deg) - 1));
    assertInDelta(result.angles[0] ?? NaN, 20 * deg, 1e-12, 'α');
  });

  it('staircase, one angle setting the fundamental: α = arccos(V₁π/(4vdc))', () => {
    // b₁ = (4vdc/π)cos α (pen and paper).
    const fundamental = 0.6 * ((4 * vdc) / Math.PI);
    const result = solveShe({ kind: 'staircase', vdc, angles: [1.2], eliminate: [], fundamental });
    expectSolved(result, fundamental);
    assertInDelta(result.angles[0] ?? NaN, Math.acos(0.6), 1e-12, 'α');
  });

  it('staircase, two angles removing the 3rd: on the closed-form families', () => {
    // cos 3a + cos 3b = 0 with 0 < a < b < π/2 has exactly the families a + b = π/3 and
    // b = a + π/3 (a < π/6), on which cos a + cos b = √3·cos((b − a)/2) resp. √3·cos(a + π/6)
    // (pen and paper, sum-to-product). At S = cos a + cos b = 1.2 only the second exists.
    const S = 1.2;
    const result = solveShe({
      kind: 'staircase',
      vdc,
      count: 2,
      eliminate: [3],
      fundamental: S * ((4 * vdc) / Math.PI),
    });
    expectSolved(result, S * ((4 * vdc) / Math.PI));
    assertInDelta(result.angles[0] ?? NaN, Math.acos(S / Math.sqrt(3)) - Math.PI / 6, 1e-10, 'a');
    assertInDelta(result.angles[1] ?? NaN, Math.acos(S / Math.sqrt(3)) + Math.PI / 6, 1e-10, 'b');
  });

  it('says plainly when no solution exists, without throwing', () => {
    // Same families: cos a + cos b > √3/2 on both, so S = 0.5 has no solution (pen and paper).
    const result = solveShe({
      kind: 'staircase',
      vdc,
      count: 2,
      eliminate: [3],
      fundamental: 0.5 * ((4 * vdc) / Math.PI),
    });
    expect(result.converged).toBe(false);
    expect(result.message).toMatch(/No solution found from 24 start/);
    expect(result.starts).toBe(24);
  });
});

describe('solveShe on larger patterns', () => {
  const vdc = 400;
  const scale = (4 * vdc) / Math.PI;

  it('bipolar, 5 angles, eliminating 5, 7, 11, 13 at 0.8 of the square-wave fundamental', () => {
    const result = solveShe({
      kind: 'bipolar',
      vdc,
      count: 5,
      eliminate: [5, 7, 11, 13],
      fundamental: 0.8 * scale,
    });
    expectSolved(result, 0.8 * scale);
    // Half-wave symmetry: no even harmonics and no DC (fact of the trade).
    harmonics(result.waveform, 12)
      .filter((h) => h.order % 2 === 0)
      .forEach((h) => expect(Math.abs(h.amplitude)).toBeLessThan(1e-9 * vdc));
  });

  it('staircase, 5 cells, eliminating 5, 7, 11, 13 from a given guess', () => {
    const fundamental = 0.8 * 5 * scale;
    const result = solveShe({
      kind: 'staircase',
      vdc,
      angles: [0.1, 0.3, 0.5, 0.8, 1.1],
      eliminate: [5, 7, 11, 13],
      fundamental,
    });
    expectSolved(result, fundamental);
    expect(result.residual.map((r) => r.order)).toEqual([5, 7, 11, 13]);
  });

  it('bipolar, 7 angles, eliminating the non-triplen orders up to 19', () => {
    const result = solveShe({
      kind: 'bipolar',
      vdc,
      count: 7,
      eliminate: [5, 7, 11, 13, 17, 19],
      fundamental: 0.5 * scale,
    });
    expectSolved(result, 0.5 * scale);
  });
});

describe('solveShe input checks', () => {
  const base = { kind: 'bipolar' as const, vdc: 100, count: 3, eliminate: [5, 7], fundamental: 60 };
  it('throws RangeError naming the field', () => {
    expect(() => solveShe({ ...base, eliminate: [4, 7] })).toThrow(/eliminate\[0\].*odd/);
    expect(() => solveShe({ ...base, eliminate: [1, 7] })).toThrow(/eliminate\[0\]/);
    expect(() => solveShe({ ...base, eliminate: [5, 5] })).toThrow(/eliminate\[1\]/);
    expect(() => solveShe({ ...base, eliminate: [5] })).toThrow(/eliminate\.length/);
    expect(() => solveShe({ ...base, fundamental: 200 })).toThrow(/fundamental must be .*< 127\.3/);
    expect(() => solveShe({ ...base, fundamental: -1 })).toThrow(RangeError);
    expect(() => solveShe({ ...base, count: undefined, angles: [0.3, 0.2, 0.9] })).toThrow(
      /angles\[1\]/,
    );
    expect(() => solveShe({ ...base, count: undefined, angles: [0.3, 0.5, 1.6] })).toThrow(
      /angles\[2\]/,
    );
    expect(() => solveShe({ ...base, vdc: 0 })).toThrow(/vdc/);
    expect(() => solveShe({ ...base, kind: 'square' as never })).toThrow(/kind/);
    expect(() => solveShe({ ...base, count: 2.5 })).toThrow(/count/);
  });
  it('throws TypeError when neither angles nor count is given', () => {
    expect(() => solveShe({ ...base, count: undefined })).toThrow(TypeError);
  });
});
