import { describe, expect, it } from 'vitest';
import { harmonics } from '../../../spectrum/index.js';
import { sheWaveform } from '../../../she/index.js';
import { waveformValueAt } from '../../../waveform/waveformValueAt.js';
import { assertInDelta } from '../../../testing/assertInDelta.js';
import { rangeErrorField } from '../../../testing/rangeErrorField.js';
import { cascadedPatternWaveform } from '../cascadedPatternWaveform.js';
import { solveCascadedPattern, type CascadedPatternResult } from '../solveCascadedPattern.js';
import type { CascadedCellPattern } from '../CascadedCellPattern.js';

const deg = Math.PI / 180;

/** The signed sine coefficient of an exact spectrum entry (amplitude·cos phase, see `Harmonic`). */
function sineCoefficient(h: { amplitude: number; phase: number } | undefined): number {
  return h === undefined ? NaN : h.amplitude * Math.cos(h.phase);
}

/**
 * b_n of one cell's pattern, closed form: bipolar s·(4V/(nπ))·[1 + 2Σ(−1)^k cos nα_k],
 * s = (−1)^N (H. S. Patel and R. G. Hoft, IEEE Trans. Ind. Appl., 1973, with +V held next to
 * π/2); unipolar (4V/(nπ))·Σ(−1)^(k+1) cos nα_k (b_n = (4/π)∫₀^{π/2} v sin nθ dθ with V on
 * (α₁, α₂), (α₃, α₄), …, pen and paper). Odd n only; 0 on even n by half-wave symmetry.
 */
function closedForm({ kind, vdc, angles }: CascadedCellPattern, n: number): number {
  if (n % 2 === 0) return 0;
  const scale = (4 * vdc) / (n * Math.PI);
  if (kind === 'unipolar') {
    return scale * angles.reduce((sum, a, k) => sum + (k % 2 === 0 ? 1 : -1) * Math.cos(n * a), 0);
  }
  const s = angles.length % 2 === 0 ? 1 : -1;
  const sum = angles.reduce((acc, a, k) => acc + (k % 2 === 0 ? -1 : 1) * Math.cos(n * a), 0);
  return s * scale * (1 + 2 * sum);
}

describe('cascadedPatternWaveform', () => {
  const cells: CascadedCellPattern[] = [
    { kind: 'bipolar', vdc: 200, angles: [14, 33, 52].map((a) => a * deg) },
    { kind: 'unipolar', vdc: 150, angles: [21, 58].map((a) => a * deg) },
    { kind: 'unipolar', vdc: 180, angles: [9, 40, 71].map((a) => a * deg) },
  ];

  it('each cell and the string match the closed forms; the string is their sum', () => {
    const result = cascadedPatternWaveform({ cells });
    expect(result.cells.map((c) => c.name)).toEqual(['cell 1', 'cell 2', 'cell 3']);
    const string = harmonics(result.output, 41);
    result.cells.forEach(({ waveform }, c) => {
      const spectrum = harmonics(waveform, 41);
      for (let n = 1; n <= 41; n++) {
        // The exact spectrum is accurate to rounding (about 1e-13 of the levels).
        assertInDelta(
          sineCoefficient(spectrum[n]),
          closedForm(cells[c] as CascadedCellPattern, n),
          1e-10,
          `cell ${c + 1} b_${n}`,
        );
      }
    });
    for (let n = 1; n <= 41; n++) {
      // Cells in series: the string's b_n is the sum of the cells' (Holmes and Lipo, 2003, ch. 11).
      const expected = cells.reduce((sum, cell) => sum + closedForm(cell, n), 0);
      assertInDelta(sineCoefficient(string[n]), expected, 1e-10, `string b_${n}`);
      assertInDelta(string[n]?.amplitude ?? NaN, Math.abs(expected), 1e-10, `string |b_${n}|`);
    }
    // Pointwise: between any two edges of any waveform, the string holds the cells' sum.
    const edges = [...new Set(result.cells.flatMap((c) => c.waveform.edges))].sort((a, b) => a - b);
    edges.forEach((edge, i) => {
      const next = i + 1 < edges.length ? (edges[i + 1] as number) : 2 * Math.PI;
      const middle = (edge + next) / 2;
      const sum = result.cells.reduce((acc, c) => acc + waveformValueAt(c.waveform, middle), 0);
      assertInDelta(waveformValueAt(result.output, middle), sum, 1e-12, `at ${middle}`);
    });
  });

  it('unipolar cells of one angle each form the staircase of unequal sources', () => {
    // A cell with one angle holds its source on (α, π − α): the cascaded staircase, the cells
    // ordered by their angles (L. M. Tolbert, J. N. Chiasson et al., IEEE Trans. Ind. Appl.,
    // 2005, from memory). Two codes, one waveform.
    const string = cascadedPatternWaveform({
      cells: [
        { kind: 'unipolar', vdc: 120, angles: [48 * deg] },
        { kind: 'unipolar', vdc: 90, angles: [7 * deg] },
        { kind: 'unipolar', vdc: 100, angles: [26 * deg] },
      ],
    }).output;
    const staircase = sheWaveform(
      [7, 26, 48].map((a) => a * deg),
      {
        kind: 'staircase',
        vdc: 100,
        cellVoltages: [90, 100, 120],
      },
    );
    expect(string.edges.length).toBe(staircase.edges.length);
    string.edges.forEach((e, i) => assertInDelta(e, staircase.edges[i] ?? NaN, 1e-15, `edge ${i}`));
    expect(string.levels).toEqual(staircase.levels);
  });

  it('names the field and its range for bad cells', () => {
    const run = (bad: unknown) => () =>
      cascadedPatternWaveform({ cells: bad as CascadedCellPattern[] });
    const good = cells[1] as CascadedCellPattern;
    expect(rangeErrorField(run([]))).toBe('cells.length');
    expect(rangeErrorField(run(new Array(17).fill(good)))).toBe('cells.length');
    expect(rangeErrorField(run([{ ...good, kind: 'staircase' }]))).toBe('cells[0].kind');
    expect(rangeErrorField(run([good, { ...good, vdc: 0 }]))).toBe('cells[1].vdc');
    expect(rangeErrorField(run([{ ...good, angles: [0.5, 0.4] }]))).toBe('cells[0].angles[1]');
    expect(rangeErrorField(run([{ ...good, angles: [0.5, 1.6] }]))).toBe('cells[0].angles[1]');
    expect(run([null])).toThrow(/cells\[0\] must be an object/);
    expect(run('cells')).toThrow(TypeError);
  });
});

