import { describe, expect, it } from 'vitest';
import { fftSpectrum } from '../fftSpectrum.js';
import { realDft } from '../realDft.js';
import { wholePeriods } from '../wholePeriods.js';
import { sineTriangle } from '../../carrier/sineTriangle.js';
import { assertInDelta } from '../../testing/assertInDelta.js';
import { waveformValueAt } from '../../waveform/waveformValueAt.js';

const TAU = 2 * Math.PI;

/** ±volts square wave, `perPeriod` samples a period, +volts over the first half of each. */
function squareWave(volts: number, perPeriod: number, periods: number): number[] {
  return Array.from({ length: perPeriod * periods }, (_, i) =>
    i % perPeriod < perPeriod / 2 ? volts : -volts,
  );
}

/** The DFT by its definition, Σ x_i e^{−j2πki/L}: the reference the transform must equal. */
function directDft(samples: readonly number[], k: number): { re: number; im: number } {
  let re = 0;
  let im = 0;
  samples.forEach((x, i) => {
    re += x * Math.cos((TAU * k * i) / samples.length);
    im -= x * Math.sin((TAU * k * i) / samples.length);
  });
  return { re, im };
}

describe('realDft: the transform of any length', () => {
  it('equals the DFT by its definition for lengths that are not powers of two', () => {
    // Definition of the DFT (any signals text); invented samples.
    for (const length of [17, 777, 1000, 2000]) {
      const samples = Array.from({ length }, (_, i) => Math.sin(0.37 * i * i) + 0.25 * (i % 7));
      const out = realDft(samples);
      expect(out).toHaveLength(2 * (Math.floor(length / 2) + 1));
      const scale = samples.reduce((a, x) => a + Math.abs(x), 0);
      for (const k of [0, 1, 2, 5, Math.floor(length / 3), Math.floor(length / 2)]) {
        const { re, im } = directDft(samples, k);
        assertInDelta(out[2 * k] as number, re, 1e-12 * scale, `L ${length} re ${k}`);
        assertInDelta(out[2 * k + 1] as number, im, 1e-12 * scale, `L ${length} im ${k}`);
      }
    }
  });

  it('keeps Parseval’s identity at a length of 10 000', () => {
    // Σ|x|² = (1/L)·Σ_k |X_k|² over the full two-sided transform (Parseval).
    const length = 10_000;
    const samples = Array.from({ length }, (_, i) => Math.cos(0.001 * i * i) - 0.3);
    const out = realDft(samples);
    let spectral = 0;
    for (let k = 0; k <= length / 2; k++) {
      const power = (out[2 * k] as number) ** 2 + (out[2 * k + 1] as number) ** 2;
      spectral += k === 0 || k === length / 2 ? power : 2 * power;
    }
    const energy = samples.reduce((a, x) => a + x * x, 0);
    assertInDelta(spectral / length, energy, 1e-11 * energy, 'Parseval');
  });
});

