import FFT from 'fft.js';
import { describe, expect, it } from 'vitest';
import { TAU } from '../../math.js';
import { assertInDelta } from '../../testing/assertInDelta.js';
import type { Waveform } from '../../waveform/Waveform.js';
import { hasHalfWaveSymmetry } from '../../waveform/waveformSymmetry.js';
import { dcLinkFigures } from '../dcLinkFigures.js';
import { sampledPhasors } from '../sampledPhasors.js';
import { spectrumLabeller } from '../spectrumLabeller.js';

const MAX_ORDER = 40;
const labeller = spectrumLabeller(MAX_ORDER, 20);
const context = {
  vdc: 100,
  phaseCount: 1 as const,
  maxOrder: MAX_ORDER,
  points: 64,
  label: labeller.harmonics,
  labelPhasors: labeller.phasors,
  transform: (size: number) => new FFT(size),
};

/** sin θ on S angles 2πj/S, the second half written as the negated first (exactly antisymmetric). */
function antisymmetricSine(size: number): Float64Array {
  const samples = new Float64Array(size);
  for (let j = 0; j < size / 2; j++) {
    samples[j] = Math.sin((TAU * j) / size);
    samples[j + size / 2] = -(samples[j] as number);
  }
  return samples;
}

describe('sampledPhasors of a signal that repeats', () => {
  it('reads order n·r from the transform of one repeat, every other order zero', () => {
    // x = 0.5 + 2·sin(2θ + 0.3) − 0.7·sin(6θ − 1) repeats twice a period: 32 samples of [0, π)
    // on the 64-sample grid; the phasors of the harmonics convention are 2·e^{j0.3} at order 2
    // and −0.7·e^{−j} at order 6, the mean 0.5 (the signal's own definition).
    const size = 64;
    const x = (theta: number): number =>
      0.5 + 2 * Math.sin(2 * theta + 0.3) - 0.7 * Math.sin(6 * theta - 1);
    const half = Float64Array.from({ length: size / 2 }, (_, j) => x((TAU * j) / size));
    const { re, im } = sampledPhasors(half, 20, new FFT(size / 2), 2);
    expect(re.length).toBe(21);
    assertInDelta(re[0] as number, 0.5, 1e-12);
    assertInDelta(re[2] as number, 2 * Math.cos(0.3), 1e-12);
    assertInDelta(im[2] as number, 2 * Math.sin(0.3), 1e-12);
    assertInDelta(re[6] as number, -0.7 * Math.cos(-1), 1e-12);
    assertInDelta(im[6] as number, -0.7 * Math.sin(-1), 1e-12);
    for (let n = 1; n <= 20; n += 2) {
      expect(re[n]).toBe(0);
      expect(im[n]).toBe(0);
    }
    // The whole period's transform gives the same phasors.
    const whole = Float64Array.from({ length: size }, (_, j) => x((TAU * j) / size));
    const full = sampledPhasors(whole, 20);
    for (let n = 0; n <= 20; n++) {
      assertInDelta(re[n] as number, full.re[n] as number, 1e-12, `re[${n}]`);
      assertInDelta(im[n] as number, full.im[n] as number, 1e-12, `im[${n}]`);
    }
  });
});

describe('dcLinkFigures over half a period', () => {
  // A bridge at ±vdc square-wave switching (edges at 0 and π) carrying i = sin θ draws
  // i_dc = |sin θ|: mean 2/π, RMS 1/√2, and the full-wave rectified sine's series
  // |sin θ| = 2/π − (4/π)·Σ_k cos(2kθ)/(4k² − 1) (standard Fourier table), so order 2k has
  // amplitude (4/π)/(4k² − 1) and the odd orders none.
  const size = 4096;
  const current = antisymmetricSine(size);
  const square: Waveform = { edges: [0, Math.PI], levels: [100, -100] };

  it('matches the rectified sine, odd orders exactly zero', () => {
    const figures = dcLinkFigures([square], [current], context);
    // Sampling |sin θ| (a kink at 0 and π) on 4096 points: the sums are within 1e-6.
    assertInDelta(figures.mean, 2 / Math.PI, 1e-6, 'mean');
    assertInDelta(figures.rms, Math.SQRT1_2, 1e-6, 'rms');
    assertInDelta(figures.secondHarmonic as number, 4 / (3 * Math.PI), 1e-6, 'second');
    for (let k = 1; 2 * k <= MAX_ORDER; k++)
      assertInDelta(
        figures.spectrum[2 * k]?.amplitude as number,
        4 / Math.PI / (4 * k * k - 1),
        1e-5,
        `order ${2 * k}`,
      );
    for (let n = 1; n <= MAX_ORDER; n += 2) expect(figures.spectrum[n]?.amplitude).toBe(0);
    // The chart reads the whole period: its last value is |sin θ| near 2π.
    const { angles, values } = figures.series;
    const last = values.length - 1;
    assertInDelta(values[last] as number, Math.abs(Math.sin(angles[last] as number)), 1e-12);
  });

  it('gives the whole period’s figures when the symmetry is not seen', () => {
    // The same square wave with a redundant edge at π/2 (three edges: no half-wave pairing), so
    // the whole period is sampled and transformed: the same figures to rounding.
    const redundant: Waveform = { edges: [0, Math.PI / 2, Math.PI], levels: [100, 100, -100] };
    expect(hasHalfWaveSymmetry(redundant)).toBe(false);
    const half = dcLinkFigures([square], [current], context);
    const whole = dcLinkFigures([redundant], [current], context);
    assertInDelta(half.mean, whole.mean, 1e-14, 'mean');
    assertInDelta(half.rms, whole.rms, 1e-14, 'rms');
    for (let n = 0; n <= MAX_ORDER; n++)
      assertInDelta(
        half.spectrum[n]?.amplitude as number,
        whole.spectrum[n]?.amplitude as number,
        1e-14,
        `order ${n}`,
      );
  });
});
