import { describe, expect, it } from 'vitest';
import { harmonics, wthd } from '../../spectrum/index.js';
import { optimalPulsePattern, sheWaveform, solveShe } from '../index.js';
import { assertInDelta } from '../../testing/assertInDelta.js';

const vdc = 200;
const scale = (4 * vdc) / Math.PI;

/** WTHD over orders ≤ maxOrder by the library's exact spectrum (Holmes and Lipo, 2003, ch. 3). */
function measuredWthd(angles: readonly number[], maxOrder: number): number {
  return wthd(harmonics(sheWaveform(angles, { kind: 'bipolar', vdc }), maxOrder));
}

function fundamentalOf(angles: readonly number[]): number {
  const h = harmonics(sheWaveform(angles, { kind: 'bipolar', vdc }), 1)[1];
  return (h?.amplitude ?? NaN) * Math.cos(h?.phase ?? NaN);
}

/** Moves angles along `direction` until the exact spectrum's V₁ equals `target` (secant). */
function backToFundamental(
  angles: number[],
  direction: readonly number[],
  target: number,
): number[] {
  let t0 = 0;
  let t1 = 1e-4;
  const at = (t: number): number[] => angles.map((a, k) => a + t * (direction[k] as number));
  let f0 = fundamentalOf(at(t0)) - target;
  let f1 = fundamentalOf(at(t1)) - target;
  for (let i = 0; i < 30 && Math.abs(f1) > 1e-13 * target; i++) {
    const t2 = t1 - (f1 * (t1 - t0)) / (f1 - f0);
    [t0, f0, t1] = [t1, f1, t2];
    f1 = fundamentalOf(at(t1)) - target;
  }
  return at(t1);
}

