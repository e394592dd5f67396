import { describe, expect, it } from 'vitest';
import { harmonics } from '../../spectrum/index.js';
import { optimalPulseSweep, sheWaveform } from '../../she/index.js';
import { assertInDelta } from '../../testing/assertInDelta.js';
import { rangeErrorField } from '../../testing/rangeErrorField.js';
import {
  angleTable,
  angleTableMidpointErrors,
  angleTableRowsForTarget,
  type EliminationTablePattern,
  type OptimalTablePattern,
} from '../index.js';

const she: EliminationTablePattern = {
  method: 'selective-harmonic-elimination',
  kind: 'bipolar',
  vdc: 300,
  eliminate: [5, 7, 11, 13],
};

const optimal: OptimalTablePattern = {
  method: 'optimal-pattern',
  kind: 'bipolar',
  vdc: 100,
  count: 4,
  objective: 'wthd',
  maxOrder: 59,
};

/** b_n of a bipolar pattern by the Patel and Hoft (1973) closed form, written out here, normalised by 4vdc/π. */
function patelHoft(angles: readonly number[], n: number): number {
  const s = angles.length % 2 === 0 ? 1 : -1;
  let sum = 1;
  angles.forEach((a, k) => (sum += 2 * (k % 2 === 0 ? -1 : 1) * Math.cos(n * a)));
  return (s * sum) / n;
}

