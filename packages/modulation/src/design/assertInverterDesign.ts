import { assertNumberInRange, assertOneOf } from '../validation/assertions.js';
import { ParameterRangeError, ParameterTypeError } from '../validation/errors.js';
import { DAMPING_PLACEMENTS } from '../filter/LcFilterOptions.js';
import { assertMultilevelCarrierOptions } from '../multilevel/carrier/assertMultilevelCarrierOptions.js';
import { THREE_LEVEL_SPACE_VECTOR_TOPOLOGIES } from '../multilevel/space-vector/threeLevelSpaceVectorWaveforms.js';
import { withFieldPrefix } from '../validation/withFieldPrefix.js';
import { DESIGN_BOUNDS, MAX_PATTERN_ANGLES, type DesignBoundsField } from './designBounds.js';
import type { InverterDesign } from './InverterDesign.js';
import { ASYNCHRONOUS_METHODS } from './designCarrierSpan.js';
import { designFrequencyRatio } from './designFrequencyRatio.js';
import { designRationalRatio } from './designRationalRatio.js';
import { CARRIER_METHODS, MODULATION_METHODS } from './Modulation.js';

/**
 * Asserts the design-level fields of an {@link InverterDesign} against {@link DESIGN_BOUNDS}
 * and returns the frequency ratio mf (null for a stored pattern). The carrier of a
 * sine-triangle, three-phase or space-vector design may be any ratio in [1, 1000] of the
 * fundamental (analysed at its nearest p/q over q periods); a multilevel carrier's must be a
 * whole ratio. The method's own function checks the rest of `modulation` when the voltages are
 * built.
 * @throws ParameterRangeError / ParameterTypeError naming the field by its path in the design
 */
export function assertInverterDesign(design: unknown): asserts design is InverterDesign {
  if (typeof design !== 'object' || design === null)
    throw new ParameterTypeError('design', 'an object', design);
  const value = design as Record<string, unknown>;
  const check = (field: DesignBoundsField, entry: unknown): void =>
    assertNumberInRange(field, entry, DESIGN_BOUNDS[field]);
  check('vdc', value.vdc);
  check('fundamentalFrequency', value.fundamentalFrequency);
  const modulation = value.modulation as Record<string, unknown> | undefined;
  if (typeof modulation !== 'object' || modulation === null)
    throw new ParameterTypeError('modulation', 'an object', modulation);
  assertOneOf('modulation.method', modulation.method, MODULATION_METHODS);
  if ('vdc' in modulation || 'mf' in modulation || 'frequencyRatio' in modulation) {
    throw new ParameterRangeError(
      'modulation',
      'a modulation without vdc, mf or frequencyRatio (the design sets the DC bus and the carrier frequency)',
      modulation,
    );
  }
  if (CARRIER_METHODS.includes(modulation.method)) {
    check('carrierFrequency', value.carrierFrequency);
    // A two-level carrier method may run at a ratio p/q (analysed over q fundamental periods);
    // the multilevel methods are built over one period and need a whole mf.
    if (ASYNCHRONOUS_METHODS.includes(modulation.method))
      designRationalRatio(value as unknown as InverterDesign);
    else designFrequencyRatio(value as unknown as InverterDesign);
  } else if (value.carrierFrequency !== undefined) {
    throw new ParameterRangeError(
      'carrierFrequency',
      `left out for method '${modulation.method}' (a stored pattern has no carrier)`,
      value.carrierFrequency,
    );
  }
  for (const [field, entry] of [
    ['modulation.ma', modulation.ma],
    ['modulation.m', modulation.m],
    ['modulation.carrierPhase', modulation.carrierPhase],
    ['modulation.zeroSplit', modulation.zeroSplit],
    ['modulation.smallVectorSplit', modulation.smallVectorSplit],
    ['modulation.fundamental', modulation.fundamental],
  ] as const) {
    if (entry !== undefined) check(field, entry);
  }
  if (Array.isArray(modulation.angles) && modulation.angles.length > MAX_PATTERN_ANGLES) {
    throw new ParameterRangeError(
      'modulation.angles.length',
      `at most ${MAX_PATTERN_ANGLES} angles`,
      modulation.angles.length,
    );
  }
  if (Array.isArray(modulation.cellVoltages)) {
    modulation.cellVoltages.forEach((voltage: unknown, i: number) =>
      assertNumberInRange(
        `modulation.cellVoltages[${i}]`,
        voltage,
        DESIGN_BOUNDS['modulation.cellVoltages'],
      ),
    );
  }
  if (Array.isArray(modulation.eliminate)) {
    modulation.eliminate.forEach((order: unknown, i: number) => {
      assertNumberInRange(
        `modulation.eliminate[${i}]`,
        order,
        DESIGN_BOUNDS['modulation.eliminate'],
      );
      if (order % 2 === 0)
        throw new ParameterRangeError(
          `modulation.eliminate[${i}]`,
          'an odd order ≥ 3 (quarter-wave symmetry leaves no even harmonics)',
          order,
        );
    });
  }
  if (modulation.method === 'multilevel-carrier') {
    // The design's bounds first, then the topology's own levels and carriers (multilevelCarrier's
    // assertion, with the DC bus and frequency ratio the design supplies).
    check('modulation.levels', modulation.levels);
    if (modulation.phaseCount !== undefined) check('modulation.phaseCount', modulation.phaseCount);
    const mf = designFrequencyRatio(value as unknown as InverterDesign);
    withFieldPrefix('modulation.', () =>
      assertMultilevelCarrierOptions({ ...modulation, vdc: value.vdc, mf }),
    );
  }
  if (modulation.method === 'multilevel-space-vector' && modulation.topology !== undefined)
    assertOneOf('modulation.topology', modulation.topology, THREE_LEVEL_SPACE_VECTOR_TOPOLOGIES);
  assertDesignLoad(value.load, check);
  assertDesignFilter(value.filter, check);
  assertDesignGrid(value, check);
}

