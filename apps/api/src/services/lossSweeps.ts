import {
  assertLossSweepOptions,
  lossesByPowerFactor,
  type LossesByPowerFactorOptions,
  type LossSweep,
} from '@pulsewright/modulation';
import type { CostEstimate } from './cost.js';
import { callLibrary } from './library.js';

/**
 * Units of the cost model (services/cost.ts) per carrier period and angle of a loss sweep:
 * 100 angles × 11 zero sequences × 200 carrier periods took 30 ms on the loaded 2-core build
 * machine, about 27 units each; rounded up.
 */
const UNITS_PER_PERIOD = 50;
/** Bytes of one number in the JSON answer (as services/cost.ts measures them). */
const BYTES_PER_NUMBER = 20;

/**
 * POST /losses/power-factor-sweeps: angles × zero sequences × carrier periods, each summed once.
 * The request is checked first by the library's own checks (assertLossSweepOptions, a 400 naming
 * the field, e.g. `device.eon`), so the estimate is made only of values the sweep accepts: a bad
 * device or a fundamental that asks for 1e331 carrier periods is named as such, never priced.
 */
export function lossSweepCost(input: LossesByPowerFactorOptions): CostEstimate {
  const checked = callLibrary('', () => assertLossSweepOptions(input));
  const angles = checked.angles.length;
  const sequences = checked.zeroSequences.length;
  const periods = Math.ceil(
    (checked.point.switchingFrequency / checked.fundamentalFrequency) *
      (checked.basis === 'equal-switching' ? 1.5 : 1),
  );
  const fields = [
    input.angles === undefined ? 'points' : 'angles',
    'zeroSequences',
    'switchingFrequency',
    ...(input.fundamentalFrequency === undefined ? [] : ['fundamentalFrequency']),
  ];
  return {
    work: angles * sequences * periods * UNITS_PER_PERIOD,
    basis: `${angles} angles × ${sequences} zero sequences × ${periods} carrier periods`,
    fields,
    responseBytes: (angles * (4 * sequences + 3) + 10 * sequences) * BYTES_PER_NUMBER,
    responseFields: fields.slice(0, 2),
  };
}

/** Semiconductor losses of each zero sequence against the load's power-factor angle (the library's). */
export function computeLossSweep(input: LossesByPowerFactorOptions): LossSweep {
  return callLibrary('', () => lossesByPowerFactor(input));
}
