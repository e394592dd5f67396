import { assertCarrierSpan } from '../carrier/assertCarrierSpan.js';
import type { CarrierSpan } from '../carrier/CarrierSpan.js';
import { spanCarrier } from '../carrier/spanCarrier.js';
import { compareWithCarrier } from '../carrier/compareWithCarrier.js';
import { fundamentalAngleOfCarrier } from '../carrier/triangleCarrier.js';
import { assertOneOf } from '../validation/assertions.js';
import { ParameterRangeError } from '../validation/errors.js';
import type { Waveform } from '../waveform/Waveform.js';
import { combineWaveforms } from '../waveform/combineWaveforms.js';
import { waveformFromTransitions } from '../waveform/waveformFromTransitions.js';
import { invertsCarrier } from './invertsCarrier.js';
import type { ThreePhaseOptions, ThreePhaseWaveforms } from './threePhase.js';
import { threePhaseReference, type PhaseIndex } from './threePhaseReference.js';
import { ZERO_SEQUENCES, type ZeroSequence } from './ZeroSequence.js';

/**
 * The legs of {@link threePhase} alone (leg to DC midpoint, volts), for a caller that combines
 * them itself: `threePhase`, and the design report through `starVoltages`. Internal.
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
