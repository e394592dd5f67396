import { describe, expect, it } from 'vitest';
import { computePreview } from './computePreview';
import { defaultDraft } from './studyDraft';

describe('computePreview', () => {
  it('gives a bipolar bridge fundamental of ma·Vdc in the linear range', () => {
    // Fact of the trade (REFERENCES.md): sine-triangle, ma ≤ 1, bipolar full bridge → V1 = ma·Vdc.
    const { preview, errors } = computePreview({ ...defaultDraft(), ma: 0.7, mf: 21, vdc: 400 });
    expect(errors).toEqual([]);
    expect(preview?.fundamental).toBeGreaterThan(0.7 * 400 * 0.995);
    expect(preview?.fundamental).toBeLessThan(0.7 * 400 * 1.005);
    // Power into R is R·I_rms² (REFERENCES.md, RL load).
    const steady = preview?.load?.steady;
    expect(steady?.power).toBeCloseTo(10 * (steady?.rmsCurrent ?? 0) ** 2, 6);
  });

  it('names the refused field instead of returning NaN', () => {
    const { preview, errors } = computePreview({ ...defaultDraft(), ma: -0.2 });
    expect(preview).toBeNull();
    expect(errors[0]?.field).toBe('ma');
    expect(errors[0]?.message).toMatch(/ma/);
  });

  it('keeps the waveform when only the load is refused', () => {
    const { preview, errors } = computePreview({ ...defaultDraft(), r: 0 });
    expect(preview?.spectrum.length).toBeGreaterThan(0);
    expect(preview?.load).toBeNull();
    expect(errors.map((e) => e.field)).toEqual(['r']);
  });

  it('previews the three-phase and space-vector methods', () => {
    for (const method of ['three-phase', 'space-vector'] as const) {
      const { preview, errors } = computePreview({ ...defaultDraft(), method, mf: 33 });
      expect(errors).toEqual([]);
      expect(preview?.outputName).toBe('Line-to-line a−b');
    }
  });
});
