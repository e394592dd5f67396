import { describe, expect, it } from 'vitest';
import { harmonics } from '../../spectrum/index.js';
import { sheSweep, sheWaveform, type SheBranch } from '../index.js';
import { assertInDelta } from '../../testing/assertInDelta.js';

function largestJump(branch: SheBranch): number {
  let jump = 0;
  for (let i = 1; i < branch.points.length; i++) {
    const a = branch.points[i - 1];
    const b = branch.points[i];
    if (a?.converged !== true || b?.converged !== true) continue;
    a.angles.forEach((x, k) => (jump = Math.max(jump, Math.abs(x - (b.angles[k] as number)))));
  }
  return jump;
}

describe('sheSweep', () => {
  it('staircase, two angles removing the 3rd: branches and gaps where pen and paper put them', () => {
    // cos 3a + cos 3b = 0 with 0 < a < b < π/2: families a + b = π/3 (S ∈ (1.5, √3)) and
    // b = a + π/3 (S ∈ (√3/2, 1.5)), S = cos a + cos b = V₁/(4vdc/π) (pen and paper,
    // sum-to-product). So no solution below √3/2 ≈ 0.866, and both families end at S = 1.5
    // where a → 0.
    const vdc = 10;
    const scale = (4 * vdc) / Math.PI;
    const progress: number[] = [];
    const result = sheSweep({
      kind: 'staircase',
      vdc,
      count: 2,
      eliminate: [3],
      fundamentals: { from: 0.6 * scale, to: 1.7 * scale, points: 111 },
      onProgress: (f) => progress.push(f),
    });
    expect(progress.length).toBe(111);
    expect(progress.at(-1)).toBe(1);
    expect(progress.every((f, i) => i === 0 || f > (progress[i - 1] as number))).toBe(true);
    const gap = result.gaps[0];
    expect(gap).toBeDefined();
    assertInDelta((gap?.from ?? NaN) / scale, 0.6, 1e-12, 'gap start');
    // The last unsolved grid point below √3/2 is 0.86 (grid step 0.01).
    assertInDelta((gap?.to ?? NaN) / scale, 0.86, 1e-9, 'gap end');
    expect(result.message).toMatch(/No solution found at/);
    for (const branch of result.branches) {
      for (const point of branch.points.filter((p) => p.converged)) {
        const S = point.fundamental / scale;
        const [a, b] = point.angles as [number, number];
        const onFirst = Math.abs(a + b - Math.PI / 3) < 1e-9;
        const onSecond = Math.abs(b - a - Math.PI / 3) < 1e-9;
        expect(onFirst || onSecond, `S = ${S}`).toBe(true);
        expect(S).toBeGreaterThan(Math.sqrt(3) / 2);
        assertInDelta(Math.cos(a) + Math.cos(b), S, 1e-12, 'fundamental');
      }
      expect(largestJump(branch)).toBeLessThan(0.05);
    }
    // Every grid point with S in (0.87, 1.49) ∪ (1.51, 1.7) is solved.
    const solvedAt = new Set(
      result.branches.flatMap((b) =>
        b.points.filter((p) => p.converged).map((p) => Math.round((100 * p.fundamental) / scale)),
      ),
    );
    for (let s = 87; s <= 170; s++)
      if (s !== 150) expect(solvedAt.has(s), `S = ${s / 100}`).toBe(true);
  });

  it('bipolar, 5 angles: every point checked on the exact spectrum, branches continuous', () => {
    const vdc = 300;
    const scale = (4 * vdc) / Math.PI;
    const result = sheSweep({
      kind: 'bipolar',
      vdc,
      count: 5,
      eliminate: [5, 7, 11, 13],
      fundamentals: { from: 0.05 * scale, to: 0.9 * scale, points: 60 },
    });
    expect(result.solvedFraction).toBe(1);
    expect(result.gaps).toEqual([]);
    expect(result.branches.length).toBeGreaterThan(0);
    for (const branch of result.branches) {
      expect(largestJump(branch)).toBeLessThan(0.1);
      for (const point of branch.points.filter((p) => p.converged)) {
        // Residual criterion of docs/references.md on the library's exact spectrum (Patel and Hoft, 1973).
        const spectrum = harmonics(sheWaveform(point.angles, { kind: 'bipolar', vdc }), 13);
        assertInDelta(
          spectrum[1]?.amplitude ?? NaN,
          point.fundamental,
          1e-9 * point.fundamental,
          'V₁',
        );
        for (const n of [5, 7, 11, 13])
          expect(spectrum[n]?.amplitude ?? NaN).toBeLessThan(1e-9 * point.fundamental);
      }
    }
  });

  it('rejects a range outside the achievable fundamentals', () => {
    expect(() =>
      sheSweep({
        kind: 'bipolar',
        vdc: 100,
        count: 3,
        eliminate: [5, 7],
        fundamentals: { from: 10, to: 130, points: 5 },
      }),
    ).toThrow(/fundamentals\.to/);
    expect(() =>
      sheSweep({
        kind: 'bipolar',
        vdc: 100,
        count: 3,
        eliminate: [5, 7],
        fundamentals: { from: 10, to: 100, points: 0 },
      }),
    ).toThrow(/fundamentals\.points/);
  });
});
