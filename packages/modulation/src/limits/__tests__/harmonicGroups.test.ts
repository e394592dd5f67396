import { describe, expect, it } from 'vitest';
import { rangeErrorField } from '../../testing/rangeErrorField.js';
import { checkGridCurrentLimits } from '../checkGridCurrentLimits.js';
import { harmonicGroups } from '../harmonicGroups.js';

// IEC 61000-4-7's harmonic group (recalled from memory, not checked against the standard's
// text): every component within half an order of harmonic h belongs to group h, a component
// exactly midway gives half its square to each neighbour, G_h = √(Σ share·A²).
describe('harmonicGroups (IEC 61000-4-7 harmonic groups, from memory)', () => {
  // A hand-made spectrum at thirds and halves of the fundamental, peak amperes.
  const spectrum = [
    { order: 0, amplitude: 9, phase: 0 },
    { order: 1 / 3, amplitude: 7, phase: 0 },
    { order: 2 / 3, amplitude: 0.6, phase: 0 },
    { order: 1, amplitude: 100, phase: 0.2 },
    { order: 4 / 3, amplitude: 0.8, phase: 0 },
    { order: 2.5, amplitude: 2, phase: 0 },
    { order: 3, amplitude: 3, phase: 0.5 },
    { order: 10 / 3, amplitude: 4, phase: 0 },
    { order: 4.75, amplitude: 1, phase: 0 },
    { order: 5, amplitude: 0, phase: 0 },
  ];
  const groups = harmonicGroups(spectrum, { maxOrder: 5 });

  it('assigns each component to the nearest harmonic and splits a midway one', () => {
    expect(groups.map((g) => g.order)).toEqual([1, 2, 3, 4, 5]);
    // Group 1: 100 at 1, 0.6 at 2/3, 0.8 at 4/3; 7 at 1/3 is nearer 0 (no group).
    expect(groups[0]?.amplitude).toBeCloseTo(Math.sqrt(100 ** 2 + 0.6 ** 2 + 0.8 ** 2), 12);
    expect(groups[0]?.harmonicAmplitude).toBe(100);
    expect(groups[0]?.phase).toBe(0.2);
    // Group 2: half of 2.5's square; group 3: the other half, 3 at 3 and 4 at 10/3.
    expect(groups[1]?.amplitude).toBeCloseTo(Math.sqrt(2 ** 2 / 2), 12);
    expect(groups[1]?.harmonicAmplitude).toBe(0);
    expect(groups[2]?.amplitude).toBeCloseTo(Math.sqrt(2 ** 2 / 2 + 3 ** 2 + 4 ** 2), 12);
    expect(groups[2]?.grouped).toEqual([
      { order: 2.5, amplitude: 2, share: 0.5 },
      { order: 10 / 3, amplitude: 4, share: 1 },
    ]);
    // 4.75 is nearer 5 than 4.
    expect(groups[3]?.amplitude).toBe(0);
    expect(groups[4]?.amplitude).toBe(1);
    expect(groups[4]?.grouped).toEqual([{ order: 4.75, amplitude: 1, share: 1 }]);
  });

  it('keeps the total: the groups and the ungrouped part below ½ hold every square (Parseval)', () => {
    const total = spectrum.reduce((s, h) => s + h.amplitude ** 2, 0);
    const grouped = groups.reduce((s, g) => s + g.amplitude ** 2, 0);
    expect(grouped + 9 ** 2 + 7 ** 2).toBeCloseTo(total, 9);
  });

  it('gives a whole-order spectrum its own amplitudes, nothing grouped', () => {
    const whole = [0, 1, 2, 3].map((order) => ({ order, amplitude: order + 0.5, phase: 0 }));
    const g = harmonicGroups(whole, { maxOrder: 3 });
    expect(g.map((x) => x.amplitude)).toEqual([1.5, 2.5, 3.5]);
    expect(g.every((x) => x.grouped.length === 0)).toBe(true);
  });

  it('feeds the whole-order limit check, an interharmonic failing its group', () => {
    // IEEE Std 1547-2018 (from memory): 4 % for orders below 11 at odd orders. 5 A at 3⅓ of a
    // 100 A fundamental makes group 3 5 %, which fails; checked by whole order it would pass.
    const groupsOf = harmonicGroups(
      [
        { order: 1, amplitude: 100, phase: 0 },
        { order: 10 / 3, amplitude: 5, phase: 0 },
        ...Array.from({ length: 50 }, (_, k) => ({ order: k + 2, amplitude: 0, phase: 0 })),
      ],
      { maxOrder: 50 },
    );
    const check = checkGridCurrentLimits(groupsOf, {
      standard: 'ieee-1547',
      referenceCurrent: 100,
      shortCircuitRatio: 20,
      totalWholeWaveform: 0.05,
    });
    expect(check.table.find((r) => r.order === 3)?.ratio).toBeCloseTo(0.05, 12);
    expect(check.violations.map((v) => v.order)).toContain(3);
  });

  it('names maxOrder when it is no whole number ≥ 1', () => {
    expect(rangeErrorField(() => harmonicGroups(spectrum, { maxOrder: 0 }))).toBe('maxOrder');
    expect(rangeErrorField(() => harmonicGroups(spectrum, { maxOrder: 2.5 }))).toBe('maxOrder');
  });
});
