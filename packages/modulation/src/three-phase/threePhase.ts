import { assertCarrierSpan } from '../carrier/assertCarrierSpan.js';
import type { CarrierSpan } from '../carrier/CarrierSpan.js';
import { spanCarrier } from '../carrier/spanCarrier.js';
import type { CarrierSampling } from '../carrier/CarrierSampling.js';
import { compareWithCarrier } from '../carrier/compareWithCarrier.js';
import { assertOneOf } from '../validation/assertions.js';
import { ParameterRangeError } from '../validation/errors.js';
import type { Waveform } from '../waveform/Waveform.js';
import { subtractWaveforms } from '../waveform/subtractWaveforms.js';
import { combineWaveforms } from '../waveform/combineWaveforms.js';
import { waveformFromTransitions } from '../waveform/waveformFromTransitions.js';
import { invertsCarrier } from './invertsCarrier.js';
import { fundamentalAngleOfCarrier } from '../carrier/triangleCarrier.js';
import { threePhaseReference, type PhaseIndex } from './threePhaseReference.js';
import { ZERO_SEQUENCES, type ZeroSequence } from './ZeroSequence.js';

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

/**
 * The legs of {@link threePhase} alone (leg to DC midpoint, volts), for a caller that combines
 * them itself: `threePhase`, and the design report through `starVoltages`. Internal: not in the
 * package's exports.
 * @throws ParameterRangeError as {@link threePhase}
 */
export function threePhaseLegs(
  options: ThreePhaseOptions,
  span: CarrierSpan = {},
): ThreePhaseWaveforms['legs'] {
  assertCarrierSpan(options, span);
  if (options.zeroSequence !== undefined) {
    assertOneOf('zeroSequence', options.zeroSequence, ZERO_SEQUENCES);
  }
  const { ma, mf, vdc, zeroSequence = 'none', sampling = 'natural', carrierPhase = 0 } = options;
  if (
    (zeroSequence === 'azspwm1' || zeroSequence === 'nspwm') &&
    sampling === 'regular-symmetric'
  ) {
    // The inverted carrier would sample at its own peaks, half a carrier period away from the
    // others' samples, and 000 and 111 would return for part of some periods.
    throw new ParameterRangeError(
      'sampling',
      `'natural' or 'regular-asymmetric' for zeroSequence '${zeroSequence}' (its inverted carrier needs every leg sampled at the same instants)`,
      sampling,
    );
  }
  const { fundamentalPeriods = 1 } = span;
  const alignment = { mf, carrierPhase };
  const leg = (phase: PhaseIndex): Waveform => {
    const restated = spanCarrier(
      threePhaseReference(phase, { ma, zeroSequence }),
      alignment,
      fundamentalPeriods,
    );
    const compare = (phaseShift: number): Waveform =>
      compareWithCarrier(restated.reference, {
        mf: restated.alignment.mf,
        carrierPhase: restated.alignment.carrierPhase + phaseShift,
        sampling,
        high: vdc / 2,
        low: -vdc / 2,
      });
    const normal = compare(0);
    if (zeroSequence !== 'azspwm1' && zeroSequence !== 'nspwm') return normal;
    // The inverted carrier is the same triangle half a carrier period later.
    const inverted = compare(Math.PI);
    return combineWaveforms(
      [
        normal,
        inverted,
        invertedHalfPeriods(zeroSequence, phase, alignment, {
          span: restated.alignment,
          fundamentalPeriods,
        }),
      ],
      ([n = 0, i = 0, inverts = 0]) => (inverts === 1 ? i : n),
    );
  };
  return { a: leg(0), b: leg(1), c: leg(2) };
}

/**
 * 1 over the carrier half periods in which phase `phase` takes the inverted carrier
 * ({@link invertsCarrier}), 0 elsewhere; its edges are carrier peaks and valleys. The half
 * periods are counted on the span's carrier (p cycles over q fundamental periods) and each is
 * decided at its centre's fundamental angle θ = q·φ against the original carrier.
 */
function invertedHalfPeriods(
  zeroSequence: ZeroSequence,
  phase: PhaseIndex,
  alignment: { mf: number; carrierPhase: number },
  restated: { span: { mf: number; carrierPhase: number }; fundamentalPeriods: number },
): Waveform {
  const { span, fundamentalPeriods } = restated;
  return waveformFromTransitions(
    Array.from({ length: 2 * span.mf }, (_, j) => {
      const start = fundamentalAngleOfCarrier(j * Math.PI, span);
      const centre = fundamentalAngleOfCarrier((j + 0.5) * Math.PI, span);
      return {
        angle: start,
        level: invertsCarrier(zeroSequence, phase, fundamentalPeriods * centre, alignment) ? 1 : 0,
      };
    }),
  );
}