/** Checks a joint solution on the exact spectrum of the string's waveform. */
function expectEliminated(result: CascadedPatternResult, fundamental: number): void {
  expect(result.converged, result.message).toBe(true);
  const maxOrder = Math.max(1, ...result.residual.map((r) => r.order));
  const spectrum = harmonics(result.output, maxOrder);
  const v1 = sineCoefficient(spectrum[1]);
  // Acceptance of the issue (13): eliminated orders below 1e-10 of the fundamental, met to 1e-10.
  assertInDelta(v1, fundamental, 1e-10 * fundamental, 'fundamental');
  assertInDelta(result.fundamental, fundamental, 1e-10 * fundamental, 'reported fundamental');
  for (const { order, amplitude } of result.residual) {
    expect(spectrum[order]?.amplitude ?? NaN, `order ${order}`).toBeLessThan(1e-10 * v1);
    expect(amplitude, `reported order ${order}`).toBeLessThan(1e-10 * v1);
  }
  // The string is what cascadedPatternWaveform makes of the returned patterns.
  expect(cascadedPatternWaveform({ cells: result.patterns })).toEqual({
    output: result.output,
    cells: result.cells,
  });
}

describe('solveCascadedPattern', () => {
  const vdc = 100;
  const scale = (4 * vdc) / Math.PI;

  it('one cell, two angles removing the 3rd: α = π/3 ∓ arcsin(m/√3)', () => {
    // cos 3α₁ = cos 3α₂ with α₁ < α₂ < π/2 forces α₁ + α₂ = 2π/3; then
    // m = cos α₁ − cos α₂ = √3·sin(π/3 − α₁) (sum-to-product, pen and paper).
    const m = 0.5;
    const result = solveCascadedPattern({
      cells: 1,
      vdc,
      count: 2,
      eliminate: [3],
      fundamental: m * scale,
    });
    expectEliminated(result, m * scale);
    const [a1, a2] = result.patterns[0]?.angles ?? [];
    assertInDelta(a1 ?? NaN, Math.PI / 3 - Math.asin(m / Math.sqrt(3)), 1e-12, 'α₁');
    assertInDelta(a2 ?? NaN, Math.PI / 3 + Math.asin(m / Math.sqrt(3)), 1e-12, 'α₂');
  });

  it('two cells of one angle removing the 3rd: the staircase family b = a + π/3', () => {
    // As the equal-source staircase: cos 3a + cos 3b = 0 with cos a + cos b = S = 1.2 has only
    // a = arccos(S/√3) − π/6, b = arccos(S/√3) + π/6 (pen and paper, see she/solveShe.test.ts).
    const S = 1.2;
    const result = solveCascadedPattern({
      cells: 2,
      vdc,
      count: 1,
      eliminate: [3],
      fundamental: S * scale,
    });
    expectEliminated(result, S * scale);
    const sorted = result.patterns.flatMap((p) => p.angles).sort((a, b) => a - b);
    assertInDelta(sorted[0] ?? NaN, Math.acos(S / Math.sqrt(3)) - Math.PI / 6, 1e-10, 'a');
    assertInDelta(sorted[1] ?? NaN, Math.acos(S / Math.sqrt(3)) + Math.PI / 6, 1e-10, 'b');
  });

  it('three cells of two angles: eliminates 5, 7, 11, 13 and 17 in the string', () => {
    const fundamental = 0.3 * 3 * scale;
    const result = solveCascadedPattern({
      cells: 3,
      vdc,
      count: 2,
      eliminate: [5, 7, 11, 13, 17],
      fundamental,
    });
    expectEliminated(result, fundamental);
    expect(result.patterns.map((p) => p.angles.length)).toEqual([2, 2, 2]);
    // Each cell switches on its own (not all at the same angles): a real per-cell pattern.
    const firsts = result.patterns.map((p) => p.angles[0] as number);
    expect(new Set(firsts.map((a) => a.toFixed(6))).size).toBe(3);
  });

  it('four cells of two angles from a given guess', () => {
    const fundamental = 0.3 * 4 * scale;
    const options = { cells: 4, vdc, count: 2, eliminate: [5, 7, 11, 13, 17, 19, 23], fundamental };
    const first = solveCascadedPattern(options);
    expectEliminated(first, fundamental);
    // Started from its own answer, Newton stays there at once.
    const again = solveCascadedPattern({ ...options, angles: first.patterns.map((p) => p.angles) });
    expectEliminated(again, fundamental);
    expect(again.starts).toBe(1);
  });

  it('says plainly when no solution exists, without throwing', () => {
    // Two cells of one angle removing the 3rd need S = cos a + cos b > √3/2 (the families above).
    const result = solveCascadedPattern({
      cells: 2,
      vdc,
      count: 1,
      eliminate: [3],
      fundamental: 0.6 * scale,
    });
    expect(result.converged).toBe(false);
    expect(result.message).toMatch(/No solution found from 24 start/);
  });

  it('names the field and its range for bad input', () => {
    const base = { cells: 3, vdc, count: 2, eliminate: [5, 7, 11, 13, 17], fundamental: 90 };
    expect(rangeErrorField(() => solveCascadedPattern({ ...base, cells: 0 }))).toBe('cells');
    expect(rangeErrorField(() => solveCascadedPattern({ ...base, cells: 17 }))).toBe('cells');
    expect(rangeErrorField(() => solveCascadedPattern({ ...base, vdc: -1 }))).toBe('vdc');
    expect(() => solveCascadedPattern({ ...base, cells: 8, count: 9 })).toThrow(
      /count must be an integer in \[1, 8\] \(cells·count ≤ 64/,
    );
    expect(rangeErrorField(() => solveCascadedPattern({ ...base, eliminate: [5, 7] }))).toBe(
      'eliminate.length',
    );
    expect(
      rangeErrorField(() => solveCascadedPattern({ ...base, eliminate: [5, 7, 11, 13, 16] })),
    ).toBe('eliminate[4]');
    // Limit: cells·4vdc/π = 381.97 V.
    expect(() => solveCascadedPattern({ ...base, fundamental: 400 })).toThrow(
      /fundamental must be .*< 381\.9/,
    );
    expect(rangeErrorField(() => solveCascadedPattern({ ...base, angles: [[0.1, 0.2]] }))).toBe(
      'angles.length',
    );
    expect(
      rangeErrorField(() =>
        solveCascadedPattern({ ...base, angles: [[0.1, 0.2], [0.3], [0.4, 0.5]] }),
      ),
    ).toBe('angles[1].length');
    expect(
      rangeErrorField(() =>
        solveCascadedPattern({
          ...base,
          angles: [
            [0.1, 0.2],
            [0.3, 0.25],
            [0.4, 0.5],
          ],
        }),
      ),
    ).toBe('angles[1][1]');
    expect(rangeErrorField(() => solveCascadedPattern({ ...base, starts: -1 }))).toBe('starts');
  });
});
