import { describe, expect, it } from 'vitest';
import { analyseDesign } from '../analyseDesign.js';
import { describeGridConnection } from '../describeGridConnection.js';
import type { InverterDesign } from '../InverterDesign.js';
import { GRID_TIED_DESIGN } from '../../testing/gridTiedDesign.js';

const design: InverterDesign = GRID_TIED_DESIGN;

describe('describeGridConnection', () => {
  it('is null for a design without a grid', () => {
    expect(describeGridConnection({ ...design, grid: null }, null)).toBeNull();
  });

  it("states the design's grid, impedance and LCL filter in the units it names, without figures no verdict", () => {
    const text = describeGridConnection(design, null)!;
    expect(text.rows).toEqual([
      // -0.1 rad = -5.730° (180/π).
      ['Grid', '400 V rms line to line, 50 Hz, phase a at -5.73°'],
      ['Grid impedance per phase (star)', 'R 0.05 Ω, L 0.2 mH'],
      ['LCL filter per phase (star)', 'L1 2 mH, C 10 µF, L2 0.5 mH'],
      ['Current control bandwidth', '1000 Hz'],
    ]);
    expect(text.verdicts).toEqual([]);
    expect(text.caution).toBeNull();
  });

  it("adds the short-circuit figures, the resonance and each standard's verdict with its edition and the from-memory caution", () => {
    const report = analyseDesign(design);
    const text = describeGridConnection(design, report.grid)!;
    // I_SC = V_ph/|r + jω₁l| (the grid's short-circuit current, circuit theory): 400/√3 V over
    // |0.05 + j·2π·50·0.2e-3| Ω = 230.94/0.080286 = 2876 A rms (hand-worked).
    expect(text.rows[1]?.[1]).toContain('short-circuit current 2876 A rms');
    // LCL resonance (1/2π)·√((L1 + L2')/(L1·L2'·C)), L2' = 0.7 mH (Liserre, Blaabjerg and
    // Hansen, 2005): √(2.7e-3/(2e-3·0.7e-3·10e-6))/2π = 2210 Hz (hand-worked).
    expect(text.rows[2]?.[1]).toContain('resonance 2210 Hz');
    // Named as the LCL's, with 10 kHz/2210 Hz = 4.524 and 2210 Hz/1000 Hz = 2.21 (hand-worked).
    expect(text.rows[2]?.[1]).toContain(
      'LCL resonance 2210 Hz (carrier 4.524× above it; 2.21× the control bandwidth)',
    );
    const { ieee519, ieee1547 } = report.grid!.limits;
    expect(text.verdicts).toHaveLength(2);
    expect(text.verdicts[0]).toMatch(/^IEEE Std 519-2022 \(I_SC\/I_L /);
    expect(text.verdicts[0]).toContain(ieee519.pass ? 'within the limits' : 'over the limits');
    expect(text.verdicts[1]).toMatch(/^IEEE Std 1547-2018 /);
    expect(text.verdicts[1]).toContain(ieee1547.pass ? 'within the limits' : 'over the limits');
    expect(text.verdicts.join(' ')).not.toContain('harmonic groups');
    // I_SC/I_L is far above 20 here, yet IEEE 519's first row applies to generating equipment
    // (Table 2's footnote, from memory): the verdict says why, 1547's (no rows by ratio) does not.
    expect(report.grid!.shortCircuitRatio).toBeGreaterThan(20);
    expect(text.verdicts[0]).toContain(
      `The I_SC/I_L < 20 row is used although I_SC/I_L is ${Number(report.grid!.shortCircuitRatio.toPrecision(4))}`,
    );
    expect(text.verdicts[1]).not.toContain('row is used although');
    expect(text.caution).toContain('recalled from memory');
    expect(text.caution).toContain('confirm them with the standards and the utility');
  });

  it('over a carrier span (60 Hz grid, 10 kHz carrier: mf 500/3) says the limits were read on harmonic groups and gives their rule', () => {
    const span: InverterDesign = {
      ...design,
      fundamentalFrequency: 60,
      grid: { ...design.grid!, controlBandwidth: undefined },
    };
    delete span.grid!.controlBandwidth;
    const report = analyseDesign(span, { maxOrder: 60 });
    expect(report.carrierSpan?.q).toBe(3);
    const text = describeGridConnection(span, report.grid)!;
    expect(text.rows.map(([label]) => label)).not.toContain('Current control bandwidth');
    expect(text.verdicts[0]).toContain('read on harmonic groups of the span’s components');
    expect(text.caution).toContain('IEC 61000-4-7');
  });
});
