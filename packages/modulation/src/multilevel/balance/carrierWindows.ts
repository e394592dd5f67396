import { TAU, wrapAngle } from '../../math.js';
import { assertNumberInRange } from '../../validation/assertions.js';

/** Internal: the carrier periods of one fundamental period (see {@link carrierWindows}). */
export interface CarrierWindows {
  /** Start of window j, wrapped into [0, 2π) (the last window may wrap past 2π). */
  starts: number[];
  /** The window that holds an angle. */
  indexOf: (angle: number) => number;
  /** Window indices in ascending order of their centre angles. */
  byCentre: number[];
  /** The centre angles in that order, ascending in [0, 2π). */
  centres: number[];
}

/** Internal: the options the charge figures share, checked. */
export interface ChargeOptions {
  windows: CarrierWindows;
  /** 2π·f₁, rad/s; null when `fundamentalFrequency` is not given (and not needed). */
  omega: number | null;
  capacitance: number | null;
}

/**
 * Internal: checks `mf`, `carrierPhase`, `fundamentalFrequency` (needed when `frequencyRequired`
 * or a `capacitance` is given) and `capacitance`, and builds the carrier periods of one
 * fundamental period, valley to valley of the carrier that `multilevelCarrier` uses
 * (x = mf·(θ − π/2) − carrierPhase, valleys at x = 2πk): `mf` windows of 2π/mf. Valley-to-valley
 * windows hold whole pulses of every level-shifted and phase-shifted carrier.
 * @throws ParameterRangeError / ParameterTypeError naming `mf` (an integer in [1, 10000]),
 *   `carrierPhase`, `fundamentalFrequency` or `capacitance`
 */
export function carrierWindows(
  options: {
    mf: unknown;
    carrierPhase?: unknown;
    fundamentalFrequency?: unknown;
    capacitance?: unknown;
  },
  frequencyRequired: boolean,
): ChargeOptions {
  const { mf, carrierPhase = 0, fundamentalFrequency, capacitance } = options;
  assertNumberInRange('mf', mf, { min: 1, max: 10_000, integer: true });
  assertNumberInRange('carrierPhase', carrierPhase, { min: -1e6, max: 1e6 });
  if (capacitance !== undefined) {
    assertNumberInRange('capacitance', capacitance, { min: 0, minExclusive: true, max: 1e3 });
  }
  let omega: number | null = null;
  if (frequencyRequired || capacitance !== undefined) {
    assertNumberInRange('fundamentalFrequency', fundamentalFrequency, {
      min: 0,
      minExclusive: true,
      max: 1e6,
    });
    omega = TAU * fundamentalFrequency;
  }
  const width = TAU / mf;
  const first = wrapAngle(Math.PI / 2 + carrierPhase / mf) % width;
  const starts = Array.from({ length: mf }, (_, j) => first + j * width);
  const byCentre = starts
    .map((start, j) => ({ centre: wrapAngle(start + width / 2), j }))
    .sort((x, y) => x.centre - y.centre);
  return {
    windows: {
      starts,
      indexOf: (angle) => Math.min(mf - 1, Math.floor(wrapAngle(angle - first) / width)),
      byCentre: byCentre.map((w) => w.j),
      centres: byCentre.map((w) => w.centre),
    },
    omega,
    capacitance: capacitance ?? null,
  };
}
