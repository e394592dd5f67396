import { assertNumberInRange } from '../validation/assertions.js';
import { assertWaveform } from '../waveform/assertWaveform.js';
import {
  hasHalfWaveSymmetry,
  waveformMirror,
  type WaveformMirror,
} from '../waveform/waveformSymmetry.js';
import { mirrorRotation } from './mirroredPhasors.js';
import type { Waveform } from '../waveform/Waveform.js';
import { waveformMean } from '../waveform/waveformMean.js';

/** The highest harmonic order {@link harmonicPhasors} (and so `harmonics`) computes; bounds the cost of one call. */
export const MAX_HARMONIC_ORDER = 100_000;

/**
 * Orders between exact re-evaluations of e^{-jnθ} in the rotation recurrence: rounding grows
 * by about one ulp per step, so it stays below ~256 ulp (6e-14 relative) while sin/cos run
 * once per block instead of once per order.
 */
const RESEED_INTERVAL = 256;

/**
 * A spectrum as two arrays indexed by order: the phasor X_n = A_n·e^{jφ_n} of each harmonic
 * A_n·sin(nθ + φ_n) (`re` = A_n·cos φ_n, `im` = A_n·sin φ_n, peak volts or amperes); order 0
 * holds the mean in `re` and 0 in `im`. The form the report's linear operations (sums of
 * waveforms, network responses, synthesis) take without building an object per order.
 */
export interface HarmonicPhasors {
  re: Float64Array;
  im: Float64Array;
}

/**
 * The exact Fourier series of a piecewise-constant waveform as phasors, orders 0..maxOrder
 * (the numbers `harmonics` returns, before amplitude and phase are taken).
 *
 * A piecewise-constant v(θ) has derivative Σ Δᵢ·δ(θ − θᵢ), where Δᵢ is the jump at edge θᵢ, so
 * its complex coefficients are c_n = Σ Δᵢ e^{−jnθᵢ} / (2πjn) for n ≥ 1 (standard Fourier
 * analysis of a step function). No sampling and no FFT: the only error is floating-point
 * rounding (about 1e−13 of the largest level).
 *
 * Convention: v(θ) = mean + Σ amplitude_n · sin(nθ + phase_n), θ in radians; the phasor of
 * order n is amplitude_n·e^{j·phase_n} = b_n + j·a_n for v = a_n cos nθ + b_n sin nθ.
 * Internal: `harmonics` and the design report read it.
 *
 * @param waveform - one period of the voltage (volts)
 * @param maxOrder - highest order, an integer in [0, 100000]
 * @returns arrays of maxOrder + 1 entries, index = order
 */
export function harmonicPhasors(waveform: Waveform, maxOrder: number): HarmonicPhasors {
  assertWaveform(waveform);
  assertNumberInRange('maxOrder', maxOrder, { min: 0, max: MAX_HARMONIC_ORDER, integer: true });
  const { edges, levels } = waveform;
  const edgeCount = edges.length;
  // sinSum[n] = Σ Δᵢ sin(nθᵢ), cosSum[n] = Σ Δᵢ cos(nθᵢ)
  const sinSum = new Float64Array(maxOrder + 1);
  const cosSum = new Float64Array(maxOrder + 1);
  // Half-wave symmetry about a level, v(θ + π) = 2c − v(θ): the second half's jumps repeat the
  // first half's negated, which doubles the odd orders and cancels the even ones.
  const symmetric = hasHalfWaveSymmetry(waveform);
  // Mirror symmetry about α, v(θ) = v(2α − θ): each jump Δ at θ has −Δ at 2α − θ.
  const mirror = waveformMirror(waveform, waveform);
  const { thetas, jumps, jumpCount } = representativeEdges(waveform, symmetric, mirror);
  for (let i = 0; i < jumpCount; i += 4) {
    accumulateFourEdges(sinSum, cosSum, { thetas, jumps, first: i }, maxOrder, symmetric ? 2 : 1);
  }
  // The part each mirror pair cancels: with e^{−jn(2α − θ)} = e^{−j2nα}·e^{jnθ}, a pair adds
  // Δ(e^{−jnθ} − e^{−j2nα}e^{jnθ}), which is 2Δ·cos nθ when e^{−j2nα} = −1 (odd n about π/2)
  // and −2jΔ·sin nθ when it is 1 (every n about 0, even n about π/2): the representatives' sums
  // hold the surviving part, the other is exactly zero.
  if (mirror !== null) {
    for (let n = 1; n <= maxOrder; n++) {
      if (mirrorRotation(mirror.axis, n) === -1) sinSum[n] = 0;
      else cosSum[n] = 0;
    }
  }
  // v = a_n cos nθ + b_n sin nθ with a_n = −ΣΔ sin/(πn), b_n = ΣΔ cos/(πn): the sums become
  // the phasors in place.
  const re = cosSum;
  const im = sinSum;
  // A half-wave symmetric waveform's mean is its centre level exactly; summing the segments
  // would leave rounding (−3e−13 V for a ±400 V bridge) where the answer is a clean 0.
  re[0] = symmetric
    ? ((levels[0] as number) + (levels[edgeCount / 2] as number)) / 2
    : waveformMean(waveform);
  im[0] = 0;
  for (let n = 1; n <= maxOrder; n++) {
    const scale = 1 / (Math.PI * n);
    im[n] = -(sinSum[n] as number) * scale;
    re[n] = (cosSum[n] as number) * scale;
  }
  return { re, im };
}

