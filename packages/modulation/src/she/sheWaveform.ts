import { assertNumberInRange, assertOneOf } from '../validation/assertions.js';
import type { Waveform } from '../waveform/Waveform.js';
import { buildSheWaveform } from './buildSheWaveform.js';
import { SHE_KINDS, type SheKind } from './SheKind.js';
import { assertCellVoltages, assertFirstQuarterAngles } from './validateShe.js';

/** Options of {@link sheWaveform}. */
export interface SheWaveformOptions {
  /** Pattern family, see {@link SheKind}. */
  kind: SheKind;
  /** DC source voltage in volts (> 0): the bipolar level, or the step of each staircase cell. */
  vdc: number;
  /**
   * Staircase only: each cell's DC source voltage, volts (> 0), one per first-quarter angle, cell
   * k switching at angle k (cascaded cells on sources of different voltage, for example a PV
   * string per cell). The levels are then the partial sums 0, V₁, V₁ + V₂, …
   * @default every cell at vdc
   */
  cellVoltages?: number[];
}

/**
 * The full-period {@link Waveform} of a quarter-wave symmetric pattern from its first-quarter
 * switching angles, exact.
 *
 * Conventions ({@link SheKind}): on (α_j, α_{j+1}) with α₀ = 0 the level is
 * `s·(−1)^j·vdc` (bipolar, s = (−1)^N so that +vdc is held next to θ = π/2), `j·vdc`
 * (staircase) or V₁ + … + V_j (staircase of `cellVoltages`); the second quarter mirrors the first about π/2 and the second half-period is
 * the negative of the first. The fundamental is then in phase with sin θ.
 *
 * @param angles - first-quarter angles in radians, strictly ascending in (0, π/2)
 * @throws ParameterRangeError for angles outside (0, π/2) or not ascending, vdc ≤ 0, or
 *   `cellVoltages` with a bipolar kind, of a length other than the angles' or holding a value ≤ 0
 */
export function sheWaveform(angles: readonly number[], options: SheWaveformOptions): Waveform {
  const { kind, vdc, cellVoltages } = options;
  assertOneOf('kind', kind, SHE_KINDS);
  assertNumberInRange('vdc', vdc, { min: 0, minExclusive: true });
  assertFirstQuarterAngles('angles', angles);
  if (cellVoltages !== undefined)
    assertCellVoltages('cellVoltages', cellVoltages, kind, angles.length);
  return buildSheWaveform(kind, vdc, angles, cellVoltages);
}
