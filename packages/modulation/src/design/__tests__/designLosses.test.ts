import { describe, expect, it } from 'vitest';
import {
  analyseDesign,
  EXAMPLE_IGBT,
  semiconductorLosses,
  semiconductorLossesByIntegration,
  type InverterDesign,
  type MosfetDevice,
} from '../../index.js';
import { assertInDelta } from '../../testing/assertInDelta.js';
import { rangeErrorField } from '../../testing/rangeErrorField.js';
import { designModulation } from '../designModulation.js';
import { modulationVoltages } from '../modulationVoltages.js';
import { switchingLegs } from '../switchingLegs.js';
import { sineTriangle } from '../../carrier/sineTriangle.js';
import { waveformValueAt } from '../../waveform/waveformValueAt.js';
import { designLosses } from '../designLosses.js';

// An invented device (not from any real part), as in the loss tests.
const device = { ...EXAMPLE_IGBT };
const vdc = 650;
const ma = 0.9;
const f1 = 50;
const mf = 99;

/**
 * A three-phase design whose phase current's fundamental is `peak` amperes in phase with the
 * phase voltage's fundamental (ma·vdc/2, in phase with sin θ): a back-EMF E = V − Î·(R + jωL)
 * (phasors; standard circuit analysis) behind the R–L, so the bridge sees unity power factor.
 */
function unityPowerFactorDesign(zeroSequence: 'none' | 'dpwm1', peak = 30): InverterDesign {
  const r = 8;
  const l = 0.01;
  const v = (ma * vdc) / 2;
  const x = 2 * Math.PI * f1 * l;
  return {
    vdc,
    fundamentalFrequency: f1,
    carrierFrequency: mf * f1,
    modulation: { method: 'three-phase', ma, zeroSequence },
    load: {
      r,
      l,
      emf: {
        amplitude: Math.hypot(v - peak * r, peak * x),
        phase: Math.atan2(-peak * x, v - peak * r),
      },
    },
    device,
  };
}

/** Mean of the upper and lower positions of one kind of device over every leg, W. */
function perDevice(
  losses: NonNullable<ReturnType<typeof analyseDesign>['losses']>,
  kind: 'Transistor' | 'Diode',
  part: 'conduction' | 'switching',
): number {
  let sum = 0;
  for (const leg of losses.legs) sum += leg[`upper${kind}`][part] + leg[`lower${kind}`][part];
  return sum / (2 * losses.legs.length);
}

