import { describe, expect, it } from 'vitest';
import { harmonics, thd, wthd } from '../index.js';
import { sineTriangle } from '../../carrier/index.js';
import { assertInDelta } from '../../testing/assertInDelta.js';

describe('harmonics of a square wave', () => {
  // ±V square wave, +V on (0, π): Fourier series 4V/(nπ) on odd n, phase 0 (standard Fourier
  // analysis, any signals text).
  const volts = 300;
  const square = { edges: [0, Math.PI], levels: [volts, -volts] };

  it('matches 4V/(nπ) on odd orders and zero on even orders', () => {
    for (const { order, amplitude, phase } of harmonics(square, 99)) {
      const expected = order % 2 === 1 ? (4 * volts) / (order * Math.PI) : 0;
      assertInDelta(amplitude, expected, 1e-10 * volts, `order ${order}`);
      if (order % 2 === 1) assertInDelta(phase, 0, 1e-12, `phase ${order}`);
    }
  });

  it('has THD √(π²/8 − 1) ≈ 48.34 % in the limit of many orders', () => {
    // THD of a square wave = √(π²/8 − 1) (standard Fourier analysis). Truncation to order N
    // leaves out a tail Σ_{odd n>N} 1/n² ≈ 1/(2N) of THD², which lowers THD by about
    // 1/(4N·THD) ≈ 2.6e-5 at N = 20001; the check allows 3e-5 and requires it to be below.
    const truncated = thd(harmonics(square, 20001));
    const limit = Math.sqrt(Math.PI ** 2 / 8 - 1);
    assertInDelta(truncated, limit, 3e-5);
    expect(truncated).toBeLessThan(limit);
  });

  it('weights each order by 1/n for WTHD', () => {
    // WTHD of a square wave: √(Σ_{odd n≥3} 1/n⁴) = √(π⁴/96 − 1) (Σ_{odd} n⁻⁴ = π⁴/96).
    assertInDelta(wthd(harmonics(square, 2001)), Math.sqrt(Math.PI ** 4 / 96 - 1), 1e-9);
  });

  it('reports a shifted wave with the shifted phase', () => {
    const shift = 0.3;
    const shifted = { edges: [shift, Math.PI + shift], levels: [volts, -volts] };
    const [, fundamental] = harmonics(shifted, 1);
    assertInDelta(fundamental?.phase ?? NaN, -shift, 1e-12);
  });
});

describe('harmonics input checks', () => {
  it('names the field and the range', () => {
    const square = { edges: [0, Math.PI], levels: [1, -1] };
    expect(() => harmonics(square, -1)).toThrow(/maxOrder must be an integer ≥ 0 and ≤ 100000/);
    expect(() => harmonics(square, 2.5)).toThrow(RangeError);
    expect(() => harmonics({ edges: [1, 0.5], levels: [1, -1] }, 3)).toThrow(/waveform.edges\[1\]/);
    expect(() => harmonics({ edges: [0, 7], levels: [1, -1] }, 3)).toThrow(/\[0, 2π\)/);
    expect(() => harmonics({ edges: [0, 1], levels: [1, NaN] }, 3)).toThrow(/levels\[1\]/);
  });
});

describe('harmonics: the mean (order 0)', () => {
  // Issue 10: the default bridge (bipolar, ma 0.8, mf 21, ±400 V) returned −3.1e-13 V for its
  // mean. With an odd frequency ratio the bipolar waveform has half-wave symmetry, so its mean
  // is exactly 0 (common practice, docs/references.md "Facts of the trade").
  it('is exactly 0 for a half-wave symmetric bridge and never negative', () => {
    const bridge = sineTriangle({ scheme: 'bipolar', ma: 0.8, mf: 21, vdc: 400 });
    expect(harmonics(bridge, 3)[0]).toEqual({ order: 0, amplitude: 0, phase: 0 });
  });

  it('gives a negative mean as its magnitude with phase π (mean = amplitude·cos(phase))', () => {
    // −100 V for a quarter period, 0 V otherwise: mean −25 V (the area over 2π).
    const pulse = { edges: [0, Math.PI / 2], levels: [-100, 0] };
    const [mean] = harmonics(pulse, 1);
    assertInDelta(mean?.amplitude ?? NaN, 25, 1e-12, 'amplitude');
    expect(mean?.phase).toBe(Math.PI);
    assertInDelta((mean?.amplitude ?? NaN) * Math.cos(mean?.phase ?? NaN), -25, 1e-12, 'mean');
  });
});

describe('harmonics of mirror-symmetric pulses (read from half their edges)', () => {
  // A pulse of height V and width 2w centred at θ₀: v = V·w/π + Σ (2V/(nπ))·sin(nw)·cos(n(θ − θ₀))
  // (the Fourier series of a rectangular pulse train, standard Fourier analysis): amplitude
  // (2V/(nπ))·|sin nw| and phase π/2 − nθ₀ (+π where sin nw < 0) in the convention
  // A·sin(nθ + φ). Centred at π/2 it is its own mirror image about π/2, without half-wave
  // symmetry; centred at 0, about 0.
  const volts = 300;
  const halfWidth = 0.7;
  const pulses = [
    [
      'π/2',
      Math.PI / 2,
      { edges: [Math.PI / 2 - halfWidth, Math.PI / 2 + halfWidth], levels: [volts, 0] },
    ],
    ['0', 0, { edges: [halfWidth, 2 * Math.PI - halfWidth], levels: [0, volts] }],
  ] as const;
  for (const [name, centre, pulse] of pulses) {
    it(`centred at ${name}: every order as the closed form`, () => {
      const spectrum = harmonics({ edges: [...pulse.edges], levels: [...pulse.levels] }, 200);
      assertInDelta(spectrum[0]?.amplitude ?? NaN, (volts * halfWidth) / Math.PI, 1e-12 * volts);
      for (const { order, amplitude, phase } of spectrum.slice(1)) {
        const signed = ((2 * volts) / (order * Math.PI)) * Math.sin(order * halfWidth);
        assertInDelta(amplitude, Math.abs(signed), 1e-12 * volts, `order ${order}`);
        if (Math.abs(signed) < 1e-9 * volts) continue;
        const expected = Math.PI / 2 - order * centre + (signed < 0 ? Math.PI : 0);
        const gap = Math.abs(phase - expected) % (2 * Math.PI);
        expect(Math.min(gap, 2 * Math.PI - gap), `phase ${order}`).toBeLessThan(1e-12);
      }
    });
  }
});
