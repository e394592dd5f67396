import { describe, expect, it } from 'vitest';
import { fftSpectrum, fftWindow } from '../index.js';
import { harmonics } from '../../spectrum/harmonics.js';
import { waveformFromTransitions } from '../../waveform/waveformFromTransitions.js';
import { waveformValueAt } from '../../waveform/waveformValueAt.js';
import { assertInDelta } from '../../testing/assertInDelta.js';

const TAU = 2 * Math.PI;

function tone(
  count: number,
  sampleRate: number,
  parts: { frequency: number; amplitude: number; phase: number }[],
): number[] {
  return Array.from({ length: count }, (_, i) =>
    parts.reduce(
      (sum, p) => sum + p.amplitude * Math.sin((TAU * p.frequency * i) / sampleRate + p.phase),
      0,
    ),
  );
}

describe('fftWindow gains (F. J. Harris, Proc. IEEE 66(1), 1978, Table I)', () => {
  const sum = (w: number[]): number => w.reduce((a, b) => a + b, 0);
  const equivalentNoiseBandwidth = (w: number[]): number =>
    (w.length * w.reduce((a, b) => a + b * b, 0)) / sum(w) ** 2;
  const n = 4096;

  it('has coherent gains 1, 0.50 and ≈ 0.2156', () => {
    assertInDelta(sum(fftWindow(n, { window: 'rectangular' })) / n, 1, 1e-15, 'rectangular');
    assertInDelta(sum(fftWindow(n, { window: 'hann' })) / n, 0.5, 1e-12, 'Hann (Harris: 0.50)');
    // Flat-top ≈ 0.2156 (docs/references.md, after Harris 1978).
    assertInDelta(sum(fftWindow(n, { window: 'flat-top' })) / n, 0.2156, 5e-5, 'flat-top');
  });

  it('has equivalent noise bandwidths 1.50 bins (Hann) and ≈ 3.77 bins (flat-top)', () => {
    // Hann ENBW 1.50 bins: Harris 1978, Table I. Flat-top 3.77 bins: from memory (tables of
    // flat-top windows, e.g. G. Heinzel et al., "Spectrum and spectral density estimation by
    // the DFT", 2002).
    assertInDelta(equivalentNoiseBandwidth(fftWindow(n, { window: 'hann' })), 1.5, 1e-9, 'Hann');
    assertInDelta(
      equivalentNoiseBandwidth(fftWindow(n, { window: 'flat-top' })),
      3.77,
      0.005,
      'flat-top',
    );
  });

  it('is periodic (DFT-even): w(0) is the minimum and the window is symmetric about N/2', () => {
    const w = fftWindow(64, { window: 'hann' });
    assertInDelta(w[0] as number, 0, 1e-15);
    assertInDelta(w[32] as number, 1, 1e-15);
    assertInDelta(w[10] as number, w[54] as number, 1e-15);
  });
});

