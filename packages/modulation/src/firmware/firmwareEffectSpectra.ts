import { harmonics } from '../spectrum/harmonics.js';
import { labelHarmonics, type LabelledHarmonic } from '../spectrum/labelHarmonics.js';
import type { FirmwareEffect } from './firmwareEffectTypes.js';

/**
 * The exact spectra (orders 0..effect.maxOrder, peak volts) of a firmware effect's reference and
 * realised outputs, each order labelled by carrier group and sideband (Holmes and Lipo, 2003,
 * ch. 3), for a chart of the two side by side.
 * @param carrierRatio - the table's carrier periods per fundamental period (its mf), > 0
 */
export function firmwareEffectSpectra(
  effect: FirmwareEffect,
  carrierRatio: number,
): { reference: LabelledHarmonic[]; realised: LabelledHarmonic[] } {
  return {
    reference: labelHarmonics(harmonics(effect.reference, effect.maxOrder), carrierRatio),
    realised: labelHarmonics(harmonics(effect.realised, effect.maxOrder), carrierRatio),
  };
}
