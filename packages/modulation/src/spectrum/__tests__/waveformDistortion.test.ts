import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { assertInDelta } from '../../testing/assertInDelta.js';
import { TAU } from '../../math.js';
import type { Waveform } from '../../waveform/Waveform.js';
import { harmonics } from '../harmonics.js';
import { thd } from '../thd.js';
import { wthd } from '../wthd.js';
import { waveformThd } from '../waveformThd.js';
import { waveformWthd } from '../waveformWthd.js';

const square: Waveform = { edges: [0, Math.PI], levels: [1, -1] };

describe('waveformThd and waveformWthd: exact over the whole waveform', () => {
  it('square wave: THD = √(π²/8 − 1) and WTHD = √(π⁴/96 − 1)', () => {
    // Fourier series of a ±V square wave, V_n = 4V/(nπ) on odd n (standard Fourier analysis):
    // Σ_{odd n≥3} 1/n² = π²/8 − 1 and Σ_{odd n≥3} 1/n⁴ = π⁴/96 − 1 (Dirichlet lambda function,
    // λ(2) = π²/8, λ(4) = π⁴/96; any table of series).
    assertInDelta(waveformThd(square), Math.sqrt(Math.PI ** 2 / 8 - 1), 1e-14, 'THD');
    assertInDelta(waveformWthd(square), Math.sqrt(Math.PI ** 4 / 96 - 1), 1e-14, 'WTHD');
  });

  it('six-step line-to-line voltage: THD ≈ 31.08 % (docs/references.md, standard Fourier analysis)', () => {
    // 120° blocks of +V and −V separated by 60° of zero; its harmonics are 6k ± 1 with V_n = V_1/n,
    // so THD² = Σ_{n = 6k±1 ≥ 5} 1/n² = π²/9 − 1 (closed form of the series, from memory).
    const sixStep: Waveform = {
      edges: [Math.PI / 6, (5 * Math.PI) / 6, (7 * Math.PI) / 6, (11 * Math.PI) / 6],
      levels: [1, 0, -1, 0],
    };
    assertInDelta(waveformThd(sixStep), Math.sqrt(Math.PI ** 2 / 9 - 1), 1e-14, 'THD');
    assertInDelta(waveformThd(sixStep), 0.3108, 5e-5, 'THD, docs/references.md');
  });

  it('agrees with the Fourier sum to a high order within a rigorous Parseval tail bound', () => {
    // For a piecewise-constant v with jumps J_k, |V_n| ≤ Σ|J_k|/(nπ) (integrate by parts), so the
    // mean square above order N is at most (ΣJ)²/(2π²)·Σ_{n>N} 1/n² < (ΣJ)²/(2π²N).
    const waveformArbitrary = fc
      .uniqueArray(fc.double({ min: 0.001, max: TAU - 0.001, noNaN: true }), {
        minLength: 2,
        maxLength: 24,
        selector: (x) => Math.round(x * 1e6),
      })
      .chain((edges) =>
        fc.record({
          edges: fc.constant([...edges].sort((a, b) => a - b)),
          levels: fc.array(fc.integer({ min: -3, max: 3 }), {
            minLength: edges.length,
            maxLength: edges.length,
          }),
        }),
      );
    fc.assert(
      fc.property(waveformArbitrary, (waveform) => {
        const order = 4000;
        const spectrum = harmonics(waveform, order);
        const fundamental = spectrum[1]?.amplitude ?? 0;
        fc.pre(fundamental > 1e-3);
        const jumps = waveform.levels.reduce(
          (sum, level, i, all) =>
            sum + Math.abs(level - (all[(i + all.length - 1) % all.length] as number)),
          0,
        );
        const tail = (jumps * jumps) / (2 * Math.PI ** 2 * order);
        const truncated = thd(spectrum) ** 2;
        const exact = waveformThd(waveform) ** 2;
        const scale = (fundamental * fundamental) / 2;
        expect(exact).toBeGreaterThanOrEqual(truncated - 1e-12);
        expect(exact - truncated).toBeLessThanOrEqual(tail / scale + 1e-12);
        // WTHD's tail falls as 1/n⁴: the sum to 4000 already holds it to ~1e-11 of the bound.
        const weightedTail = tail / (order * order);
        expect(Math.abs(waveformWthd(waveform) ** 2 - wthd(spectrum) ** 2)).toBeLessThanOrEqual(
          weightedTail / scale + 1e-10,
        );
      }),
      { numRuns: 60, seed: 20261202 },
    );
  });

  it('refuses a waveform without a fundamental, naming it', () => {
    expect(() => waveformThd({ edges: [0], levels: [1] })).toThrow(
      /waveform must be a waveform whose fundamental/,
    );
  });
});
