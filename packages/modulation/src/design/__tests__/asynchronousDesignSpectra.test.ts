import { describe, expect, it } from 'vitest';
import { rangeErrorField } from '../../testing/rangeErrorField.js';
import { analyseDesign } from '../analyseDesign.js';
import { asynchronousDesignSpectra } from '../asynchronousDesignSpectra.js';
import type { InverterDesign } from '../InverterDesign.js';

const vdc = 600;

describe('asynchronousDesignSpectra', () => {
  const whole: InverterDesign[] = [
    {
      vdc,
      fundamentalFrequency: 50,
      carrierFrequency: 1050,
      modulation: { method: 'sine-triangle', scheme: 'unipolar', ma: 0.8 },
    },
    {
      vdc,
      fundamentalFrequency: 50,
      carrierFrequency: 2550,
      modulation: { method: 'three-phase', ma: 0.9, zeroSequence: 'dpwm1' },
    },
    {
      vdc,
      fundamentalFrequency: 60,
      carrierFrequency: 1080,
      modulation: { method: 'space-vector', m: 0.8 },
    },
  ];
  for (const design of whole) {
    it(`a whole ratio (q = 1) gives analyseDesign's figures to 1e-12: ${design.modulation.method}`, () => {
      const result = asynchronousDesignSpectra(design, { maxOrder: 60 });
      const report = analyseDesign(design, { maxOrder: 60 });
      expect(result.q).toBe(1);
      expect(result.carrierError).toBe(0);
      const pairs = [
        [result.voltages[0], report.bridge],
        [result.voltages[2], report.lineToLine],
      ] as const;
      for (const [mine, theirs] of pairs) {
        if (theirs === null || theirs === undefined) continue;
        expect(mine?.name).toBe(theirs.name);
        const spectrum = mine?.spectrum;
        expect(Math.abs((spectrum?.fundamental ?? NaN) - theirs.fundamental)).toBeLessThan(
          1e-12 * vdc,
        );
        expect(Math.abs((spectrum?.thd ?? NaN) - theirs.thd)).toBeLessThan(1e-12);
        expect(Math.abs((spectrum?.wthd ?? NaN) - theirs.wthd)).toBeLessThan(1e-12);
        theirs.spectrum.forEach((h, n) => {
          expect(Math.abs((spectrum?.components[n]?.amplitude ?? NaN) - h.amplitude)).toBeLessThan(
            1e-12 * vdc,
          );
        });
      }
    });
  }

  it('a fixed 2 kHz carrier at 37.3 Hz: nearest p/q with q ≤ 64, the error in hertz, the line fundamental √3·ma·vdc/2 (Holmes and Lipo ch. 5) to 1e-6', () => {
    const design: InverterDesign = {
      vdc,
      fundamentalFrequency: 37.3,
      carrierFrequency: 2000,
      modulation: { method: 'three-phase', ma: 0.85, zeroSequence: 'none' },
    };
    const result = asynchronousDesignSpectra(design, { maxOrder: 20 });
    expect(result.q).toBeGreaterThan(1);
    expect(result.q).toBeLessThanOrEqual(64);
    expect(Math.abs(result.carrierError - ((result.p / result.q) * 37.3 - 2000))).toBeLessThan(
      1e-9,
    );
    expect(Math.abs(result.carrierError)).toBeLessThan(37.3 / (result.q * 65));
    expect(result.baseFrequency).toBeCloseTo(37.3 / result.q, 12);
    const line = result.voltages[2];
    expect(line?.name).toBe('line a−b');
    expect(
      Math.abs((line?.spectrum.fundamental ?? NaN) - (Math.sqrt(3) * 0.85 * vdc) / 2),
    ).toBeLessThan(1e-6 * vdc);
    expect(line?.spectrum.components[1]?.label).toBe(`1/${result.q}`);
  });

  it('a low fixed carrier (100 Hz at 37.3 Hz, mf ≈ 2.68): sub-harmonic content in the bridge voltage (Holmes and Lipo ch. 3)', () => {
    const design: InverterDesign = {
      vdc,
      fundamentalFrequency: 37.3,
      carrierFrequency: 100,
      modulation: { method: 'sine-triangle', scheme: 'bipolar', ma: 0.8 },
    };
    const result = asynchronousDesignSpectra(design, { maxOrder: 5 });
    const bridge = result.voltages[0]?.spectrum;
    const below = (bridge?.components ?? []).filter((c) => c.order > 0 && c.order < 1);
    const largest = Math.max(...below.map((c) => c.amplitude));
    expect(largest).toBeGreaterThan(1e-2 * vdc);
  });

  it('names the field: a stored pattern, a carrier below the fundamental, a bad ma, too many orders', () => {
    const base: InverterDesign = {
      vdc,
      fundamentalFrequency: 37.3,
      carrierFrequency: 2000,
      modulation: { method: 'three-phase', ma: 0.85 },
    };
    expect(
      rangeErrorField(() =>
        asynchronousDesignSpectra({
          vdc,
          fundamentalFrequency: 50,
          modulation: {
            method: 'selective-harmonic-elimination',
            kind: 'bipolar',
            angles: [0.3, 0.6],
          },
        }),
      ),
    ).toBe('modulation.method');
    expect(
      rangeErrorField(() => asynchronousDesignSpectra({ ...base, carrierFrequency: 20 })),
    ).toBe('carrierFrequency');
    expect(
      rangeErrorField(() =>
        asynchronousDesignSpectra({ ...base, modulation: { method: 'three-phase', ma: -1 } }),
      ),
    ).toBe('modulation.ma');
    expect(rangeErrorField(() => asynchronousDesignSpectra(base, { maxOrder: 100_000 }))).toBe(
      'maxOrder',
    );
  });
});
