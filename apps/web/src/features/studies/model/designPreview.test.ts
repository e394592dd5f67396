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

  it('analyses a carrier that is not a whole multiple over its span, with a filter too, and names a costly one', () => {
    // 1051 Hz over 50 Hz is 1051/50: the library's report over 50 periods, its carrierSpan stated.
    const spanned = previewDesign(designOf({ ...defaultDraft(), carrierFrequency: 1051 }));
    expect(spanned.errors).toEqual([]);
    expect(spanned.report?.carrierSpan).toMatchObject({ p: 1051, q: 50 });
    // 1075/50 = 43/2 through the filter; 3000/37 would solve it to 821 orders over 37 periods.
    const filtered = previewDesign(
      designOf({ ...defaultDraft(), carrierFrequency: 1075, filterOn: true }),
    );
    expect(filtered.errors).toEqual([]);
    expect(filtered.report?.carrierSpan).toMatchObject({ p: 43, q: 2 });
    expect(filtered.report?.output?.spectrum[2]?.order).toBe(1);
    const { errors } = previewDesign(
      designOf({
        ...defaultDraft(),
        fundamentalFrequency: 37,
        carrierFrequency: 3000,
        filterOn: true,
      }),
    );
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
