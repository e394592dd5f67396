import { analyseDesign, type InverterDesign } from '@pulsewright/modulation';
import { describe, expect, it } from 'vitest';
import { COLUMNS } from './compareColumns';
import type { ConditionedRow } from './useEqualConditions';

const design: InverterDesign = {
  vdc: 600,
  fundamentalFrequency: 37,
  carrierFrequency: 1000,
  modulation: { method: 'three-phase', ma: 0.8 },
  load: { r: 4, l: 0.012 },
};

describe('Compare columns', () => {
  it('the mf column states a span ratio as p/q and a whole one as its number', () => {
    const mf = COLUMNS.find((c) => c.heading === 'mf');
    const row = { carrierFrequency: 1000, factor: 1 } as ConditionedRow;
    const span = analyseDesign(design, { maxOrder: 50, points: 64 });
    expect(mf?.cell(span, row)).toBe('1000/37');
    expect(mf?.value?.(span, row)).toBeCloseTo(1000 / 37, 12);
    expect(mf?.title?.(span, row)).toContain('figures over 37 fundamental periods');
    const whole = analyseDesign(
      { ...design, carrierFrequency: 37 * 27 },
      { maxOrder: 50, points: 64 },
    );
    expect(mf?.cell(whole, row)).toBe('27');
  });
});
