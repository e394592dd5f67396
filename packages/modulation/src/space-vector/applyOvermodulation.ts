import { wrapAngle } from '../math.js';
import { SECTOR_ANGLE, locateSector } from './locateSector.js';
import type { OvermodulationSetting } from './overmodulationSetting.js';
import type { SpaceVectorReference } from './spaceVectorTypes.js';
import { heldAngle } from './trajectoryFundamental.js';

/**
 * The per-switching-period reference vector a setting gives at the commanded angle `theta`
 * (radians, the commanded vector's angle). Internal helper of {@link overmodulatedReference}
 * and the waveform builder (the setting is solved once, applied each period).
 */
export function applyOvermodulation(
  setting: OvermodulationSetting,
  theta: number,
): SpaceVectorReference {
  const { mode, radius, holdingAngle } = setting;
  if (mode === 'linear') return { m: setting.m, theta: wrapAngle(theta) };
  const { sector, angle } = locateSector(theta);
  const sectorStart = (sector - 1) * SECTOR_ANGLE;
  if (mode === 'overmodulation-i' || mode === 'magnitude-limited') {
    return { m: Math.min(radius, hexagonRadius(angle)), theta: sectorStart + angle };
  }
  const moved = heldAngle(angle, holdingAngle);
  return { m: hexagonRadius(moved), theta: sectorStart + moved };
}

/** Distance, in m units, from the centre to the hexagon's side at angle α within a sector. */
function hexagonRadius(angle: number): number {
  return 1 / Math.cos(angle - SECTOR_ANGLE / 2);
}