describe('analyseDesign: losses by device', () => {
  it('three-phase sinusoidal PWM: conduction and switching equal the closed forms', () => {
    const report = analyseDesign(unityPowerFactorDesign('none'));
    const current = report.currents[0]?.inverter;
    const losses = report.losses;
    if (!current || !losses) throw new Error('expected currents and losses');
    // The circuit gives the current asked for, in phase with the voltage (checks the EMF above).
    assertInDelta(current.fundamental, 30, 1e-6, 'Î');
    assertInDelta(current.fundamentalPhase, 0, 1e-6, 'φ');
    // Closed form of sinusoidal PWM with a sinusoidal current (D. Bierhoff and F. W. Fuchs, IEEE
    // PESC 2004, from memory; the average model of J. W. Kolar, H. Ertl, F. C. Zach, IEEE Trans.
    // Ind. Appl., 1991): P_T = vce0·Î·(1/(2π) + m·cos φ/8) + rce·Î²·(1/8 + m·cos φ/(3π)), …
    // The report's current carries its ripple (0.32 A rms of 21 A) and natural-sampling edges:
    // conduction within 0.1 %, the transistors' switching (|i| read at each edge) within 1 %.
    // A diode recovers as its transistor turns on, at the trough of the ripple (the current has
    // fallen while the diode conducted), so its share is lower than the ripple-free form's by
    // about ripple/Î: within 3 %.
    const closed = semiconductorLosses(device, {
      vdc,
      ma,
      peakCurrent: current.fundamental,
      currentAngle: -current.fundamentalPhase,
      switchingFrequency: mf * f1,
    });
    const label = 'SPWM';
    assertInDelta(
      perDevice(losses, 'Transistor', 'conduction'),
      closed.transistor.conduction,
      1e-3 * closed.transistor.conduction,
      `${label} T cond`,
    );
    assertInDelta(
      perDevice(losses, 'Diode', 'conduction'),
      closed.diode.conduction,
      1e-3 * closed.diode.conduction,
      `${label} D cond`,
    );
    assertInDelta(
      perDevice(losses, 'Transistor', 'switching'),
      closed.transistor.switching,
      1e-2 * closed.transistor.switching,
      `${label} T sw`,
    );
    assertInDelta(
      perDevice(losses, 'Diode', 'switching'),
      closed.diode.switching,
      3e-2 * closed.diode.switching,
      `${label} D sw`,
    );
    assertInDelta(losses.total, closed.total, 5e-3 * closed.total, `${label} total`);
    // Output power 3·vdc·ma·Î·cos φ/4 (ideal average model) within the ripple's share.
    assertInDelta(losses.outputPower, closed.outputPower, 1e-3 * closed.outputPower, 'P out');
    assertInDelta(
      losses.efficiency ?? 0,
      losses.outputPower / (losses.outputPower + losses.total),
      1e-12,
      'η',
    );
    // The parts add up (Kirchhoff of watts): legs to total, conduction + switching to total.
    const legSum = losses.legs.reduce((s, leg) => s + leg.total, 0);
    assertInDelta(legSum, losses.total, 1e-9 * losses.total, 'legs');
    assertInDelta(losses.conduction + losses.switching, losses.total, 1e-9 * losses.total, 'parts');
    expect(losses.legs.map((l) => l.name)).toEqual(['leg a', 'leg b', 'leg c']);
  });

  it("DPWM1 switches half of SPWM's loss at unity power factor", () => {
    // Switching-loss function of DPWM1, 1 − cos φ/2 for |φ| ≤ 30°: 0.5 at unity power factor
    // (J. W. Kolar, H. Ertl, F. C. Zach, IEEE Trans. Ind. Appl., 1991; A. M. Hava, R. J.
    // Kerkman, T. A. Lipo, IEEE Trans. Power Electronics, 1998/1999; from memory): each leg is
    // clamped for the 60° about each peak of its current, where |i| is largest. Both reports'
    // switching losses are per ampere of their own fundamental; within 0.02 (ripple at the edges).
    const spwm = analyseDesign(unityPowerFactorDesign('none'));
    const dpwm = analyseDesign(unityPowerFactorDesign('dpwm1'));
    const perAmpere = (r: typeof spwm) =>
      (r.losses?.switching ?? Number.NaN) / (r.currents[0]?.inverter.fundamental ?? Number.NaN);
    const phi = -(dpwm.currents[0]?.inverter.fundamentalPhase ?? Number.NaN);
    assertInDelta(perAmpere(dpwm) / perAmpere(spwm), 1 - Math.cos(phi) / 2, 0.02, 'SLF');
    // Conduction follows the current, not the clamps, to first order: within 2 %.
    assertInDelta(
      dpwm.losses?.conduction ?? 0,
      spwm.losses?.conduction ?? 0,
      0.02 * (spwm.losses?.conduction ?? 0),
      'conduction',
    );
  });

  it('single-phase bipolar and unipolar bridges: the closed form of two legs', () => {
    // Both schemes drive leg a with duty (1 + ma·sin θ)/2 and leg b with (1 − ma·sin θ)/2 and
    // the opposite current, each leg switching once a carrier period: the closed form's average
    // model with 2 legs (Bierhoff and Fuchs 2004, from memory). Within 0.1 % (conduction) and
    // 1 % (switching).
    for (const scheme of ['bipolar', 'unipolar'] as const) {
      const report = analyseDesign({
        vdc: 400,
        fundamentalFrequency: f1,
        carrierFrequency: 101 * f1,
        modulation: { method: 'sine-triangle', scheme, ma: 0.8 },
        load: { r: 5, l: 0.02 },
        device,
      });
      const current = report.currents[0]?.inverter;
      if (!current || !report.losses) throw new Error('expected currents and losses');
      const closed = semiconductorLosses(device, {
        vdc: 400,
        ma: 0.8,
        peakCurrent: current.fundamental,
        currentAngle: -current.fundamentalPhase,
        switchingFrequency: 101 * f1,
        topology: 'h-bridge',
      });
      assertInDelta(
        report.losses.conduction,
        closed.conduction,
        1e-3 * closed.conduction,
        `${scheme} conduction`,
      );
      assertInDelta(
        report.losses.switching,
        closed.switching,
        1e-2 * closed.switching,
        `${scheme} switching`,
      );
      expect(report.losses.legs.map((l) => l.name)).toEqual(['leg a', 'leg b']);
    }
  });

  it('unipolar legs: leg a is +ref against the carrier, and a − b is the bridge output', () => {
    // Holmes and Lipo 2003, ch. 3: leg a compares +ref, leg b −ref, with one carrier.
    const modulation = designModulation({
      vdc: 400,
      fundamentalFrequency: f1,
      carrierFrequency: 101 * f1,
      modulation: { method: 'sine-triangle', scheme: 'unipolar', ma: 0.8 },
    });
    const voltages = modulationVoltages(modulation);
    const legs = switchingLegs(modulation, voltages, 400);
    const legA = sineTriangle({ scheme: 'bipolar', ma: 0.8, mf: 101, vdc: 1 });
    const output = voltages.phases[0]?.waveform;
    if (!legs || !output) throw new Error('expected legs');
    const [a, b] = legs;
    if (!a || !b) throw new Error('expected two legs');
    for (let k = 0; k < 20_000; k++) {
      const theta = (2 * Math.PI * (k + 0.37)) / 20_000;
      expect(waveformValueAt(a.state, theta)).toBe(waveformValueAt(legA, theta) > 0 ? 1 : 0);
      expect(400 * (waveformValueAt(a.state, theta) - waveformValueAt(b.state, theta))).toBe(
        waveformValueAt(output, theta),
      );
    }
  });

  it('space vector: the carrier-period integration of min-max (its equivalent)', () => {
    // Centred space vector equals min-max zero-sequence injection (Holmes and Lipo ch. 5; van der
    // Broeck, Skudelny, Stanke 1988); against semiconductorLossesByIntegration within 0.5 %.
    const report = analyseDesign({
      vdc,
      fundamentalFrequency: f1,
      carrierFrequency: mf * f1,
      modulation: { method: 'space-vector', ma },
      load: { r: 8, l: 0.01 },
      device,
    });
    const current = report.currents[0]?.inverter;
    if (!current || !report.losses) throw new Error('expected currents and losses');
    const summed = semiconductorLossesByIntegration(device, {
      vdc,
      ma,
      peakCurrent: current.fundamental,
      currentAngle: -current.fundamentalPhase,
      switchingFrequency: mf * f1,
      fundamentalFrequency: f1,
      zeroSequence: 'min-max',
    });
    assertInDelta(
      report.losses.conduction,
      summed.conduction,
      5e-3 * summed.conduction,
      'SV conduction',
    );
    assertInDelta(
      report.losses.switching,
      summed.switching,
      5e-3 * summed.switching,
      'SV switching',
    );
  });

  it('a MOSFET conducts rdsOn·I_rms² a phase, ripple included', () => {
    // Synchronous rectification: one channel of each leg carries the phase current at every
    // instant, so the conduction loss is rdsOn·i² whatever the duty (Ohm's law); the report's
    // RMS is exact. Within 1e−4 (the grid's midpoint sum).
    const mosfet: MosfetDevice = {
      kind: 'mosfet',
      rdsOn: 0.02,
      eon: 1e-4,
      eoff: 1e-4,
      err: 1e-5,
      referenceVoltage: 800,
      referenceCurrent: 50,
    };
    const report = analyseDesign({ ...unityPowerFactorDesign('dpwm1'), device: mosfet });
    const expected = report.currents.reduce((s, p) => s + 0.02 * p.inverter.rms ** 2, 0);
    assertInDelta(report.losses?.conduction ?? 0, expected, 1e-4 * expected, 'rdsOn·I²');
    expect(report.losses?.legs.every((l) => l.upperDiode.conduction === 0)).toBe(true);
  });

  it('with a filter (the currents on a finer grid, summed on every k-th cell): the closed form still', () => {
    // The filtered report reads its currents on 16 samples per analysis order (16384 here); the
    // conduction sum keeps 64 cells a carrier period. Against the closed form (Bierhoff and Fuchs
    // 2004, from memory) with the inverter current's own fundamental and angle: the filter
    // inductor's ripple (1.7 A rms on 36 A) only adds, through r·i² and, near the current's
    // zeros, the threshold terms: between 0 and 0.5 % above it; switching within 2 %.
    const report = analyseDesign({
      vdc,
      fundamentalFrequency: f1,
      carrierFrequency: mf * f1,
      modulation: { method: 'three-phase', ma },
      load: { r: 8, l: 0.003 },
      filter: { l: 0.002, c: 10e-6 },
      device,
    });
    const current = report.currents[0]?.inverter;
    if (!current || !report.losses) throw new Error('expected currents and losses');
    const closed = semiconductorLosses(device, {
      vdc,
      ma,
      peakCurrent: current.fundamental,
      currentAngle: -current.fundamentalPhase,
      switchingFrequency: mf * f1,
    });
    expect(current.rippleRms).toBeGreaterThan(1);
    expect(report.losses.conduction).toBeGreaterThan(closed.conduction);
    expect(report.losses.conduction).toBeLessThan(1.005 * closed.conduction);
    assertInDelta(report.losses.switching, closed.switching, 2e-2 * closed.switching, 'switching');
  });

  it('with a filter every zero sequence gives losses, and the clamps switch less', () => {
    const base: InverterDesign = {
      vdc,
      fundamentalFrequency: f1,
      carrierFrequency: mf * f1,
      modulation: { method: 'three-phase', ma },
      load: { r: 8, l: 0.003 },
      filter: { l: 0.002, c: 10e-6 },
      device,
    };
    const none = analyseDesign(base).losses;
    for (const zeroSequence of ['dpwm0', 'dpwm2', 'dpwm-max', 'dpwm-min'] as const) {
      const clamped = analyseDesign({
        ...base,
        modulation: { method: 'three-phase', ma, zeroSequence },
      }).losses;
      // A clamp at most halves nothing it did not switch: 120° of 360° unswitched a leg.
      expect(clamped?.switching).toBeLessThan(none?.switching ?? 0);
      expect(clamped?.efficiency).toBeGreaterThan(0.9);
    }
  });

  it('no device, no current or a staircase: no losses; a bad device value names its field', () => {
    const { device: _device, ...withoutDevice } = unityPowerFactorDesign('none');
    expect(analyseDesign(withoutDevice).losses).toBeNull();
    expect(analyseDesign({ ...unityPowerFactorDesign('none'), load: null }).losses).toBeNull();
    expect(
      analyseDesign({
        vdc: 100,
        fundamentalFrequency: f1,
        modulation: {
          method: 'selective-harmonic-elimination',
          kind: 'staircase',
          angles: [0.2, 0.6, 1.0],
        },
        load: { r: 10, l: 0.01 },
        device,
      }).losses,
    ).toBeNull();
    expect(
      rangeErrorField(() =>
        analyseDesign({ ...unityPowerFactorDesign('none'), device: { ...device, vce0: -1 } }),
      ),
    ).toBe('device.vce0');
  });

  it('a half-wave symmetric leg and current: its first half gives the whole period’s losses', () => {
    // A bipolar sine-triangle state at mf 21 (half-wave symmetric: the odd ratio) carrying
    // i = 10·sin(θ − 0.5) written exactly antisymmetric on 4096 samples. The same state with a
    // redundant edge (one segment split, so no half-wave pairing is seen) is read over the whole
    // period: the two agree to rounding, device by device.
    const bipolar = sineTriangle({ scheme: 'bipolar', ma: 0.8, mf: 21, vdc });
    const state = { edges: bipolar.edges, levels: bipolar.levels.map((v) => (v > 0 ? 1 : 0)) };
    const [firstEdge = 0, secondEdge = 0] = state.edges;
    const firstLevel = state.levels[0] ?? 0;
    const redundant = {
      edges: [firstEdge, (firstEdge + secondEdge) / 2, ...state.edges.slice(1)],
      levels: [firstLevel, firstLevel, ...state.levels.slice(1)],
    };
    const size = 4096;
    const current = new Float64Array(size);
    for (let j = 0; j < size / 2; j++) {
      current[j] = 10 * Math.sin((2 * Math.PI * j) / size - 0.5);
      current[j + size / 2] = -(current[j] as number);
    }
    const context = { device, vdc, fundamentalFrequency: f1, outputPower: 1000 };
    const leg = { name: 'leg a', phaseIndex: 0, currentSign: 1 as const };
    const half = designLosses([{ ...leg, state }], [current], context);
    const whole = designLosses([{ ...leg, state: redundant }], [current], context);
    const parts = ['upperTransistor', 'lowerTransistor', 'upperDiode', 'lowerDiode'] as const;
    for (const part of parts)
      for (const kind of ['conduction', 'switching'] as const) {
        const expected = whole.legs[0]?.[part][kind] as number;
        expect(expected).toBeGreaterThan(0);
        assertInDelta(half.legs[0]?.[part][kind] as number, expected, 1e-12 * expected, part);
      }
  });
});
