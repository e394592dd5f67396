/**
 * Benchmark (not a test): the exact spectrum of a seven-level cascaded H-bridge string (three
 * cells, phase-shifted carriers, mf = 21 per cell, single-phase, natural sampling) up to order
 * 50·mf, waveform and spectrum together, against a sampled baseline (2^16 samples per period of
 * the same comparators transformed with the npm package fft.js), measured in one run.
 *
 * Accuracy reference: the same Fourier expression c_n = Σ Δᵢ e^{−jnθᵢ}/(2πjn) evaluated
 * independently: each cell leg's edges found by 200-step bisection of ±reference − its carrier
 * (cell k's carrier delayed by k·π/3, Holmes and Lipo, 2003, ch. 11), a direct sin/cos per edge
 * and order, Kahan's compensated summation. Both the engine and the baseline are scored against it.
 */
import FFT from 'fft.js';
import {
  harmonics,
  multilevelCarrier,
  triangleCarrier,
  type Harmonic,
  type Waveform,
} from '@pulsewright/modulation';
import { edgeAmplitudes, maxError, sampledHarmonics, type EdgeJump } from './spectrumBaselines.js';
import { medianTime, printTable } from './measure.js';

const cells = 3;
const mf = 21;
const ma = 0.8;
const vdc = 1;
const maxOrder = 50 * mf;
const samples = 2 ** 16;
const delays = Array.from({ length: cells }, (_, k) => (k * Math.PI) / cells);

function exactWaveform(): Waveform {
  const result = multilevelCarrier({
    topology: 'cascaded-h-bridge',
    levels: 2 * cells + 1,
    carriers: 'phase-shifted',
    phaseCount: 1,
    ma,
    mf,
    vdc,
  });
  return (result.legs[0] as { output: Waveform }).output;
}

/** Both sides produce the same output: the library's `{ order, amplitude, phase }` list. */
function exactSpectrum(): Harmonic[] {
  return harmonics(exactWaveform(), maxOrder);
}

function sampledSpectrum(fft: FFT, input: Float64Array, output: Float64Array): Harmonic[] {
  for (let k = 0; k < samples; k++) {
    const theta = (2 * Math.PI * k) / samples;
    const reference = ma * Math.sin(theta);
    let level = 0;
    for (const delay of delays) {
      const carrier = triangleCarrier(theta, { mf, carrierPhase: delay });
      level += (reference > carrier ? vdc : 0) - (-reference > carrier ? vdc : 0);
    }
    input[k] = level;
  }
  return sampledHarmonics(fft, input, output, maxOrder);
}

function independentReference(): number[] {
  const edges: EdgeJump[] = [];
  for (const delay of delays) {
    for (const sign of [1, -1]) {
      const difference = (theta: number): number =>
        sign * ma * Math.sin(theta) - triangleCarrier(theta, { mf, carrierPhase: delay });
      // Carrier half periods start at π/2 + (kπ + delay)/mf; each holds one crossing for ma < 1.
      for (let k = 0; k < 2 * mf; k++) {
        let low = Math.PI / 2 + (k * Math.PI + delay) / mf;
        let high = low + Math.PI / mf;
        const startSign = Math.sign(difference(low));
        for (let i = 0; i < 200; i++) {
          const middle = (low + high) / 2;
          if (Math.sign(difference(middle)) === startSign) low = middle;
          else high = middle;
        }
        // The leg on +reference adds vdc while high, the one on −reference subtracts it.
        edges.push({ angle: (low + high) / 2, jump: -sign * vdc * startSign });
      }
    }
  }
  return edgeAmplitudes(edges, maxOrder);
}

const fft = new FFT(samples);
const input = new Float64Array(samples);
const output = fft.createComplexArray() as unknown as Float64Array;
const reference = independentReference();

const exactTime = medianTime(exactSpectrum, 400, 400);
const waveformTime = medianTime(exactWaveform, 400, 400);
const sampledTime = medianTime(() => sampledSpectrum(fft, input, output), 50, 20);
const exactError = maxError(exactSpectrum(), reference);
const sampledError = maxError(sampledSpectrum(fft, input, output), reference);

printTable(
  `Exact multilevel spectrum vs sampled FFT baseline (cascaded H-bridge, ${cells} cells, phase-shifted, mf = ${mf} per cell, ma = ${ma}, orders 0..${maxOrder})`,
  [
    ['exact engine (waveform + spectrum), median time, goal < 2 ms', `${exactTime.toFixed(3)} ms`],
    ['of which the waveform (multilevelCarrier), median time', `${waveformTime.toFixed(3)} ms`],
    [`sampled baseline (2^16 samples + fft.js), median time`, `${sampledTime.toFixed(3)} ms`],
    ['speed ratio (baseline / exact)', `${(sampledTime / exactTime).toFixed(1)}×`],
    ['exact engine, max amplitude error (of vdc)', exactError.toExponential(2)],
    ['sampled baseline, max amplitude error (of vdc)', sampledError.toExponential(2)],
    [
      'accuracy ratio (baseline error / exact error)',
      `${(sampledError / Math.max(exactError, Number.MIN_VALUE)).toExponential(2)}×`,
    ],
  ],
);