function assertDesignGrid(
  design: Record<string, unknown>,
  check: (field: DesignBoundsField, entry: unknown) => void,
): void {
  const grid = design.grid;
  if (grid === undefined || grid === null) return;
  if (typeof grid !== 'object') throw new ParameterTypeError('grid', 'an object or null', grid);
  if (design.load !== undefined && design.load !== null)
    throw new ParameterRangeError(
      'load',
      'left out or null with a grid (the grid is what the bridge feeds)',
      design.load,
    );
  const { lineVoltage, phase, r, l, l2, controlBandwidth, generation } = grid as Record<
    string,
    unknown
  >;
  check('grid.lineVoltage', lineVoltage);
  if (phase !== undefined) check('grid.phase', phase);
  check('grid.r', r);
  check('grid.l', l);
  check('grid.l2', l2);
  if (controlBandwidth !== undefined) check('grid.controlBandwidth', controlBandwidth);
  if (generation !== undefined && typeof generation !== 'boolean')
    throw new ParameterTypeError('grid.generation', 'true or false', generation);
}

function assertDesignLoad(
  load: unknown,
  check: (field: DesignBoundsField, entry: unknown) => void,
): void {
  if (load === undefined || load === null) return;
  if (typeof load !== 'object') throw new ParameterTypeError('load', 'an object or null', load);
  const { r, l, emf } = load as Record<string, unknown>;
  check('load.r', r);
  check('load.l', l);
  if (emf === undefined) return;
  if (typeof emf !== 'object' || emf === null)
    throw new ParameterTypeError('load.emf', 'an object { amplitude, phase }', emf);
  const { amplitude, phase } = emf as Record<string, unknown>;
  check('load.emf.amplitude', amplitude);
  check('load.emf.phase', phase);
}

function assertDesignFilter(
  filter: unknown,
  check: (field: DesignBoundsField, entry: unknown) => void,
): void {
  if (filter === undefined || filter === null) return;
  if (typeof filter !== 'object')
    throw new ParameterTypeError('filter', 'an object or null', filter);
  const { l, c, rDamping, dampingPlacement, cDamping } = filter as Record<string, unknown>;
  check('filter.l', l);
  check('filter.c', c);
  if (rDamping !== undefined) check('filter.rDamping', rDamping);
  if (dampingPlacement !== undefined)
    assertOneOf('filter.dampingPlacement', dampingPlacement, DAMPING_PLACEMENTS);
  if (cDamping !== undefined) check('filter.cDamping', cDamping);
  if ('loadR' in filter)
    throw new ParameterRangeError(
      'filter.loadR',
      "left out (the design's load is the filter's load)",
      (filter as Record<string, unknown>).loadR,
    );
}
