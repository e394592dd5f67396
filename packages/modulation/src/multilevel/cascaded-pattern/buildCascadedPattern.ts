/** Builds the waveforms of a cascaded string of cell patterns (internal; see cascadedPatternWaveform). */
import { buildSheWaveform } from '../../she/buildSheWaveform.js';
import { quarterWaveWaveform } from '../../she/quarterWaveWaveform.js';
import { combineWaveforms } from '../../waveform/combineWaveforms.js';
import type { Waveform } from '../../waveform/Waveform.js';
import type { CascadedCellPattern, CascadedPatternWaveforms } from './CascadedCellPattern.js';

/** {@link cascadedPatternWaveform} without validation, for callers that have validated already. */
export function buildCascadedPattern(
  cells: readonly CascadedCellPattern[],
): CascadedPatternWaveforms {
  const waveforms = cells.map(cellWaveform);
  return {
    output: combineWaveforms(waveforms, (levels) => levels.reduce((sum, v) => sum + v, 0)),
    cells: waveforms.map((waveform, c) => ({ name: `cell ${c + 1}`, waveform })),
  };
}

function cellWaveform({ kind, vdc, angles }: CascadedCellPattern): Waveform {
  if (kind === 'bipolar') return buildSheWaveform('bipolar', vdc, angles);
  return quarterWaveWaveform(angles, (j) => (j % 2 === 1 ? vdc : 0));
}
