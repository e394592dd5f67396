import { describe, expect, it } from 'vitest';
import { abs, add, div, mul, polar, sub, type HandComplex } from '../../testing/handComplex.js';
import { analyseDesign } from '../analyseDesign.js';
import type { InverterDesign } from '../InverterDesign.js';
import { harmonics } from '../../spectrum/harmonics.js';
import { assertInDelta } from '../../testing/assertInDelta.js';
import { designLclFilter } from '../../filter/designLclFilter.js';
import { ParameterRangeError } from '../../validation/errors.js';

// The LCL ladder solved by hand (circuit theory, written here without the library): bridge
// source V_b, series Z1 = jωL1, shunt Zc = R_d + 1/(jωC), series Z2 = r + jω(l2 + l) to a
// grid source E. With Σ = Z1·Zc + Z1·Z2 + Zc·Z2 (mesh analysis),
//   I_grid = (V_b·Zc − E·(Z1 + Zc))/Σ,   I_inv = (V_b·(Zc + Z2) − E·Zc)/Σ.
// Phasors in the `harmonics` convention: A·sin(θ + φ) ↔ A·e^{jφ}.
type C = HandComplex;
const TAU = 2 * Math.PI;

// Invented values: a 400 V, 50 Hz grid fed from 700 V at 10 kHz (mf 200).
const l1 = 2e-3;
const c = 10e-6;
const rd = 2;
const l2 = 0.5e-3;
const gridR = 0.05;
const gridL = 0.2e-3;
const gridPhase = -0.1;
const design: InverterDesign = {
  vdc: 700,
  fundamentalFrequency: 50,
  carrierFrequency: 10_000,
  modulation: { method: 'three-phase', ma: 1, zeroSequence: 'third-harmonic' },
  filter: { l: l1, c, rDamping: rd },
  grid: { lineVoltage: 400, phase: gridPhase, r: gridR, l: gridL, l2, controlBandwidth: 1000 },
};
const report = analyseDesign(design);
const grid = report.grid!;
const sourcePeak = (Math.SQRT2 * 400) / Math.sqrt(3);

function ladder(order: number, bridge: C): { grid: C; inverter: C } {
  const w = TAU * 50 * order;
  const z1: C = [0, w * l1];
  const zc: C = [rd, -1 / (w * c)];
  const z2: C = [gridR, w * (l2 + gridL)];
  const e: C = order === 1 ? polar(sourcePeak, gridPhase) : [0, 0];
  const sigma = add(add(mul(z1, zc), mul(z1, z2)), mul(zc, z2));
  return {
    grid: div(sub(mul(bridge, zc), mul(e, add(z1, zc))), sigma),
    inverter: div(sub(mul(bridge, add(zc, z2)), mul(e, zc)), sigma),
  };
}

