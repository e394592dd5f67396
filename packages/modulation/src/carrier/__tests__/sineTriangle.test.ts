import { describe, expect, it } from 'vitest';
import {
  harmonics,
  sineTriangle,
  thd,
  triangleCarrier,
  waveformIntegral,
  waveformValueAt,
} from '../../index.js';
import { assertInDelta } from '../../testing/assertInDelta.js';

const vdc = 350;

describe('sineTriangle in the linear range', () => {
  // Fact of the trade (common practice; Holmes and Lipo 2003 ch. 3): for naturally sampled
  // sine-triangle PWM with ma ≤ 1 the bridge fundamental is ma·vdc, in phase with the
  // reference, for both schemes. It is exact while no sideband m·mf ± n lands on order 1; at
  // mf ≥ 15 those sidebands (J_{mf−1}(π·ma/2) and smaller) are below 1e-12 of vdc. The small-mf
  // departure is bounded in tests/reference/doubleFourier.test.ts.
  for (const scheme of ['bipolar', 'unipolar'] as const) {
    for (const mf of [15, 21, 40, 101]) {
      for (const ma of [0.05, 0.37, 0.8, 1]) {
        it(`${scheme} mf=${mf} ma=${ma}: fundamental = ma·vdc`, () => {
          const [, fundamental] = harmonics(sineTriangle({ scheme, ma, mf, vdc }), 1);
          assertInDelta(fundamental?.amplitude ?? NaN, ma * vdc, 1e-9 * vdc);
          assertInDelta(fundamental?.phase ?? NaN, 0, 1e-9);
        });
      }
    }
  }

  it('has half-wave symmetry at odd mf: no DC and no even harmonics (common practice)', () => {
    for (const mf of [3, 7, 21, 51]) {
      const spectrum = harmonics(sineTriangle({ scheme: 'bipolar', ma: 0.73, mf, vdc }), 8 * mf);
      for (const { order, amplitude } of spectrum) {
        if (order % 2 === 0) assertInDelta(amplitude, 0, 1e-10 * vdc, `order ${order}`);
      }
    }
  });

  it('has quarter-wave symmetry at odd mf with carrierPhase 0: v(θ) = v(π − θ)', () => {
    // docs/architecture.md: a carrier valley at θ = π/2 gives quarter-wave symmetry for odd mf, so every
    // harmonic is in phase (0) or antiphase (π) with sin nθ.
    const spectrum = harmonics(sineTriangle({ scheme: 'bipolar', ma: 0.61, mf: 15, vdc }), 300);
    for (const { order, amplitude, phase } of spectrum) {
      if (order === 0 || amplitude < 1e-9 * vdc) continue;
      const offAxis = Math.min(Math.abs(phase), Math.abs(Math.abs(phase) - Math.PI));
      assertInDelta(offAxis, 0, 1e-7, `phase of order ${order}`);
    }
  });

  it('switches only between the levels of the scheme', () => {
    const bipolar = sineTriangle({ scheme: 'bipolar', ma: 0.9, mf: 12, vdc });
    expect(new Set(bipolar.levels)).toEqual(new Set([vdc, -vdc]));
    const unipolar = sineTriangle({ scheme: 'unipolar', ma: 0.9, mf: 12, vdc });
    expect(new Set(unipolar.levels)).toEqual(new Set([vdc, 0, -vdc]));
  });

  it('makes 2·mf edges per period for bipolar natural sampling below ma = 1', () => {
    // Each carrier half period holds exactly one crossing while |ref| < 1.
    expect(sineTriangle({ scheme: 'bipolar', ma: 0.95, mf: 33, vdc }).edges).toHaveLength(66);
  });
});

describe('sineTriangle in overmodulation', () => {
  it('drops pulses past ma = 1 and tends to the square wave', () => {
    const edgeCount = (ma: number): number =>
      sineTriangle({ scheme: 'bipolar', ma, mf: 21, vdc }).edges.length;
    expect(edgeCount(1.5)).toBeLessThan(edgeCount(1));
    expect(edgeCount(1.5)).toBeGreaterThan(edgeCount(4));
    // Square wave ±vdc: fundamental 4·vdc/π and THD √(π²/8 − 1) (standard Fourier analysis).
    const square = sineTriangle({ scheme: 'bipolar', ma: 1000, mf: 21, vdc });
    expect(square.edges).toHaveLength(2);
    const spectrum = harmonics(square, 20001);
    assertInDelta(spectrum[1]?.amplitude ?? NaN, (4 * vdc) / Math.PI, 1e-3 * vdc);
    assertInDelta(thd(spectrum), Math.sqrt(Math.PI ** 2 / 8 - 1), 1e-3);
  });

  it('keeps the fundamental below the square wave limit and rising with ma', () => {
    let previous = 0;
    for (const ma of [1, 1.2, 1.6, 2.5, 5]) {
      const [, fundamental] = harmonics(sineTriangle({ scheme: 'unipolar', ma, mf: 20, vdc }), 1);
      const amplitude = fundamental?.amplitude ?? NaN;
      expect(amplitude).toBeGreaterThan(previous);
      expect(amplitude).toBeLessThanOrEqual((4 * vdc) / Math.PI + 1e-9);
      previous = amplitude;
    }
  });
});

