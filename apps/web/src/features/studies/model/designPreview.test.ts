import { analyseDesign } from '@pulsewright/modulation';
import { describe, expect, it } from 'vitest';
import { previewDesign } from './designPreview';
import { defaultDraft, designOf } from './studyDraft';

describe('previewDesign', () => {
  it('is the library report of the design, figure for figure', () => {
    const design = designOf({ ...defaultDraft(), filterOn: true });
    const { report, errors } = previewDesign(design);
    expect(errors).toEqual([]);
    expect(report).toEqual(analyseDesign(design));
  });

  it('names a refused field by its path in the design instead of drawing NaN', () => {
    const { report, errors } = previewDesign(designOf({ ...defaultDraft(), ma: Number.NaN }));
    expect(report).toBeNull();
    expect(errors).toHaveLength(1);
    expect(errors[0]?.field).toBe('modulation.ma');
    expect(errors[0]?.message).toMatch(/modulation\.ma/);
  });

  it('names the carrier when it is not a whole multiple of the fundamental', () => {
    const { errors } = previewDesign(designOf({ ...defaultDraft(), carrierFrequency: 1051 }));
    expect(errors.map((e) => e.field)).toEqual(['carrierFrequency']);
  });

  it('keeps the voltages when only the load or the filter is refused', () => {
    const { report, errors } = previewDesign(
      designOf({ ...defaultDraft(), loadR: 0, filterOn: true, filterC: -1 }),
    );
    expect(errors.map((e) => e.field).sort()).toEqual(['filter.c', 'load.r']);
    expect(report?.bridge.spectrum.length).toBeGreaterThan(0);
    expect(report?.currents).toEqual([]);
    expect(report?.output).toBeNull();
  });

  it('keeps the report when only the bus voltage of the limit check is refused', () => {
    const design = designOf(defaultDraft());
    const { report, errors } = previewDesign(design, { busVoltage: -5 });
    expect(errors.map((e) => e.field)).toEqual(['busVoltage']);
    // The report is the library's with the refused option left out, figure for figure.
    expect(report).toEqual(analyseDesign(design));
  });
});
