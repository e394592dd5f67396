import {
  lossesByPowerFactor,
  type LossesByPowerFactorOptions,
  type LossSweep,
} from '@pulsewright/modulation';
import { libraryFieldError } from '../../../lib/libraryFieldError';

// The loss sweep runs with the library in the browser (100 angles of every zero sequence take
// tens of milliseconds), so it follows each keystroke; the service's
// POST /api/v1/losses/power-factor-sweeps gives the same figures to scripts.

/** The library's sweep, or its error naming the field. */
export function lossSweepOf(
  options: LossesByPowerFactorOptions,
): { sweep: LossSweep; error: null } | { sweep: null; error: { field: string; message: string } } {
  try {
    return { sweep: lossesByPowerFactor(options), error: null };
  } catch (error) {
    return { sweep: null, error: libraryFieldError(error, 'sweep') };
  }
}
