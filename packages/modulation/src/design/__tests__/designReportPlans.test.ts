import { describe, expect, it } from 'vitest';
import { assertInDelta } from '../../testing/assertInDelta.js';
import { TAU } from '../../math.js';
import { analyseDesign } from '../analyseDesign.js';
import { designReportPlans } from '../designReportPlans.js';
import type { InverterDesign } from '../InverterDesign.js';
import { EXAMPLE_IGBT } from '../../losses/exampleIgbt.js';

const design = (mf: number, filtered: boolean): InverterDesign => ({
  vdc: 650,
  fundamentalFrequency: 50,
  carrierFrequency: 50 * mf,
  modulation: { method: 'three-phase', ma: 0.9, zeroSequence: 'min-max' },
  load: { r: 16, l: 0.03 },
  ...(filtered ? { filter: { l: 0.002, c: 10e-6, rDamping: 3 } } : {}),
});

describe('designReportPlans', () => {
  it('gives reports equal to those built without plans, reused across designs and grid sizes', () => {
    const plans = designReportPlans();
    // Filtered at mf 21 and 45 (grids of 4096 and 8192 samples), unfiltered at mf 129 (its
    // DC link on a 16384-sample grid): seven sizes among them (the current and chart grids and
    // the half of each), more than the plans keep, so the second pass at mf 21 finds some
    // evicted and builds them again; the third reuses the second's grids and label table.
    const designs = [
      design(21, true),
      design(45, true),
      design(129, false),
      design(21, true),
      design(21, true),
    ];
    for (const d of designs) {
      const options = { maxOrder: 200, points: 256 };
      // Same transforms, same operations: the same numbers, not merely close ones.
      expect(analyseDesign(d, { ...options, plans })).toEqual(analyseDesign(d, options));
    }
  });

  it("leaves a report's figures alone when the next report reuses the plans' sample buffers", () => {
    // The filtered phases' samples live in buffers the plans keep from report to report: a
    // report must hold copies only. Two reports on the same grid (mf 45 and 43: 8192 samples),
    // with device losses and the DC link reading the samples; the first, deep-copied before the
    // second ran, must be unchanged after it.
    const plans = designReportPlans();
    const options = { maxOrder: 300, points: 256, plans };
    const first = analyseDesign({ ...design(45, true), device: { ...EXAMPLE_IGBT } }, options);
    const copy = structuredClone(first);
    const second = analyseDesign(
      { ...design(43, true), load: { r: 9, l: 0.02 }, device: { ...EXAMPLE_IGBT } },
      options,
    );
    // Not a vacuous check: the second report's currents differ from the first's.
    expect(second.currents[0]?.load?.rms).not.toBe(first.currents[0]?.load?.rms);
    expect(first).toEqual(copy);
  });

  it('writes a series into the buffers of the slot asked for, one pair of buffers a slot', () => {
    const synthesiser = designReportPlans().synthesiser(64);
    const phasors = { re: Float64Array.from([1, 2]), im: Float64Array.from([0, 0]) };
    const [x, y] = synthesiser.pair(phasors, phasors, 2, 1);
    const [kept, keptSecond] = synthesiser.buffers(1);
    expect(x).toBe(kept);
    expect(y).toBe(keptSecond);
    expect(synthesiser.buffers(0)[0]).not.toBe(kept);
    expect(synthesiser.buffers(0)[1]).not.toBe(keptSecond);
  });

  it('keeps a transform per grid size for the last six sizes used', () => {
    const plans = designReportPlans();
    const first = plans.transform(4096);
    expect(plans.transform(4096)).toBe(first);
    plans.synthesiser(4096);
    expect(plans.transform(4096)).toBe(first);
    const second = plans.transform(8192);
    const kept = [16384, 32768, 65536, 128].map((size) => plans.transform(size));
    expect(plans.transform(4096)).toBe(first);
    // 8192 is now the least recently used of the six kept: a seventh size evicts it, the others stay.
    plans.transform(256);
    expect(plans.transform(4096)).toBe(first);
    expect(plans.transform(16384)).toBe(kept[0]);
    const rebuilt = plans.transform(8192);
    expect(rebuilt.size).toBe(8192);
    expect(rebuilt).not.toBe(second);
  });

  it('keeps the label table of the last orders and carrier ratio asked for', () => {
    const plans = designReportPlans();
    const first = plans.labeller(200, 21);
    expect(plans.labeller(200, 21)).toBe(first);
    // Another ratio or another highest order is another table, and replaces the one kept.
    const other = plans.labeller(200, 45);
    expect(other).not.toBe(first);
    expect(plans.labeller(300, 45)).not.toBe(other);
    expect(plans.labeller(200, 21)).not.toBe(first);
    // mf 21: order 23 is the first carrier group's sideband +2 (23 = 1·21 + 2).
    const [, labelled] = plans.labeller(200, 21).harmonics([
      { order: 0, amplitude: 0, phase: 0 },
      { order: 23, amplitude: 1, phase: 0 },
    ]);
    expect(labelled).toMatchObject({ carrierGroup: 1, sideband: 2, label: 'mf+2' });
  });

  it("synthesises a sinusoid from its phasor on the plans' transform", () => {
    // x(θ) = X₀ + |X₁|·sin(θ + arg X₁) + |X₃|·sin(3θ + arg X₃) sampled at θ_j = 2πj/S: the
    // harmonics convention (docs/methods.md), evaluated here directly.
    const size = 64;
    const synthesiser = designReportPlans().synthesiser(size);
    const re = Float64Array.from([0.5, 2, 0, -0.3]);
    const im = Float64Array.from([0, 1, 0, 0.4]);
    const [x, y] = synthesiser.pair({ re, im }, null, 4, 0);
    expect(y).toBeNull();
    for (let j = 0; j < size; j++) {
      const theta = (TAU * j) / size;
      const expected =
        0.5 +
        Math.hypot(2, 1) * Math.sin(theta + Math.atan2(1, 2)) +
        0.5 * Math.sin(3 * theta + Math.atan2(0.4, -0.3));
      assertInDelta(x[j] as number, expected, 1e-12);
    }
  });

  it('leaves none of a longer series behind in a shorter one on the same synthesiser', () => {
    // First 20 orders of a square-wave-like spectrum (1/n at odd n), then a single order 2 on
    // the same transform: the second must be that sinusoid alone (direct evaluation).
    const size = 64;
    const synthesiser = designReportPlans().synthesiser(size);
    const longRe = Float64Array.from({ length: 20 }, (_, n) => (n % 2 === 1 ? 1 / n : 0));
    synthesiser.pair({ re: longRe, im: new Float64Array(20) }, { re: longRe, im: longRe }, 20, 0);
    const [x, y] = synthesiser.pair(
      { re: Float64Array.from([0, 0, 3]), im: Float64Array.from([0, 0, 0]) },
      { re: Float64Array.from([1, 0, 0]), im: Float64Array.from([0, 0, 0]) },
      3,
      0,
    );
    for (let j = 0; j < size; j++) {
      const theta = (TAU * j) / size;
      assertInDelta(x[j] as number, 3 * Math.sin(2 * theta), 1e-12);
      assertInDelta((y as Float64Array)[j] as number, 1, 1e-12);
    }
  });

  it('synthesises a half-wave symmetric pair through half the transform, exactly antisymmetric', () => {
    // Odd orders only (1, 3 and 7 in x, 5 in y): the synthesiser says so, its samples are the
    // direct sums of the harmonics convention, and each sample half a period on is the negated
    // one, exactly. The same call with an even order added takes the whole transform.
    const size = 64;
    const synthesiser = designReportPlans().synthesiser(size);
    const x = { re: new Float64Array(8), im: new Float64Array(8) };
    const y = { re: new Float64Array(8), im: new Float64Array(8) };
    [x.re[1], x.im[1], x.re[3], x.im[3], x.im[7]] = [2, 1, -0.3, 0.4, 0.05];
    [y.re[5], y.im[5]] = [0.7, -0.2];
    const expected = (p: typeof x, theta: number): number => {
      let sum = p.re[0] as number;
      for (let n = 1; n < 8; n++) {
        const a = p.re[n] as number;
        const b = p.im[n] as number;
        sum += Math.hypot(a, b) * Math.sin(n * theta + Math.atan2(b, a));
      }
      return sum;
    };
    const [xs, ys, halfWave] = synthesiser.pair(x, y, 8, 0);
    expect(halfWave).toBe(true);
    for (let j = 0; j < size; j++) {
      const theta = (TAU * j) / size;
      assertInDelta(xs[j] as number, expected(x, theta), 1e-12, `x[${j}]`);
      assertInDelta((ys as Float64Array)[j] as number, expected(y, theta), 1e-12, `y[${j}]`);
      if (j < size / 2) {
        expect(xs[j + size / 2]).toBe(-(xs[j] as number));
        expect((ys as Float64Array)[j + size / 2]).toBe(-((ys as Float64Array)[j] as number));
      }
    }
    y.im[2] = 0.1;
    const [xw, yw, whole] = synthesiser.pair(x, y, 8, 0);
    expect(whole).toBe(false);
    for (let j = 0; j < size; j++) {
      const theta = (TAU * j) / size;
      assertInDelta(xw[j] as number, expected(x, theta), 1e-12, `x[${j}]`);
      assertInDelta((yw as Float64Array)[j] as number, expected(y, theta), 1e-12, `y[${j}]`);
    }
  });

  it('leaves none of a longer half-wave series behind in a shorter one', () => {
    // Orders 1..19 (1/n at odd n), then order 3 alone on the same synthesiser: that sinusoid only.
    const size = 64;
    const synthesiser = designReportPlans().synthesiser(size);
    const longRe = Float64Array.from({ length: 20 }, (_, n) => (n % 2 === 1 ? 1 / n : 0));
    synthesiser.pair({ re: longRe, im: longRe }, { re: longRe, im: new Float64Array(20) }, 20, 0);
    const [x, y, halfWave] = synthesiser.pair(
      { re: Float64Array.from([0, 0, 0, 3]), im: new Float64Array(4) },
      null,
      4,
      0,
    );
    expect(halfWave).toBe(true);
    expect(y).toBeNull();
    for (let j = 0; j < size; j++)
      assertInDelta(x[j] as number, 3 * Math.sin((3 * TAU * j) / size), 1e-12, `x[${j}]`);
  });
});
