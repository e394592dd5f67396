import { TAU } from '../math.js';
import { legLossesFromSamples } from './legLossesFromSamples.js';
import type { LossOperatingPoint, SemiconductorDevice, SemiconductorLosses } from './lossTypes.js';
import { summariseLosses } from './summariseLosses.js';

/**
 * Internal: the converter's losses from leg a's duty in each of the n = duties.length carrier
 * periods of one fundamental period, with the current Î·sin(θ_j − φ) at each period's centre
 * θ_j = (j + ½)·2π/n ({@link legLossesFromSamples}); one transistor and one diode are the mean
 * of the upper and lower positions (every leg has the same average by symmetry).
 */
export function lossesFromDuties(
  device: SemiconductorDevice,
  point: Required<LossOperatingPoint>,
  duties: readonly number[],
): SemiconductorLosses {
  const n = duties.length;
  const currents = Array.from(
    { length: n },
    (_, j) => point.peakCurrent * Math.sin(((j + 0.5) * TAU) / n - point.currentAngle),
  );
  const leg = legLossesFromSamples(duties, currents, {
    device,
    vdc: point.vdc,
    switchingFrequency: point.switchingFrequency,
  });
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