describe('analyseDesign with a grid (LCL filter, issue 12 capability 6)', () => {
  const bridge = report.bridge.spectrum;

  it('gives grid and inverter currents equal to the hand-solved LCL ladder at every order', () => {
    for (const order of [1, 5, 7, 195, 197, 199, 201, 203, 397, 401]) {
      const h = bridge[order]!;
      const expected = ladder(order, polar(h.amplitude, h.phase));
      const g = grid.gridCurrentSpectrum[order]!;
      const i = grid.inverterCurrentSpectrum[order]!;
      const scale = Math.max(abs(expected.grid), 1e-12);
      assertInDelta(g.amplitude, abs(expected.grid), 1e-9 * scale + 1e-12, `grid ${order}`);
      assertInDelta(i.amplitude, abs(expected.inverter), 1e-9 * abs(expected.inverter) + 1e-12);
      if (abs(expected.grid) > 1e-9)
        assertInDelta(g.phase, Math.atan2(expected.grid[1], expected.grid[0]), 1e-9);
    }
    // The report's phase-a grid (load) current agrees with the grid figures' fundamental.
    assertInDelta(report.currents[0]!.load!.fundamental, grid.gridCurrentFundamental, 1e-9);
    expect(report.motor).toBeNull();
    expect(report.currents.map((c) => c.load?.name)).toEqual([
      'grid current, phase a',
      'grid current, phase b',
      'grid current, phase c',
    ]);
  });

  it("names a single-phase bridge's grid current without a phase (it has one)", () => {
    const single = analyseDesign({
      ...design,
      modulation: { method: 'sine-triangle', ma: 0.9, scheme: 'unipolar' },
      grid: { ...design.grid!, lineVoltage: 230 },
    });
    expect(single.phaseCount).toBe(1);
    expect(single.currents.map((c) => [c.inverter.name, c.capacitor?.name, c.load?.name])).toEqual([
      ['inverter (switch) current', 'capacitor current', 'grid current'],
    ]);
    // Its fundamental is still the grid figures' (the same phase, named once).
    assertInDelta(single.currents[0]!.load!.fundamental, single.grid!.gridCurrentFundamental, 1e-9);
  });

  it('reports the resonance (1/2π)·√((L1 + L2′)/(L1·L2′·C)) with L2′ = l2 + l, and its distances', () => {
    const l2Total = l2 + gridL;
    const f = Math.sqrt((l1 + l2Total) / (l1 * l2Total * c)) / TAU;
    assertInDelta(grid.resonance!.frequency, f, 1e-9);
    assertInDelta(grid.resonance!.carrierRatio!, 10_000 / f, 1e-9);
    assertInDelta(grid.resonance!.controlBandwidthRatio!, f / 1000, 1e-12);
    expect(grid.resonance!.withinLiserreRange).toBe(f >= 500 && f <= 5000);
  });

  it('gives the power, the damping loss and the capacitor reactive power from the ladder currents', () => {
    const analysisBridge = harmonics(report.voltages[0]!.waveform, report.analysisOrder);
    let damping = 0;
    let bridgePower = 0;
    let gridResistorLoss = 0;
    for (const h of analysisBridge) {
      if (h.order === 0) continue;
      const vb = polar(h.amplitude, h.phase);
      const solved = ladder(h.order, vb);
      const capacitor = sub(solved.inverter, solved.grid);
      damping += (rd * abs(capacitor) ** 2) / 2;
      bridgePower += mul(vb, [solved.inverter[0], -solved.inverter[1]])[0] / 2;
      gridResistorLoss += (gridR * abs(solved.grid) ** 2) / 2;
    }
    assertInDelta(grid.dampingLoss, 3 * damping, 1e-9 * 3 * damping);
    const first = ladder(1, polar(bridge[1]!.amplitude, bridge[1]!.phase));
    const e = polar(sourcePeak, gridPhase);
    // Power into the grid source: ½·Re(E·conj(I)) a phase (peak phasors).
    const gridPower = (3 * (e[0] * first.grid[0] + e[1] * first.grid[1])) / 2;
    assertInDelta(grid.power, gridPower, 1e-9 * Math.abs(gridPower));
    // Energy balance (Tellegen): the bridge's power = the grid's + the resistors' losses.
    assertInDelta(
      3 * bridgePower,
      grid.power + grid.dampingLoss + 3 * gridResistorLoss,
      1e-6 * Math.abs(grid.power),
    );
    // A capacitor supplies |I_C|²/(ωC)/2 var a phase at the fundamental.
    const ic = sub(first.inverter, first.grid);
    assertInDelta(
      grid.capacitor!.reactivePower,
      (3 * abs(ic) ** 2) / (TAU * 50 * c) / 2,
      1e-9 * grid.capacitor!.reactivePower,
    );
    assertInDelta(grid.capacitor!.fundamentalCurrent, abs(ic) / Math.SQRT2, 1e-12);
  });

  it('takes I_SC/I_L from the grid impedance and checks the grid current against both tables', () => {
    const isc = 400 / Math.sqrt(3) / Math.hypot(gridR, TAU * 50 * gridL);
    assertInDelta(grid.shortCircuitCurrent, isc, 1e-9 * isc);
    assertInDelta(grid.shortCircuitRatio, isc / (grid.gridCurrentFundamental / Math.SQRT2), 1e-9);
    const fifth = grid.limits.ieee519.table.find((row) => row.order === 5)!;
    assertInDelta(
      fifth.ratio,
      grid.gridCurrentSpectrum[5]!.amplitude / grid.gridCurrentFundamental,
      1e-12,
    );
    expect(grid.limits.ieee519.standard.edition).toBe('2022');
    expect(grid.limits.ieee1547.standard.edition).toBe('2018');
    expect(report.cautions.some((text) => text.includes('IEEE Std 1547-2018'))).toBe(true);
  });

  it('keeps the inverter ripple within the bound designLclFilter sized L1 for', () => {
    const lcl = designLclFilter({
      power: 10_000,
      lineVoltage: 400,
      gridFrequency: 50,
      switchingFrequency: 10_000,
      vdc: 700,
    });
    const sized = analyseDesign({
      ...design,
      modulation: { method: 'three-phase', ma: 1.05, zeroSequence: 'third-harmonic' },
      filter: { l: lcl.l1, c: lcl.c, rDamping: lcl.rDamping },
      grid: { lineVoltage: 400, phase: 0.05, r: 0.05, l: 0, l2: lcl.l2 },
    });
    expect(sized.currents[0]!.inverter.ripplePeakToPeak).toBeLessThanOrEqual(lcl.rippleBound);
  });

  it('refuses a load beside a grid and a grid field out of range, naming the field', () => {
    expect(() => analyseDesign({ ...design, load: { r: 1, l: 0 } })).toThrow(/load/);
    expect(() => analyseDesign({ ...design, grid: { ...design.grid!, r: 0 } })).toThrow(
      ParameterRangeError,
    );
    expect(() => analyseDesign({ ...design, grid: { ...design.grid!, r: 0 } })).toThrow(/grid\.r/);
    expect(() => analyseDesign({ ...design, grid: { ...design.grid!, lineVoltage: -1 } })).toThrow(
      /grid\.lineVoltage/,
    );
  });
});
