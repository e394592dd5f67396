import { analyseDesign } from '@pulsewright/modulation';
import { describe, expect, it } from 'vitest';
import { defaultDraft, designOf, draftOf } from './studyDraft';

describe('a study draft with a grid (issue 12, capability 6)', () => {
  const draft = {
    ...defaultDraft('p'),
    method: 'three-phase' as const,
    vdc: 700,
    carrierFrequency: 10_000,
    ma: 1,
    filterOn: true,
    filterL: 2e-3,
    filterC: 10e-6,
    filterR: 2,
    gridOn: true,
    gridLineVoltage: 400,
    gridPhase: -0.1,
    gridL2: 0.5e-3,
  };

  it('sends the grid in place of the load, and reads it back', () => {
    const design = designOf(draft);
    expect(design.load).toBeNull();
    expect(design.grid).toEqual({ lineVoltage: 400, phase: -0.1, r: 0.05, l: 0.0002, l2: 0.0005 });
    const back = draftOf(design, { name: 'g', projectId: 'p' });
    expect(back).toMatchObject({
      gridOn: true,
      gridLineVoltage: 400,
      gridPhase: -0.1,
      loadOn: false,
    });
    // The library analyses it: the grid figures are there.
    expect(analyseDesign(design, { points: 256 }).grid).not.toBeNull();
  });

  it('sends grid.generation only when the bridge draws power, and reads it back', () => {
    expect('generation' in designOf(draft).grid!).toBe(false); // the library's default, true
    const drawing = designOf({ ...draft, gridGeneration: false });
    expect(drawing.grid?.generation).toBe(false);
    expect(draftOf(drawing, { name: 'g', projectId: 'p' }).gridGeneration).toBe(false);
    expect(draftOf(designOf(draft), { name: 'g', projectId: 'p' }).gridGeneration).toBe(true);
    // IEEE Std 519-2022 Table 2 (from memory): the row of the design's own I_SC/I_L, not the first.
    const { ieee519 } = analyseDesign(drawing, { points: 256 }).grid!.limits;
    expect(ieee519.row.byGenerationRule).toBe(false);
  });

  it('sends a control bandwidth only when one is set, and no grid when it is off', () => {
    expect(designOf({ ...draft, gridControlBandwidth: 800 }).grid?.controlBandwidth).toBe(800);
    const off = designOf({ ...draft, gridOn: false });
    expect('grid' in off).toBe(false);
    expect(off.load).not.toBeNull();
  });
});
