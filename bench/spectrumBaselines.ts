import type FFT from 'fft.js';
import type { Harmonic } from '@pulsewright/modulation';

/** A step of a piecewise-constant period: at `angle` (radians) the level changes by `jump` (volts). */
export interface EdgeJump {
  angle: number;
  jump: number;
}

/**
 * Harmonic amplitudes 0..maxOrder (peak volts; order 0 left at 0) of a piecewise-constant period
 * from its steps alone: b_n − j·a_n = (1/(πn))·Σ jump·e^{−jnθ} (integration by parts of the
 * Fourier integral), summed with Kahan's compensation. The benches' independent reference,
 * written without the library.
 */
export function edgeAmplitudes(edges: readonly EdgeJump[], maxOrder: number): number[] {
  const amplitudes = [0];
  for (let n = 1; n <= maxOrder; n++) {
    let s = 0;
    let sc = 0;
    let c = 0;
    let cc = 0;
    for (const { angle, jump } of edges) {
      [s, sc] = kahanAdd(s, sc, jump * Math.sin(n * angle));
      [c, cc] = kahanAdd(c, cc, jump * Math.cos(n * angle));
    }
    amplitudes.push(Math.hypot(s, c) / (Math.PI * n));
  }
  return amplitudes;
}

function kahanAdd(sum: number, compensation: number, value: number): [number, number] {
  const y = value - compensation;
  const t = sum + y;
  return [t, t - sum - y];
}

/** The largest |amplitude − reference| over the orders of a spectrum, volts. */
export function maxError(values: readonly Harmonic[], reference: readonly number[]): number {
  return values.reduce(
    (worst, v, i) => Math.max(worst, Math.abs(v.amplitude - (reference[i] as number))),
    0,
  );
}

/**
 * Harmonics 0..maxOrder of one period sampled at N = input.length evenly spaced angles, by the
 * FFT the benches take as their sampled baseline (`fft.js`), in the library's convention
 * (v = A_0 + Σ A_n·sin(nθ + φ_n)): X_n = (N/2)·(a_n − j·b_n) for v = a_n cos nθ + b_n sin nθ.
 */
export function sampledHarmonics(
  fft: FFT,
  input: Float64Array,
  output: Float64Array,
  maxOrder: number,
): Harmonic[] {
  const samples = input.length;
  fft.realTransform(output, input);
  const spectrum: Harmonic[] = [];
  for (let n = 0; n <= maxOrder; n++) {
    const re = output[2 * n] as number;
    const im = output[2 * n + 1] as number;
    spectrum.push({
      order: n,
      amplitude: ((n === 0 ? 1 : 2) * Math.sqrt(re * re + im * im)) / samples,
      phase: Math.atan2(re, -im),
    });
  }
  return spectrum;
}
