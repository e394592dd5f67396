import { TAU, wrapAngle } from '../../math.js';
import { assertNumberInRange } from '../../validation/assertions.js';

/**
 * Internal: the carrier periods of one fundamental period, valley to valley of the carrier that
 * `multilevelCarrier` uses (x = mf·(θ − π/2) − carrierPhase, valleys at x = 2πk): `mf` windows of
 * 2π/mf, window j starting at `starts[j]` (wrapped into [0, 2π); the last may wrap past 2π).
 * Valley-to-valley windows hold whole pulses of every level-shifted and phase-shifted carrier.
 * @throws ParameterRangeError naming `mf` (an integer in [1, 10000]) or `carrierPhase`
 */
export function carrierWindows(
  mf: unknown,
  carrierPhase: unknown = 0,
): { starts: number[]; centres: number[]; indexOf: (angle: number) => number } {
  assertNumberInRange('mf', mf, { min: 1, max: 10_000, integer: true });
  assertNumberInRange('carrierPhase', carrierPhase, { min: -1e6, max: 1e6 });
  const width = TAU / mf;
  const first = wrapAngle(Math.PI / 2 + carrierPhase / mf) % width;
  const starts = Array.from({ length: mf }, (_, j) => first + j * width);
  return {
    starts,
    centres: starts.map((s) => wrapAngle(s + width / 2)),
    indexOf: (angle) => Math.min(mf - 1, Math.floor(wrapAngle(angle - first) / width)),
  };
}