describe('sineTriangle regular sampling', () => {
  it('delays the fundamental by the sampling instant (Bowes 1975; Holmes and Lipo ch. 3)', () => {
    // Symmetric sampling takes the sample half a carrier period (π/mf rad) before the pulse
    // centre, asymmetric a quarter period (π/(2mf)) on average: the fundamental lags by that.
    const mf = 21;
    const symmetric = harmonics(
      sineTriangle({ scheme: 'bipolar', ma: 0.8, mf, vdc, sampling: 'regular-symmetric' }),
      1,
    );
    const asymmetric = harmonics(
      sineTriangle({ scheme: 'bipolar', ma: 0.8, mf, vdc, sampling: 'regular-asymmetric' }),
      1,
    );
    assertInDelta(symmetric[1]?.phase ?? NaN, -Math.PI / mf, 1e-9);
    assertInDelta(asymmetric[1]?.phase ?? NaN, -Math.PI / (2 * mf), 1e-9);
  });

  it('matches each sample in volt-seconds over its carrier period (symmetric)', () => {
    const mf = 9;
    const ma = 0.7;
    const waveform = sineTriangle({
      scheme: 'bipolar',
      ma,
      mf,
      vdc,
      sampling: 'regular-symmetric',
    });
    for (let k = 0; k < mf; k++) {
      // Carrier period k runs peak to peak round the valley at π/2 + 2πk/mf.
      const start = Math.PI / 2 + (2 * Math.PI * k - Math.PI) / mf;
      const mean =
        waveformIntegral(waveform, start, start + (2 * Math.PI) / mf) / ((2 * Math.PI) / mf);
      assertInDelta(mean, vdc * ma * Math.sin(start), 1e-9 * vdc, `period ${k}`);
    }
  });
});

describe('sineTriangle carrier phase', () => {
  it('delays the carrier: its valley moves from π/2 to π/2 + carrierPhase/mf (docs/architecture.md)', () => {
    const mf = 9;
    const carrierPhase = 0.8;
    assertInDelta(triangleCarrier(Math.PI / 2, { mf }), -1, 1e-12);
    assertInDelta(
      triangleCarrier(Math.PI / 2 + carrierPhase / mf, { mf, carrierPhase }),
      -1,
      1e-12,
    );
    assertInDelta(
      triangleCarrier(Math.PI / 2 + (carrierPhase + Math.PI) / mf, { mf, carrierPhase }),
      1,
      1e-12,
    );
    // The bipolar pulse round that valley is high (reference ma·sin θ > −1 there) and, with
    // regular sampling, centred on it.
    const waveform = sineTriangle({
      scheme: 'bipolar',
      ma: 0.5,
      mf,
      vdc,
      carrierPhase,
      sampling: 'regular-symmetric',
    });
    const valley = Math.PI / 2 + carrierPhase / mf;
    const rise = waveform.edges.filter((e) => e < valley).at(-1) ?? NaN;
    const fall = waveform.edges.find((e) => e > valley) ?? NaN;
    assertInDelta(valley - rise, fall - valley, 1e-12);
    expect(waveformValueAt(waveform, valley)).toBe(vdc);
  });

  it('moves the edges with the carrier and leaves the linear fundamental unchanged', () => {
    const base = sineTriangle({ scheme: 'bipolar', ma: 0.5, mf: 10, vdc });
    const shifted = sineTriangle({ scheme: 'bipolar', ma: 0.5, mf: 10, vdc, carrierPhase: 1.1 });
    expect(shifted.edges).not.toEqual(base.edges);
    const [, fundamental] = harmonics(shifted, 1);
    assertInDelta(fundamental?.amplitude ?? NaN, 0.5 * vdc, 1e-9 * vdc);
  });
});

describe('sineTriangle input checks', () => {
  const valid = { scheme: 'bipolar', ma: 0.8, mf: 21, vdc } as const;
  it.each([
    [{ ma: 0 }, /ma must be a finite number > 0 and ≤ 1000; got 0/],
    [{ ma: -1 }, /ma must be/],
    [{ ma: Number.NaN }, /ma must be .*got NaN/],
    [{ ma: Number.POSITIVE_INFINITY }, /ma must be .*got Infinity/],
    [{ mf: 0 }, /mf must be an integer ≥ 1 and ≤ 10000; got 0/],
    [{ mf: 20.5 }, /mf must be an integer/],
    [{ vdc: 0 }, /vdc must be a finite number > 0/],
    [{ scheme: 'tripolar' }, /scheme must be one of 'bipolar', 'unipolar'; got "tripolar"/],
    [{ sampling: 'sometimes' }, /sampling must be one of 'natural'/],
    [{ carrierPhase: Number.NaN }, /carrierPhase must be a finite number/],
  ])('rejects %o', (patch, message) => {
    expect(() => sineTriangle({ ...valid, ...patch } as never)).toThrow(RangeError);
    expect(() => sineTriangle({ ...valid, ...patch } as never)).toThrow(message);
  });

  it('rejects a string where a number is needed with a TypeError', () => {
    expect(() => sineTriangle({ ...valid, ma: '0.8' } as never)).toThrow(TypeError);
  });
});
