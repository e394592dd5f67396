import { describe, expect, it } from 'vitest';
import { computePreview } from './computePreview';
import type { Study } from '../api/studies';
import { defaultDraft, draftFromStudy, modulationOf } from './studyDraft';

/** A stored study as the API returns it (its `modulation` is typed as a plain object there). */
const stored = (modulation: Record<string, unknown>) => ({ name: 'x', note: '', projectId: 'p', modulation: modulation as Study['modulation'], load: null, filter: null });

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

  it('previews a stored harmonic-elimination pattern: one staircase step at π/6 has no 3rd harmonic', () => {
    const vdc = 100;
    const modulation = { method: 'selective-harmonic-elimination', kind: 'staircase', vdc, angles: [Math.PI / 6], eliminate: [3] };
    const draft = draftFromStudy(stored(modulation));
    expect(draft.she).toEqual({ kind: 'staircase', angles: [Math.PI / 6], eliminate: [3] });
    // The draft sends back exactly what was stored.
    expect(modulationOf(draft)).toEqual(modulation);
    const { preview, errors } = computePreview(draft);
    expect(errors).toEqual([]);
    expect(preview?.modulator).toBeNull();
    // Staircase series b_n = (4·vdc/(nπ))·Σ cos nα (Patel and Hoft, IEEE Trans. Ind. Appl., 1973):
    // b_1 = (4·vdc/π)·cos(π/6), and cos(3·π/6) = 0 removes the 3rd.
    expect(preview?.fundamental).toBeCloseTo(((4 * vdc) / Math.PI) * Math.cos(Math.PI / 6), 9);
    expect(preview?.spectrum[3]?.amplitude ?? 1).toBeLessThan(1e-9 * (preview?.fundamental ?? 0));
  });

  it('sends a space-vector draft as the API document names it (frequencyRatio) and reads it back', () => {
    const draft = { ...defaultDraft('p'), method: 'space-vector' as const, ma: 0.9, mf: 45, vdc: 600 };
    const modulation = modulationOf(draft);
    expect(modulation).toEqual({ method: 'space-vector', ma: 0.9, vdc: 600, frequencyRatio: 45, sequence: 'seven-segment' });
    const back = draftFromStudy(stored(modulation));
    expect(back).toMatchObject({ method: 'space-vector', ma: 0.9, mf: 45 });
    // Stored with m instead: ma = 2m/√3 (Holmes and Lipo 2003, ch. 5), read through the library.
    const fromM = draftFromStudy(stored({ method: 'space-vector', m: 0.75, vdc: 600, frequencyRatio: 45 }));
    expect(fromM.ma).toBeCloseTo((2 * 0.75) / Math.sqrt(3), 12);
  });
});
