import { assertNumberInRange } from '../../validation/assertions.js';
import type { Waveform } from '../../waveform/Waveform.js';
import type { MultilevelWaveforms } from '../MultilevelTypes.js';
import { assertMultilevelWaveforms } from './assertMultilevelWaveforms.js';

/** One switch's switching rate. */
export interface DeviceSwitching {
  /** The switch's name as the waveforms give it (`S1`, `cell 2 upper`, …). */
  name: string;
  /** Turn-on events (gate 0 → 1) in one fundamental period. */
  turnOnsPerPeriod: number;
  /** Average device switching frequency, turn-ons per second, Hz. */
  frequency: number;
}

/** The switching rates of one leg (string). */
export interface LegSwitching {
  name: string;
  switches: DeviceSwitching[];
  /** Level changes of the leg's (string's) output in one fundamental period. */
  outputEdgesPerPeriod: number;
  /**
   * Effective switching frequency seen at the output, (edges per period / 2)·f₁, Hz: where the
   * first carrier group of the output sits (mf·f₁ for a two-level leg).
   */
  effectiveFrequency: number;
}

/** Device and output switching frequencies of a multilevel bridge. */
export interface MultilevelSwitchingFrequencies {
  legs: LegSwitching[];
  /** Highest device switching frequency of the bridge, Hz. */
  maxDeviceFrequency: number;
  /** Mean over every device of the bridge, Hz. */
  meanDeviceFrequency: number;
}

/**
 * Average switching frequency of every device of a multilevel bridge (turn-on events per
 * second) and the effective switching frequency of each leg's (string's) output, (level changes
 * per period / 2)·f₁: the cost side and the benefit side of a carrier arrangement. With
 * phase-shifted carriers every device switches at mf·f₁ while the output's first carrier group
 * sits at 2·cells·mf·f₁ (cascaded H-bridge) or (levels − 1)·mf·f₁ (flying capacitor); with
 * level-shifted carriers a device switches only while the reference is in its band (Holmes and
 * Lipo, 2003, ch. 11; McGrath and Holmes, IEEE Trans. Ind. Electron., 2002).
 *
 * @param waveforms - `multilevelCarrier` output (exact waveforms over one period)
 * @param fundamentalFrequency - output frequency f₁, Hz, in (0, 1e6]
 * @throws ParameterRangeError / ParameterTypeError naming `waveforms…` or `fundamentalFrequency`
 */
export function deviceSwitchingFrequencies(
  waveforms: MultilevelWaveforms,
  fundamentalFrequency: number,
): MultilevelSwitchingFrequencies {
  assertMultilevelWaveforms(waveforms);
  assertNumberInRange('fundamentalFrequency', fundamentalFrequency, {
    min: 0,
    minExclusive: true,
    max: 1e6,
  });
  const legs = waveforms.legs.map((leg): LegSwitching => {
    const outputEdgesPerPeriod = levelChanges(leg.output, () => true);
    return {
      name: leg.name,
      switches: leg.switches.map((s) => {
        const turnOnsPerPeriod = levelChanges(s.on, (from, to) => to > from);
        return {
          name: s.name,
          turnOnsPerPeriod,
          frequency: turnOnsPerPeriod * fundamentalFrequency,
        };
      }),
      outputEdgesPerPeriod,
      effectiveFrequency: (outputEdgesPerPeriod / 2) * fundamentalFrequency,
    };
  });
  const frequencies = legs.flatMap((leg) => leg.switches.map((s) => s.frequency));
  return {
    legs,
    maxDeviceFrequency: frequencies.length === 0 ? 0 : Math.max(...frequencies),
    meanDeviceFrequency:
      frequencies.length === 0 ? 0 : frequencies.reduce((a, b) => a + b, 0) / frequencies.length,
  };
}

/** Edges at which the level changes and `counts(from, to)` holds (the last level wraps round). */
function levelChanges({ levels }: Waveform, counts: (from: number, to: number) => boolean): number {
  let changes = 0;
  levels.forEach((to, i) => {
    const from = levels[(i + levels.length - 1) % levels.length] as number;
    if (to !== from && counts(from, to)) changes++;
  });
  return changes;
}