describe('fftSpectrum of synthesized sines', () => {
  const sampleRate = 12_800;
  const count = 2048;

  it('reads a coherent sine back in peak volts and phase with every window', () => {
    // 50 Hz with 2048 samples at 12.8 kHz: exactly 8 periods, so the tone sits on bin 8.
    for (const window of ['rectangular', 'hann', 'flat-top'] as const) {
      const result = fftSpectrum(
        tone(count, sampleRate, [{ frequency: 50, amplitude: 311, phase: -0.7 }]),
        sampleRate,
        {
          window,
          fundamentalFrequency: 50,
          maxOrder: 5,
        },
      );
      const [first] = result.harmonics;
      assertInDelta(first?.amplitude ?? NaN, 311, 1e-10 * 311, `${window} amplitude`);
      assertInDelta(first?.phase ?? NaN, -0.7, 1e-10, `${window} phase`);
      assertInDelta(result.thd, 0, 1e-12, `${window} thd`);
    }
  });

  it('reads known harmonics and their THD', () => {
    // Three tones on bins 8, 40 and 56 (orders 1, 5, 7): THD = √(0.2² + 0.1²) by definition.
    const parts = [
      { frequency: 50, amplitude: 100, phase: 0.2 },
      { frequency: 250, amplitude: 20, phase: 1.0 },
      { frequency: 350, amplitude: 10, phase: -2.0 },
    ];
    const result = fftSpectrum(tone(count, sampleRate, parts), sampleRate, {
      fundamentalFrequency: 50,
      maxOrder: 9,
    });
    assertInDelta(result.harmonics[4]?.amplitude ?? NaN, 20, 1e-9, 'order 5');
    assertInDelta(result.harmonics[6]?.phase ?? NaN, -2.0, 1e-10, 'order 7 phase');
    assertInDelta(result.harmonics[2]?.amplitude ?? NaN, 0, 1e-9, 'order 3');
    assertInDelta(result.thd, Math.hypot(0.2, 0.1), 1e-11, 'thd');
  });

  it('bounds the non-coherent amplitude error by each window’s scalloping loss', () => {
    // On the power-of-two grid (lengthPolicy 'zero-pad' of 2048 samples), a tone between bins.
    // Worst-case scalloping loss at half a bin: rectangular 3.92 dB, Hann 1.42 dB (Harris 1978,
    // Table I); flat-top about 0.01 dB (flat-top window tables, from memory). Tones near bin
    // 100 keep the negative-frequency image's leakage small.
    const loss = { rectangular: 3.92, hann: 1.42, 'flat-top': 0.01 } as const;
    for (const window of ['rectangular', 'hann', 'flat-top'] as const) {
      let worst = 1;
      for (let offset = 0; offset <= 1.0001; offset += 0.05) {
        const frequency = ((100 + offset) * sampleRate) / count;
        const result = fftSpectrum(
          tone(count, sampleRate, [{ frequency, amplitude: 1, phase: 0.3 }]),
          sampleRate,
          {
            window,
            fundamentalFrequency: frequency,
            maxOrder: 1,
            lengthPolicy: 'zero-pad',
          },
        );
        worst = Math.min(worst, result.harmonics[0]?.amplitude ?? NaN);
        expect(result.harmonics[0]?.amplitude ?? NaN).toBeLessThanOrEqual(1 + 1e-3);
      }
      const worstLossDb = -20 * Math.log10(worst);
      // The worst case over offsets reaches the published loss to within its rounding (0.01 dB);
      // for the rectangular window the image at −100 bins leaks ≈ 1/(200π) of the amplitude
      // (its side lobes fall as 1/bins), about 0.014 dB, so it is allowed 0.03 dB.
      const tolerance = window === 'rectangular' ? 0.03 : window === 'hann' ? 0.011 : 0.01;
      assertInDelta(worstLossDb, loss[window], tolerance, `${window} loss ${worstLossDb} dB`);
    }
  });

  it('estimates an off-bin fundamental and reads its amplitude with the flat-top window', () => {
    const frequency = 53.3;
    const result = fftSpectrum(
      tone(count, sampleRate, [{ frequency, amplitude: 2.5, phase: 0 }]),
      sampleRate,
      {
        window: 'flat-top',
        maxOrder: 3,
      },
    );
    expect(result.fundamentalEstimated).toBe(true);
    assertInDelta(result.fundamentalFrequency, frequency, 1e-4 * frequency, 'estimate');
    // Flat-top amplitude flatness ≈ 0.01 dB ≈ 0.12 % (as above).
    assertInDelta(result.harmonics[0]?.amplitude ?? NaN, 2.5, 0.0012 * 2.5, 'amplitude');
  });

  it('zero-pads or truncates a capture whose length is not a power of two', () => {
    // 1000 samples at 10 kHz of 50 Hz: exactly 5 periods.
    const samples = tone(1000, 10_000, [{ frequency: 50, amplitude: 10, phase: 0 }]);
    const padded = fftSpectrum(samples, 10_000, {
      window: 'flat-top',
      fundamentalFrequency: 50,
      maxOrder: 1,
      lengthPolicy: 'zero-pad',
    });
    expect(padded.fftSize).toBe(1024);
    expect(padded.sampleCount).toBe(1000);
    assertInDelta(padded.resolution, 10, 1e-12);
    assertInDelta(
      padded.harmonics[0]?.amplitude ?? NaN,
      10,
      0.0012 * 10,
      'zero-padded, flat-top flatness',
    );
    const truncated = fftSpectrum(samples, 10_000, {
      window: 'flat-top',
      fundamentalFrequency: 50,
      lengthPolicy: 'truncate',
      maxOrder: 1,
    });
    expect(truncated.fftSize).toBe(512);
    expect(truncated.sampleCount).toBe(512);
    assertInDelta(truncated.harmonics[0]?.amplitude ?? NaN, 10, 0.0012 * 10, 'truncated');
  });

  it('returns one-sided bins up to Nyquist', () => {
    const result = fftSpectrum(
      tone(256, 1000, [{ frequency: 125, amplitude: 1, phase: 0 }]),
      1000,
      { window: 'rectangular' },
    );
    expect(result.bins.frequency).toHaveLength(129);
    assertInDelta(result.bins.frequency[128] as number, 500, 1e-12);
    assertInDelta(result.bins.amplitude[32] as number, 1, 1e-12, 'bin 32 = 125 Hz');
    // 256 samples: the image's leakage biases the Hann estimate by ~1e−5 Hz here.
    assertInDelta(result.fundamentalFrequency, 125, 1e-4, 'estimate on a bin');
  });
});

