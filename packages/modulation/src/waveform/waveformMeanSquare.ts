import { TAU } from '../math.js';
import type { Waveform } from './Waveform.js';

/**
 * Mean square of a waveform over one period, exact: Σ levelᵢ²·(widthᵢ)/2π, in volts².
 * The RMS value is its square root.
 */
export function waveformMeanSquare(waveform: Waveform): number {
  const { edges, levels } = waveform;
  let sum = 0;
  for (let i = 0; i < edges.length; i++) {
    const start = edges[i] as number;
    const end = i + 1 < edges.length ? (edges[i + 1] as number) : (edges[0] as number) + TAU;
    const level = levels[i] as number;
    sum += level * level * (end - start);
  }
  return sum / TAU;
}
