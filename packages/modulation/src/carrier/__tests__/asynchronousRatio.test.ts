import { describe, expect, it } from 'vitest';
import { TAU } from '../../math.js';
import { harmonics } from '../../spectrum/harmonics.js';
import { subharmonicSpectrum } from '../../spectrum/subharmonicSpectrum.js';
import { waveformThd } from '../../spectrum/waveformThd.js';
import { waveformWthd } from '../../spectrum/waveformWthd.js';
import { rangeErrorField } from '../../testing/rangeErrorField.js';
import { threePhase } from '../../three-phase/threePhase.js';
import type { Waveform } from '../../waveform/Waveform.js';
import { waveformValueAt } from '../../waveform/waveformValueAt.js';
import { mulberry32 } from '../../numeric/mulberry32.js';
import { sineTriangle, type SineTriangleOptions } from '../sineTriangle.js';

const vdc = 400;

/** The waveform of one fundamental period restated over q periods: every edge at (θ + 2πk)/q. */
function repeated(waveform: Waveform, q: number): Waveform {
  const pairs: [number, number][] = [];
  for (let k = 0; k < q; k++) {
    waveform.edges.forEach((edge, i) =>
      pairs.push([(edge + k * TAU) / q, waveform.levels[i] as number]),
    );
  }
  pairs.sort((a, b) => a[0] - b[0]);
  return { edges: pairs.map(([e]) => e), levels: pairs.map(([, l]) => l) };
}

function expectSameWaveform(actual: Waveform, expected: Waveform, tolerance: number): void {
  expect(actual.levels).toEqual(expected.levels);
  expect(actual.edges.length).toBe(expected.edges.length);
  actual.edges.forEach((edge, i) => {
    expect(Math.abs(edge - (expected.edges[i] as number))).toBeLessThan(tolerance);
  });
}

/**
 * Natural sampling by brute force over q fundamental periods, from the definition alone: the
 * leg is high while ma·sin θ is above the unit triangle whose valleys sit at θ = π/2 + 2πk/mf
 * (the library's documented alignment, docs/architecture.md); each change of the comparator's
 * answer on a fine grid is refined by bisection. Edges returned as span angles θ/q.
 */
function bruteForceBipolar(ma: number, mf: number, q: number): Waveform {
  const carrier = (theta: number): number => {
    const x = mf * (theta - Math.PI / 2);
    const u = x - TAU * Math.floor(x / TAU);
    return u <= Math.PI ? -1 + (2 * u) / Math.PI : 3 - (2 * u) / Math.PI;
  };
  const above = (theta: number): boolean => ma * Math.sin(theta) > carrier(theta);
  const steps = Math.ceil(400 * mf * q);
  const edges: number[] = [];
  const levels: number[] = [];
  let previous = above(0);
  for (let k = 1; k <= steps; k++) {
    let hi = (k * q * TAU) / steps;
    const now = above(hi);
    if (now === previous) continue;
    let lo = ((k - 1) * q * TAU) / steps;
    for (let j = 0; j < 80; j++) {
      const mid = (lo + hi) / 2;
      if (above(mid) === previous) lo = mid;
      else hi = mid;
    }
    edges.push((lo + hi) / 2 / q);
    levels.push(now ? vdc : -vdc);
    previous = now;
  }
  return { edges, levels };
}

