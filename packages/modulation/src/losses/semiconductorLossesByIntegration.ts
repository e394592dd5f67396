import { TAU } from '../math.js';
import { dutyFromReference } from '../firmware/dutyFromReference.js';
import { legReferences } from '../firmware/legReferences.js';
import { assertNumberInRange } from '../validation/assertions.js';
import { assertLossInputs } from './assertLossInputs.js';
import { legLossesFromSamples } from './legLossesFromSamples.js';
import type { LossOperatingPoint, SemiconductorDevice, SemiconductorLosses } from './lossTypes.js';
import { summariseLosses } from './summariseLosses.js';

/** Options of {@link semiconductorLossesByIntegration}. */
export interface LossIntegrationOptions extends LossOperatingPoint {
  /** Fundamental frequency, Hz; fixes the carrier periods per fundamental. @default 50 */
  fundamentalFrequency?: number;
}

/**
 * Semiconductor losses found by summing the losses of every carrier period over one
 * fundamental period ({@link legLossesFromSamples}), with the duty cycles of the actual
 * modulation ({@link legReferences}, clamped in overmodulation) and the current
 * Î·sin(θ − φ) at the centre of each carrier period; N = round(fsw/f1) periods.
 *
 * An independent method for the closed form of {@link semiconductorLosses}: the two agree to
 * O(1/N²) in the linear range; this one also covers 'min-max' and overmodulation (clamped
 * periods do not switch). Leg a is evaluated; every leg has the same average by symmetry.
 */
export function semiconductorLossesByIntegration(
  device: SemiconductorDevice,
  options: LossIntegrationOptions,
): SemiconductorLosses {
  const point = assertLossInputs(device, options);
  const { fundamentalFrequency = 50 } = options;
  assertNumberInRange('fundamentalFrequency', fundamentalFrequency, {
    min: 0,
    minExclusive: true,
    max: point.switchingFrequency / 3,
  });
  const n = Math.round(point.switchingFrequency / fundamentalFrequency);
  const modulation =
    point.topology === 'h-bridge'
      ? ({ method: 'sine-triangle', scheme: 'unipolar', ma: point.ma } as const)
      : ({ method: 'three-phase', zeroSequence: point.zeroSequence, ma: point.ma } as const);
  const duties: number[] = [];
  const currents: number[] = [];
  for (let j = 0; j < n; j++) {
    const theta = ((j + 0.5) * TAU) / n;
    duties.push(dutyFromReference(legReferences(theta, modulation)[0] as number));
    currents.push(point.peakCurrent * Math.sin(theta - point.currentAngle));
  }
  const leg = legLossesFromSamples(duties, currents, {
    device,
    vdc: point.vdc,
    switchingFrequency: point.switchingFrequency,
  });
  // One transistor / one diode: the mean of the upper and lower positions.
  const mean = (
    a: { conduction: number; switching: number },
    b: { conduction: number; switching: number },
  ) => ({
    conduction: (a.conduction + b.conduction) / 2,
    switching: (a.switching + b.switching) / 2,
  });
  return summariseLosses(
    mean(leg.upperTransistor, leg.lowerTransistor),
    mean(leg.upperDiode, leg.lowerDiode),
    point,
  );
}