describe('fftSpectrum of sampled PWM against the exact harmonics', () => {
  it('reproduces the DFT of a sampled square wave: 4V/(M·sin(πn/M))', () => {
    // Standard DSP: a ±V square wave sampled M times a period at mid-sample instants has DFT
    // amplitude 4V/(M·sin(πn/M)) on odd n (a geometric sum), the exact 4V/(nπ) times
    // (πn/M)/sin(πn/M), the aliasing of the higher orders.
    const volts = 200;
    const perPeriod = 512;
    const periods = 4;
    const samples = Array.from({ length: perPeriod * periods }, (_, i) =>
      (i % perPeriod) + 0.5 < perPeriod / 2 ? volts : -volts,
    );
    const result = fftSpectrum(samples, perPeriod * 50, {
      window: 'rectangular',
      fundamentalFrequency: 50,
      maxOrder: 31,
    });
    for (const h of result.harmonics) {
      const expected =
        h.order % 2 === 1
          ? (4 * volts) / (perPeriod * Math.sin((Math.PI * h.order) / perPeriod))
          : 0;
      assertInDelta(h.amplitude, expected, 1e-9 * volts, `order ${h.order}`);
    }
  });

  it('matches harmonics(waveform) of a sampled unipolar PWM within the aliasing bound', () => {
    // An invented quarter-wave symmetric unipolar pattern: 7 pulses a half period.
    const vdc = 200;
    const starts = [0.11, 0.42, 0.71, 1.0, 1.26, 1.52, 1.78];
    const widths = [0.05, 0.12, 0.18, 0.22, 0.24, 0.25, 0.255];
    const transitions = [];
    for (let k = 0; k < starts.length; k++) {
      const a = starts[k] as number;
      const b = a + (widths[k] as number);
      for (const [from, to, level] of [
        [a, b, vdc],
        [Math.PI - b, Math.PI - a, vdc],
        [Math.PI + a, Math.PI + b, -vdc],
        [TAU - b, TAU - a, -vdc],
      ] as const) {
        transitions.push({ angle: from, level }, { angle: to, level: 0 });
      }
    }
    const waveform = waveformFromTransitions(transitions.sort((x, y) => x.angle - y.angle));
    const perPeriod = 2 ** 15;
    const periods = 4;
    const f1 = 50;
    const samples = Array.from({ length: perPeriod * periods }, (_, i) =>
      waveformValueAt(waveform, (TAU * (i + 0.5)) / perPeriod),
    );
    const result = fftSpectrum(samples, perPeriod * f1, {
      window: 'hann',
      fundamentalFrequency: f1,
      maxOrder: 40,
    });
    const exact = harmonics(waveform, 40);
    // Aliasing bound, derived for this test: the DFT of M samples a period gives
    // c_n + Σ_{k≠0} c_{n+kM}, with c_m = Σᵢ Δᵢ e^{−jmθᵢ}/(2πjm). Splitting 1/(n+kM) and using
    // max Σ sin(kx)/k = Si(π) ≈ 1.8519 (Gibbs) bounds the amplitude error by
    // (J/π)·(3.704/M + 3.29·n/(M(M − n))), J = Σ|Δᵢ|.
    const jumps = waveform.levels.length * vdc;
    for (const h of result.harmonics) {
      const reference = exact[h.order]?.amplitude ?? NaN;
      const bound =
        (jumps / Math.PI) *
        (3.704 / perPeriod + (3.29 * h.order) / (perPeriod * (perPeriod - h.order)));
      assertInDelta(h.amplitude, reference, bound, `order ${h.order}`);
    }
  });
});

describe('capture input checks', () => {
  it('names the field and the range', () => {
    const ok = tone(64, 1000, [{ frequency: 50, amplitude: 1, phase: 0 }]);
    expect(() => fftSpectrum([...ok.slice(0, 3), NaN, ...ok.slice(4)], 1000)).toThrow(
      /samples\[3\] must be a finite number/,
    );
    expect(() => fftSpectrum(ok.slice(0, 8), 1000)).toThrow(
      /samples.length must be an array of 16 to 2097152 numbers/,
    );
    expect(() => fftSpectrum(ok, 0)).toThrow(/sampleRate must be a finite number > 0/);
    expect(() => fftSpectrum(ok, 1000, { fundamentalFrequency: 500 })).toThrow(
      /fundamentalFrequency must be .* < 500/,
    );
    expect(() => fftSpectrum(ok, 1000, { window: 'triangle' as 'hann' })).toThrow(
      /window must be one of/,
    );
    expect(() => fftSpectrum(ok, 1000, { maxOrder: 0 })).toThrow(/maxOrder/);
    expect(() => fftWindow(0)).toThrow(/length must be an integer ≥ 1/);
  });
});
