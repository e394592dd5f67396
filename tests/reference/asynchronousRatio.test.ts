import { besselj } from 'bessel';
import { describe, expect, it } from 'vitest';
import { subharmonicSpectrum, threePhase } from '@pulsewright/modulation';

// A fixed carrier at an asynchronous ratio mf = p/q, checked against the double Fourier series
// of naturally sampled sine-triangle PWM (H. S. Black, *Modulation Theory*, 1953, in the form of
// D. G. Holmes and T. A. Lipo, *Pulse Width Modulation for Power Converters*, 2003, ch. 3),
// evaluated with the npm package `bessel`. A leg switching ±Vdc/2 with reference M·cos y
// against a carrier with a valley at x = 0 is
//   v = (Vdc/2)·M·cos y + Σ_{m≥1} Σ_n (2·Vdc/(mπ))·J_n(mπM/2)·sin((m+n)π/2)·cos(m·x + n·y).
// The library's convention (reference M·sin θ, carrier valley at θ = π/2) gives y = θ − π/2 and
// x = mf·y. Over the span of q fundamental periods, θ = q·φ, the term (m, n) sits at span order
// k = m·p + n·q, that is at m·p/q + n times the fundamental, with phase −π·k/(2q): every term
// that lands on the same |k| has the same phase, so the exact amplitude there is the absolute
// value of the signed sum of their coefficients. At a whole ratio only k multiple of q occur;
// at p/q (coprime) every k does, which is the beat and sub-harmonic content of a fixed carrier.

const vdc = 600;
const GROUPS = 60; // m ≤ 60: with mf ≥ 7/3 and M ≤ 1, J_n(mπM/2) at |n| ≈ m·mf is below 1e-20 by then

/** The double Fourier series' amplitude at span order k of a leg (±vdc/2) at mf = p/q. */
function predicted(k: number, p: number, q: number, ma: number): { sum: number; terms: number[] } {
  const terms: number[] = [];
  if (k === q) terms.push((vdc / 2) * ma); // the reference itself (m = 0)
  for (let m = 1; m <= GROUPS; m++) {
    for (const target of [k, -k]) {
      const n = (target - m * p) / q;
      if (!Number.isInteger(n) || (k === 0 && target < 0)) continue;
      const coefficient =
        ((2 * vdc) / (m * Math.PI)) *
        besselj((m * Math.PI * ma) / 2, n) *
        Math.sin(((m + n) * Math.PI) / 2);
      if (coefficient !== 0) terms.push(coefficient);
    }
  }
  return { sum: Math.abs(terms.reduce((s, t) => s + t, 0)), terms };
}

const cases = [
  { p: 7, q: 3, ma: 0.8 },
  { p: 31, q: 2, ma: 0.9 },
  { p: 52, q: 5, ma: 0.6 },
];

describe('asynchronous ratio p/q: the exact leg spectrum equals the double Fourier series', () => {
  for (const { p, q, ma } of cases) {
    it(`leg a, mf = ${p}/${q}, ma = ${ma}: every component to 3·mf matches to 1e-6 of vdc`, () => {
      const maxOrder = Math.ceil((3 * p) / q);
      const leg = threePhase({ ma, mf: p / q, vdc }, { fundamentalPeriods: q }).legs.a;
      const { components } = subharmonicSpectrum(leg, { fundamentalPeriods: q, maxOrder });
      let worst = 0;
      for (const component of components.slice(1)) {
        const expected = predicted(component.spanOrder, p, q, ma).sum;
        worst = Math.max(worst, Math.abs(component.amplitude - expected));
      }
      // 1e-6 of vdc: the `bessel` package's own rounding (as in doubleFourier.test.ts).
      expect(worst / vdc).toBeLessThan(1e-6);
    });
  }

  it('mf = 7/3: a sub-harmonic at 1/3 and a beat at 5/3 of the fundamental, where m·p/q + n predicts them (1/3 = 7/3 − 2, 5/3 = 2·7/3 − 3), none at 2/3', () => {
    const [p, q, ma] = [7, 3, 0.8];
    const leg = threePhase({ ma, mf: p / q, vdc }, { fundamentalPeriods: q }).legs.a;
    const { components } = subharmonicSpectrum(leg, { fundamentalPeriods: q, maxOrder: 2 });
    for (const [k, label] of [
      [1, '1/3'],
      [5, '5/3'],
    ] as const) {
      const component = components[k];
      // The largest single term at each order: (m, n) = (1, −2) at 1/3 and (2, −3) at 5/3.
      const { terms } = predicted(k, p, q, ma);
      const largest = Math.max(...terms.map(Math.abs));
      expect(component?.label).toBe(label);
      expect(component?.amplitude).toBeGreaterThan(1e-2 * vdc);
      expect(Math.abs((component?.amplitude ?? 0) - largest)).toBeLessThan(0.2 * largest);
      console.log(
        `mf = 7/3, ma = 0.8: order ${label} holds ${((component?.amplitude ?? 0) / vdc).toExponential(3)} of vdc`,
      );
    }
    // k = 7m + 3n has the parity of m + n, and sin((m + n)π/2) = 0 for even m + n: a two-level
    // leg has no component at even span orders, 2/3 among them.
    expect(components[2]?.amplitude).toBeLessThan(1e-9 * vdc);
  });

  it('the fundamental is ma·vdc/2 (Holmes and Lipo ch. 3) to 1e-9 at mf = 31/2, and departs by the beat terms at mf = 7/3', () => {
    const fundamentalOf = (p: number, q: number, ma: number): number => {
      const leg = threePhase({ ma, mf: p / q, vdc }, { fundamentalPeriods: q }).legs.a;
      return subharmonicSpectrum(leg, { fundamentalPeriods: q, maxOrder: 1 }).fundamental;
    };
    expect(Math.abs(fundamentalOf(31, 2, 0.9) - (0.9 * vdc) / 2)).toBeLessThan(1e-9 * vdc);
    // At 7/3 the sideband (m, n) = (3, −6) lands on the fundamental (3·7/3 − 6 = 1): the
    // departure from ma·vdc/2 is bounded by the other terms there and is not negligible.
    const { terms } = predicted(3, 7, 3, 0.8);
    const others = terms.slice(1).reduce((s, t) => s + Math.abs(t), 0);
    const departure = Math.abs(fundamentalOf(7, 3, 0.8) - (0.8 * vdc) / 2);
    expect(departure).toBeLessThanOrEqual(others + 1e-6 * vdc);
    expect(departure).toBeGreaterThan(1e-3 * vdc);
  });
});