describe('angleTable', () => {
  it('SHE rows: eliminated orders below 1e-9 of the fundamental, the fundamental at ma·vdc', () => {
    const table = angleTable({ pattern: she, ma: { from: 0.1, to: 1.1 }, rows: 24 });
    expect(table.gaps).toEqual([]);
    expect(table.rows.length).toBe(24);
    assertInDelta(table.step, 1 / 23, 1e-15, 'step');
    for (const row of table.rows) {
      expect(row.solved).toBe(true);
      // Independent check on the library's exact spectrum of the waveform the angles define
      // (Patel and Hoft, IEEE Trans. Ind. Appl. 1973: the eliminated b_n vanish).
      const spectrum = harmonics(sheWaveform(row.angles, { kind: 'bipolar', vdc: 300 }), 13);
      const v1 = spectrum[1]?.amplitude ?? NaN;
      assertInDelta(v1, row.ma * 300, 1e-9 * v1, `V1 at ma ${row.ma}`);
      assertInDelta(row.fundamental ?? NaN, row.ma * 300, 1e-9 * v1, 'row.fundamental');
      for (const n of [5, 7, 11, 13]) {
        expect((spectrum[n]?.amplitude ?? NaN) / v1, `order ${n}`).toBeLessThan(1e-9);
      }
      expect(row.worstResidual).toBeLessThan(1e-9);
      expect(
        row.angles.every(
          (a, k) => a > 0 && a < Math.PI / 2 && (k === 0 || a > (row.angles[k - 1] as number)),
        ),
      ).toBe(true);
    }
  });

  it('optimal rows satisfy the first- and second-order optimality conditions', () => {
    const table = angleTable({ pattern: optimal, ma: { from: 0.4, to: 1.0 }, rows: 7 });
    const scale = (4 * 100) / Math.PI;
    for (const row of table.rows) {
      expect(row.solved).toBe(true);
      const a = row.angles;
      // f = Σ g_n²/n² over odd n 3..59 and c = g₁ − m (Patel and Hoft model, normalised by
      // 4vdc/π); at a constrained minimum ∇f = λ∇c (Lagrange; Nocedal and Wright 2006, §12.3).
      // Gradients by central differences (h = 1e-6): tolerance 1e-5 of |∇f| (stated: the
      // optimiser stops at a projected gradient at rounding level, the differences add ~h²).
      const f = (x: number[]) => {
        let sum = 0;
        for (let n = 3; n <= 59; n += 2) sum += (patelHoft(x, n) / n) ** 2;
        return sum;
      };
      const grad = (fn: (x: number[]) => number) =>
        a.map((_, k) => {
          const up = [...a];
          const down = [...a];
          up[k] = (up[k] as number) + 1e-6;
          down[k] = (down[k] as number) - 1e-6;
          return (fn(up) - fn(down)) / 2e-6;
        });
      const gf = grad(f);
      const gc = grad((x) => patelHoft(x, 1));
      const lambda =
        gf.reduce((s, g, k) => s + g * (gc[k] as number), 0) / gc.reduce((s, g) => s + g * g, 0);
      const projected = Math.hypot(...gf.map((g, k) => g - lambda * (gc[k] as number)));
      expect(projected / Math.hypot(...gf), `ma ${row.ma}`).toBeLessThan(1e-5);
      assertInDelta(patelHoft(a, 1) * scale, row.ma * 100, 1e-9 * row.ma * 100, 'constraint');
      // Second order: feasible moves along the constraint (back onto g₁ = m by one Newton step
      // along ∇c) never lower f.
      for (let k = 0; k < a.length; k++) {
        for (const sign of [-1, 1]) {
          const moved = [...a];
          moved[k] = (moved[k] as number) + sign * 1e-3;
          const err = patelHoft(moved, 1) - patelHoft(a, 1);
          const g = grad((x) => patelHoft(x, 1));
          const norm = g.reduce((s, v) => s + v * v, 0);
          const back = moved.map((x, j) => x - (err * (g[j] as number)) / norm);
          expect(f(back)).toBeGreaterThanOrEqual(f(a) - 1e-12);
        }
      }
    }
  });

  it('an optimal table of few rows follows the family through the steps between its rows', () => {
    const pattern: OptimalTablePattern = { ...optimal, vdc: 300, count: 3, maxOrder: 99 };
    // The library's own sweep in steps of 0.02 in ma follows one family over this range...
    const fine = optimalPulseSweep({
      kind: 'bipolar',
      vdc: 300,
      count: 3,
      maxOrder: 99,
      fundamentals: { from: 0.4 * 300, to: 0.9 * 300, points: 26 },
    });
    expect(fine.points.slice(1).every((p) => p.continued)).toBe(true);
    // ...so a table of 6 rows (steps of 0.1) over it has no jump, and its rows are those points.
    const table = angleTable({ pattern, ma: { from: 0.4, to: 0.9 }, rows: 6 });
    expect(table.rows.slice(1).every((r) => r.continued)).toBe(true);
    table.rows.forEach((row, i) =>
      row.angles.forEach((a, k) =>
        assertInDelta(a, fine.points[5 * i]?.angles[k] ?? NaN, 1e-9, `row ${i} angle ${k}`),
      ),
    );
  });

  it('midpoint error falls as 1/N² on a smooth branch (fact of linear interpolation)', () => {
    const counts = [8, 16, 32, 64];
    const errors = counts.map((rows) => {
      const table = angleTable({ pattern: she, ma: { from: 0.2, to: 0.8 }, rows });
      const midpoint = angleTableMidpointErrors(table);
      expect(midpoint.intervals.every((v) => v.interpolable)).toBe(true);
      return midpoint.worstResidual as number;
    });
    // Least-squares slope of log(error) against log(N): −2 for an O(h²) remainder.
    const xs = counts.map(Math.log);
    const ys = errors.map(Math.log);
    const mx = xs.reduce((s, x) => s + x, 0) / xs.length;
    const my = ys.reduce((s, y) => s + y, 0) / ys.length;
    const slope =
      xs.reduce((s, x, i) => s + (x - mx) * ((ys[i] as number) - my), 0) /
      xs.reduce((s, x) => s + (x - mx) ** 2, 0);
    assertInDelta(slope, -2, 0.1, 'log-log slope');
  });

  it('midpoint errors: interpolated angles measured on the exact spectrum', () => {
    const table = angleTable({ pattern: she, ma: { from: 0.3, to: 0.6 }, rows: 4 });
    const { intervals, worstResidual } = angleTableMidpointErrors(table);
    expect(intervals.length).toBe(3);
    for (const interval of intervals) {
      const spectrum = harmonics(
        sheWaveform(interval.interpolatedAngles, { kind: 'bipolar', vdc: 300 }),
        13,
      );
      const v1 = spectrum[1]?.amplitude ?? NaN;
      const worst = Math.max(...[5, 7, 11, 13].map((n) => spectrum[n]?.amplitude ?? NaN)) / v1;
      assertInDelta(interval.worstResidual ?? NaN, worst, 1e-12, 'worst residual');
      const wanted = ((interval.from + interval.to) / 2) * 300;
      assertInDelta(
        interval.fundamentalError ?? NaN,
        (v1 - wanted) / wanted,
        1e-12,
        'fundamental error',
      );
      // The exact midpoint pattern eliminates the orders (Patel and Hoft 1973).
      const exact = harmonics(sheWaveform(interval.exactAngles, { kind: 'bipolar', vdc: 300 }), 13);
      expect((exact[5]?.amplitude ?? NaN) / wanted).toBeLessThan(1e-9);
    }
    expect(worstResidual).toBe(Math.max(...intervals.map((v) => v.worstResidual as number)));
  });

  it('a gap: rows past the end of the branch are marked, never interpolated across', () => {
    // Staircase, two cells, 3rd removed (pen and paper, as in sheSweep's tests; S = V₁/(4vdc/π)):
    // from S = 0.9 the only family is b = a + π/3, which ends at S = 1.5 where a reaches 0. The
    // other family (a + b = π/3, S in (1.5, √3)) is another branch and is not spliced in.
    const pattern: EliminationTablePattern = {
      method: 'selective-harmonic-elimination',
      kind: 'staircase',
      vdc: 10,
      eliminate: [3],
    };
    const maOf = (s: number) => (s * 4) / Math.PI / 2; // V₁ = S·4vdc/π, ma = V₁/(2·vdc)
    const table = angleTable({ pattern, ma: { from: maOf(0.9), to: maOf(1.7) }, rows: 17 });
    expect(table.gaps.length).toBeGreaterThan(0);
    const gap = table.gaps[0];
    // The branch b = a + π/3 ends at S = 1.5 (a → 0): every row above it is unsolved.
    for (const row of table.rows) {
      const s = (row.ma * 2 * Math.PI) / 4;
      if (s < 1.49) expect(row.solved, `S ${s}`).toBe(true);
      if (s > 1.51) expect(row.solved, `S ${s}`).toBe(false);
    }
    expect(gap?.lastRow).toBe(16);
    expect(table.message).toMatch(/do not interpolate/);
    const { intervals } = angleTableMidpointErrors(table);
    for (const interval of intervals) {
      const s = (interval.to * 2 * Math.PI) / 4;
      if (s > 1.51) {
        expect(interval.interpolable).toBe(false);
        expect(interval.reason).toMatch(/no solution/);
      }
    }
  });

  it('bad input names the field', () => {
    expect(
      rangeErrorField(() => angleTable({ pattern: she, ma: { from: 0.5, to: 1.4 }, rows: 8 })),
    ).toBe('ma.to');
    expect(
      rangeErrorField(() => angleTable({ pattern: she, ma: { from: 0.5, to: 0.4 }, rows: 8 })),
    ).toBe('ma.to');
    expect(
      rangeErrorField(() => angleTable({ pattern: she, ma: { from: 0.2, to: 0.4 }, rows: 5000 })),
    ).toBe('rows');
    expect(
      rangeErrorField(() =>
        angleTable({ pattern: { ...she, eliminate: [4] }, ma: { from: 0.2, to: 0.4 }, rows: 8 }),
      ),
    ).toBe('pattern.eliminate[0]');
    expect(
      rangeErrorField(() =>
        angleTable({ pattern: { ...optimal, count: 0 }, ma: { from: 0.2, to: 0.4 }, rows: 8 }),
      ),
    ).toBe('pattern.count');
    // Staircase with 2 cells removing the 3rd has no solution below S = √3/2 (pen and paper).
    const staircase: EliminationTablePattern = {
      method: 'selective-harmonic-elimination',
      kind: 'staircase',
      vdc: 10,
      eliminate: [3],
    };
    expect(
      rangeErrorField(() =>
        angleTable({ pattern: staircase, ma: { from: 0.3, to: 0.9 }, rows: 8 }),
      ),
    ).toBe('ma.from');
  });
});

