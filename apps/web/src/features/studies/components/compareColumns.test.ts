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

  it('the filter resonance column gives a grid design’s LCL resonance, marked as such, and an LC design its LC one', () => {
    const column = COLUMNS.find((c) => c.heading === 'Filter resonance (Hz)');
    const row = { carrierFrequency: 10_000, factor: 1 } as ConditionedRow;
    const lcl: InverterDesign = {
      vdc: 700,
      fundamentalFrequency: 50,
      carrierFrequency: 10_000,
      modulation: { method: 'three-phase', ma: 1, zeroSequence: 'third-harmonic' },
      filter: { l: 2e-3, c: 10e-6, rDamping: 2 },
      grid: { lineVoltage: 400, r: 0.05, l: 0.2e-3, l2: 0.5e-3 },
    };
    // (1/2π)·√((L1 + L2')/(L1·L2'·C)), L2' = 0.7 mH: 2210 Hz (Liserre, Blaabjerg and Hansen,
    // 2005); L1 with C alone 1/(2π√(LC)) = 1125 Hz (hand-worked); 10 kHz/2210 Hz = 4.524.
    const grid = analyseDesign(lcl, { points: 64 });
    expect(column?.cell(grid, row)).toBe('2210 (LCL)');
    expect(column?.value?.(grid, row)).toBeCloseTo(2210.2, 1);
    expect(column?.title?.(grid, row)).toBe('LCL resonance; carrier 4.524× above it');
    const { grid: _grid, ...alone } = lcl;
    const lc = analyseDesign({ ...alone, load: { r: 10, l: 0 } }, { points: 64 });
    expect(column?.cell(lc, row)).toBe('1125');
  });
});
