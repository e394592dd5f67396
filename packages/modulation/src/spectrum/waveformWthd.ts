import { TAU } from '../math.js';
import { assertWaveform } from '../waveform/assertWaveform.js';
import type { Waveform } from '../waveform/Waveform.js';
import { waveformMean } from '../waveform/waveformMean.js';
import { fundamentalAmplitude } from './fundamentalAmplitude.js';

/**
 * Weighted total harmonic distortion of a whole waveform, every order ≥ 2 included, exact:
 * WTHD = √(Σ_{n≥2} (V_n/n)²)/V₁ (Holmes and Lipo, 2003, ch. 3). The weights 1/n are the
 * harmonics of the waveform's running integral: for v − V₀ = Σ V_n·sin(nθ + φ_n) the integral
 * is Φ(θ) = C − Σ (V_n/n)·cos(nθ + φ_n), piecewise linear between the switching angles, so by
 * Parseval Σ_{n≥1} (V_n/n)²/2 is the variance of Φ over the period, integrated exactly segment by
 * segment. A ratio; unlike {@link wthd} of a truncated spectrum, nothing above any order is lost.
 *
 * @param waveform - one period, volts
 * @throws ParameterRangeError when the fundamental is zero
 */
export function waveformWthd(waveform: Waveform): number {
  assertWaveform(waveform);
  const fundamental = fundamentalAmplitude(waveform);
  const remainder = 2 * integralVariance(waveform) - fundamental * fundamental;
  return Math.sqrt(Math.max(0, remainder)) / fundamental;
}

/** Variance over one period of Φ(θ) = ∫ (v − mean) dθ from the first edge, volt-radians². */
function integralVariance(waveform: Waveform): number {
  const { edges, levels } = waveform;
  const mean = waveformMean(waveform);
  let flux = 0;
  let sum = 0;
  let sumOfSquares = 0;
  for (let i = 0; i < edges.length; i++) {
    const start = edges[i] as number;
    const end = i + 1 < edges.length ? (edges[i + 1] as number) : (edges[0] as number) + TAU;
    const width = end - start;
    const slope = (levels[i] as number) - mean;
    // ∫₀ʷ (a + s·t) dt and ∫₀ʷ (a + s·t)² dt for the linear piece a + s·t.
    sum += flux * width + (slope * width * width) / 2;
    sumOfSquares += flux * flux * width + flux * slope * width * width + (slope * slope * width * width * width) / 3;
    flux += slope * width;
  }
  const meanFlux = sum / TAU;
  return sumOfSquares / TAU - meanFlux * meanFlux;
}
