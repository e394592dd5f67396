import { ZERO_SEQUENCES, type ZeroSequence } from '../three-phase/ZeroSequence.js';

/**
 * Types of the semiconductor loss model. Units: volts, ohms, joules, amperes, hertz, watts,
 * radians.
 */

/**
 * An IGBT with its anti-parallel diode, from datasheet values. Conduction: v = vce0 + rce·i
 * (transistor), v = vf0 + rf·i (diode). Switching energies measured at `referenceVoltage` and
 * `referenceCurrent`, scaled linearly to the operating point (common practice).
 */
export interface IgbtDevice {
  kind: 'igbt';
  /** Collector-emitter threshold voltage, V. */
  vce0: number;
  /** Collector-emitter slope resistance, Ω. */
  rce: number;
  /** Diode threshold voltage, V. */
  vf0: number;
  /** Diode slope resistance, Ω. */
  rf: number;
  /** Turn-on energy at the reference point, J. */
  eon: number;
  /** Turn-off energy at the reference point, J. */
  eoff: number;
  /** Diode reverse-recovery energy at the reference point, J. */
  err: number;
  /** Datasheet test voltage of the energies, V. */
  referenceVoltage: number;
  /** Datasheet test current of the energies, A. */
  referenceCurrent: number;
}

/**
 * A MOSFET with synchronous rectification: the channel (on-resistance `rdsOn`) carries the
 * current in either direction whenever its gate is on; the body diode conducts only during
 * dead time (neglected here) and contributes its recovery energy `err`.
 */
export interface MosfetDevice {
  kind: 'mosfet';
  /** On-resistance at the operating temperature, Ω. */
  rdsOn: number;
  eon: number;
  eoff: number;
  err: number;
  referenceVoltage: number;
  referenceCurrent: number;
}

/** A switch position: a transistor with its anti-parallel diode. */
export type SemiconductorDevice = IgbtDevice | MosfetDevice;

/**
 * The zero sequences the loss functions take: every {@link ZeroSequence} of the carrier
 * modulator, and `'gdpwm'`, the generalised discontinuous method whose 60° clamp follows the
 * load: centred on the current's peak, its shift ψ = φ limited to ±30° (ψ = −30° is DPWM0, 0 is
 * DPWM1, +30° is DPWM2; A. M. Hava, R. J. Kerkman, T. A. Lipo, IEEE Trans. Power Electronics,
 * 1998, from memory).
 */
export type LossZeroSequence = ZeroSequence | 'gdpwm';

/** Every zero sequence the loss functions take, in the order the sweeps list them. */
export const LOSS_ZERO_SEQUENCES: readonly LossZeroSequence[] = [...ZERO_SEQUENCES, 'gdpwm'];

/** The operating point shared by the loss functions. */
export interface LossOperatingPoint {
  /** DC bus voltage, V. */
  vdc: number;
  /** Modulation index (peak sine reference / (vdc/2)). */
  ma: number;
  /** Peak of the sinusoidal load current of each leg, A. */
  peakCurrent: number;
  /**
   * Power-factor angle φ: the current lags the leg's sine reference by φ, rad, in [−π, π].
   * @default 0
   */
  currentAngle?: number;
  /** Carrier (switching) frequency, Hz. */
  switchingFrequency: number;
  /** `'h-bridge'`: 2 legs; `'three-phase'`: 3 legs. @default 'three-phase' */
  topology?: 'h-bridge' | 'three-phase';
  /** Zero sequence added to each leg's reference (three-phase). @default 'none' */
  zeroSequence?: LossZeroSequence;
}

/** Conduction and switching loss of one device, W. */
export interface DeviceLoss {
  conduction: number;
  switching: number;
  total: number;
}

/** Losses of a converter at one operating point. */
export interface SemiconductorLosses {
  /** One transistor (every transistor has the same average loss by symmetry), W. */
  transistor: DeviceLoss;
  /** One diode (reverse recovery as its switching loss), W. */
  diode: DeviceLoss;
  /** One leg: two transistors and two diodes, W. */
  perLeg: number;
  legs: number;
  /** All legs, W. */
  total: number;
  conduction: number;
  switching: number;
  /** Power delivered to the load, legs·vdc·ma·Î·cos φ/4, W (ideal average model). */
  outputPower: number;
  /** outputPower / (outputPower + total); null when no power flows to the load (cos φ ≤ 0). */
  efficiency: number | null;
}
