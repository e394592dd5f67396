import { describe, expect, it } from 'vitest';
import { TAU } from '../../../math.js';
import { assertInDelta } from '../../../testing/assertInDelta.js';
import { rangeErrorField } from '../../../testing/rangeErrorField.js';
import { multilevelCarrier } from '../../carrier/multilevelCarrier.js';
import { threeLevelSpaceVectorWaveforms } from '../../space-vector/threeLevelSpaceVectorWaveforms.js';
import { waveformValueAt } from '../../../waveform/waveformValueAt.js';
import { neutralPointCurrentFigures } from '../neutralPointCurrentFigures.js';

const PEAK = 10;
const MA = 0.8;
const MF = 99;

function npcBridge(phaseCount: 1 | 3, mf = MF) {
  return multilevelCarrier({
    topology: 'npc',
    levels: 3,
    carriers: 'pd',
    phaseCount,
    ma: MA,
    mf,
    vdc: 800,
  });
}

/** Mean of f over [a, b] by the midpoint rule (2000 points): the average model's window mean. */
function windowMean(f: (theta: number) => number, a: number, b: number): number {
  let sum = 0;
  for (let q = 0; q < 2000; q++) sum += f(a + ((q + 0.5) * (b - a)) / 2000);
  return sum / 2000;
}

/** Amplitude of order n of a series evenly spaced over the period (plain DFT). */
function dftAmplitude(values: readonly number[], n: number): number {
  let re = 0;
  let im = 0;
  values.forEach((v, j) => {
    re += v * Math.cos((n * TAU * j) / values.length);
    im += v * Math.sin((n * TAU * j) / values.length);
  });
  return (2 * Math.hypot(re, im)) / values.length;
}