describe('fftSpectrum over whole periods (issue 10: the 10 000-sample square wave)', () => {
  // ±100 V, 50 Hz, sampled at 100 kHz over 5 periods: 2000 samples a period.
  const volts = 100;
  const perPeriod = 2000;
  const samples = squareWave(volts, perPeriod, 5);
  const sampleRate = 100_000;

  it('reads the frequency and the exact amplitudes of an exactly periodic capture', () => {
    const result = fftSpectrum(samples, sampleRate, { maxOrder: 9 });
    expect(result.periodic).toBe(true);
    expect(result.periods).toBe(5);
    expect(result.sampleCount).toBe(10_000);
    expect(result.fftSize).toBe(10_000);
    expect(result.window).toBe('rectangular');
    expect(result.fundamentalEstimated).toBe(true);
    assertInDelta(result.fundamentalFrequency, 50, 1e-9 * 50, 'fundamental frequency');
    for (const h of result.harmonics) {
      // Fourier series of a ±V square wave: 4V/(nπ) on odd n, 0 on even n (a fact of the
      // trade; docs/references.md). Sampling M times a period aliases the higher orders: the
      // DFT of the samples is the geometric sum 4V/(M·sin(πn/M)), which the transform of
      // exactly 5 periods must reproduce to rounding.
      const series = h.order % 2 === 1 ? (4 * volts) / (h.order * Math.PI) : 0;
      const sampled =
        h.order % 2 === 1
          ? (4 * volts) / (perPeriod * Math.sin((Math.PI * h.order) / perPeriod))
          : 0;
      assertInDelta(h.amplitude, sampled, 1e-9 * series + 1e-9 * volts, `order ${h.order} DFT`);
      // Within the aliasing factor (πn/M)/sin(πn/M) − 1 ≈ (πn/M)²/6 of the series itself.
      const aliasing = ((Math.PI * h.order) / perPeriod) ** 2 / 6;
      assertInDelta(h.amplitude, series, aliasing * series + 1e-9 * volts, `order ${h.order}`);
    }
    assertInDelta(result.harmonics[0]?.amplitude ?? NaN, 127.32, 0.005, '4·100/π');
    assertInDelta(result.harmonics[2]?.amplitude ?? NaN, 42.44, 0.005, '4·100/(3π)');
  });

  it('zero-padding to 16 384 smears the same capture (why whole periods are the default)', () => {
    const padded = fftSpectrum(samples, sampleRate, { maxOrder: 3, lengthPolicy: 'zero-pad' });
    expect(padded.fftSize).toBe(16_384);
    // Issue 10 reported 126.2 V and 50.01 Hz from this path: more than 0.5 V and 1e−5 off.
    const exact = (4 * volts) / Math.PI;
    expect(Math.abs((padded.harmonics[0]?.amplitude ?? NaN) - exact)).toBeGreaterThan(0.5);
    expect(Math.abs(padded.fundamentalFrequency - 50)).toBeGreaterThan(50e-5);
  });

  it('reads a capture periodic over a non-integer number of samples a period', () => {
    // 3 periods in 1000 samples (333⅓ samples a period), fundamental and 5th harmonic: a
    // periodic capture whose period is not a whole number of samples.
    const sampleRate2 = 10_000;
    const f0 = (3 * sampleRate2) / 1000;
    const count = 4000;
    const capture = Array.from(
      { length: count },
      (_, i) =>
        230 * Math.sin((TAU * f0 * i) / sampleRate2 + 0.4) +
        11.5 * Math.sin((TAU * 5 * f0 * i) / sampleRate2 - 1.1),
    );
    const result = fftSpectrum(capture, sampleRate2, { maxOrder: 7, window: 'flat-top' });
    expect(result.periodic).toBe(true);
    expect(result.sampleCount % 1000).toBe(0);
    assertInDelta(result.fundamentalFrequency, f0, 1e-9 * f0, 'f0');
    // The tones' own amplitudes and phases (they were made so), to rounding.
    assertInDelta(result.harmonics[0]?.amplitude ?? NaN, 230, 1e-9 * 230, 'fundamental');
    assertInDelta(result.harmonics[0]?.phase ?? NaN, 0.4, 1e-9, 'fundamental phase');
    assertInDelta(result.harmonics[4]?.amplitude ?? NaN, 11.5, 1e-9 * 230, '5th');
    assertInDelta(result.harmonics[2]?.amplitude ?? NaN, 0, 1e-9 * 230, '3rd');
  });

  it('keeps the window for a capture that is not periodic over the record', () => {
    // 53.3 Hz at 12.8 kHz: 240.15 samples a period, never a whole number; read with the
    // flat-top over the 8 whole periods that fit, within its flatness (≈ 0.01 dB ≈ 0.12 %,
    // flat-top window tables, from memory).
    const sampleRate3 = 12_800;
    const frequency = 53.3;
    const capture = Array.from(
      { length: 2048 },
      (_, i) => 2.5 * Math.sin((TAU * frequency * i) / sampleRate3),
    );
    const result = fftSpectrum(capture, sampleRate3, { window: 'flat-top', maxOrder: 2 });
    expect(result.periodic).toBe(false);
    expect(result.window).toBe('flat-top');
    expect(result.periods).toBe(8);
    expect(result.sampleCount).toBe(Math.round((8 * sampleRate3) / frequency));
    assertInDelta(result.fundamentalFrequency, frequency, 1e-4 * frequency, 'estimate');
    assertInDelta(result.harmonics[0]?.amplitude ?? NaN, 2.5, 0.0012 * 2.5, 'amplitude');
  });

  it('does not take a capture with noise for an exactly periodic one', () => {
    // The same square wave with a 10 mV disturbance at an unrelated frequency.
    const noisy = samples.map((v, i) => v + 0.01 * Math.sin(1.2345 * i));
    const span = wholePeriods(noisy, sampleRate, 50);
    expect(span.periodic).toBe(false);
    expect(span.periods).toBe(5);
    const result = fftSpectrum(noisy, sampleRate, { maxOrder: 3, window: 'hann' });
    expect(result.window).toBe('hann');
    // Hann on (almost) whole periods: the fundamental within 0.01 % of 4·100/π (the
    // disturbance is 1e−4 of it and the stretch 2 samples short of 5 periods at most).
    assertInDelta(result.harmonics[0]?.amplitude ?? NaN, 127.324, 1e-4 * 127.324, 'fundamental');
  });

  it('estimates the fundamental of a short, noisy PWM capture from its phase advance', () => {
    // Unipolar PWM, ma 0.8, mf 42, 360 V, sampled at 250 kS/s with two disturbances (invented,
    // like the demo's bench capture), over 2 (less 63 samples), 3 and 5 periods of 50 Hz. The
    // spectral peak alone read 50.29 Hz from two periods (a Hann main lobe spans DC and the
    // neighbouring orders there); the phase advance from the first period to the last must bring
    // it within 1e−4.
    const pwm = sineTriangle({ scheme: 'unipolar', ma: 0.8, mf: 42, vdc: 360 });
    const rate = 250_000;
    for (const periods of [2, 3, 5]) {
      const count = Math.round((periods * rate) / 50) - 63;
      const capture = Array.from(
        { length: count },
        (_, i) =>
          waveformValueAt(pwm, (TAU * 50 * i) / rate + 0.3) +
          2 * Math.sin(0.7311 * i) +
          1.5 * Math.sin(2.1 * i),
      );
      const result = fftSpectrum(capture, rate, { maxOrder: 3 });
      expect(result.periodic).toBe(false);
      assertInDelta(result.fundamentalFrequency, 50, 1e-4 * 50, `${periods} periods`);
      // Linear range: the fundamental is ma·vdc = 288 V (Holmes and Lipo 2003, ch. 3); the
      // Hann window over the whole periods that fit reads it within 0.2 %.
      assertInDelta(result.harmonics[0]?.amplitude ?? NaN, 288, 0.002 * 288, `${periods} V1`);
    }
  });

  it('bounds the search for a repetition: a capture flat for most of its length is not periodic', () => {
    // 2^20 samples at zero with a burst at the end: every shift matches until the burst, so an
    // unbounded search would compare ~N²/perPeriod samples; the budget ends it after 16·N.
    const count = 2 ** 20;
    const capture = Array.from({ length: count }, (_, i) =>
      i < count - 500 ? 0 : Math.sin(0.3 * i),
    );
    const span = wholePeriods(capture, 1e6, 1e6 / 7);
    expect(span.periodic).toBe(false);
    expect(span.periods).toBe(Math.floor(count / 7));
  });

  it('refuses an unknown length policy, naming the field', () => {
    expect(() => fftSpectrum(samples, sampleRate, { lengthPolicy: 'pad' as 'zero-pad' })).toThrow(
      /lengthPolicy must be one of/,
    );
  });
});
