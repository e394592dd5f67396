import { describe, expect, it } from 'vitest';
import { GRID_TIED_DESIGN } from '../../testing/gridTiedDesign.js';
import { generationRowReason } from '../../limits/generationRowReason.js';
import { ParameterTypeError } from '../../validation/errors.js';
import { analyseDesign } from '../analyseDesign.js';
import { describeGridConnection } from '../describeGridConnection.js';

// IEEE Std 519-2022 Table 2 (recalled from memory, as the library's table): TDD limits 5 %, 8 %,
// 12 %, 15 % and 20 % for I_SC/I_L < 20, 20–50, 50–100, 100–1000 and > 1000; a footnote holds
// power-generation equipment to the first row whatever its actual ratio.
const design = GRID_TIED_DESIGN;
const grid = design.grid!;

describe('grid.generation: which IEEE 519 row a grid design is read on', () => {
  const generating = analyseDesign(design).grid!.limits;
  const drawing = analyseDesign({ ...design, grid: { ...grid, generation: false } }).grid!.limits;

  it('reads a generating bridge (the default) on the first row, whatever I_SC/I_L', () => {
    // I_SC = (400/√3 V)/|0.05 + j·2π·50·0.2e-3 Ω| ≈ 2.88 kA against about 35 A rms: ratio ≈ 83.
    expect(generating.ieee519.shortCircuitRatio).toBeGreaterThan(50);
    expect(generating.ieee519.shortCircuitRatio).toBeLessThan(100);
    expect(generating.ieee519.row).toEqual({ label: 'I_SC/I_L < 20', byGenerationRule: true });
    expect(generating.ieee519.totalLimit).toBe(0.05);
  });

  it('reads a bridge that draws power (generation false) on the row of its own ratio', () => {
    expect(drawing.ieee519.shortCircuitRatio).toBe(generating.ieee519.shortCircuitRatio);
    expect(drawing.ieee519.row).toEqual({
      label: '50 < I_SC/I_L < 100',
      byGenerationRule: false,
    });
    expect(drawing.ieee519.totalLimit).toBe(0.12);
    // The same current, measured the same way, against the looser row.
    expect(drawing.ieee519.total).toBe(generating.ieee519.total);
    expect(generationRowReason(drawing.ieee519.row, drawing.ieee519.shortCircuitRatio)).toBeNull();
    // The printed verdict names the row and says nothing of generating equipment.
    const drawingDesign = { ...design, grid: { ...grid, generation: false } };
    const [drawn] = describeGridConnection(
      drawingDesign,
      analyseDesign(drawingDesign).grid,
    )!.verdicts;
    const [generated] = describeGridConnection(design, analyseDesign(design).grid)!.verdicts;
    expect(generated).toContain('the row for generating equipment');
    expect(drawn).toContain('(50 < I_SC/I_L < 100)');
    expect(drawn).not.toContain('generating equipment');
  });

  it('leaves IEEE 1547 as it was (its limits do not depend on the ratio)', () => {
    expect(drawing.ieee1547).toEqual(generating.ieee1547);
  });

  it('refuses anything but true or false, naming grid.generation', () => {
    const bad = { ...design, grid: { ...grid, generation: 'yes' as unknown as boolean } };
    expect(() => analyseDesign(bad)).toThrow(ParameterTypeError);
    expect(() => analyseDesign(bad)).toThrow(/grid\.generation/);
  });
});