describe('asynchronous frequency ratio p/q: exact waveforms over q fundamental periods', () => {
  it('q = 1 gives the integer path unchanged (to 1e-12; here bit for bit)', () => {
    const options: SineTriangleOptions = { scheme: 'unipolar', ma: 0.7, mf: 15, vdc };
    expect(sineTriangle(options, { fundamentalPeriods: 1 })).toEqual(sineTriangle(options));
    const dpwm = { ma: 0.9, mf: 12, vdc, zeroSequence: 'dpwm1' as const };
    expect(threePhase(dpwm, { fundamentalPeriods: 1 })).toEqual(threePhase(dpwm));
  });

  // A whole ratio analysed over q periods must be the one-period waveform repeated q times:
  // the span machinery (restated carrier phase, reference and breakpoints) against the
  // integer path, which does none of it.
  const cases = [
    {
      name: 'bipolar natural, mf 21 over 2 periods',
      q: 2,
      run: (span = {}) => sineTriangle({ scheme: 'bipolar', ma: 0.8, mf: 21, vdc }, span),
    },
    {
      name: 'unipolar regular-symmetric, mf 9 over 3 periods',
      q: 3,
      run: (span = {}) =>
        sineTriangle(
          {
            scheme: 'unipolar',
            ma: 0.6,
            mf: 9,
            vdc,
            sampling: 'regular-symmetric',
            carrierPhase: 0.3,
          },
          span,
        ),
    },
    {
      name: 'three-phase DPWM1 natural, mf 15 over 4 periods',
      q: 4,
      run: (span = {}) => threePhase({ ma: 0.9, mf: 15, vdc, zeroSequence: 'dpwm1' }, span).legs.b,
    },
    {
      name: 'three-phase AZSPWM1 regular-asymmetric, mf 12 over 3 periods',
      q: 3,
      run: (span = {}) =>
        threePhase(
          { ma: 0.9, mf: 12, vdc, zeroSequence: 'azspwm1', sampling: 'regular-asymmetric' },
          span,
        ).legs.c,
    },
  ];
  for (const { name, q, run } of cases) {
    it(`${name} equals the integer waveform repeated (to 1e-12 rad)`, () => {
      expectSameWaveform(run({ fundamentalPeriods: q }), repeated(run(), q), 1e-12);
    });
  }

  for (const [mf, q] of [
    [7 / 3, 3],
    [15.5, 2],
    [50.4, 5],
  ] as const) {
    it(`bipolar natural sampling at mf = ${mf.toFixed(4)} (q = ${q}) equals a brute-force comparator with bisection (to 1e-10 rad)`, () => {
      const ma = 0.9;
      const exact = sineTriangle({ scheme: 'bipolar', ma, mf, vdc }, { fundamentalPeriods: q });
      const reference = bruteForceBipolar(ma, mf, q);
      // Rotate the brute force's list to start where the library's does (both wrap at 0).
      expect(exact.edges.length).toBe(reference.edges.length);
      expect(exact.edges.length).toBe(2 * Math.round(mf * q));
      exact.edges.forEach((edge, i) => {
        expect(Math.abs(edge - (reference.edges[i] as number))).toBeLessThan(1e-10);
        expect(exact.levels[i]).toBe(reference.levels[i]);
      });
    });
  }

  it('regular-asymmetric sampling at mf = 7/3 (q = 3) equals a held-sample comparator at 20000 random instants', () => {
    // From the definitions (Holmes and Lipo ch. 3; S. R. Bowes, Proc. IEE, 1975): the reference
    // is sampled at each carrier peak and valley, θ_j = π/2 + j·π/mf, and held for that half
    // period; the output is +vdc while the held sample is above the carrier.
    const [ma, mf, q] = [0.9, 7 / 3, 3];
    const waveform = sineTriangle(
      { scheme: 'bipolar', ma, mf, vdc, sampling: 'regular-asymmetric' },
      { fundamentalPeriods: q },
    );
    const random = mulberry32(5);
    let checked = 0;
    for (let k = 0; k < 20_000; k++) {
      const phi = TAU * random();
      // An instant within 1e-9 rad of an edge is left out: rounding decides it either way.
      if (waveform.edges.some((edge) => Math.abs(edge - phi) < 1e-9)) continue;
      const theta = q * phi;
      const x = mf * (theta - Math.PI / 2);
      const half = Math.floor(x / Math.PI);
      const held = ma * Math.sin(Math.PI / 2 + (half * Math.PI) / mf);
      const u = x - TAU * Math.floor(x / TAU);
      const carrier = u <= Math.PI ? -1 + (2 * u) / Math.PI : 3 - (2 * u) / Math.PI;
      expect(waveformValueAt(waveform, phi)).toBe(held > carrier ? vdc : -vdc);
      checked++;
    }
    expect(checked).toBeGreaterThan(19_000);
  });

  it('names the field of a ratio that is no p/q for the span, or a bad span', () => {
    const bipolar = { scheme: 'bipolar' as const, ma: 0.8, vdc };
    expect(rangeErrorField(() => sineTriangle({ ...bipolar, mf: 7 / 3 }))).toBe('mf');
    expect(
      rangeErrorField(() => sineTriangle({ ...bipolar, mf: 2.3 }, { fundamentalPeriods: 3 })),
    ).toBe('mf');
    expect(() => sineTriangle({ ...bipolar, mf: 2.3 }, { fundamentalPeriods: 3 })).toThrow(/p\/3/);
    expect(
      rangeErrorField(() => sineTriangle({ ...bipolar, mf: 2.5 }, { fundamentalPeriods: 0 })),
    ).toBe('fundamentalPeriods');
    expect(
      rangeErrorField(() => threePhase({ ma: 0.8, vdc, mf: 2.5 }, { fundamentalPeriods: 1.5 })),
    ).toBe('fundamentalPeriods');
    expect(
      rangeErrorField(() => threePhase({ ma: 0.8, vdc, mf: 5000.5 }, { fundamentalPeriods: 2 })),
    ).toBe('mf');
  });
});

