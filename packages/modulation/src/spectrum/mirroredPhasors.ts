import type { HarmonicPhasors } from './harmonicPhasors.js';

/**
 * The phasors of a waveform read backwards in angle, w(θ) = v(2α − θ), from those of v, for the
 * axes α = π/2 and 0 that `waveformMirror` finds. A term A·sin(nθ + φ) of v becomes
 * A·sin(2nα − nθ + φ) = A·sin(nθ + π − 2nα − φ), so W_n = −e^{−j2nα}·conj(V_n) (time reversal of
 * a Fourier series, standard Fourier analysis): about π/2, conj(V_n) for odd n and −conj(V_n) for
 * even n; about 0, −conj(V_n). Only signs change, so w's phasors carry v's rounding and no more;
 * the mean is v's. Internal: a three-phase bridge's leg c read from leg b.
 * @param phasors - v's phasors (`harmonicPhasors`), orders 0..N
 * @param axis - α, radians: π/2 or 0
 */
export function mirroredPhasors(phasors: HarmonicPhasors, axis: number): HarmonicPhasors {
  const count = phasors.re.length;
  const re = new Float64Array(count);
  const im = new Float64Array(count);
  if (count > 0) {
    re[0] = phasors.re[0] as number;
    im[0] = phasors.im[0] as number;
  }
  for (let n = 1; n < count; n++) {
    // −e^{−j2nα}·conj(V) = (−s·re, s·im) with s = e^{−j2nα}; s = ±1 keeps the numbers exact.
    const sign = mirrorRotation(axis, n);
    re[n] = -sign * (phasors.re[n] as number);
    im[n] = sign * (phasors.im[n] as number);
  }
  return { re, im };
}

/**
 * e^{−j2nα}, the rotation a reflection about α puts on order n, for the axes `waveformMirror`
 * finds: −1 for odd n about π/2, else 1. The one rule for reading a mirror image's phasors
 * ({@link mirroredPhasors}) and for which part of a self-mirrored waveform's order vanishes
 * (`harmonicPhasors`).
 * @param axis - α, radians: π/2 or 0
 */
export function mirrorRotation(axis: number, order: number): 1 | -1 {
  return axis !== 0 && order % 2 === 1 ? -1 : 1;
}
