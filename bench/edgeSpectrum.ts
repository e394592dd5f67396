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
