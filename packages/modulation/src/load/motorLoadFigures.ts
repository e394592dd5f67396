import { TAU } from '../math.js';
import type { BackEmf } from './RlLoad.js';
import type { MotorFigures, MotorPhaseFigures } from './MotorFigures.js';

/** A load current's fundamental, i₁ = fundamental·sin(θ + fundamentalPhase), of one phase. */
export interface PhaseFundamental {
  phase: MotorPhaseFigures['phase'];
  /** Peak amperes. */
  fundamental: number;
  /** Radians. */
  fundamentalPhase: number;
}

/**
 * What a load with back-EMF converts, phase by phase: each load current's fundamental resolved
 * against its phase's EMF into the torque-producing part (in phase with the EMF) and the part in
 * quadrature, and the mean power the EMFs take in, P = Σ ½·E·I₁·cos(angle) (only the
 * fundamental does work against a sinusoidal EMF: the harmonics' mean products with it vanish by
 * orthogonality). The torque of a machine whose EMF this is follows as P/ω_mech with
 * ω_mech = 2πf/pole pairs (standard machine theory; e.g. A. E. Fitzgerald, C. Kingsley,
 * S. D. Umans, Electric Machinery, ch. on synchronous machines, from memory).
 *
 * Phase k of a three-phase load has the EMF of phase a delayed by k·2π/3 (positive sequence),
 * as the design report's currents do.
 *
 * @param currents - the load current's fundamental of each phase, in order a (, b, c)
 * @param emf - phase a's EMF, peak volts and radians
 * @param frequency - the fundamental, hertz, > 0
 * Internal: part of analyseDesign, which has checked its inputs.
 */
export function motorLoadFigures(
  currents: readonly PhaseFundamental[],
  emf: BackEmf,
  frequency: number,
): MotorFigures {
  const phases = currents.map((current, k): MotorPhaseFigures => {
    const emfPhase = wrap(emf.phase - (k * TAU) / 3);
    const currentAngle = wrap(current.fundamentalPhase - emfPhase);
    const torqueCurrent = current.fundamental * Math.cos(currentAngle);
    return {
      phase: current.phase,
      emfAmplitude: emf.amplitude,
      emfPhase,
      currentAmplitude: current.fundamental,
      currentPhase: wrap(current.fundamentalPhase),
      currentAngle,
      torqueCurrent,
      quadratureCurrent: current.fundamental * Math.sin(currentAngle),
      electromagneticPower: 0.5 * emf.amplitude * torqueCurrent,
    };
  });
  const electromagneticPower = phases.reduce((sum, p) => sum + p.electromagneticPower, 0);
  return {
    phases,
    electromagneticPower,
    torquePerPolePair: electromagneticPower / (TAU * frequency),
  };
}

/** An angle in (−π, π]. */
function wrap(angle: number): number {
  const wrapped = angle - TAU * Math.floor((angle + Math.PI) / TAU);
  return wrapped <= -Math.PI ? wrapped + TAU : wrapped;
}
