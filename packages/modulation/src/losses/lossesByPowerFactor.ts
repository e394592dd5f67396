import { assertLossSweepOptions } from './assertLossSweepOptions.js';
import { legDutySamples } from './legDutySamples.js';
import type { LossZeroSequence, SemiconductorDevice } from './lossTypes.js';
import { lossesFromDuties } from './lossesFromDuties.js';

/** Samples (0.1° apart) on which a sequence's share of switched time is read for 'equal-switching'. */
const FRACTION_GRID = 3600;

/**
 * How the zero sequences are compared: at one carrier frequency, or each at the carrier that gives
 * every switch the same average switching frequency (a method that clamps each leg for 120° a
 * period runs its carrier 1.5× faster).
 */
export type LossComparisonBasis = 'equal-carrier' | 'equal-switching';

/** Options of {@link lossesByPowerFactor}. */
export interface LossesByPowerFactorOptions {
  device: SemiconductorDevice;
  /** DC bus voltage, V. */
  vdc: number;
  /** Modulation index (peak sine reference / (vdc/2)), (0, 4]. */
  ma: number;
  /** Peak of the sinusoidal phase current, A. */
  peakCurrent: number;
  /**
   * Carrier frequency, Hz; with `'equal-switching'` the average switching frequency of every
   * switch instead (the carrier of continuous PWM).
   */
  switchingFrequency: number;
  /** Fundamental frequency, Hz; switchingFrequency/fundamentalFrequency carrier periods are summed. @default 50 */
  fundamentalFrequency?: number;
  /** The zero sequences compared. @default LOSS_ZERO_SEQUENCES (all of them and 'gdpwm') */
  zeroSequences?: readonly LossZeroSequence[];
  /** Power-factor angles φ (the current lags the reference by φ), rad in [−π, π]. @default `points` angles evenly over [−π/2, π/2] */
  angles?: readonly number[];
  /** Angles when `angles` is not given, integer in [2, 1000]. @default 100 */
  points?: number;
  /** @default 'equal-carrier' */
  basis?: LossComparisonBasis;
}

/** The losses of one zero sequence over the angles of a sweep. */
export interface LossSweepSeries {
  zeroSequence: LossZeroSequence;
  /** Carrier frequency it ran at, Hz. */
  carrierFrequency: number;
  /** Average turn-ons of each switch per second, Hz: carrier × the fraction of carrier periods that switch. */
  averageSwitchingFrequency: number;
  /** Whole converter (three legs), W, one per angle. */
  total: number[];
  conduction: number[];
  switching: number[];
  /** One transistor's conduction and switching loss, W, one per angle (all six alike by symmetry). */
  transistor: { conduction: number[]; switching: number[] };
  /** One diode's conduction and recovery (switching) loss, W, one per angle. */
  diode: { conduction: number[]; switching: number[] };
  /** Efficiency ratio; null where no power flows to the load (cos φ ≤ 0). */
  efficiency: (number | null)[];
}

/** Result of {@link lossesByPowerFactor}; plain serialisable data. */
export interface LossSweep {
  /** Power-factor angles, rad. */
  angles: number[];
  /** cos φ at each angle. */
  powerFactor: number[];
  basis: LossComparisonBasis;
  series: LossSweepSeries[];
  /** At each angle, the zero sequence with the least total loss (the first listed on a tie). */
  lowest: LossZeroSequence[];
}

/**
 * Semiconductor losses of a three-phase bridge for each zero sequence, including the
 * discontinuous clamps and the generalised discontinuous method, as a function of the load's
 * power-factor angle: the comparison that chooses a discontinuous method for a drive (J. W. Kolar,
 * H. Ertl, F. C. Zach, IEEE Trans. Ind. Appl., 1991; A. M. Hava, R. J. Kerkman, T. A. Lipo, IEEE
 * Trans. Power Electronics, 1998; both from memory).
 *
 * Each point is the sum of {@link semiconductorLossesByIntegration}: the carrier periods of one fundamental
 * period with their actual duties and the current Î·sin(θ − φ) at each period's centre; a clamped
 * period conducts but does not switch. With `'equal-switching'` each sequence's carrier is
 * switchingFrequency divided by the share of the period in which its legs switch (read on a 0.1°
 * grid at φ = 0; 2/3 for every 120° clamp in the linear range, so 1.5×), and
 * `averageSwitchingFrequency` reports what the whole carrier periods then give.
 *
 * @throws ParameterRangeError naming the field (`angles[3]`, `points`, `zeroSequences[1]`,
 *   `switchingFrequency/fundamentalFrequency` above {@link MAX_SWEEP_CARRIER_PERIODS}, …)
 */
export function lossesByPowerFactor(options: LossesByPowerFactorOptions): LossSweep {
  const { point, fundamentalFrequency, zeroSequences, angles, basis } =
    assertLossSweepOptions(options);
  const { device, ma, switchingFrequency } = options;

  const series = zeroSequences.map((zeroSequence): LossSweepSeries => {
    const carrierFrequency =
      basis === 'equal-carrier'
        ? switchingFrequency
        : switchingFrequency / switchedFraction(zeroSequence, ma, FRACTION_GRID);
    const n = Math.round(carrierFrequency / fundamentalFrequency);
    // The duties do not depend on the load angle, except the generalised clamp's.
    const fixed =
      zeroSequence === 'gdpwm' ? null : Array.from(legDutySamples(zeroSequence, ma, n, 0));
    const losses = angles.map((currentAngle) =>
      lossesFromDuties(
        device,
        {
          ...point,
          currentAngle,
          switchingFrequency: carrierFrequency,
          zeroSequence,
        },
        fixed ?? Array.from(legDutySamples(zeroSequence, ma, n, currentAngle)),
      ),
    );
    return {
      zeroSequence,
      carrierFrequency,
      averageSwitchingFrequency:
        carrierFrequency *
        switchedFraction(zeroSequence, ma, carrierFrequency / fundamentalFrequency),
      total: losses.map((l) => l.total),
      conduction: losses.map((l) => l.conduction),
      switching: losses.map((l) => l.switching),
      transistor: {
        conduction: losses.map((l) => l.transistor.conduction),
        switching: losses.map((l) => l.transistor.switching),
      },
      diode: {
        conduction: losses.map((l) => l.diode.conduction),
        switching: losses.map((l) => l.diode.switching),
      },
      efficiency: losses.map((l) => l.efficiency),
    };
  });
  const lowest = angles.map((_, k) => {
    let best = series[0] as LossSweepSeries;
    for (const s of series) if ((s.total[k] as number) < (best.total[k] as number)) best = s;
    return best.zeroSequence;
  });
  return {
    angles: [...angles],
    powerFactor: angles.map((a) => Math.cos(a)),
    basis,
    series,
    lowest,
  };
}

/**
 * The fraction of `ratio` evenly spaced carrier periods (rounded) in which leg a switches
 * (0 < duty < 1), at φ = 0.
 */
function switchedFraction(zeroSequence: LossZeroSequence, ma: number, ratio: number): number {
  const n = Math.max(1, Math.round(ratio));
  const duties = legDutySamples(zeroSequence, ma, n, 0);
  let switched = 0;
  for (const d of duties) if (d > 0 && d < 1) switched++;
  // A leg that never switches (far past the linear range) keeps the given carrier.
  return switched === 0 ? 1 : switched / n;
}
