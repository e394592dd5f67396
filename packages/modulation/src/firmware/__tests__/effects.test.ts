import { describe, expect, it } from 'vitest';
import {
  deadTimeEffect,
  firmwareEffectSpectra,
  firmwareEffects,
  minimumPulseEffect,
  quantisationEffect,
  timerTable,
  timerTableWaveforms,
  type TimerTable,
  type TimerTableOptions,
} from '../index.js';
import { harmonics } from '../../spectrum/index.js';
import { assertInDelta } from '../../testing/assertInDelta.js';

const vdc = 400;
const bipolar: TimerTableOptions = {
  modulation: { method: 'sine-triangle', scheme: 'bipolar', ma: 0.8 },
  fundamentalFrequency: 50,
  carrierFrequency: 10_000,
  timerClock: 64e6,
  deadTime: 1e-6,
  vdc,
};

/**
 * Fundamental phasor (cosine part a, sine part b) of rectangular pulses of height `height`
 * (V), each given by its centre and width in radians: a pulse contributes
 * (height/π)·2·sin(w/2)·(cos θc, sin θc) (Fourier series of a rectangular pulse, standard
 * Fourier analysis).
 */
function pulsePhasor(
  pulses: { centre: number; width: number }[],
  height: number,
): [number, number] {
  let a = 0;
  let b = 0;
  for (const { centre, width } of pulses) {
    a += (height / Math.PI) * 2 * Math.sin(width / 2) * Math.cos(centre);
    b += (height / Math.PI) * 2 * Math.sin(width / 2) * Math.sin(centre);
  }
  return [a, b];
}

/** High pulses of channel `k` for a centre-aligned, symmetric table (one per carrier period). */
function centreAlignedPulses(table: TimerTable, k: number): { centre: number; width: number }[] {
  const windows = table.carrierPeriodsPerFundamental;
  return table.channels[k]!.compare.map((c, j) => ({
    centre: ((j + 0.5) * 2 * Math.PI) / windows,
    width: (2 * Math.PI * 2 * c) / (windows * table.ticksPerCarrierPeriod),
  }));
}

describe('realised waveforms', () => {
  it('match the Fourier sum of the pulses the compare values define (centre-aligned)', () => {
    const table = timerTable(bipolar);
    const output = timerTableWaveforms(table, { includeDeadTime: false }).outputs[0]!;
    const fundamental = harmonics(output, 1)[1]!;
    // Leg A = −vdc/2 + vdc on each high pulse; bipolar vAB = 2·vA.
    const [a, b] = pulsePhasor(centreAlignedPulses(table, 0), 2 * vdc);
    assertInDelta(fundamental.amplitude, Math.hypot(a, b), 1e-9 * vdc);
    // Linear range: fundamental = ma·vdc for a bipolar full bridge (fact of the trade),
    // within the (π/mf)² regular-sampling error.
    assertInDelta(fundamental.amplitude, 0.8 * vdc, 1e-3 * vdc);
  });

  it('match the Fourier sum of the pulses when edge-aligned', () => {
    const table = timerTable({ ...bipolar, countingMode: 'edge-aligned' });
    const output = timerTableWaveforms(table, { includeDeadTime: false }).outputs[0]!;
    const n = table.fullScaleCounts;
    const windows = table.carrierPeriodsPerFundamental;
    // Each high pulse runs from the counter reset for `compare` ticks.
    const pulses = table.channels[0]!.compare.map((c, j) => ({
      centre: (2 * Math.PI * (j * n + c / 2)) / (windows * n),
      width: (2 * Math.PI * c) / (windows * n),
    }));
    const [a, b] = pulsePhasor(pulses, 2 * vdc);
    assertInDelta(harmonics(output, 1)[1]!.amplitude, Math.hypot(a, b), 1e-9 * vdc);
  });

  it('give a three-level unipolar output and √3·ma·vdc/2 line-to-line for three-phase', () => {
    const unipolar = timerTableWaveforms(
      timerTable({
        ...bipolar,
        modulation: { method: 'sine-triangle', scheme: 'unipolar', ma: 0.8 },
      }),
      { includeDeadTime: false },
    );
    expect([...new Set(unipolar.outputs[0]!.levels)].sort((x, y) => x - y)).toEqual([-vdc, 0, vdc]);
    const three = timerTableWaveforms(
      timerTable({ ...bipolar, modulation: { method: 'three-phase', ma: 0.8 } }),
      { includeDeadTime: false },
    );
    // Line-to-line fundamental √3·ma·vdc/2 in the linear range (Holmes and Lipo 2003 ch. 5).
    assertInDelta(
      harmonics(three.outputs[0]!, 1)[1]!.amplitude,
      (Math.sqrt(3) * 0.8 * vdc) / 2,
      1e-3 * vdc,
    );
  });
});

