import { TAU } from '../math.js';
import type { Waveform } from './Waveform.js';

/** Mean (DC) value of a waveform over one period, exact: Σ levelᵢ·widthᵢ/2π, in volts. */
export function waveformMean({ edges, levels }: Waveform): number {
  let sum = 0;
  for (let i = 0; i < edges.length; i++) {
    const end = i + 1 < edges.length ? (edges[i + 1] as number) : (edges[0] as number) + TAU;
    sum += (levels[i] as number) * (end - (edges[i] as number));
  }
  return sum / TAU;
}
