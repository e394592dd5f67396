import type { MultilevelCarrierArrangement } from '../MultilevelTypes.js';

/**
 * The delay (carrier radians) of band k's carrier in a level-shifted arrangement of an even
 * number of `bands` (k = 0 lowest): 0 for a carrier in phase, π for one in opposition (the unit
 * triangle half a carrier period later is the inverted triangle). McGrath and Holmes, IEEE Trans.
 * Ind. Electron., 2002; Holmes and Lipo, 2003, ch. 11:
 * - `pd`: every band in phase;
 * - `pod`: bands above zero in phase, bands below zero in opposition;
 * - `apod`: the band just above zero in phase and each band in opposition to its neighbours
 *   (for three levels POD and APOD coincide).
 */
export function levelShiftedBandDelay(
  arrangement: Exclude<MultilevelCarrierArrangement, 'phase-shifted'>,
  band: number,
  bands: number,
): number {
  const aboveZero = band - bands / 2;
  switch (arrangement) {
    case 'pd':
      return 0;
    case 'pod':
      return aboveZero >= 0 ? 0 : Math.PI;
    case 'apod':
      return Math.abs(aboveZero) % 2 === 0 ? 0 : Math.PI;
  }
}
