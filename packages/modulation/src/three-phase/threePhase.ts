import type { CarrierSampling } from '../carrier/CarrierSampling.js';
import type { CarrierSpan } from '../carrier/CarrierSpan.js';
import type { Waveform } from '../waveform/Waveform.js';
import { subtractWaveforms } from '../waveform/subtractWaveforms.js';
import { threePhaseLegs } from './threePhaseLegs.js';
import type { ZeroSequence } from './ZeroSequence.js';

/** Options of {@link threePhase}. */
export interface ThreePhaseOptions {
  /** Modulation index of each sine reference, (0, 1000]; linear to 1, or 2/√3 with injection. */
  ma: number;
  /**
   * Frequency ratio, an integer in [1, 10000]; one carrier is shared by the three legs. Over a
   * span of q fundamental periods (the second argument) any p/q with p ≤ 10000 whole.
   */
  mf: number;
  /** DC bus voltage (volts), > 0; each leg switches between +vdc/2 and −vdc/2. */
  vdc: number;
  /** @default 'none' */
  zeroSequence?: ZeroSequence;
  /** @default 'natural' */
  sampling?: CarrierSampling;
  /** Carrier delay in carrier radians, as for {@link sineTriangle}. @default 0 */
  carrierPhase?: number;
}

/** The waveforms of a three-phase, two-level inverter over one fundamental period. */
export interface ThreePhaseWaveforms {
  /** Leg-to-midpoint voltages of the DC bus (volts, ±vdc/2). */
  legs: { a: Waveform; b: Waveform; c: Waveform };
  /** Line-to-line voltages ab = a − b, bc = b − c, ca = c − a (volts, 0 or ±vdc). */
  lineToLine: { ab: Waveform; bc: Waveform; ca: Waveform };
}

/**
 * A three-phase two-level inverter under carrier PWM with zero-sequence injection, exact. The
 * phase references are ma·sin(θ − k·2π/3) plus a common offset (see {@link ZeroSequence}); each
 * leg is +vdc/2 while its reference is above the shared carrier. The leg fundamental is
 * ma·vdc/2 in the linear range; the zero sequence cancels in the line-to-line voltages, whose
 * fundamental is √3·ma·vdc/2 (Holmes and Lipo, 2003, ch. 5). For the reduced common-mode
 * methods (`azspwm1`, `nspwm`) the middle phase is compared with the inverted carrier, the same
 * triangle delayed by half a carrier period (see {@link invertsCarrier}); with regular sampling
 * that carrier samples at its own peaks.
 *
 * Asynchronous ratio mf = p/q: with `span.fundamentalPeriods` = q the waveforms cover q
 * fundamental periods on [0, 2π) with p carrier cycles, exact, as for {@link sineTriangle}.
 *
 * @throws ParameterRangeError naming `ma`, `mf`, `vdc`, `zeroSequence`, `sampling` (also
 *   `'regular-symmetric'` with `azspwm1` or `nspwm`), `carrierPhase` or `fundamentalPeriods`
 */
export function threePhase(
  options: ThreePhaseOptions,
  span: CarrierSpan = {},
): ThreePhaseWaveforms {
  const legs = threePhaseLegs(options, span);
  const { a, b, c } = legs;
  return {
    legs,
    lineToLine: {
      ab: subtractWaveforms(a, b),
      bc: subtractWaveforms(b, c),
      ca: subtractWaveforms(c, a),
    },
  };
}
