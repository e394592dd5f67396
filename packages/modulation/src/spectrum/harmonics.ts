import { assertNumberInRange } from '../validation/assertions.js';
import { assertWaveform } from '../waveform/assertWaveform.js';
import type { Waveform } from '../waveform/Waveform.js';
import { waveformMean } from '../waveform/waveformMean.js';
import type { Harmonic } from './Harmonic.js';

/** The highest harmonic order {@link harmonics} computes; bounds the cost of one call. */
export const MAX_HARMONIC_ORDER = 100_000;

/**
 * Orders between exact re-evaluations of e^{-jnθ} in the rotation recurrence; keeps the
 * accumulated rounding below ~64 ulp while avoiding a sin/cos per order.
 */
const RESEED_INTERVAL = 64;

/**
 * Exact Fourier series of a piecewise-constant waveform, orders 0..maxOrder.
 *
 * A piecewise-constant v(θ) has derivative Σ Δᵢ·δ(θ − θᵢ), where Δᵢ is the jump at edge θᵢ, so
 * its complex coefficients are c_n = Σ Δᵢ e^{−jnθᵢ} / (2πjn) for n ≥ 1 (standard Fourier
 * analysis of a step function). No sampling and no FFT: the only error is floating-point
 * rounding (about 1e−13 of the largest level).
 *
 * Convention: v(θ) = mean + Σ amplitude_n · sin(nθ + phase_n), θ in radians.
 *
 * @param waveform - one period of the voltage (volts)
 * @param maxOrder - highest order, an integer in [0, 100000]
 * @returns maxOrder + 1 entries, index = order
 */
export function harmonics(waveform: Waveform, maxOrder: number): Harmonic[] {
  assertWaveform(waveform);
  assertNumberInRange('maxOrder', maxOrder, { min: 0, max: MAX_HARMONIC_ORDER, integer: true });
  const { edges, levels } = waveform;
  const edgeCount = edges.length;
  // sinSum[n] = Σ Δᵢ sin(nθᵢ), cosSum[n] = Σ Δᵢ cos(nθᵢ)
  const sinSum = new Float64Array(maxOrder + 1);
  const cosSum = new Float64Array(maxOrder + 1);
  for (let i = 0; i < edgeCount; i++) {
    const jump = (levels[i] as number) - (levels[(i + edgeCount - 1) % edgeCount] as number);
    if (jump === 0) continue;
    const theta = edges[i] as number;
    const stepCos = Math.cos(theta);
    const stepSin = Math.sin(theta);
    let c = 1;
    let s = 0;
    for (let n = 1; n <= maxOrder; n++) {
      if (n % RESEED_INTERVAL === 0) {
        c = Math.cos(n * theta);
        s = Math.sin(n * theta);
      } else {
        const nextC = c * stepCos - s * stepSin;
        s = s * stepCos + c * stepSin;
        c = nextC;
      }
      sinSum[n] = (sinSum[n] as number) + jump * s;
      cosSum[n] = (cosSum[n] as number) + jump * c;
    }
  }
  const result: Harmonic[] = [{ order: 0, amplitude: waveformMean(waveform), phase: 0 }];
  for (let n = 1; n <= maxOrder; n++) {
    // v = a_n cos nθ + b_n sin nθ with a_n = −ΣΔ sin/(πn), b_n = ΣΔ cos/(πn)
    const a = -(sinSum[n] as number) / (Math.PI * n);
    const b = (cosSum[n] as number) / (Math.PI * n);
    result.push({ order: n, amplitude: Math.hypot(a, b), phase: Math.atan2(a, b) });
  }
  return result;
}
