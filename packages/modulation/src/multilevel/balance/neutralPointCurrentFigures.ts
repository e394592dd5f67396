import { TAU } from '../../math.js';
import { ParameterRangeError } from '../../validation/errors.js';
import type { MultilevelWaveforms } from '../MultilevelTypes.js';
import { assertMultilevelWaveforms } from './assertMultilevelWaveforms.js';
import { carrierWindows } from './carrierWindows.js';
import { forEachPiece } from './forEachPiece.js';
import { legCurrentModel, type PieceCoefficients } from './legCurrentModel.js';
import type { MultilevelPhaseCurrents } from './MultilevelPhaseCurrents.js';
import { runningCharge } from './runningCharge.js';

/** Options of {@link neutralPointCurrentFigures}. */
export interface NeutralPointCurrentOptions {
  /** Carrier cycles per fundamental period, integer in [1, 10000] (the windows of the averages). */
  mf: number;
  /** The carrier's delay in carrier radians, as given to `multilevelCarrier`. @default 0 */
  carrierPhase?: number;
  /** Output frequency f₁, Hz, > 0; needed with `capacitance`. */
  fundamentalFrequency?: number;
  /** Capacitance of each half of the DC link, F, > 0: gives the midpoint voltage ripple. */
  capacitance?: number;
}

/** A series over one fundamental period: angles (rad, ascending) and values. */
export interface AngleSeries {
  angles: number[];
  values: number[];
}

/** Neutral-point (DC midpoint) current of a three-level bridge, amperes. */
export interface NeutralPointCurrentFigures {
  /** Mean over the fundamental period, A (zero for a balanced bridge: no midpoint drift). */
  mean: number;
  /** RMS over the fundamental period, switching pulses included, A. */
  rms: number;
  /** The average over each carrier period (valley to valley), at each period's centre angle, A. */
  carrierAverages: AngleSeries;
  /** Peak-to-peak of `carrierAverages`, A: the low-frequency neutral-point current ripple. */
  lowFrequencyRipple: number;
  /**
   * Peak-to-peak ripple of the DC midpoint voltage, V, with `capacitance` on each half of a stiff
   * DC link (the two halves in parallel for the midpoint: dv/dt = −i_np/(2C)), the mean drift
   * left out; null without `capacitance`.
   */
  midpointVoltageRipple: number | null;
}

/**
 * The current a three-level (`npc` or `t-type`) bridge draws from its DC midpoint:
 * i_np(θ) = Σ_legs [leg at its middle level (0 V)]·i_leg(θ), positive out of the midpoint into
 * the legs (N. Celanovic and D. Boroyevich, IEEE Trans. Power Electronics, 2000). Integrated
 * exactly over the pieces between switching edges and current samples (see
 * {@link MultilevelPhaseCurrents}); carrier-period averages over valley-to-valley windows.
 *
 * For a level-shifted leg in the linear range the middle level's duty is 1 − |m(θ)|, so the
 * carrier average of one leg's share is (1 − |m(θ)|)·i(θ) (Holmes and Lipo, 2003, ch. 11); with
 * three-phase sine references and a balanced load the sum has zero mean and a ripple at three
 * times the output frequency (Celanovic and Boroyevich, 2000).
 *
 * @param waveforms - `multilevelCarrier` output of an `npc` or `t-type` bridge (levels 3)
 * @param currents - the phase currents, see {@link MultilevelPhaseCurrents}
 * @throws ParameterRangeError / ParameterTypeError naming `waveforms…`, `currents…`, `mf`,
 *   `carrierPhase`, `fundamentalFrequency` or `capacitance`
 */
export function neutralPointCurrentFigures(
  waveforms: MultilevelWaveforms,
  currents: MultilevelPhaseCurrents,
  options: NeutralPointCurrentOptions,
): NeutralPointCurrentFigures {
  assertMultilevelWaveforms(waveforms);
  if (waveforms.levels !== 3) {
    throw new ParameterRangeError(
      'waveforms.levels',
      '3 (an npc or t-type bridge)',
      waveforms.levels,
    );
  }
  const { windows, omega, capacitance } = carrierWindows(options, false);
  const mf = windows.starts.length;
  const model = legCurrentModel(waveforms, currents);
  const legCount = waveforms.legs.length;
  // The middle level is 0 V; a hand-built waveform may hold it to rounding.
  const middle = waveforms.legs.map(
    (leg) => 1e-9 * Math.max(...leg.output.levels.map((v) => Math.abs(v))),
  );
  const sums = new Float64Array(mf);
  let total = 0;
  let squares = 0;
  const charge = runningCharge(model);
  forEachPiece(
    waveforms.legs.map((leg) => leg.output),
    [...model.knots, ...windows.starts],
    (a, b, levels) => {
      let c0 = 0;
      let c1 = 0;
      for (let k = 0; k < legCount; k++) {
        if (Math.abs(levels[k] as number) > (middle[k] as number)) continue;
        const [x, y] = model.coefficients(k, a, b);
        c0 += x;
        c1 += y;
      }
      const c: PieceCoefficients = [c0, c1];
      const integral = model.integral(c, a, b);
      const w = windows.indexOf((a + b) / 2);
      sums[w] = (sums[w] as number) + integral;
      total += integral;
      squares += model.squareIntegral(c, a, b);
      if (capacitance !== null) charge.add(c, a, b, integral);
    },
  );
  const mean = total / TAU;
  const width = TAU / mf;
  const values = windows.byCentre.map((j) => (sums[j] as number) / width);
  const ripple =
    capacitance === null || omega === null
      ? null
      : charge.peakToPeak(total) / omega / (2 * capacitance);
  return {
    mean,
    rms: Math.sqrt(Math.max(0, squares / TAU)),
    carrierAverages: { angles: windows.centres, values },
    lowFrequencyRipple: Math.max(...values) - Math.min(...values),
    midpointVoltageRipple: ripple,
  };
}