/**
 * One edge of each orbit under the waveform's symmetries (the half-wave shift i → i + N/2 and
 * the mirror i → offset − i, and both), weighted by the orbit's size: every member adds the
 * representative's term to the orders that survive the symmetries (odd ones under the half-wave
 * shift; the mirror's surviving part, see harmonicPhasors), so the sums run over a half or a
 * quarter of the edges. Edges without a jump are left out. As two arrays padded to a whole
 * number of groups of four with zero jumps (which add nothing), in the waveform's order.
 */
function representativeEdges(
  { edges, levels }: Waveform,
  halfWave: boolean,
  mirror: WaveformMirror | null,
): { thetas: Float64Array; jumps: Float64Array; jumpCount: number } {
  const count = edges.length;
  const thetas = new Float64Array(count + 3);
  const jumps = new Float64Array(count + 3);
  const seen = new Uint8Array(count);
  let jumpCount = 0;
  for (let i = 0; i < count; i++) {
    if (seen[i] === 1) continue;
    let orbitSize = 0;
    const join = (k: number): void => {
      if (seen[k] === 0) {
        seen[k] = 1;
        orbitSize++;
      }
    };
    join(i);
    if (halfWave) join((i + count / 2) % count);
    if (mirror !== null) {
      const image = (((mirror.offset - i) % count) + count) % count;
      join(image);
      if (halfWave) join((image + count / 2) % count);
    }
    const jump = (levels[i] as number) - (levels[(i + count - 1) % count] as number);
    if (jump === 0) continue;
    thetas[jumpCount] = edges[i] as number;
    jumps[jumpCount] = orbitSize * jump;
    jumpCount++;
  }
  return { thetas, jumps, jumpCount };
}

/**
 * Adds Σ jump·sin(nθ) and Σ jump·cos(nθ) over the four edges first..first + 3 of `edges` for the
 * orders n = 1, 1 + orderStep, … ≤ maxOrder into the sums. Each edge's e^{jnθ} is rotated one step
 * at a time and re-evaluated exactly at the start of every block; four edges run side by side so
 * their recurrences overlap in the pipeline (eight spill out of the registers: measured slower).
 * The edges are read from typed arrays into locals, so the loop holds doubles only.
 */
function accumulateFourEdges(
  sinSum: Float64Array,
  cosSum: Float64Array,
  edges: { thetas: Float64Array; jumps: Float64Array; first: number },
  maxOrder: number,
  orderStep: number,
): void {
  const { thetas, jumps, first } = edges;
  const t0 = thetas[first] as number;
  const t1 = thetas[first + 1] as number;
  const t2 = thetas[first + 2] as number;
  const t3 = thetas[first + 3] as number;
  const j0 = jumps[first] as number;
  const j1 = jumps[first + 1] as number;
  const j2 = jumps[first + 2] as number;
  const j3 = jumps[first + 3] as number;
  // The step's rotation, needed only when a block holds more than one order (a fundamental
  // alone, `fundamentalAmplitude`, spares half its trigonometry): the identity otherwise.
  const stepped = maxOrder >= 1 + orderStep;
  const k0 = stepped ? Math.cos(orderStep * t0) : 1;
  const k1 = stepped ? Math.cos(orderStep * t1) : 1;
  const k2 = stepped ? Math.cos(orderStep * t2) : 1;
  const k3 = stepped ? Math.cos(orderStep * t3) : 1;
  const q0 = stepped ? Math.sin(orderStep * t0) : 0;
  const q1 = stepped ? Math.sin(orderStep * t1) : 0;
  const q2 = stepped ? Math.sin(orderStep * t2) : 0;
  const q3 = stepped ? Math.sin(orderStep * t3) : 0;
  const blockSpan = RESEED_INTERVAL * orderStep;
  for (let blockStart = 1; blockStart <= maxOrder; blockStart += blockSpan) {
    let c0 = j0 * Math.cos(blockStart * t0);
    let s0 = j0 * Math.sin(blockStart * t0);
    let c1 = j1 * Math.cos(blockStart * t1);
    let s1 = j1 * Math.sin(blockStart * t1);
    let c2 = j2 * Math.cos(blockStart * t2);
    let s2 = j2 * Math.sin(blockStart * t2);
    let c3 = j3 * Math.cos(blockStart * t3);
    let s3 = j3 * Math.sin(blockStart * t3);
    const blockEnd = Math.min(maxOrder, blockStart + blockSpan - 1);
    for (let n = blockStart; n <= blockEnd; n += orderStep) {
      sinSum[n] = (sinSum[n] as number) + (s0 + s1 + (s2 + s3));
      cosSum[n] = (cosSum[n] as number) + (c0 + c1 + (c2 + c3));
      let next = c0 * k0 - s0 * q0;
      s0 = s0 * k0 + c0 * q0;
      c0 = next;
      next = c1 * k1 - s1 * q1;
      s1 = s1 * k1 + c1 * q1;
      c1 = next;
      next = c2 * k2 - s2 * q2;
      s2 = s2 * k2 + c2 * q2;
      c2 = next;
      next = c3 * k3 - s3 * q3;
      s3 = s3 * k3 + c3 * q3;
      c3 = next;
    }
  }
}
