import { analyseDesign, generationRowReason, type InverterDesign } from '@pulsewright/modulation';
import { describe, expect, it } from 'vitest';
import { formatNumber, formatPercent } from '../../../lib/format';
import { reportFigures } from './reportFigures';

// Invented values: a 400 V, 50 Hz grid fed through an LCL filter from 700 V at 10 kHz.
const design: InverterDesign = {
  vdc: 700,
  fundamentalFrequency: 50,
  carrierFrequency: 10_000,
  modulation: { method: 'three-phase', ma: 1, zeroSequence: 'third-harmonic' },
  filter: { l: 2e-3, c: 10e-6, rDamping: 2 },
  grid: { lineVoltage: 400, phase: -0.1, r: 0.05, l: 0.2e-3, l2: 0.5e-3 },
};

describe('reportFigures with a grid', () => {
  it('shows the grid current THD with both verdicts, and names the load current the grid current', () => {
    const report = analyseDesign(design, { points: 256 });
    const figures = reportFigures(report);
    const grid = figures.find((f) => f.label === 'Grid current THD');
    expect(grid?.value).toBe(formatPercent(report.grid!.gridCurrentThd));
    expect(grid?.note).toContain('IEEE Std 519-2022');
    expect(grid?.note).toContain('IEEE Std 1547-2018');
    expect(grid?.note).toContain('recalled from memory');
    expect(figures.some((f) => f.label === 'Grid current')).toBe(true);
    expect(figures.some((f) => f.label === 'Load current')).toBe(false);
    // The report's load power is then the grid's r's: P = 3·I_rms²·r over the grid current
    // (Joule's law; three phases alike), not a load's.
    expect(figures.some((f) => f.label === 'Load power')).toBe(false);
    const loss = figures.find((f) => f.label === 'Grid resistance loss');
    expect(loss?.note).toBe('into the grid’s series resistance r, all three phases');
    const gridRms = report.currents[0]!.load!.rms;
    expect(report.loadPower!).toBeCloseTo(3 * gridRms * gridRms * 0.05, 6);
  });

  it('says on the THD card why IEEE 519’s first row was read when the generation footnote chose it', () => {
    const report = analyseDesign(design, { points: 256 });
    const { ieee519 } = report.grid!.limits;
    // I_SC = (400/√3 V)/|0.05 + j·2π·50·0.2e-3 Ω| ≈ 2.9 kA against tens of amperes of grid
    // current: a ratio far above 20, yet IEEE 519-2022's footnote puts generating equipment on
    // the < 20 row (from memory), so the card carries the library's sentence saying so.
    expect(ieee519.shortCircuitRatio).toBeGreaterThan(20);
    const reason = generationRowReason(ieee519.row, ieee519.shortCircuitRatio);
    expect(reason).toContain('the table’s footnote applies it to generating equipment');
    const card = reportFigures(report).find((f) => f.label === 'Grid current THD');
    expect(card?.note).toContain(reason!);
  });

  it('shows the LCL resonance, named as such, with its distances from the carrier and the control bandwidth, not the L1–C one', () => {
    const report = analyseDesign(
      { ...design, grid: { ...design.grid!, controlBandwidth: 1000 } },
      { points: 256 },
    );
    const figures = reportFigures(report);
    expect(figures.map((f) => f.label)).not.toContain('Filter resonance');
    const card = figures.find((f) => f.label === 'LCL resonance');
    // (1/2π)·√((L1 + L2')/(L1·L2'·C)), L2' = l2 + l = 0.7 mH (Liserre, Blaabjerg and Hansen,
    // 2005): 2210 Hz, where L1 with C alone would be 1125 Hz; 10 kHz/2210 Hz = 4.524 and
    // 2210 Hz/1000 Hz = 2.21 (hand-worked).
    expect(card?.value).toBe(`${formatNumber(2210.2)} Hz`);
    expect(card?.note).toContain('carrier 4.524× above it; 2.21× the control bandwidth');
  });

  it('keeps an LC-filtered design (no grid) on its filter resonance 1/(2π√(LC)), 1125 Hz', () => {
    const { grid: _grid, ...alone } = design;
    const figures = reportFigures(
      analyseDesign({ ...alone, load: { r: 10, l: 0 } }, { points: 256 }),
    );
    expect(figures.find((f) => f.label === 'Filter resonance')?.value).toBe(
      `${formatNumber(1125.4)} Hz`,
    );
    expect(figures.map((f) => f.label)).not.toContain('LCL resonance');
  });

  it('says a span’s limits were read on harmonic groups (60 Hz at 10 kHz: 500/3), and a whole mf’s not', () => {
    const report = analyseDesign({ ...design, fundamentalFrequency: 60 }, { points: 256 });
    expect(report.carrierSpan?.q).toBe(3);
    const note = reportFigures(report).find((f) => f.label === 'Grid current THD')?.note;
    expect(note).toContain(
      'read on IEC 61000-4-7 harmonic groups of the span’s components, from memory: confirm with the standard and the utility',
    );
    const whole = reportFigures(analyseDesign(design, { points: 256 }));
    expect(whole.find((f) => f.label === 'Grid current THD')?.note).not.toContain('IEC 61000-4-7');
  });

  it('has no grid card without a grid', () => {
    const { grid: _grid, ...alone } = design;
    expect(reportFigures(analyseDesign(alone, { points: 256 })).map((f) => f.label)).not.toContain(
      'Grid current THD',
    );
  });
});
