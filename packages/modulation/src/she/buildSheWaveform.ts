/** Builds the full-period waveform of first-quarter angles (internal; see sheWaveform). */
import type { Waveform } from '../waveform/Waveform.js';
import { waveformFromTransitions, type Transition } from '../waveform/waveformFromTransitions.js';
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
  // 0 − x would give −0 for a zero level; keep +0 so results compare and serialise plainly.
  const negate = (x: number): number => (x === 0 ? 0 : -x);
  const transitions: Transition[] = [
    { angle: 0, level: level(0) },
    { angle: Math.PI, level: negate(level(0)) },
  ];
  for (let j = 1; j <= count; j++) {
    const alpha = angles[j - 1] as number;
    transitions.push(
      { angle: alpha, level: level(j) },
      { angle: Math.PI - alpha, level: level(j - 1) },
      { angle: Math.PI + alpha, level: negate(level(j)) },
      { angle: 2 * Math.PI - alpha, level: negate(level(j - 1)) },
    );
  }
  return waveformFromTransitions(transitions);
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
