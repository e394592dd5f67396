import { assertNumberInRange, assertOneOf } from '../validation/assertions.js';
import type { Waveform } from '../waveform/Waveform.js';
import { buildSheWaveform } from './buildSheWaveform.js';
import { SHE_KINDS, type SheKind } from './SheKind.js';
import { assertFirstQuarterAngles } from './validateShe.js';

/** Options of {@link sheWaveform}. */
export interface SheWaveformOptions {
  /** Pattern family, see {@link SheKind}. */
  kind: SheKind;
  /** DC source voltage in volts (> 0): the bipolar level, or the step of each staircase cell. */
  vdc: number;
}

/**
 * The full-period {@link Waveform} of a quarter-wave symmetric pattern from its first-quarter
 * switching angles, exact.
 *
 * Conventions ({@link SheKind}): on (α_j, α_{j+1}) with α₀ = 0 the level is
 * `s·(−1)^j·vdc` (bipolar, s = (−1)^N so that +vdc is held next to θ = π/2) or `j·vdc`
 * (staircase); the second quarter mirrors the first about π/2 and the second half-period is
 * the negative of the first. The fundamental is then in phase with sin θ.
 *
 * @param angles - first-quarter angles in radians, strictly ascending in (0, π/2)
 * @throws ParameterRangeError for angles outside (0, π/2) or not ascending, or vdc ≤ 0
 */
export function sheWaveform(angles: readonly number[], options: SheWaveformOptions): Waveform {
  const { kind, vdc } = options;
  assertOneOf('kind', kind, SHE_KINDS);
  assertNumberInRange('vdc', vdc, { min: 0, minExclusive: true });
  assertFirstQuarterAngles('angles', angles);
  return buildSheWaveform(kind, vdc, angles);
}