describe('quantisationEffect', () => {
  it('stays within the Fourier bound of half a count per pulse', () => {
    // A coarse timer: 2 MHz / (2·10 kHz) = P = 100 counts.
    const table = timerTable({ ...bipolar, timerClock: 2e6, deadTime: 0 });
    const effect = quantisationEffect(table);
    // Each pulse moves by at most half a count (an average error of at most q/2 per carrier
    // period), so the fundamental moves by at most (4/π)·(q/2) per leg (Fourier integral of a
    // bounded error: |b1| ≤ (1/π)∫|e·sin θ| dθ), twice that for the bipolar bridge.
    expect(Math.abs(effect.fundamentalChange)).toBeLessThanOrEqual(
      2 * (4 / Math.PI) * effect.maxQuantisationError,
    );
    expect(effect.fundamentalChange).not.toBe(0);
    // The realised output is the exact pulse sum of the rounded compare values.
    const [a, b] = pulsePhasor(centreAlignedPulses(table, 0), 2 * vdc);
    assertInDelta(effect.realisedFundamental, Math.hypot(a, b), 1e-9 * vdc);
    expect(effect.realisedThd).toBeGreaterThan(0);
  });
});

describe('deadTimeEffect', () => {
  // Average-value model: each leg loses td·fsw·vdc with the sign of the current (Murai,
  // Watanabe, Miyairi, IEEE Trans. Ind. Appl. 1987, from memory); the square-wave error's
  // fundamental is (4/π)·td·fsw·vdc per leg, twice that for the H-bridge output.
  const lossBridge = (8 / Math.PI) * 1e-6 * 10_000 * vdc;

  it('lowers the H-bridge fundamental by (8/π)·td·fsw·vdc with the current in phase', () => {
    for (const countingMode of ['centre-aligned', 'edge-aligned'] as const) {
      const effect = deadTimeEffect(timerTable({ ...bipolar, countingMode }));
      assertInDelta(effect.fundamentalChange, -lossBridge, 0.01 * lossBridge, countingMode);
      assertInDelta(effect.legVoltageError, 1e-6 * 10_000 * vdc, 1e-9);
    }
    const unipolar = deadTimeEffect(
      timerTable({
        ...bipolar,
        modulation: { method: 'sine-triangle', scheme: 'unipolar', ma: 0.8 },
      }),
    );
    assertInDelta(unipolar.fundamentalChange, -lossBridge, 0.01 * lossBridge, 'unipolar');
  });

  it('turns the phasor when the current lags by π/2', () => {
    const effect = deadTimeEffect(timerTable(bipolar), { currentAngle: Math.PI / 2 });
    // Error phasor (8/π)·ΔV·e^{j(π−φ)} = +j·(8/π)ΔV at φ = π/2: the phase advances by
    // atan(E/V), the amplitude grows by √(V² + E²) − V (same model).
    const v = effect.referenceFundamental;
    assertInDelta(
      effect.fundamentalPhaseChange,
      Math.atan(lossBridge / v),
      0.02 * Math.atan(lossBridge / v),
    );
    assertInDelta(effect.fundamentalChange, Math.hypot(v, lossBridge) - v, 0.05);
  });

  it('follows a given current sign: a constant current out of leg A shifts the mean', () => {
    // Constant current out of leg A (into leg B): every carrier period loses one dead time on
    // leg A and gains one on leg B, so vAB's mean is −2·td·fsw·vdc (same volt-second rule).
    const table = timerTable(bipolar);
    const output = timerTableWaveforms(table, { currentSign: () => 1 }).outputs[0]!;
    // The mean is order 0's amplitude·cos(phase) (the Harmonic convention).
    const mean = harmonics(output, 0)[0]!;
    assertInDelta(mean.amplitude * Math.cos(mean.phase), -2 * 1e-6 * 10_000 * vdc, 1e-9 * vdc);
  });

  it('lowers a line-to-line fundamental by √3·(4/π)·td·fsw·vdc', () => {
    const effect = deadTimeEffect(
      timerTable({ ...bipolar, modulation: { method: 'three-phase', ma: 0.8 } }),
    );
    const loss = Math.sqrt(3) * (4 / Math.PI) * 1e-6 * 10_000 * vdc;
    assertInDelta(effect.fundamentalChange, -loss, 0.01 * loss);
    assertInDelta(effect.predictedFundamentalChange, -loss, 0.01 * loss);
  });
});