describe('subharmonicSpectrum', () => {
  it('with q = 1 equals harmonics, waveformThd and waveformWthd (to 1e-12)', () => {
    const waveform = sineTriangle({ scheme: 'bipolar', ma: 0.8, mf: 9, vdc });
    const result = subharmonicSpectrum(waveform, { fundamentalPeriods: 1, maxOrder: 40 });
    const reference = harmonics(waveform, 40);
    result.components.forEach((c, n) => {
      expect(c.order).toBe(n);
      expect(Math.abs(c.amplitude - (reference[n]?.amplitude ?? NaN))).toBeLessThan(1e-12 * vdc);
    });
    expect(Math.abs(result.thd - waveformThd(waveform))).toBeLessThan(1e-12);
    expect(Math.abs(result.wthd - waveformWthd(waveform))).toBeLessThan(1e-12);
  });

  it('a whole ratio over 2 periods has no sub-harmonics and the same fundamental, THD and WTHD (Fourier series of a 2π-periodic signal read over 4π)', () => {
    const one = sineTriangle({ scheme: 'unipolar', ma: 0.8, mf: 10, vdc });
    const two = sineTriangle(
      { scheme: 'unipolar', ma: 0.8, mf: 10, vdc },
      { fundamentalPeriods: 2 },
    );
    const result = subharmonicSpectrum(two, { fundamentalPeriods: 2, maxOrder: 30 });
    for (const c of result.components)
      if (c.spanOrder % 2 === 1) expect(c.amplitude).toBeLessThan(1e-10 * vdc);
    expect(Math.abs(result.fundamental - (harmonics(one, 1)[1]?.amplitude ?? NaN))).toBeLessThan(
      1e-10 * vdc,
    );
    expect(Math.abs(result.thd - waveformThd(one))).toBeLessThan(1e-10);
    expect(Math.abs(result.wthd - waveformWthd(one))).toBeLessThan(1e-10);
  });

  it('labels orders as fractions of the fundamental in lowest terms', () => {
    const waveform = sineTriangle(
      { scheme: 'bipolar', ma: 0.8, mf: 7 / 3, vdc },
      { fundamentalPeriods: 3 },
    );
    const { components } = subharmonicSpectrum(waveform, { fundamentalPeriods: 3, maxOrder: 16 });
    expect(components[1]?.label).toBe('1/3');
    expect(components[3]?.label).toBe('1');
    expect(components[6]?.label).toBe('2');
    expect(components[47]?.label).toBe('47/3');
    expect(components[47]?.order).toBeCloseTo(47 / 3, 12);
  });

  it('names maxOrder and fundamentalPeriods when out of range', () => {
    const waveform = sineTriangle({ scheme: 'bipolar', ma: 0.8, mf: 9, vdc });
    expect(
      rangeErrorField(() => subharmonicSpectrum(waveform, { fundamentalPeriods: 0, maxOrder: 10 })),
    ).toBe('fundamentalPeriods');
    expect(
      rangeErrorField(() =>
        subharmonicSpectrum(waveform, { fundamentalPeriods: 1000, maxOrder: 101 }),
      ),
    ).toBe('maxOrder');
  });
});
