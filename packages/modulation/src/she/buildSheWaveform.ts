/** Builds the full-period waveform of first-quarter angles (internal; see sheWaveform). */
import type { Waveform } from '../waveform/Waveform.js';
import { quarterWaveWaveform } from './quarterWaveWaveform.js';
import type { SheKind } from './SheKind.js';

/**
 * {@link sheWaveform} without validation, for callers that have validated already;
 * `cellVoltages` (staircase only) gives the step of each cell, volts.
 */
export function buildSheWaveform(
  kind: SheKind,
  vdc: number,
  angles: readonly number[],
  cellVoltages?: readonly number[],
): Waveform {
  const count = angles.length;
  const sign = count % 2 === 0 ? 1 : -1;
  const steps = staircaseLevels(count, vdc, cellVoltages);
  const level = (j: number): number =>
    kind === 'staircase' ? (steps[j] as number) : sign * (j % 2 === 0 ? 1 : -1) * vdc;
  return quarterWaveWaveform(angles, level);
}

/** The staircase levels 0, V₁, V₁ + V₂, …: the partial sums of the cells' voltages. */
function staircaseLevels(
  count: number,
  vdc: number,
  cellVoltages: readonly number[] | undefined,
): number[] {
  const levels = [0];
  for (let j = 1; j <= count; j++) {
    levels.push(
      cellVoltages ? (levels[j - 1] as number) + (cellVoltages[j - 1] as number) : j * vdc,
    );
  }
  return levels;
}
