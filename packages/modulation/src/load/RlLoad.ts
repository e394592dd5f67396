/**
 * A sinusoidal back-EMF at the fundamental: e(θ) = amplitude · sin(θ + phase), in series with
 * the load and opposing the current (a motor winding's induced voltage).
 *
 * - `amplitude`: peak volts, ≥ 0.
 * - `phase`: radians, relative to sin θ of the waveform's angle.
 */
export interface BackEmf {
  amplitude: number;
  phase: number;
}

/**
 * A series R–L load driven by a periodic voltage, optionally with a back-EMF:
 * L di/dt + R i = v(t) − e(t).
 */
export interface RlLoadOptions {
  /** Resistance in ohms, > 0 (a pure inductance has no unique periodic current). */
  r: number;
  /** Inductance in henries, ≥ 0 (0 is a resistive load, i = (v − e)/R). */
  l: number;
  /** Fundamental frequency in hertz, > 0 (one waveform period lasts 1/frequency seconds). */
  frequency: number;
  /** Optional sinusoidal back-EMF at the fundamental. @default none */
  emf?: BackEmf;
}
