import { describe, expect, it } from 'vitest';
import { TAU } from '../../math.js';
import { firstGridSampleFrom } from '../firstGridSampleFrom.js';
import { runningIntegral } from '../runningIntegral.js';
import { waveformValueAt } from '../waveformValueAt.js';

/** The definition: the first j with (2π·j)/S ≥ angle, by testing every sample (S when none). */
const byEverySample = (angle: number, size: number): number => {
  for (let j = 0; j < size; j++) if ((TAU * j) / size >= angle) return j;
  return size;
};

describe('firstGridSampleFrom', () => {
  it('finds the first sample at or after an angle, as testing every sample does', () => {
    const sizes = [1, 3, 7, 64, 1000, 16384];
    // Angles on samples (the boundary cases where rounding decides), a hair either side, between.
    for (const size of sizes) {
      const angles = [0, TAU - 1e-15, 1e-300];
      for (let j = 0; j < size; j += Math.max(1, Math.floor(size / 97))) {
        const onSample = (TAU * j) / size;
        angles.push(onSample, onSample * (1 + Number.EPSILON), onSample * (1 - Number.EPSILON));
        angles.push(onSample + TAU / size / 2);
      }
      for (const angle of angles)
        expect(firstGridSampleFrom(angle, size), `${angle} at S = ${size}`).toBe(
          byEverySample(angle, size),
        );
    }
  });

  it('walks the running integral to the level of each sample (slope = level − mean)', () => {
    // A pulse train with an edge exactly on a sample: Φ rises with slope (level − mean) on each
    // piece, so the differences of the samples follow the levels (definition of Φ).
    const size = 64;
    const waveform = { edges: [(TAU * 8) / size, 2, 4.5], levels: [3, -1, 0.5] };
    const samples = runningIntegral(waveform).at(size);
    const mean =
      (3 * (2 - (waveform.edges[0] as number)) -
        (4.5 - 2) +
        0.5 * (TAU - 4.5 + (waveform.edges[0] as number))) /
      TAU;
    for (let j = 0; j + 1 < size; j++) {
      const from = (TAU * j) / size;
      const to = (TAU * (j + 1)) / size;
      // Only where no edge lies strictly between two samples is the step one level's.
      if (waveform.edges.some((edge) => edge > from && edge < to)) continue;
      const level = waveformValueAt(waveform, from);
      expect(((samples[j + 1] as number) - (samples[j] as number)) / (to - from)).toBeCloseTo(
        level - mean,
        10,
      );
    }
  });
});
