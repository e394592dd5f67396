import { describe, expect, it } from 'vitest';
import { harmonics } from '../../spectrum/index.js';
import { sheWaveform } from '../index.js';
import { assertInDelta } from '../../testing/assertInDelta.js';

/** Signed sine coefficient b_n of a spectrum entry (a_n is zero for these patterns). */
/** The mean of an order-0 entry: amplitude·cos(phase) (the `Harmonic` convention). */
function meanOf(h: { amplitude: number; phase: number } | undefined): number {
  return h ? h.amplitude * Math.cos(h.phase) : Number.NaN;
}

function sineCoefficient(h: { amplitude: number; phase: number } | undefined): number {
  return h === undefined ? NaN : h.amplitude * Math.cos(h.phase);
}

describe('sheWaveform', () => {
  const vdc = 250;
  const deg = Math.PI / 180;

  it('bipolar: the exact spectrum equals Patel and Hoft’s b_n for odd and even counts', () => {
    // H. S. Patel and R. G. Hoft, IEEE Trans. Ind. Appl., 1973: for a two-level quarter-wave
    // pattern starting at +vdc, b_n = (4vdc/(nπ))·[1 + 2Σ(−1)^k cos nα_k] on odd n. Our
    // convention holds +vdc next to π/2, so for odd N the pattern (and b_n) is negated.
    for (const anglesDeg of [
      [12, 31, 40, 61, 77],
      [9, 22, 47, 70],
    ]) {
      const angles = anglesDeg.map((a) => a * deg);
      const s = angles.length % 2 === 0 ? 1 : -1;
      const spectrum = harmonics(sheWaveform(angles, { kind: 'bipolar', vdc }), 41);
      for (let n = 0; n <= 41; n++) {
        let expected = 0;
        if (n % 2 === 1) {
          const sum = angles.reduce(
            (acc, a, k) => acc + (k % 2 === 0 ? -1 : 1) * Math.cos(n * a),
            0,
          );
          expected = s * ((4 * vdc) / (n * Math.PI)) * (1 + 2 * sum);
        }
        // Exact spectrum versus closed form: rounding only (harmonics is accurate to ~1e-13 vdc).
        assertInDelta(
          n === 0 ? meanOf(spectrum[0]) : sineCoefficient(spectrum[n]),
          expected,
          1e-10 * vdc,
          `order ${n}`,
        );
      }
      // In phase with sin θ: a positive b₁ (phase 0) for these patterns with a large fundamental.
      expect(sineCoefficient(spectrum[1])).toBeGreaterThan(0);
    }
  });

  it('staircase: the exact spectrum equals (4vdc/(nπ))·Σ cos nα_k', () => {
    // Multilevel staircase of equal DC sources (the cascaded-cell form of Patel and Hoft's series).
    const angles = [7, 19, 33, 58].map((a) => a * deg);
    const waveform = sheWaveform(angles, { kind: 'staircase', vdc });
    expect(Math.max(...waveform.levels)).toBe(4 * vdc);
    const spectrum = harmonics(waveform, 31);
    for (let n = 1; n <= 31; n++) {
      const expected =
        n % 2 === 1
          ? ((4 * vdc) / (n * Math.PI)) * angles.reduce((acc, a) => acc + Math.cos(n * a), 0)
          : 0;
      assertInDelta(sineCoefficient(spectrum[n]), expected, 1e-10 * vdc, `order ${n}`);
    }
  });

  it('is quarter- and half-wave symmetric', () => {
    // v(π − θ) = v(θ) and v(θ + π) = −v(θ) by construction (fact of the trade for SHE patterns).
    const waveform = sheWaveform([0.2, 0.5, 0.9], { kind: 'bipolar', vdc });
    expect(waveform.edges.length).toBe(4 * 3 + 2);
    const mirrored = waveform.edges
      .map((e) => (e === 0 ? 0 : 2 * Math.PI - e))
      .sort((a, b) => a - b);
    mirrored.forEach((e, i) => assertInDelta(e, waveform.edges[i] ?? NaN, 1e-12, `edge ${i}`));
  });

  it('rejects angles outside (0, π/2) or not ascending', () => {
    expect(() => sheWaveform([0.5, 0.4], { kind: 'bipolar', vdc })).toThrow(/angles\[1\]/);
    expect(() => sheWaveform([0, 0.4], { kind: 'bipolar', vdc })).toThrow(RangeError);
    expect(() => sheWaveform([0.4, Math.PI / 2], { kind: 'staircase', vdc })).toThrow(
      /\(0, π\/2\)/,
    );
    expect(() => sheWaveform([0.4], { kind: 'staircase', vdc: -1 })).toThrow(/vdc/);
  });
});
