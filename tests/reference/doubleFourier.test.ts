import { describe, expect, it } from 'vitest';
import { harmonics, sineTriangle, threePhase, type Harmonic } from '@pulsewright/modulation';
import { doubleFourierAmplitude } from './doubleFourier.js';

// Every check here compares the exact engine with the double Fourier series of H. S. Black
// (1953) in the form of Holmes and Lipo (2003, ch. 3), evaluated with the npm package `bessel`.

const vdc = 400;
const SIDEBANDS = 14; // |n| ≤ 14: J_n(mπM/2) for m ≤ 4, M ≤ 1 is below 1e-5 past that

function amplitudeAt(spectrum: readonly Harmonic[], order: number): number {
  const entry = spectrum[order];
  if (entry === undefined) throw new Error(`order ${order} is not in the spectrum`);
  return entry.amplitude;
}

describe('large mf: every component m·mf ± n for m ≤ 4 matches to 1e-3 of vdc', () => {
  const mf = 201;
  const cases = [
    { kind: 'bipolar', make: (ma: number) => sineTriangle({ scheme: 'bipolar', ma, mf, vdc }) },
    { kind: 'unipolar', make: (ma: number) => sineTriangle({ scheme: 'unipolar', ma, mf, vdc }) },
    { kind: 'line-to-line', make: (ma: number) => threePhase({ ma, mf, vdc }).lineToLine.ab },
  ] as const;
  for (const { kind, make } of cases) {
    for (const ma of [0.2, 0.6, 0.9, 1]) {
      it(`${kind}, ma = ${ma}`, () => {
        const spectrum = harmonics(make(ma), 4 * mf + SIDEBANDS);
        let worst = 0;
        for (let m = 1; m <= 4; m++) {
          for (let n = -SIDEBANDS; n <= SIDEBANDS; n++) {
            const expected = doubleFourierAmplitude(kind, vdc, ma, m, n);
            worst = Math.max(worst, Math.abs(amplitudeAt(spectrum, m * mf + n) - expected));
          }
        }
        expect(worst / vdc).toBeLessThan(1e-3);
      });
    }
  }
});

describe('small mf: the exact spectrum departs from the single-term table by sideband overlap', () => {
  // Where carrier groups overlap, several (m, n) terms land on one order h; the exact amplitude
  // is their phasor sum, so | |exact| − |nearest term| | ≤ Σ |other terms at h| (triangle
  // inequality). The test shows the departure and bounds it by that sum.
  const GROUPS = 40; // m ≤ 40; the terms left out have |n| ≥ 40·mf − h and vanish (J_n(x), n ≫ x)

  function termsAt(order: number, mf: number, ma: number): number[] {
    const terms: number[] = [];
    for (let m = 1; m <= GROUPS; m++) {
      // A term at m·mf + n lands on +order (n = order − m·mf) or, folded, on −order.
      for (const n of [order - m * mf, -order - m * mf]) {
        const amplitude = doubleFourierAmplitude('bipolar', vdc, ma, m, n);
        // A folded term reaches order 0 twice over: count it once.
        if (order === 0 && n === -order - m * mf) continue;
        terms.push(amplitude);
      }
    }
    return terms;
  }

  const departures = new Map<number, number>();
  for (const mf of [3, 5, 9]) {
    it(`bipolar mf = ${mf}: departure shown and bounded`, () => {
      const ma = 0.8;
      const spectrum = harmonics(sineTriangle({ scheme: 'bipolar', ma, mf, vdc }), 3 * mf);
      let largestDeparture = 0;
      for (let order = 1; order <= 3 * mf; order++) {
        const terms = termsAt(order, mf, ma);
        if (order === 1) terms.push(ma * vdc); // the reference itself (m = 0)
        const nearest = Math.max(...terms);
        const others = terms.reduce((sum, t) => sum + t, 0) - nearest;
        const departure = Math.abs(amplitudeAt(spectrum, order) - nearest);
        // 1e-6 of vdc allows for the `bessel` package's own rounding where the bound is tight.
        expect(departure).toBeLessThanOrEqual(others + 1e-6 * vdc);
        largestDeparture = Math.max(largestDeparture, departure);
      }
      departures.set(mf, largestDeparture / vdc);
      console.log(
        `mf = ${mf}: largest departure from the single-term table ${(largestDeparture / vdc).toExponential(2)} of vdc`,
      );
    });
  }

  it('is large at mf ≤ 5 and shrinks as the groups separate', () => {
    const at = (mf: number): number => departures.get(mf) ?? NaN;
    expect(at(3)).toBeGreaterThan(1e-2);
    expect(at(5)).toBeGreaterThan(1e-2);
    expect(at(5)).toBeLessThan(at(3));
    expect(at(9)).toBeLessThan(at(5));
  });
});

describe('small mf: a second, independent method confirms the exact engine', () => {
  // Brute force: evaluate the comparator (reference > carrier) at N midpoints per period and
  // integrate the Fourier sums numerically. Edge positions are resolved to 2π/N, so each of the
  // 2·mf edges contributes at most vdc·(2/π)·(2π/N) of error per coefficient.
  const N = 2 ** 20;

  function bruteForce(mf: number, ma: number, order: number): number {
    let a = 0;
    let b = 0;
    for (let k = 0; k < N; k++) {
      const theta = ((k + 0.5) * 2 * Math.PI) / N;
      const x = mf * (theta - Math.PI / 2); // carrier valley at π/2 (docs/architecture.md)
      const u = x - 2 * Math.PI * Math.floor(x / (2 * Math.PI));
      const carrier = u <= Math.PI ? -1 + (2 * u) / Math.PI : 3 - (2 * u) / Math.PI;
      const v = ma * Math.sin(theta) > carrier ? vdc : -vdc;
      a += v * Math.cos(order * theta);
      b += v * Math.sin(order * theta);
    }
    return (2 / N) * Math.hypot(a, b);
  }

  for (const mf of [3, 5]) {
    it(`bipolar mf = ${mf}, ma = 0.8`, () => {
      const ma = 0.8;
      const exact = harmonics(sineTriangle({ scheme: 'bipolar', ma, mf, vdc }), 2 * mf + 1);
      const tolerance = 2 * mf * vdc * (2 / Math.PI) * ((2 * Math.PI) / N);
      for (const order of [1, mf - 2, mf, mf + 2, 2 * mf - 1, 2 * mf + 1].filter((h) => h > 0)) {
        expect(Math.abs(amplitudeAt(exact, order) - bruteForce(mf, ma, order))).toBeLessThan(
          tolerance,
        );
      }
    });
  }
});
