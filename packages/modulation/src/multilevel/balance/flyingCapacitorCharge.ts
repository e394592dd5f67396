import { TAU } from '../../math.js';
import { ParameterRangeError } from '../../validation/errors.js';
import type { MultilevelWaveforms } from '../MultilevelTypes.js';
import { assertMultilevelWaveforms } from './assertMultilevelWaveforms.js';
import { carrierWindows } from './carrierWindows.js';
import { forEachPiece } from './forEachPiece.js';
import { legCurrentModel } from './legCurrentModel.js';
import type { MultilevelPhaseCurrents } from './MultilevelPhaseCurrents.js';
import type { AngleSeries } from './neutralPointCurrentFigures.js';
import { runningCharge, type RunningCharge } from './runningCharge.js';

/** Options of {@link flyingCapacitorCharge}. */
export interface FlyingCapacitorChargeOptions {
  /** Carrier cycles per fundamental period, integer in [1, 10000]. */
  mf: number;
  /** The carrier's delay in carrier radians, as given to `multilevelCarrier`. @default 0 */
  carrierPhase?: number;
  /** Output frequency f₁, Hz, > 0 (turns ampere-radians into coulombs). */
  fundamentalFrequency: number;
  /** Capacitance of every flying capacitor, F, > 0: gives each one's voltage ripple. */
  capacitance?: number;
}

/** One flying capacitor's charge balance. */
export interface FlyingCapacitorBalance {
  /** `capacitor k`: between cells k and k + 1, nominally at (levels − 1 − k)·vdc/(levels − 1). */
  name: string;
  /** Charge it receives in each carrier period (valley to valley), C, at each period's centre. */
  chargePerCarrierPeriod: AngleSeries;
  /** Largest |charge| received in one carrier period, C. */
  maxChargePerCarrierPeriod: number;
  /** Net charge over the fundamental period, C (zero: the capacitor holds its voltage). */
  netCharge: number;
  /** RMS of its current over the period, A. */
  rmsCurrent: number;
  /** Peak-to-peak of its voltage over the period with `capacitance`, V; null without it. */
  voltageRipple: number | null;
}

/** The flying capacitors of each leg. */
export interface FlyingCapacitorCharge {
  legs: { name: string; capacitors: FlyingCapacitorBalance[] }[];
}

/**
 * The charge each flying capacitor of a flying-capacitor bridge receives. With the cells
 * numbered outermost first (as `multilevelCarrier` gives them) and s_k the state of cell k's
 * upper switch, capacitor k (between cells k and k + 1) carries i_C,k = (s_k − s_{k+1})·i, positive
 * charging it (raising its voltage): the leg current i (out of the leg) enters its positive plate
 * through cell k's upper switch when s_k = 1, s_{k+1} = 0, and leaves it through cell k + 1's upper
 * switch when s_k = 0, s_{k+1} = 1 (T. A. Meynard and H. Foch, 1992; Holmes and Lipo, 2003,
 * ch. 11). Integrated exactly per piece (see {@link MultilevelPhaseCurrents}); charge in coulombs
 * = ∫ i_C dθ / (2π·f₁). Phase-shifted carriers give each cell the same duty over a carrier
 * period, so the charge per carrier period is small and the net over the fundamental near zero:
 * the natural balancing of the flying-capacitor leg (Meynard and Foch, from memory).
 *
 * Voltage ripple: peak-to-peak of the running charge over the period (evaluated at every piece's
 * ends and where i_C crosses zero, the net drift removed) divided by the capacitance.
 *
 * @param waveforms - `multilevelCarrier` output of a `flying-capacitor` bridge (cells in each leg)
 * @param currents - the phase currents, see {@link MultilevelPhaseCurrents}
 * @throws ParameterRangeError / ParameterTypeError naming `waveforms…`, `currents…`, `mf`,
 *   `carrierPhase`, `fundamentalFrequency` or `capacitance`
 */
export function flyingCapacitorCharge(
  waveforms: MultilevelWaveforms,
  currents: MultilevelPhaseCurrents,
  options: FlyingCapacitorChargeOptions,
): FlyingCapacitorCharge {
  assertMultilevelWaveforms(waveforms);
  waveforms.legs.forEach((leg, k) => {
    if (leg.cells.length !== waveforms.levels - 1) {
      throw new ParameterRangeError(
        `waveforms.legs[${k}].cells.length`,
        `${waveforms.levels - 1} (levels − 1 commutation cells of a flying-capacitor leg)`,
        leg.cells.length,
      );
    }
  });
  const { windows, omega: frequency, capacitance } = carrierWindows(options, true);
  const omega = frequency as number;
  const mf = windows.starts.length;
  const model = legCurrentModel(waveforms, currents);
  return {
    legs: waveforms.legs.map((leg, legIndex) => {
      const count = leg.cells.length - 1;
      const sums = Array.from({ length: count }, () => new Float64Array(mf));
      const totals = new Float64Array(count);
      const squares = new Float64Array(count);
      const charges = Array.from({ length: count }, () => runningCharge(model));
      forEachPiece(
        leg.cells.map((cell) => cell.waveform),
        [...model.knots, ...windows.starts],
        (a, b, states) => {
          const [x, y] = model.coefficients(legIndex, a, b);
          const w = windows.indexOf((a + b) / 2);
          for (let k = 0; k < count; k++) {
            const weight = (states[k] as number) - (states[k + 1] as number);
            if (weight === 0) continue;
            const c = [weight * x, weight * y] as const;
            const integral = model.integral(c, a, b);
            (sums[k] as Float64Array)[w] = ((sums[k] as Float64Array)[w] as number) + integral;
            totals[k] = (totals[k] as number) + integral;
            squares[k] = (squares[k] as number) + model.squareIntegral(c, a, b);
            if (capacitance !== null) (charges[k] as RunningCharge).add(c, a, b, integral);
          }
        },
      );
      return {
        name: leg.name,
        capacitors: Array.from({ length: count }, (_, k): FlyingCapacitorBalance => {
          const values = windows.byCentre.map(
            (j) => ((sums[k] as Float64Array)[j] as number) / omega,
          );
          const net = totals[k] as number;
          return {
            name: `capacitor ${k + 1}`,
            chargePerCarrierPeriod: { angles: windows.centres, values },
            maxChargePerCarrierPeriod: Math.max(...values.map(Math.abs)),
            netCharge: net / omega,
            rmsCurrent: Math.sqrt(Math.max(0, (squares[k] as number) / TAU)),
            voltageRipple:
              capacitance === null
                ? null
                : (charges[k] as RunningCharge).peakToPeak(net) / omega / capacitance,
          };
        }),
      };
    }),
  };
}