describe('minimumPulseEffect', () => {
  const table = timerTable({
    ...bipolar,
    modulation: { method: 'sine-triangle', scheme: 'bipolar', ma: 0.95 },
  });
  const minPulseWidth = 3e-6;
  const minTicks = minPulseWidth * 64e6;
  const p = table.fullScaleCounts;
  const windows = table.carrierPeriodsPerFundamental;
  const compare = table.channels[0]!.compare;
  const tickAngle = (2 * Math.PI) / (windows * table.ticksPerCarrierPeriod);
  // High pulse j: 2·c_j ticks centred on valley j; low pulse between valleys j and j + 1:
  // (P − c_j) + (P − c_{j+1}) ticks centred on the counter peak between them.
  const narrowHighs = compare.flatMap((c, j) =>
    c > 0 && 2 * c < minTicks
      ? [{ centre: ((j + 0.5) * 2 * Math.PI) / windows, width: 2 * c * tickAngle }]
      : [],
  );
  const narrowLows = compare.flatMap((c, j) => {
    const width = 2 * p - c - compare[(j + 1) % windows]!;
    const centre =
      ((j + 1) * 2 * Math.PI) / windows + ((c - compare[(j + 1) % windows]!) / 2) * tickAngle;
    return width > 0 && width < minTicks ? [{ centre, width: width * tickAngle }] : [];
  });

  it('counts the narrow pulses and moves the fundamental by their Fourier content when dropped', () => {
    const effect = minimumPulseEffect(table, { minPulseWidth, action: 'drop' });
    expect(narrowHighs.length).toBeGreaterThan(0);
    expect(narrowLows.length).toBeGreaterThan(0);
    expect(effect.adjustedPulses).toBe(narrowHighs.length + narrowLows.length);
    // Dropping a high pulse takes vAB from +vdc to −vdc over it (−2vdc); dropping a low pulse
    // the reverse (Fourier series of rectangular pulses).
    const before = harmonics(effect.reference, 1)[1]!;
    const [ha, hb] = pulsePhasor(narrowHighs, -2 * vdc);
    const [la, lb] = pulsePhasor(narrowLows, 2 * vdc);
    const a = before.amplitude * Math.sin(before.phase) + ha + la;
    const b = before.amplitude * Math.cos(before.phase) + hb + lb;
    assertInDelta(effect.realisedFundamental, Math.hypot(a, b), 1e-9 * vdc);
    expect(effect.fundamentalChange).toBeGreaterThan(0);
  });

  it('widens the narrow pulses to the minimum when clamped', () => {
    const effect = minimumPulseEffect(table, { minPulseWidth, action: 'clamp' });
    expect(effect.adjustedPulses).toBe(narrowHighs.length + narrowLows.length);
    const widen = (pulses: typeof narrowHighs) => [
      ...pulses.map((x) => ({ centre: x.centre, width: minTicks * tickAngle })),
    ];
    const before = harmonics(effect.reference, 1)[1]!;
    const [ha0, hb0] = pulsePhasor(narrowHighs, -2 * vdc);
    const [ha1, hb1] = pulsePhasor(widen(narrowHighs), 2 * vdc);
    const [la0, lb0] = pulsePhasor(narrowLows, 2 * vdc);
    const [la1, lb1] = pulsePhasor(widen(narrowLows), -2 * vdc);
    const a = before.amplitude * Math.sin(before.phase) + ha0 + ha1 + la0 + la1;
    const b = before.amplitude * Math.cos(before.phase) + hb0 + hb1 + lb0 + lb1;
    assertInDelta(effect.realisedFundamental, Math.hypot(a, b), 1e-9 * vdc);
    expect(effect.fundamentalChange).toBeLessThan(0);
  });

  it('changes nothing with no minimum', () => {
    const effect = minimumPulseEffect(table, { minPulseWidth: 0 });
    expect(effect.adjustedPulses).toBe(0);
    expect(effect.realised).toEqual(effect.reference);
    expect(() => minimumPulseEffect(table, { minPulseWidth: 1 })).toThrow(/minPulseWidth must be/);
  });
});

