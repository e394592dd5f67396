import { assertCascadedCells } from './assertCascadedCells.js';
import { buildCascadedPattern } from './buildCascadedPattern.js';
import type { CascadedCellPattern, CascadedPatternWaveforms } from './CascadedCellPattern.js';

/** Options of {@link cascadedPatternWaveform}. */
export interface CascadedPatternOptions {
  /** The cells of the string, 1..16, each with its own pattern and DC source. */
  cells: CascadedCellPattern[];
}

/**
 * The exact waveforms of a cascaded H-bridge string whose cells each run their own
 * quarter-wave symmetric pattern (bipolar ±vdc or unipolar +vdc/0/−vdc from first-quarter
 * angles; conventions in `CascadedCellKind`): each cell's output, and the string's output,
 * their sum (cells in series; Holmes and Lipo, *Pulse Width Modulation for Power Converters*,
 * 2003, ch. 11, for the cascaded bridge). Angles are radians of the fundamental; volts.
 *
 * @throws ParameterRangeError / ParameterTypeError naming the field (`cells.length`,
 *   `cells[i].kind`, `cells[i].vdc`, `cells[i].angles[k]`) and its allowed range
 */
export function cascadedPatternWaveform(options: CascadedPatternOptions): CascadedPatternWaveforms {
  const { cells } = options;
  assertCascadedCells('cells', cells);
  return buildCascadedPattern(cells);
}
