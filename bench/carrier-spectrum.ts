/**
 * Benchmark (not a test): the exact spectrum of bipolar natural PWM at mf = 21 up to order
 * 50·mf against a sampled baseline (2^16 samples per period transformed with the npm package
 * fft.js), measured in one run; and a 100-point ma sweep to the same order.
 *
 * Accuracy reference: the same Fourier expression c_n = Σ Δᵢ e^{−jnθᵢ}/(2πjn) evaluated
 * independently, with edges found by 200-step bisection of reference − carrier (not Brent) and
 * a direct sin/cos per edge and order (not the rotation recurrence), summed with Kahan's
 * compensated summation. Both the engine and the baseline are scored against it.
 */
import FFT from 'fft.js';
import {
  harmonics,
  sineTriangle,
  sweepModulationIndex,
  triangleCarrier,
  type Harmonic,
} from '@pulsewright/modulation';
import { edgeAmplitudes, maxError, sampledHarmonics, type EdgeJump } from './spectrumBaselines.js';
import { medianTime, printTable } from './measure.js';

const mf = 21;
const ma = 0.8;
const vdc = 1;
const maxOrder = 50 * mf;
const samples = 2 ** 16;

/** Both sides produce the same output: the library's `{ order, amplitude, phase }` list. */
function exactSpectrum(): Harmonic[] {
  return harmonics(sineTriangle({ scheme: 'bipolar', ma, mf, vdc }), maxOrder);
}

function sampledSpectrum(fft: FFT, input: Float64Array, output: Float64Array): Harmonic[] {
  for (let k = 0; k < samples; k++) {
    const theta = (2 * Math.PI * k) / samples;
    input[k] = ma * Math.sin(theta) > triangleCarrier(theta, { mf }) ? vdc : -vdc;
  }
  return sampledHarmonics(fft, input, output, maxOrder);
}

function independentReference(): number[] {
  const difference = (theta: number): number =>
    ma * Math.sin(theta) - triangleCarrier(theta, { mf });
  const edges: EdgeJump[] = [];
  // Carrier half periods start at π/2 + kπ/mf; each holds one crossing for ma < 1.
  for (let k = 0; k < 2 * mf; k++) {
    let low = Math.PI / 2 + (k * Math.PI) / mf;
    let high = low + Math.PI / mf;
    const risingSign = Math.sign(difference(low));
    for (let i = 0; i < 200; i++) {
      const middle = (low + high) / 2;
      if (Math.sign(difference(middle)) === risingSign) low = middle;
      else high = middle;
    }
    edges.push({ angle: (low + high) / 2, jump: -2 * vdc * risingSign });
  }
  return edgeAmplitudes(edges, maxOrder);
}

const fft = new FFT(samples);
const input = new Float64Array(samples);
const output = fft.createComplexArray() as unknown as Float64Array;
const reference = independentReference();

const exactTime = medianTime(exactSpectrum, 400, 400);
const sampledTime = medianTime(() => sampledSpectrum(fft, input, output), 100, 50);
const exactError = maxError(exactSpectrum(), reference);
const sampledError = maxError(sampledSpectrum(fft, input, output), reference);
const sweepTime = medianTime(
  () =>
    sweepModulationIndex((m) => sineTriangle({ scheme: 'bipolar', ma: m, mf, vdc }), {
      from: 0.05,
      to: 1.3,
      points: 100,
      maxOrder,
    }),
  15,
  3,
);

printTable(
  `Exact spectrum vs sampled FFT baseline (bipolar natural PWM, mf = ${mf}, orders 0..${maxOrder})`,
  [
    ['exact engine, median time', `${exactTime.toFixed(3)} ms`],
    [`sampled baseline (2^16 samples + fft.js), median time`, `${sampledTime.toFixed(3)} ms`],
    ['speed ratio (baseline / exact), goal ≥ 20', `${(sampledTime / exactTime).toFixed(1)}×`],
    ['exact engine, max amplitude error (of vdc)', exactError.toExponential(2)],
    ['sampled baseline, max amplitude error (of vdc)', sampledError.toExponential(2)],
    [
      'accuracy ratio (baseline error / exact error), goal ≥ 1000',
      `${(sampledError / Math.max(exactError, Number.MIN_VALUE)).toExponential(2)}×`,
    ],
    [
      `100-point ma sweep (0.05..1.3) to order ${maxOrder}, goal < 50 ms`,
      `${sweepTime.toFixed(1)} ms`,
    ],
  ],
);
