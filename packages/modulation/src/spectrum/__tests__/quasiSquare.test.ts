import { describe, expect, it } from 'vitest';
import { harmonics, thd, waveformMeanSquare } from '../../index.js';
import { assertInDelta } from '../../testing/assertInDelta.js';

/**
 * Quasi-square wave: +V on (π/2 − β, π/2 + β), −V on the same span half a period later, 0
 * elsewhere. Standard Fourier analysis: b_n = (4V/(nπ))·sin(nπ/2)·sin(nβ), the mean square is
 * 2βV²/π, so THD² = πβ/(4·sin²β) − 1. At β = π/3 (120° blocks, the six-step line-to-line
 * shape) THD = √(π²/9 − 1) ≈ 31.08 % (docs/references.md).
 */
function quasiSquare(volts: number, halfWidth: number) {
  const start = Math.PI / 2 - halfWidth;
  return {
    edges: [start, start + 2 * halfWidth, start + Math.PI, start + Math.PI + 2 * halfWidth],
    levels: [volts, 0, -volts, 0],
  };
}

describe('quasi-square waves', () => {
  const volts = 540;

  it('have the closed-form Fourier coefficients (4V/(nπ))·sin(nπ/2)·sin(nβ)', () => {
    for (const halfWidth of [0.3, Math.PI / 3, 1.2]) {
      for (const { order, amplitude } of harmonics(quasiSquare(volts, halfWidth), 301)) {
        if (order === 0) continue;
        const expected = Math.abs(
          ((4 * volts) / (order * Math.PI)) *
            Math.sin((order * Math.PI) / 2) *
            Math.sin(order * halfWidth),
        );
        assertInDelta(amplitude, expected, 1e-10 * volts, `β = ${halfWidth}, order ${order}`);
      }
    }
  });

  it('have THD² = πβ/(4 sin²β) − 1, 31.08 % at 120° blocks', () => {
    // Truncated at N, THD² falls short by at most δ = Σ_{odd n>N} (1/n²)/sin²β ≤ 1/(2N·sin²β),
    // so THD by at most δ/(√THD² + √(THD² − δ)) ≤ δ/THD.
    const maxOrder = 40001;
    for (const halfWidth of [0.5, Math.PI / 3, 1.4]) {
      const exact = Math.sqrt((Math.PI * halfWidth) / (4 * Math.sin(halfWidth) ** 2) - 1);
      const truncated = thd(harmonics(quasiSquare(volts, halfWidth), maxOrder));
      const shortfall = 1 / (2 * maxOrder * Math.sin(halfWidth) ** 2) / exact;
      expect(truncated).toBeLessThanOrEqual(exact + 1e-12);
      expect(truncated).toBeGreaterThanOrEqual(exact - shortfall);
    }
    assertInDelta(Math.sqrt(Math.PI ** 2 / 9 - 1), 0.3108, 5e-5);
  });

  it('have the mean square 2βV²/π', () => {
    assertInDelta(
      waveformMeanSquare(quasiSquare(volts, 0.7)),
      (2 * 0.7 * volts ** 2) / Math.PI,
      1e-9 * volts ** 2,
    );
  });
});
