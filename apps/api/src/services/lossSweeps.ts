import {
  LOSS_ZERO_SEQUENCES,
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

/** POST /losses/power-factor-sweeps: angles × zero sequences × carrier periods, each summed once. */
export function lossSweepCost(input: LossesByPowerFactorOptions): CostEstimate {
  const angles = input.angles?.length ?? input.points ?? 100;
  const sequences = input.zeroSequences?.length ?? LOSS_ZERO_SEQUENCES.length;
  const periods = Math.ceil(
    (input.switchingFrequency / (input.fundamentalFrequency ?? 50)) *
      (input.basis === 'equal-switching' ? 1.5 : 1),
  );
  const fields = [
    input.angles === undefined ? 'points' : 'angles',
    'zeroSequences',
    'switchingFrequency',
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
