import { TAU } from '../math.js';
import { firstGridSampleFrom } from './firstGridSampleFrom.js';
import type { Waveform } from './Waveform.js';
import { waveformMean } from './waveformMean.js';

/**
 * The running integral of a waveform's AC part, Φ(θ) = ∫₀^θ (v − v̄) dθ' (volt-radians),
 * piecewise linear between the switching angles and periodic; taken here up to a constant
 * (zero at the first edge), which no figure depends on. For
 * v − v̄ = Σ V_n·sin(nθ + φ_n) it is Φ = C − Σ (V_n/n)·cos(nθ + φ_n), so its variance is
 * Σ (V_n/n)²/2 (Parseval). Internal: used by `waveformWthd` and the filtered design figures.
 */
export interface RunningIntegral {
  /** Mean of Φ over the period. */
  mean: number;
  /** Variance of Φ over the period, exact (closed-form integrals of each linear piece). */
  variance: number;
  /**
   * Φ at evenly spaced angles 2πj/count, j = 0..upTo − 1 (the whole period by default).
   * @param upTo - how many of the count angles, from the first, at most count
   */
  at(count: number, upTo?: number): Float64Array;
}

/** Builds the {@link RunningIntegral} of a validated waveform. */
export function runningIntegral(waveform: Waveform): RunningIntegral {
  const { edges, levels } = waveform;
  const mean = waveformMean(waveform);
  const first = edges[0] as number;
  // Φ from θ = 0: the last segment wraps round through 0, so start with its part on (0, edges[0]).
  const wrapLevel = (levels[levels.length - 1] as number) - mean;
  const startValue = -wrapLevel * first;
  let flux = wrapLevel * first + startValue;
  let sum = 0;
  let sumOfSquares = 0;
  const valueAtEdge: number[] = [];
  for (let i = 0; i < edges.length; i++) {
    const start = edges[i] as number;
    const end = i + 1 < edges.length ? (edges[i + 1] as number) : first + TAU;
    const width = end - start;
    const slope = (levels[i] as number) - mean;
    valueAtEdge.push(flux);
    sum += flux * width + (slope * width * width) / 2;
    sumOfSquares +=
      flux * flux * width +
      flux * slope * width * width +
      (slope * slope * width * width * width) / 3;
    flux += slope * width;
  }
  const meanFlux = sum / TAU;
  return {
    mean: meanFlux,
    variance: sumOfSquares / TAU - meanFlux * meanFlux,
    at(count: number, upTo = count): Float64Array {
      const values = new Float64Array(upTo);
      // Sample j's angle j·(2π/count): equal to 2πj/count bit for bit when count is a power of
      // two (the report's grids), a multiplication instead of a division per sample.
      const step = TAU / count;
      // The wrapped piece on [0, edges[0]), then each segment's samples from the first at or
      // after its edge: one walk along the segments.
      let start = 0;
      for (let segment = -1; segment < edges.length; segment++) {
        const end =
          segment + 1 < edges.length
            ? Math.min(upTo, firstGridSampleFrom(edges[segment + 1] as number, count))
            : upTo;
        if (segment < 0) {
          for (let j = start; j < end; j++) values[j] = startValue + wrapLevel * (j * step);
        } else {
          const value = valueAtEdge[segment] as number;
          const slope = (levels[segment] as number) - mean;
          const edge = edges[segment] as number;
          for (let j = start; j < end; j++) values[j] = value + slope * (j * step - edge);
        }
        start = Math.max(start, end);
      }
      return values;
    },
  };
}
