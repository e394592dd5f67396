import { describe, expect, it } from 'vitest';
import { assertInDelta } from '../../testing/assertInDelta.js';
import { rangeErrorField } from '../../testing/rangeErrorField.js';
import { analyseDesign } from '../analyseDesign.js';
import { designCarrierSpan } from '../designCarrierSpan.js';
import type { RationalRatio } from '../designRationalRatio.js';
import { designSpanSpectrum } from '../designSpanSpectrum.js';
import type { InverterDesign } from '../InverterDesign.js';

// A drive with a fixed 4 kHz carrier at 37 Hz: mf = 4000/37, a 37-period span.
const drive: InverterDesign = {
  vdc: 560,
  fundamentalFrequency: 37,
  carrierFrequency: 4000,
  modulation: { method: 'three-phase', ma: 0.7, zeroSequence: 'none' },
};
const single: InverterDesign = {
  vdc: 400,
  fundamentalFrequency: 30,
  carrierFrequency: 1010,
  modulation: { method: 'sine-triangle', ma: 0.8, scheme: 'unipolar' },
};

describe('designSpanSpectrum', () => {
  it("a three-phase design at 4000/37 gives line a−b's components at n/37 with the linear range's fundamental", () => {
    const span = designCarrierSpan(drive) as RationalRatio;
    const result = designSpanSpectrum(drive, span, { maxOrder: 60 });
    expect(result.name).toBe('line a−b');
    expect(result.carrierSpan).toMatchObject({ p: 4000, q: 37, baseFrequency: 1 });
    expect(result.harmonics).toHaveLength(37 * 60 + 1);
    assertInDelta(result.harmonics[1]?.order ?? NaN, 1 / 37, 1e-15, 'first component 1/37');
    // Naturally sampled sine-triangle in the linear range: line fundamental √3·ma·vdc/2 (Holmes
    // and Lipo, 2003, ch. 3; the sidebands that could land on it, m = 37k, carry J_n of order
    // about 4000 at an argument below 100: far below rounding).
    assertInDelta(
      result.harmonics[37]?.amplitude ?? NaN,
      (Math.sqrt(3) * 0.7 * 560) / 2,
      1e-9 * 560,
      'fundamental',
    );
  });

  it("is the design report's line a−b (three-phase) or bridge output (single-phase) over its span", () => {
    // The report's span figures are checked against their sources in analyseDesignSpan.test.ts;
    // this is the same voltage read to the same order, so the same numbers to rounding.
    for (const design of [drive, single]) {
      const span = designCarrierSpan(design) as RationalRatio;
      const result = designSpanSpectrum(design, span, { maxOrder: 60 });
      const report = analyseDesign(design, { maxOrder: 60 });
      const voltage = report.lineToLine ?? report.bridge;
      expect(result.name).toBe(voltage.name);
      expect(result.harmonics).toHaveLength(voltage.spectrum.length);
      result.harmonics.forEach((h, n) => {
        const expected = voltage.spectrum[n];
        assertInDelta(h.order, expected?.order ?? NaN, 1e-12, `order ${n}`);
        assertInDelta(h.amplitude, expected?.amplitude ?? NaN, 1e-9, `amplitude ${n}`);
      });
      assertInDelta(result.thd, voltage.thd, 1e-12, 'thd');
      assertInDelta(result.wthd, voltage.wthd, 1e-12, 'wthd');
      assertInDelta(result.spectrumThd, voltage.spectrumThd ?? NaN, 1e-12, 'spectrumThd');
      // Parseval: the shown components' THD cannot exceed the whole span's.
      expect(result.spectrumThd).toBeLessThanOrEqual(result.thd + 1e-12);
    }
  });

  it('refuses an order beyond the span cost bound, naming maxOrder', () => {
    const span = designCarrierSpan(drive) as RationalRatio;
    // 2e7/(4000·37) = 135.1: order 136 is refused before any work.
    expect(rangeErrorField(() => designSpanSpectrum(drive, span, { maxOrder: 136 }))).toBe(
      'maxOrder',
    );
  });
});
