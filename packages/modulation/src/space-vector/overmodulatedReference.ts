import { ParameterTypeError } from '../validation/errors.js';
import { assertNumberInRange } from '../validation/assertions.js';
import { applyOvermodulation } from './applyOvermodulation.js';
import {
  overmodulationSetting,
  type OvermodulationSettingOptions,
} from './overmodulationSetting.js';
import type { OvermodulationMode, SpaceVectorReference } from './spaceVectorTypes.js';

/** A reference vector after overmodulation shaping, ready for {@link spaceVector}. */
export interface OvermodulatedReference extends SpaceVectorReference {
  /** The shaping applied (see {@link OvermodulationMode}). */
  mode: OvermodulationMode;
}

/**
 * The reference vector to realise in one switching period when the commanded one may lie beyond
 * the linear range: `{ m, theta }` inside (or on) the hexagon, so {@link spaceVector} accepts it.
 * Holtz, Lotzkat, Khambadkone (IEEE Trans. Power Electron., 1993) two-mode shaping by default;
 * see {@link overmodulationSetting} for the modes and their limits. For many periods, solving the
 * setting once is cheaper; the waveform functions do that.
 *
 * @param commanded - `{ m, theta }`: m in [0, 2√3/π] the commanded index of the wanted
 *   fundamental, theta the commanded vector's angle in radians (any finite value)
 * @returns the vector to apply; theta in [0, 2π)
 * @throws ParameterRangeError naming `m`, `theta` or `method`
 */
export function overmodulatedReference(
  commanded: SpaceVectorReference,
  options: OvermodulationSettingOptions = {},
): OvermodulatedReference {
  if (typeof commanded !== 'object' || commanded === null) {
    throw new ParameterTypeError('commanded', 'an object { m, theta }', commanded);
  }
  const { m, theta } = commanded;
  assertNumberInRange('theta', theta);
  const setting = overmodulationSetting(m, options);
  const applied = applyOvermodulation(setting, theta);
  return { ...applied, mode: setting.mode };
}
