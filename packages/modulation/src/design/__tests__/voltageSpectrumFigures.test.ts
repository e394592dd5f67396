import { describe, expect, it } from 'vitest';
import { assertInDelta } from '../../testing/assertInDelta.js';
import { rangeErrorField } from '../../testing/rangeErrorField.js';
import { sineTriangle } from '../../carrier/sineTriangle.js';
import { voltageFigures } from '../voltageFigures.js';
import { voltageSpectrumFigures } from '../voltageSpectrumFigures.js';

// A ±200 V square wave: V_n = 4·200/(nπ) on odd n, 0 on even n (standard Fourier analysis).
const square = { name: 'bridge output', waveform: { edges: [0, Math.PI], levels: [200, -200] } };

describe('voltageFigures input checks', () => {
  it('refuses a spectrum without its fundamental, naming maxOrder', () => {
    expect(rangeErrorField(() => voltageFigures(square, { maxOrder: 0 }))).toBe('maxOrder');
    expect(rangeErrorField(() => voltageFigures(square, { maxOrder: 1.5 }))).toBe('maxOrder');
    expect(rangeErrorField(() => voltageFigures(square, { maxOrder: 1 }))).toBeUndefined();
  });
});

describe('voltageSpectrumFigures: the spectrum figures without labels', () => {
  it('square wave: V_n = 4V/(nπ) on odd n, THD √(π²/8 − 1), WTHD √(π⁴/96 − 1), spectrum THD the partial sum', () => {
    const maxOrder = 51;
    const figures = voltageSpectrumFigures(square, { maxOrder });
    expect(figures.name).toBe('bridge output');
    expect(figures.spectrum).toHaveLength(maxOrder + 1);
    for (const { order, amplitude } of figures.spectrum) {
      const expected = order % 2 === 1 ? (4 * 200) / (order * Math.PI) : 0;
      assertInDelta(amplitude, expected, 1e-10, `order ${order}`);
    }
    // Σ_{odd n≥3} 1/n² = π²/8 − 1 and Σ_{odd n≥3} 1/n⁴ = π⁴/96 − 1 (Dirichlet lambda function,
    // λ(2) = π²/8, λ(4) = π⁴/96; any table of series).
    assertInDelta(figures.thd, Math.sqrt(Math.PI ** 2 / 8 - 1), 1e-14, 'THD');
    assertInDelta(figures.wthd, Math.sqrt(Math.PI ** 4 / 96 - 1), 1e-14, 'WTHD');
    // With V_n/V_1 = 1/n, the THD of orders 3..51 is √(Σ_{odd 3..51} 1/n²), summed here by hand.
    let partial = 0;
    for (let n = 3; n <= maxOrder; n += 2) partial += 1 / n ** 2;
    assertInDelta(figures.spectrumThd, Math.sqrt(partial), 1e-12, 'spectrum THD');
  });

  it('gives voltageFigures its numbers: the same orders, amplitudes and phases, THD, WTHD and spectrum THD', () => {
    const waveform = sineTriangle({ scheme: 'bipolar', ma: 0.9, mf: 21, vdc: 400 });
    const voltage = { name: 'bridge output', waveform };
    const plain = voltageSpectrumFigures(voltage, { maxOrder: 1050 });
    const labelled = voltageFigures(voltage, { maxOrder: 1050, frequencyRatio: 21 });
    expect(plain.spectrum).toEqual(
      labelled.spectrum.map(({ order, amplitude, phase }) => ({ order, amplitude, phase })),
    );
    expect([plain.thd, plain.wthd, plain.spectrumThd]).toEqual([
      labelled.thd,
      labelled.wthd,
      labelled.spectrumThd,
    ]);
    // The bridge output of a single-phase full bridge under bipolar sine-triangle PWM swings ±vdc,
    // its fundamental ma·vdc in the linear range (Holmes and Lipo 2003, ch. 3): here 360 V.
    assertInDelta(plain.spectrum[1]!.amplitude, 360, 1e-6, 'fundamental');
  });

  it('names maxOrder when it is out of range', () => {
    expect(() => voltageSpectrumFigures(square, { maxOrder: -1 })).toThrow(/maxOrder/);
  });
});
