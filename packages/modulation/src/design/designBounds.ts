import type { NumberBounds } from '../validation/assertions.js';

/** The largest frequency ratio a design may have: bounds the cost of one analysis (about 4·mf edges a leg). */
export const MAX_DESIGN_FREQUENCY_RATIO = 1000;

/**
 * The largest denominator q of a design's frequency ratio p/q: a carrier frequency that is no
 * ratio p/q with q up to this is approximated by the nearest one that is (designRationalRatio).
 */
export const MAX_DESIGN_FUNDAMENTAL_PERIODS = 64;

/** The most first-quarter angles a stored pattern may hold. */
export const MAX_PATTERN_ANGLES = 31;

/**
 * The allowed range of every numeric field of an {@link InverterDesign}, by its path. The API's
 * schema and the dashboard's forms take their bounds from here (a test compares the schema with
 * it). Units: volts, hertz, radians, ohms, henries, farads.
 */
export const DESIGN_BOUNDS = {
  vdc: { min: 0, minExclusive: true, max: 100_000 },
  fundamentalFrequency: { min: 0.001, max: 100_000 },
  carrierFrequency: { min: 0.001, max: 100_000_000 },
  'modulation.ma': { min: 0, minExclusive: true, max: 4 },
  'modulation.m': { min: 0, minExclusive: true, max: (2 * Math.sqrt(3)) / Math.PI },
  'modulation.carrierPhase': { min: -2 * Math.PI, max: 2 * Math.PI },
  'modulation.zeroSplit': { min: 0, max: 1 },
  'modulation.angles': { min: 0, minExclusive: true, max: Math.PI / 2, maxExclusive: true },
  'modulation.eliminate': { min: 3, max: 199, integer: true },
  'modulation.fundamental': { min: 0, minExclusive: true, max: 1_000_000 },
  // A staircase's cell sources, volts: each as the DC bus.
  'modulation.cellVoltages': { min: 0, minExclusive: true, max: 100_000 },
  // Multilevel: the levels of any topology (each topology's own range in MULTILEVEL_LEVEL_BOUNDS),
  // and the phase count (1 or 3; the schema states the two values).
  'modulation.levels': { min: 3, max: 17, integer: true },
  'modulation.phaseCount': { min: 1, max: 3, integer: true },
  'modulation.smallVectorSplit': { min: 0, max: 1 },
  'load.r': { min: 1e-6, max: 1_000_000 },
  'load.l': { min: 0, max: 100 },
  'load.emf.amplitude': { min: 0, max: 100_000 },
  'load.emf.phase': { min: -2 * Math.PI, max: 2 * Math.PI },
  'filter.l': { min: 1e-9, max: 100 },
  'filter.c': { min: 1e-12, max: 1 },
  'filter.rDamping': { min: 0, max: 1_000_000 },
  'filter.cDamping': { min: 1e-12, max: 1 },
  'grid.lineVoltage': { min: 0, minExclusive: true, max: 1_000_000 },
  'grid.phase': { min: -2 * Math.PI, max: 2 * Math.PI },
  'grid.r': { min: 1e-6, max: 1_000_000 },
  'grid.l': { min: 0, max: 100 },
  'grid.l2': { min: 0, max: 100 },
  'grid.controlBandwidth': { min: 0.001, max: 100_000_000 },
} as const satisfies Record<string, NumberBounds>;

/** A path of {@link DESIGN_BOUNDS}. */
export type DesignBoundsField = keyof typeof DESIGN_BOUNDS;