describe('optimalPulsePattern', () => {
  it('bipolar, 2 angles: matches a brute-force scan of the one-parameter family', () => {
    // With N = 2 (start at +vdc) V₁ = (4vdc/π)(1 − 2cos α₁ + 2cos α₂) (Patel and Hoft, 1973), so
    // α₂ follows from α₁; scan α₁ finely and measure WTHD by the exact spectrum.
    const m = 0.55;
    const maxOrder = 61;
    const result = optimalPulsePattern({
      kind: 'bipolar',
      vdc,
      count: 2,
      fundamental: m * scale,
      maxOrder,
    });
    expect(result.converged, result.message).toBe(true);
    let best = Infinity;
    for (let i = 1; i < 20000; i++) {
      const a1 = (i / 20000) * (Math.PI / 2);
      const c2 = (m - 1 + 2 * Math.cos(a1)) / 2;
      if (!(c2 > 0 && c2 < 1)) continue;
      const a2 = Math.acos(c2);
      if (!(a2 > a1)) continue;
      best = Math.min(best, measuredWthd([a1, a2], maxOrder));
    }
    expect(result.objective).toBeLessThanOrEqual(best + 1e-12);
    assertInDelta(result.objective, best, 1e-6 * best, 'WTHD');
  });

  it('bipolar, 5 angles: a strict local minimum under feasible perturbations', () => {
    const fundamental = 0.7 * scale;
    const maxOrder = 99;
    const result = optimalPulsePattern({ kind: 'bipolar', vdc, count: 5, fundamental, maxOrder });
    expect(result.converged, result.message).toBe(true);
    assertInDelta(result.fundamental, fundamental, 1e-9 * fundamental, 'V₁');
    // The reported objective is the WTHD of the exact spectrum (Holmes and Lipo, 2003, ch. 3).
    const optimum = measuredWthd(result.angles, maxOrder);
    assertInDelta(result.objective, optimum, 1e-12, 'objective');
    // Normal direction of the constraint: ∂V₁/∂α_k ∝ σ_k sin α_k (Patel and Hoft's b₁ with
    // N = 5, σ_k = −2(−1)^k); perturb along directions orthogonal to it, then return to the
    // same V₁ by the exact spectrum; no such move may lower the WTHD.
    const normal = result.angles.map((a, k) => (k % 2 === 0 ? 2 : -2) * Math.sin(a));
    const norm = Math.hypot(...normal);
    for (let trial = 0; trial < 12; trial++) {
      const raw = result.angles.map((_, k) => Math.sin(1.7 * trial + 2.3 * k + 0.4));
      const along = raw.reduce((s, r, k) => s + r * (normal[k] as number), 0) / (norm * norm);
      const tangent = raw.map((r, k) => r - along * (normal[k] as number));
      for (const eps of [1e-3, -1e-3, 1e-2]) {
        const moved = result.angles.map((a, k) => a + eps * (tangent[k] as number));
        const feasible = backToFundamental(moved, normal, fundamental);
        assertInDelta(fundamentalOf(feasible), fundamental, 1e-9 * fundamental, 'perturbed V₁');
        expect(measuredWthd(feasible, maxOrder), `trial ${trial}, ε ${eps}`).toBeGreaterThan(
          optimum,
        );
      }
    }
  });

  it('weights on the 5th and 7th only: the optimum nulls them, as SHE does', () => {
    // Minimising V₅² + V₇² with 3 angles has zero as its least value wherever an SHE solution
    // eliminating 5 and 7 exists (Patel and Hoft, 1973), so the two methods must agree on zero.
    const fundamental = 0.6 * scale;
    const weights = [
      { order: 5, weight: 1 },
      { order: 7, weight: 1 },
    ];
    const result = optimalPulsePattern({ kind: 'bipolar', vdc, count: 3, fundamental, weights });
    const she = solveShe({ kind: 'bipolar', vdc, count: 3, eliminate: [5, 7], fundamental });
    expect(she.converged).toBe(true);
    expect(result.converged, result.message).toBe(true);
    expect(result.objective).toBeLessThan(1e-9);
    const spectrum = harmonics(result.waveform, 7);
    expect(spectrum[5]?.amplitude ?? NaN).toBeLessThan(1e-9 * fundamental);
    expect(spectrum[7]?.amplitude ?? NaN).toBeLessThan(1e-9 * fundamental);
  });

  it('staircase optimum has a lower WTHD than the SHE pattern with the same cells', () => {
    // Any SHE solution is a feasible point of the WTHD problem, so the minimum found from
    // several starts, one of them the SHE angles, cannot exceed it (definition of a minimum).
    const fundamental = 0.8 * 3 * scale;
    const she = solveShe({ kind: 'staircase', vdc, count: 3, eliminate: [5, 7], fundamental });
    expect(she.converged).toBe(true);
    const result = optimalPulsePattern({
      kind: 'staircase',
      vdc,
      angles: she.angles,
      fundamental,
      maxOrder: 49,
    });
    expect(result.converged, result.message).toBe(true);
    const sheWthd = wthd(harmonics(she.waveform, 49));
    expect(result.objective).toBeLessThan(sheWthd);
  });

  it('throws RangeError for bad input', () => {
    expect(() =>
      optimalPulsePattern({ kind: 'bipolar', vdc, count: 3, fundamental: 2 * scale }),
    ).toThrow(/fundamental/);
    expect(() =>
      optimalPulsePattern({
        kind: 'bipolar',
        vdc,
        count: 3,
        fundamental: 100,
        weights: [{ order: 4, weight: 1 }],
      }),
    ).toThrow(/weights\[0\]\.order/);
    expect(() =>
      optimalPulsePattern({ kind: 'bipolar', vdc, count: 3, fundamental: 100, maxOrder: 2 }),
    ).toThrow(/maxOrder/);
    expect(() =>
      optimalPulsePattern({
        kind: 'bipolar',
        vdc,
        count: 3,
        fundamental: 100,
        objective: 'peak' as never,
      }),
    ).toThrow(/objective/);
  });
});
