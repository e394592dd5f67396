import { describe, expect, it } from 'vitest';
import { analyseDesign } from '../analyseDesign.js';
import { designResonance } from '../designResonance.js';
import type { InverterDesign } from '../InverterDesign.js';
import { GRID_TIED_DESIGN } from '../../testing/gridTiedDesign.js';

const design: InverterDesign = GRID_TIED_DESIGN;

describe('designResonance', () => {
  it("is a grid design's LCL resonance with its distances from the carrier and the control bandwidth, not L1–C", () => {
    const report = analyseDesign(design);
    const resonance = designResonance(report)!;
    // (1/2π)·√((L1 + L2')/(L1·L2'·C)), L2' = l2 + l = 0.7 mH (Liserre, Blaabjerg and Hansen,
    // 2005): √(2.7e-3/(2e-3·0.7e-3·10e-6))/2π = 2210.2 Hz (hand-worked); L1–C alone would be
    // 1/(2π√(2e-3·10e-6)) = 1125.4 Hz.
    expect(resonance.name).toBe('LCL resonance');
    expect(resonance.frequency).toBeCloseTo(2210.2, 1);
    expect(report.filter!.characteristics.resonanceFrequency).toBeCloseTo(1125.4, 1);
    // 10 kHz / 2210.2 Hz = 4.524; 2210.2 Hz / 1000 Hz = 2.210 (hand-worked).
    expect(resonance.carrierRatio).toBeCloseTo(4.524, 3);
    expect(resonance.controlBandwidthRatio).toBeCloseTo(2.21, 3);
    expect(resonance.distances).toBe('carrier 4.524× above it; 2.21× the control bandwidth');
  });

  it('keeps an LC-filtered design (no grid) on its LC resonance 1/(2π√(LC))', () => {
    const report = analyseDesign({ ...design, grid: null, load: { r: 10, l: 0 } });
    const resonance = designResonance(report)!;
    expect(resonance.name).toBe('LC filter resonance');
    expect(resonance.frequency).toBeCloseTo(1125.4, 1);
    expect(resonance.distances).toBeNull();
  });

  it('names a grid design without grid-side inductance (l2 + l = 0, no LCL) by its L1–C resonance, 1125 Hz', () => {
    const report = analyseDesign({ ...design, grid: { ...design.grid!, l: 0, l2: 0 } });
    expect(report.grid!.resonance).toBeNull();
    expect(designResonance(report)).toMatchObject({ name: 'L1–C resonance', distances: null });
    expect(designResonance(report)!.frequency).toBeCloseTo(1125.4, 1);
  });

  it('is null without a filter, and without the carrier distance when no control bandwidth is given', () => {
    expect(designResonance({ filter: null, grid: null })).toBeNull();
    const grid = { ...design.grid! };
    delete grid.controlBandwidth;
    const resonance = designResonance(analyseDesign({ ...design, grid }))!;
    expect(resonance.controlBandwidthRatio).toBeNull();
    expect(resonance.distances).toBe('carrier 4.524× above it');
  });
});
