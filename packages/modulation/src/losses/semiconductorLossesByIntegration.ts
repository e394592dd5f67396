import { TAU } from '../math.js';
import { dutyFromReference } from '../firmware/dutyFromReference.js';
import { assertNumberInRange } from '../validation/assertions.js';
import { assertLossInputs } from './assertLossInputs.js';
import { legDutySamples } from './legDutySamples.js';
import { lossesFromDuties } from './lossesFromDuties.js';
import type { LossOperatingPoint, SemiconductorDevice, SemiconductorLosses } from './lossTypes.js';

/** Options of {@link semiconductorLossesByIntegration}. */
export interface LossIntegrationOptions extends LossOperatingPoint {
  /** Fundamental frequency, Hz; fixes the carrier periods per fundamental. @default 50 */
  fundamentalFrequency?: number;
}

/**
 * Semiconductor losses found by summing the losses of every carrier period over one
 * fundamental period ({@link legLossesFromSamples}), with the duty cycles of the actual
 * modulation (regular samples of the reference at each carrier period's centre, clamped in
 * overmodulation; every zero sequence, the discontinuous clamps and `'gdpwm'` included) and the current
 * Î·sin(θ − φ) at the centre of each carrier period; N = round(fsw/f1) periods.
 *
 * An independent method for the closed form of {@link semiconductorLosses}: the two agree to
 * O(1/N²) in the linear range; this one also covers 'min-max', the discontinuous clamps, the
 * reduced common-mode methods (their duties; the carrier swaps add 4 switchings a period, not
 * counted) and overmodulation: clamped periods (duty 0 or 1) do not switch. Leg a is evaluated; every leg has the same average by symmetry.
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
  const duties =
    point.topology === 'h-bridge'
      ? Array.from({ length: n }, (_, j) =>
          dutyFromReference(point.ma * Math.sin(((j + 0.5) * TAU) / n)),
        )
      : Array.from(legDutySamples(point.zeroSequence, point.ma, n, point.currentAngle));
  return lossesFromDuties(device, point, duties);
}
