/** One phase of a motor load: its load current's fundamental against its back-EMF. */
export interface MotorPhaseFigures {
  phase: 'a' | 'b' | 'c';
  /** Back-EMF of this phase, peak volts. */
  emfAmplitude: number;
  /** Its phase, radians, of e = emfAmplitude·sin(θ + emfPhase) (phase k lags a by k·2π/3). */
  emfPhase: number;
  /** The load current's fundamental, peak amperes. */
  currentAmplitude: number;
  /** Its phase, radians in (−π, π], of i₁ = currentAmplitude·sin(θ + currentPhase). */
  currentPhase: number;
  /** Angle by which the current's fundamental leads the EMF, radians in (−π, π]. */
  currentAngle: number;
  /**
   * The torque-producing current: the part of the fundamental in phase with the EMF,
   * currentAmplitude·cos(currentAngle), peak amperes (negative when the machine generates).
   */
  torqueCurrent: number;
  /** The part in quadrature, currentAmplitude·sin(currentAngle), peak amperes (positive leading). */
  quadratureCurrent: number;
  /** Mean power the EMF takes in, ½·emfAmplitude·torqueCurrent, watts (positive motoring). */
  electromagneticPower: number;
}

/** What a load with back-EMF (a motor winding) converts; a plain serialisable object. */
export interface MotorFigures {
  /** One entry per phase (a; or a, b, c), labelled. */
  phases: MotorPhaseFigures[];
  /** Σ of the phases' electromagneticPower, watts: the air-gap power. */
  electromagneticPower: number;
  /**
   * electromagneticPower/(2π·fundamentalFrequency), newton-metres: the torque of a machine with
   * one pole pair; multiply by the machine's pole pairs (mechanical speed = 2πf/pole pairs).
   */
  torquePerPolePair: number;
}
