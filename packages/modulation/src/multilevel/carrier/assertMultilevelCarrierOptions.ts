import { assertCarrierOptions } from '../../carrier/assertCarrierOptions.js';
import { assertOneOf } from '../../validation/assertions.js';
import { ParameterRangeError, ParameterTypeError } from '../../validation/errors.js';
import {
  MULTILEVEL_CARRIERS_BY_TOPOLOGY,
  MULTILEVEL_TOPOLOGIES,
  MULTILEVEL_ZERO_SEQUENCES,
  type MultilevelCarrierOptions,
} from '../MultilevelTypes.js';

/**
 * The output levels of a leg (string) each topology accepts, inclusive: `npc` and `t-type` are
 * three-level by construction; a flying-capacitor leg of 2…8 commutation cells gives 3…9 levels;
 * a cascaded string of 1…8 H-bridge cells gives 3…17 levels, odd only (2·cells + 1).
 */
export const MULTILEVEL_LEVEL_BOUNDS: Readonly<
  Record<MultilevelCarrierOptions['topology'], { min: number; max: number; odd: boolean }>
> = {
  npc: { min: 3, max: 3, odd: true },
  't-type': { min: 3, max: 3, odd: true },
  'flying-capacitor': { min: 3, max: 9, odd: false },
  'cascaded-h-bridge': { min: 3, max: 17, odd: true },
};

/**
 * Asserts the options of `multilevelCarrier`: `topology` one of {@link MULTILEVEL_TOPOLOGIES};
 * `levels` an integer within the topology's {@link MULTILEVEL_LEVEL_BOUNDS}; `carriers` one the
 * topology accepts ({@link MULTILEVEL_CARRIERS_BY_TOPOLOGY}); `phaseCount` 1 or 3; `ma`, `mf`,
 * `vdc`, `sampling`, `carrierPhase` as every carrier method (`assertCarrierOptions`);
 * `zeroSequence` one of {@link MULTILEVEL_ZERO_SEQUENCES}, and other than `'none'` only for a
 * three-phase bridge.
 * @throws ParameterTypeError when `options` is not an object or a field has the wrong kind
 * @throws ParameterRangeError naming the field and its allowed values
 */
export function assertMultilevelCarrierOptions(
  options: unknown,
): asserts options is MultilevelCarrierOptions {
  if (typeof options !== 'object' || options === null) {
    throw new ParameterTypeError('options', 'an object', options);
  }
  const input = options as Record<string, unknown>;
  assertOneOf('topology', input.topology, MULTILEVEL_TOPOLOGIES);
  const topology = input.topology;
  assertLevels(topology, input.levels);
  const allowed = MULTILEVEL_CARRIERS_BY_TOPOLOGY[topology];
  if (
    typeof input.carriers !== 'string' ||
    !(allowed as readonly string[]).includes(input.carriers)
  ) {
    throw new ParameterRangeError(
      'carriers',
      `one of ${allowed.map((c) => `'${c}'`).join(', ')} for topology '${topology}'`,
      input.carriers,
    );
  }
  if (input.phaseCount !== 1 && input.phaseCount !== 3) {
    throw new ParameterRangeError('phaseCount', '1 or 3', input.phaseCount);
  }
  assertCarrierOptions({
    ma: input.ma,
    mf: input.mf,
    vdc: input.vdc,
    sampling: input.sampling,
    carrierPhase: input.carrierPhase,
  });
  if (input.zeroSequence !== undefined) {
    assertOneOf('zeroSequence', input.zeroSequence, MULTILEVEL_ZERO_SEQUENCES);
    if (input.phaseCount === 1 && input.zeroSequence !== 'none') {
      throw new ParameterRangeError(
        'zeroSequence',
        "'none' for a single-phase bridge (a zero sequence needs three phases in star to cancel)",
        input.zeroSequence,
      );
    }
  }
}

function assertLevels(topology: MultilevelCarrierOptions['topology'], levels: unknown): void {
  if (typeof levels !== 'number') throw new ParameterTypeError('levels', 'a number', levels);
  const { min, max, odd } = MULTILEVEL_LEVEL_BOUNDS[topology];
  const inRange = Number.isInteger(levels) && levels >= min && levels <= max;
  if (!inRange || (odd && levels % 2 === 0)) {
    const range = min === max ? `${min}` : `${odd ? 'an odd' : 'an'} integer in [${min}, ${max}]`;
    throw new ParameterRangeError('levels', `${range} for topology '${topology}'`, levels);
  }
}
