import { analyseDesign, solveShe, type InverterDesign } from '@pulsewright/modulation';
import { describe, expect, it } from 'vitest';
import { designOf, draftOf } from './studyDraft';

describe('a stored staircase of unequal cell sources in the study editor (issue 13)', () => {
  // Three cascaded cells on invented sources, solved to remove the 5th and 7th (Tolbert,
  // Chiasson, Du and McKenzie, IEEE Trans. Ind. Appl., 2005, from memory).
  const cellVoltages = [430, 385, 360];
  const fundamental = 0.8 * ((4 * (430 + 385 + 360)) / Math.PI);
  const solved = solveShe({
    kind: 'staircase',
    vdc: 400,
    count: 3,
    eliminate: [5, 7],
    fundamental,
    cellVoltages,
  });
  const design: InverterDesign = {
    vdc: 400,
    fundamentalFrequency: 50,
    modulation: {
      method: 'selective-harmonic-elimination',
      kind: 'staircase',
      angles: solved.angles,
      cellVoltages,
      eliminate: [5, 7],
      fundamental,
    },
  };

  it('keeps the cell sources through the editor, so the saved figures stay those of the solve', () => {
    const back = designOf(draftOf(design, { name: 'x', note: '', projectId: 'p' }));
    expect(back.modulation).toEqual(design.modulation);
    // The report of what the editor would save: the solved fundamental, the 5th and 7th gone
    // (below 1e-9 of the fundamental on the exact spectrum).
    const report = analyseDesign(back, { maxOrder: 50 });
    expect(Math.abs(report.bridge.fundamental - fundamental)).toBeLessThan(1e-9 * fundamental);
    for (const order of [5, 7]) {
      const h = report.bridge.spectrum.find((x) => x.order === order);
      expect(h?.amplitude ?? NaN).toBeLessThan(1e-9 * fundamental);
    }
  });
});