describe('neutralPointCurrentFigures', () => {
  it('one leg: each carrier-period average is (1 − |m(θ)|)·i(θ) (Holmes and Lipo 2003, ch. 11)', () => {
    // Duty of the middle level of a level-shifted three-level leg in the linear range is
    // 1 − |m(θ)| (Holmes and Lipo 2003, ch. 11; common practice). Only leg a carries current
    // (sampled, the form the design report passes), so i_np is leg a's share alone.
    const phi = 0.5;
    const current = (theta: number) => PEAK * Math.sin(theta - phi);
    const size = 64 * MF;
    const ia = Float64Array.from({ length: size }, (_, j) => current((TAU * j) / size));
    const zero = new Float64Array(size);
    const figures = neutralPointCurrentFigures(npcBridge(3), [ia, zero, zero], { mf: MF });
    const width = TAU / MF;
    expect(figures.carrierAverages.values).toHaveLength(MF);
    figures.carrierAverages.angles.forEach((centre, j) => {
      const expected = windowMean(
        (t) => (1 - Math.abs(MA * Math.sin(t))) * current(t),
        centre - width / 2,
        centre + width / 2,
      );
      // Natural sampling moves each pulse within its window: measured up to 6.6e-4·Î at mf 99
      // (largest beside the reference's zero crossings), and 1.7e-3·Î in the window holding a
      // zero crossing (the kink of |m(θ)|; 8e-4·Î at mf 199: first order in 1/mf).
      const nearKink = Math.min(Math.abs(centre), Math.abs(centre - Math.PI), TAU - centre) < width;
      assertInDelta(
        figures.carrierAverages.values[j] as number,
        expected,
        (nearKink ? 2.5e-3 : 8e-4) * PEAK,
        `window at ${centre}`,
      );
    });
  });

  it('one leg: RMS² = Î²·(1/2 − 4m/(3π)) at unity power factor (average model, worked here)', () => {
    // i_np² = [middle]·i²; its mean is (1/2π)∫(1 − m|sin θ|)·Î² sin²θ dθ = Î²(1/2 − 4m/(3π))
    // (the middle duty 1 − |m sin θ| of Holmes and Lipo ch. 11; ∫|sin θ|³ over a period = 8/3).
    const figures = neutralPointCurrentFigures(
      { ...npcBridge(1), legs: npcBridge(1).legs.slice(0, 1), phaseCount: 1 },
      { peakCurrent: PEAK },
      { mf: MF },
    );
    const expected = PEAK * Math.sqrt(0.5 - (4 * MA) / (3 * Math.PI));
    assertInDelta(figures.rms, expected, 2e-3 * expected, 'rms');
  });

  it('three-phase PD, balanced load: zero mean and a ripple at three times the fundamental (Celanovic and Boroyevich 2000)', () => {
    const phi = 0.6;
    const figures = neutralPointCurrentFigures(
      npcBridge(3, 201),
      { peakCurrent: PEAK, currentAngle: phi },
      { mf: 201 },
    );
    // Celanovic and Boroyevich, IEEE TPE 2000: with sine references and a balanced load the
    // neutral-point current averages to zero over the fundamental.
    assertInDelta(figures.mean, 0, 1e-9 * PEAK, 'mean');
    // Average model: i_np = Σ_k (1 − |m sin θ_k|)·Î sin(θ_k − φ) = −Σ_k |m sin θ_k|·Î sin(θ_k − φ),
    // periodic in 2π/3 (the same paper's carrier-period average).
    const model = (t: number) => {
      let sum = 0;
      for (let k = 0; k < 3; k++) {
        const tk = t - (k * TAU) / 3;
        sum += (1 - Math.abs(MA * Math.sin(tk))) * PEAK * Math.sin(tk - phi);
      }
      return sum;
    };
    const values = figures.carrierAverages.values;
    const third = dftAmplitude(values, 3);
    for (const n of [1, 2, 4, 5]) expect(dftAmplitude(values, n)).toBeLessThan(0.01 * third);
    let high = -Infinity;
    let low = Infinity;
    for (let q = 0; q < 30_000; q++) {
      const v = model((TAU * q) / 30_000);
      high = Math.max(high, v);
      low = Math.min(low, v);
    }
    // The carrier averages sample the model once per carrier period: the peak-to-peak of the
    // samples falls short of the model's by at most the model's change over half a period.
    assertInDelta(figures.lowFrequencyRipple, high - low, 0.01 * (high - low), 'ripple');
    assertInDelta(
      dftAmplitude(
        values.map((_, j) => model(figures.carrierAverages.angles[j] as number)),
        3,
      ),
      third,
      0.01 * third,
      'third',
    );
  });

  it('three-level space vector: the symmetric small-vector split draws no mean midpoint current, the P-type and N-type forms opposite ones (Celanovic and Boroyevich 2000)', () => {
    const n = 60;
    // Switching period k spans [k, k + 1)·2π/N: a carrier valley at θ = 0 (carrierPhase −N·π/2).
    const windows = { mf: n, carrierPhase: -((n * Math.PI) / 2) % TAU };
    const run = (smallVectorSplit: number) =>
      neutralPointCurrentFigures(
        threeLevelSpaceVectorWaveforms({ m: 0.7, frequencyRatio: n, vdc: 800, smallVectorSplit }),
        { peakCurrent: PEAK, currentAngle: 0.4 },
        windows,
      );
    // Regular sampling delays the voltage by π/N against the current: measured 2.6e-4·Î.
    assertInDelta(run(0.5).mean, 0, 1e-3 * PEAK, 'symmetric split');
    const pType = run(1).mean;
    const nType = run(0).mean;
    // Each small vector's P-type and N-type forms draw opposite midpoint currents.
    expect(Math.abs(pType)).toBeGreaterThan(0.2 * PEAK);
    assertInDelta(pType, -nType, 1e-3 * PEAK, 'P-type against N-type');
  });

  it('midpoint voltage ripple follows the average model, ∫i_np dt/(2C) (common practice)', () => {
    const f1 = 50;
    const c = 2e-3;
    const figures = neutralPointCurrentFigures(
      npcBridge(3, 201),
      { peakCurrent: PEAK, currentAngle: 0.3 },
      { mf: 201, fundamentalFrequency: f1, capacitance: c },
    );
    // Average model's charge: integrate the carrier-period average i_np(θ) (Celanovic and
    // Boroyevich 2000) numerically; the switching pulses add a small high-frequency part.
    let q = 0;
    let high = 0;
    let low = 0;
    const steps = 60_000;
    for (let s = 0; s < steps; s++) {
      const t = ((s + 0.5) * TAU) / steps;
      let sum = 0;
      for (let k = 0; k < 3; k++) {
        const tk = t - (k * TAU) / 3;
        sum -= Math.abs(MA * Math.sin(tk)) * PEAK * Math.sin(tk - 0.3);
      }
      q += (sum * TAU) / steps;
      high = Math.max(high, q);
      low = Math.min(low, q);
    }
    const expected = (high - low) / (TAU * f1) / (2 * c);
    assertInDelta(figures.midpointVoltageRipple as number, expected, 0.05 * expected, 'ripple');
  });

  it('single-phase full bridge: the two legs cancel at every carrier period (duty of the middle level equal, currents opposite)', () => {
    const figures = neutralPointCurrentFigures(npcBridge(1), { peakCurrent: PEAK }, { mf: MF });
    for (const v of figures.carrierAverages.values) assertInDelta(v, 0, 3e-3 * PEAK, 'average');
  });

  it('sampled and sinusoidal currents agree', () => {
    const bridge = npcBridge(3);
    const size = 64 * MF;
    const samples = [0, 1, 2].map((k) =>
      Float64Array.from(
        { length: size },
        (_, j) => PEAK * Math.sin((TAU * j) / size - (k * TAU) / 3 - 0.4),
      ),
    );
    const a = neutralPointCurrentFigures(bridge, samples, { mf: MF });
    const b = neutralPointCurrentFigures(
      bridge,
      { peakCurrent: PEAK, currentAngle: 0.4 },
      { mf: MF },
    );
    // Linear interpolation of 64 samples a carrier period: error ≈ (2π/S)²/8 of the peak.
    assertInDelta(a.rms, b.rms, 1e-5 * PEAK, 'rms');
    assertInDelta(a.lowFrequencyRipple, b.lowFrequencyRipple, 1e-5 * PEAK, 'ripple');
  });

  it('brute force: mean, RMS and every carrier average from 600 000 instants agree with the exact pieces', () => {
    // An independent comparator (as the two-level suite's): the state of every leg and the current
    // at each instant, summed by the midpoint rule; error O(1/instants) at the edges.
    const mf = 15;
    const bridge = multilevelCarrier({
      topology: 't-type',
      levels: 3,
      carriers: 'apod',
      phaseCount: 3,
      ma: 0.9,
      mf,
      vdc: 800,
    });
    const phi = -0.7;
    const figures = neutralPointCurrentFigures(
      bridge,
      { peakCurrent: PEAK, currentAngle: phi },
      { mf, carrierPhase: 0.3 },
    );
    const instants = 600_000;
    const perWindow = new Float64Array(mf);
    const width = TAU / mf;
    const first = (((Math.PI / 2 + 0.3 / mf) % width) + width) % width;
    let sum = 0;
    let squares = 0;
    for (let q = 0; q < instants; q++) {
      const t = ((q + 0.5) * TAU) / instants;
      let value = 0;
      bridge.legs.forEach((leg, k) => {
        if (waveformValueAt(leg.output, t) === 0) value += PEAK * Math.sin(t - (k * TAU) / 3 - phi);
      });
      sum += value;
      squares += value * value;
      const w = Math.min(mf - 1, Math.floor(((((t - first) % TAU) + TAU) % TAU) / width));
      perWindow[w] = perWindow[w]! + value;
    }
    assertInDelta(figures.mean, sum / instants, 1e-4 * PEAK, 'mean');
    assertInDelta(figures.rms, Math.sqrt(squares / instants), 1e-4 * PEAK, 'rms');
    figures.carrierAverages.angles.forEach((centre, j) => {
      const w = Math.floor(((((centre - first) % TAU) + TAU) % TAU) / width);
      const expected = perWindow[w]! / (instants / mf);
      assertInDelta(
        figures.carrierAverages.values[j]!,
        expected,
        1e-3 * PEAK,
        `window at ${centre}`,
      );
    });
  });

  it('names the field of bad input', () => {
    const bridge = npcBridge(3);
    const sine = { peakCurrent: PEAK };
    expect(rangeErrorField(() => neutralPointCurrentFigures(bridge, sine, { mf: 2.5 }))).toBe('mf');
    expect(
      rangeErrorField(() => neutralPointCurrentFigures(bridge, [new Float64Array(8)], { mf: MF })),
    ).toBe('currents.length');
    expect(
      rangeErrorField(() => neutralPointCurrentFigures(bridge, { peakCurrent: -1 }, { mf: MF })),
    ).toBe('currents.peakCurrent');
    expect(
      rangeErrorField(() => neutralPointCurrentFigures(bridge, { peakCurrent: 2e6 }, { mf: MF })),
    ).toBe('currents.peakCurrent');
    const huge = [new Float64Array(64), new Float64Array(64), new Float64Array(64).fill(1e300)];
    expect(rangeErrorField(() => neutralPointCurrentFigures(bridge, huge, { mf: MF }))).toBe(
      'currents[2][0]',
    );
    const nan = [
      new Float64Array(64),
      Float64Array.from({ length: 64 }, (_, j) => (j === 9 ? NaN : 0)),
      new Float64Array(64),
    ];
    expect(rangeErrorField(() => neutralPointCurrentFigures(bridge, nan, { mf: MF }))).toBe(
      'currents[1][9]',
    );
    expect(() => neutralPointCurrentFigures(bridge, sine, { mf: MF, capacitance: 1e-3 })).toThrow(
      /^fundamentalFrequency must be a number/,
    );
    expect(
      rangeErrorField(() => neutralPointCurrentFigures({ ...bridge, levels: 5 }, sine, { mf: MF })),
    ).toBe('waveforms.levels');
    expect(
      rangeErrorField(() =>
        neutralPointCurrentFigures(
          {
            ...bridge,
            legs: [
              bridge.legs[0]!,
              bridge.legs[1]!,
              { ...bridge.legs[2]!, output: { edges: [1, 0.5], levels: [0, 1] } },
            ],
          },
          sine,
          { mf: MF },
        ),
      ),
    ).toBe('waveforms.legs[2].output.edges[1]');
  });
});
