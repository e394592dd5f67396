/** The full-period waveform of a quarter-wave symmetric pattern from its first-quarter levels (internal). */
import type { Waveform } from '../waveform/Waveform.js';
import { waveformFromTransitions, type Transition } from '../waveform/waveformFromTransitions.js';

/**
 * The waveform holding `level(j)` volts on (α_j, α_{j+1}) of the first quarter (α₀ = 0,
 * α_{N+1} = π/2), mirrored about π/2 (v(π − θ) = v(θ)) and negated over the second half-period
 * (v(θ + π) = −v(θ)); the angles are not checked.
 */
export function quarterWaveWaveform(
  angles: readonly number[],
  level: (j: number) => number,
): Waveform {
  // 0 − x would give −0 for a zero level; keep +0 so results compare and serialise plainly.
  const negate = (x: number): number => (x === 0 ? 0 : -x);
  const transitions: Transition[] = [
    { angle: 0, level: level(0) },
    { angle: Math.PI, level: negate(level(0)) },
  ];
  for (let j = 1; j <= angles.length; j++) {
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