describe('firmwareEffects', () => {
  it('reports the three effects and their combination', () => {
    const table = timerTable({
      ...bipolar,
      timerClock: 8e6,
      modulation: { method: 'sine-triangle', scheme: 'unipolar', ma: 0.95 },
    });
    const all = firmwareEffects(table, { minPulseWidth: 2e-6, currentAngle: 0.3 });
    expect(all.quantisation.fundamentalChange).toBe(quantisationEffect(table).fundamentalChange);
    expect(all.deadTime.fundamentalChange).toBe(
      deadTimeEffect(table, { currentAngle: 0.3 }).fundamentalChange,
    );
    expect(all.minimumPulse.adjustedPulses).toBe(
      minimumPulseEffect(table, { minPulseWidth: 2e-6 }).adjustedPulses,
    );
    // The effects are small and nearly independent, so the total change is close to their sum
    // (first-order superposition; the tolerance covers their interaction near the peaks).
    const sum =
      all.quantisation.fundamentalChange +
      all.deadTime.fundamentalChange +
      all.minimumPulse.fundamentalChange;
    assertInDelta(all.combined.fundamentalChange, sum, 0.1 * Math.abs(sum));
    expect(all.onStateDrop).toBeNull();
  });

  it('adds the on-state drops: with equal drops v the H-bridge output loses the square wave 2v·sgn(i)', () => {
    // With the transistor's and the diode's drop equal, whichever device conducts (dead time
    // included) takes v against the current, so each leg loses v·sgn(i) and vAB = vA − vB, leg B
    // carrying −i, loses 2v·sgn(i): a fundamental phasor −(8/π)·v·e^{−jφ} in the sine basis
    // (standard circuit analysis; Fourier series of a square wave).
    const table = timerTable({
      ...bipolar,
      modulation: { method: 'sine-triangle', scheme: 'unipolar', ma: 0.9 },
    });
    const v = 1.4;
    const phi = 0.3;
    const all = firmwareEffects(table, {
      currentAngle: phi,
      onStateDrop: { transistor: v, diode: v },
    });
    const effect = all.onStateDrop!;
    const reference = harmonics(effect.reference, 1)[1]!;
    const re = reference.amplitude * Math.cos(reference.phase) - (8 / Math.PI) * v * Math.cos(-phi);
    const im = reference.amplitude * Math.sin(reference.phase) - (8 / Math.PI) * v * Math.sin(-phi);
    // Edges on the 64 MHz timer's ticks: the square wave's own edges within a tick of the zero crossings.
    assertInDelta(effect.realisedFundamental, Math.hypot(re, im), 1e-4 * (8 / Math.PI) * v);
    expect(effect.fundamentalChange).toBeLessThan(0);
    // The reference is the dead-time table with ideal switches: the dead-time effect's realised output.
    assertInDelta(effect.referenceFundamental, all.deadTime.realisedFundamental, 1e-12);
    // The combination carries the drops too: the ideal duties against every effect at once.
    const withoutDrops = firmwareEffects(table, { currentAngle: phi });
    assertInDelta(
      withoutDrops.combined.realisedFundamental - all.combined.realisedFundamental,
      -effect.fundamentalChange,
      1e-9,
    );
  });
});

describe('firmwareEffectSpectra', () => {
  it('labels the exact spectra of the reference and realised outputs by carrier group', () => {
    const table = timerTable(bipolar);
    const { combined } = firmwareEffects(table);
    const mf = table.carrierPeriodsPerFundamental;
    const spectra = firmwareEffectSpectra(combined, mf);
    expect(spectra.reference).toHaveLength(combined.maxOrder + 1);
    // The chart's fundamentals are the effect's own (both from the exact spectrum).
    expect(spectra.reference[1]?.amplitude).toBe(combined.referenceFundamental);
    expect(spectra.realised[1]?.amplitude).toBe(combined.realisedFundamental);
    // The carrier harmonic of bipolar PWM sits at order mf, labelled as the carrier itself
    // (order = m·mf + n with m = 1, n = 0; Holmes and Lipo, 2003, ch. 3).
    expect(spectra.realised[mf]?.label).toBe('mf');
    expect(spectra.realised[mf - 2]?.label).toBe('mf−2');
  });
});
