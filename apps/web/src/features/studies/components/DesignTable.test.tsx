import { analyseDesign, type InverterDesign } from '@pulsewright/modulation';
import { render, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { DesignTable } from './DesignTable';

// Invented values: a 400 V, 50 Hz grid fed through an LCL filter from 700 V at 10 kHz (mf 200).
const design: InverterDesign = {
  vdc: 700,
  fundamentalFrequency: 50,
  carrierFrequency: 10_000,
  modulation: { method: 'three-phase', ma: 1, zeroSequence: 'third-harmonic' },
  filter: { l: 2e-3, c: 10e-6, rDamping: 2 },
  grid: { lineVoltage: 400, r: 0.05, l: 0.2e-3, l2: 0.5e-3 },
};

/** The table's rows as label → values (a label may repeat: one verdict a standard). */
function rowsOf(): Map<string, string[]> {
  const rows = new Map<string, string[]>();
  for (const row of within(screen.getByRole('table', { name: 'Design' })).getAllByRole('row')) {
    const label = within(row).getByRole('rowheader').textContent ?? '';
    rows.set(label, [...(rows.get(label) ?? []), within(row).getByRole('cell').textContent ?? '']);
  }
  return rows;
}

describe('DesignTable (the printed report’s design)', () => {
  it('lists a grid-tied design’s grid, impedance and LCL, never “Load: none”, before the report arrives', () => {
    render(<DesignTable design={design} grid={undefined} />);
    const rows = rowsOf();
    expect(rows.has('Load')).toBe(false);
    expect(rows.has('LC filter')).toBe(false);
    expect(rows.get('Grid')).toEqual(['400 V rms line to line, 50 Hz, phase a at 0°']);
    expect(rows.get('Grid impedance per phase (star)')).toEqual(['R 0.05 Ω, L 0.2 mH']);
    expect(rows.get('LCL filter per phase (star)')).toEqual(['L1 2 mH, C 10 µF, L2 0.5 mH']);
    expect(rows.get('Filter damping')?.[0]).toMatch(/^2 Ω/);
    expect(rows.has('Grid current')).toBe(false);
  });

  it('with the report adds I_SC and I_SC/I_L, the LCL resonance, both standards’ verdicts on the grid current and the from-memory caution', () => {
    const grid = analyseDesign(design, { points: 256 }).grid!;
    render(<DesignTable design={design} grid={grid} />);
    const rows = rowsOf();
    // I_SC = V_ph/|r + jω₁l| = (400/√3)/|0.05 + j·0.06283| = 2876 A rms (hand-worked).
    expect(rows.get('Grid impedance per phase (star)')?.[0]).toContain(
      'short-circuit current 2876 A rms, I_SC/I_L',
    );
    // (1/2π)·√((L1 + L2')/(L1·L2'·C)) = 2210 Hz (Liserre, Blaabjerg and Hansen, 2005).
    expect(rows.get('LCL filter per phase (star)')?.[0]).toContain('resonance 2210 Hz');
    const verdicts = rows.get('Grid current') ?? [];
    expect(verdicts).toHaveLength(2);
    expect(verdicts[0]).toMatch(
      new RegExp(
        `^IEEE Std 519-2022 .*: ${grid.limits.ieee519.pass ? 'within' : 'over'} the limits; TDD`,
      ),
    );
    expect(verdicts[1]).toMatch(
      new RegExp(
        `^IEEE Std 1547-2018 .*: ${grid.limits.ieee1547.pass ? 'within' : 'over'} the limits; TRD`,
      ),
    );
    expect(rows.get('Grid limits')?.[0]).toMatch(
      /recalled from memory.*confirm them with the standards and the utility/,
    );
  });

  it('over a carrier span (60 Hz grid, 10 kHz: mf 500/3) says the limits were read on harmonic groups', () => {
    const span = { ...design, fundamentalFrequency: 60 };
    const grid = analyseDesign(span, { maxOrder: 60, points: 256 }).grid!;
    render(<DesignTable design={span} grid={grid} />);
    const rows = rowsOf();
    expect(rows.get('Carrier frequency')?.[0]).toContain('mf 500/3');
    for (const verdict of rows.get('Grid current') ?? [])
      expect(verdict).toContain('read on harmonic groups of the span’s components');
    expect(rows.get('Grid limits')?.[0]).toContain('IEC 61000-4-7');
  });
});
