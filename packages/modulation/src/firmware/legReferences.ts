import { threePhaseReference, type PhaseIndex } from '../three-phase/threePhaseReference.js';
import type { TimerModulation } from './timerTableTypes.js';

/**
 * Normalised references of each inverter leg at angle `theta`, in units of vdc/2 (a value of
 * 1 asks for the positive rail for the whole carrier period), before any clamping.
 *
 * - `'sine-triangle'` bipolar: `[ma·sin θ]` (one leg; leg B is its complement).
 * - `'sine-triangle'` unipolar: `[ma·sin θ, −ma·sin θ]` (two legs against one carrier).
 * - `'three-phase'`: `ma·sin(θ − 2πk/3) + v0` for k = 0, 1, 2 with the zero-sequence `v0`:
 *   `'none'` 0; `'third-harmonic'` `(ma/6)·sin 3θ` (Houldsworth and Grant 1984; Holmes and
 *   Lipo 2003 ch. 5: linear to ma = 2/√3); `'min-max'` `−(max + min)/2` of the three sines
 *   (equivalent to centred space vector, van der Broeck et al. 1988).
 *
 * @param theta - radians of the fundamental
 */
export function legReferences(theta: number, modulation: TimerModulation): number[] {
  const { ma } = modulation;
  if (modulation.method === 'sine-triangle') {
    const r = ma * Math.sin(theta);
    return modulation.scheme === 'bipolar' ? [r] : [r, -r];
  }
  const zeroSequence = modulation.zeroSequence ?? 'none';
  return PHASES.map((phase) => threePhaseReference(phase, { ma, zeroSequence }).value(theta));
}

const PHASES: readonly PhaseIndex[] = [0, 1, 2];