describe('angleTableRowsForTarget', () => {
  it('the chosen N meets the target and N − 1 does not', () => {
    const target = { metric: 'eliminated-residual' as const, value: 1e-3 };
    const chosen = angleTableRowsForTarget({ pattern: she, ma: { from: 0.2, to: 0.8 }, target });
    expect(chosen.error).toBeLessThanOrEqual(1e-3);
    expect(chosen.midpointErrors.worstResidual).toBe(chosen.error);
    expect(chosen.table.rows.length).toBe(chosen.rows);
    const fewer = angleTableMidpointErrors(
      angleTable({ pattern: she, ma: { from: 0.2, to: 0.8 }, rows: chosen.rows - 1 }),
    );
    expect(fewer.worstResidual).toBeGreaterThan(1e-3);
    // 1/N² scaling from memory of the remainder: N ≈ N₈·√(e₈/target) within a row or two.
    const at8 = chosen.tried.find((t) => t.rows === 8)?.error as number;
    expect(Math.abs(chosen.rows - 8 * Math.sqrt(at8 / 1e-3))).toBeLessThan(2);
  });

  it('an unreachable target, or a metric the pattern has no meaning for, names the field', () => {
    expect(
      rangeErrorField(() =>
        angleTableRowsForTarget({
          pattern: she,
          ma: { from: 0.2, to: 0.8 },
          target: { metric: 'eliminated-residual', value: 1e-9 },
          maxRows: 16,
        }),
      ),
    ).toBe('target.value');
    expect(
      rangeErrorField(() =>
        angleTableRowsForTarget({
          pattern: optimal,
          ma: { from: 0.4, to: 0.8 },
          target: { metric: 'eliminated-residual', value: 1e-3 },
        }),
      ),
    ).toBe('target.metric');
    expect(
      rangeErrorField(() =>
        angleTableRowsForTarget({
          pattern: she,
          ma: { from: 0.2, to: 0.8 },
          target: { metric: 'wthd-change', value: 0 },
        }),
      ),
    ).toBe('target.value');
    expect(
      rangeErrorField(() =>
        angleTableRowsForTarget({
          pattern: she,
          ma: { from: 0.2, to: 0.8 },
          target: { metric: 'wthd-change', value: 0.1 },
          maxRows: 2000,
        }),
      ),
    ).toBe('maxRows');
  });
});
