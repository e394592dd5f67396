import { analyseDesign, MODULATION_METHODS, type InverterDesign } from '@pulsewright/modulation';
import { describe, expect, it } from 'vitest';
import { defaultDraft, designOf, draftOf } from './studyDraft';

const study = { name: 'x', note: '', projectId: 'p' };

/** One design of each method with every option the model has set away from its default. */
const DESIGNS: InverterDesign[] = [
  {
    vdc: 400,
    fundamentalFrequency: 50,
    carrierFrequency: 1050,
    modulation: {
      method: 'sine-triangle',
      scheme: 'unipolar',
      ma: 0.9,
      sampling: 'regular-asymmetric',
      carrierPhase: 0.25,
    },
    load: { r: 8, l: 0.01, emf: { amplitude: 50, phase: -0.3 } },
    filter: { l: 0.001, c: 10e-6, rDamping: 2, dampingPlacement: 'parallel-rc', cDamping: 40e-6 },
  },
  {
    vdc: 600,
    fundamentalFrequency: 60,
    carrierFrequency: 2460,
    modulation: {
      method: 'three-phase',
      ma: 1.1,
      zeroSequence: 'dpwm2',
      sampling: 'regular-symmetric',
      carrierPhase: 0,
    },
    load: { r: 5, l: 0.004 },
    filter: null,
  },
  {
    vdc: 700,
    fundamentalFrequency: 50,
    carrierFrequency: 4000,
    modulation: {
      method: 'space-vector',
      ma: 1.2,
      sequence: 'five-segment',
      sampling: 'asymmetric',
      clamping: 'dpwm3',
      overmodulation: 'hexagon-limit',
    },
    load: null,
    filter: { l: 0.002, c: 5e-6, rDamping: 0, dampingPlacement: 'series-with-capacitor' },
  },
  {
    vdc: 100,
    fundamentalFrequency: 50,
    modulation: {
      method: 'selective-harmonic-elimination',
      kind: 'staircase',
      angles: [0.2, 0.6, 1.1],
      eliminate: [5, 7],
      fundamental: 330,
    },
    load: { r: 10, l: 0.02 },
    filter: null,
  },
  {
    vdc: 100,
    fundamentalFrequency: 400,
    modulation: { method: 'optimal-pattern', kind: 'bipolar', angles: [0.3, 0.5, 0.9] },
    load: null,
    filter: null,
  },
  {
    vdc: 700,
    fundamentalFrequency: 50,
    carrierFrequency: 2050,
    modulation: {
      method: 'multilevel-carrier',
      topology: 'flying-capacitor',
      levels: 5,
      carriers: 'phase-shifted',
      phaseCount: 3,
      zeroSequence: 'min-max',
      ma: 1.05,
      sampling: 'regular-asymmetric',
      carrierPhase: 0.1,
    },
    load: { r: 6, l: 0.008 },
    filter: null,
  },
  {
    vdc: 800,
    fundamentalFrequency: 50,
    carrierFrequency: 2500,
    modulation: {
      method: 'multilevel-space-vector',
      topology: 't-type',
      smallVectorSplit: 0.3,
      ma: 0.9,
      sampling: 'asymmetric',
    },
    load: { r: 6, l: 0.008 },
    filter: null,
  },
];

describe('draft ↔ design', () => {
  it('covers every method of the library', () => {
    expect(DESIGNS.map((d) => d.modulation.method).sort()).toEqual([...MODULATION_METHODS].sort());
  });

  it.each(DESIGNS.map((d) => [d.modulation.method, d] as const))(
    'reads a %s design into the editor and writes back exactly what was stored',
    (_method, design) => {
      const draft = draftOf(design, study);
      expect(designOf(draft)).toEqual(design);
    },
  );

  it('keeps a clamping stored with the seven-segment sequence, and a zero split with the five (issue 10)', () => {
    // The library's space-vector options hold both; each sequence reads one (spaceVectorWaveforms).
    const seven: InverterDesign = {
      vdc: 700,
      fundamentalFrequency: 50,
      carrierFrequency: 4000,
      modulation: {
        method: 'space-vector',
        ma: 0.9,
        sequence: 'seven-segment',
        zeroSplit: 0.3,
        clamping: 'dpwm3',
      },
      load: null,
      filter: null,
    };
    const draft = draftOf(seven, study);
    expect(designOf(draft).modulation).toMatchObject({ zeroSplit: 0.3, clamping: 'dpwm3' });
    // Switching to five segments reads the stored clamping, and the zero split stays stored.
    expect(designOf({ ...draft, sequence: 'five-segment' }).modulation).toMatchObject({
      sequence: 'five-segment',
      clamping: 'dpwm3',
      zeroSplit: 0.3,
    });
    // A design stored without the other sequence's field does not gain one.
    const plain = { ...seven, modulation: { method: 'space-vector', ma: 0.9, zeroSplit: 0.3 } };
    expect(designOf(draftOf(plain as InverterDesign, study)).modulation).not.toHaveProperty(
      'clamping',
    );
  });

  it('writes the design of a new study that the library accepts', () => {
    const design = designOf(defaultDraft('p'));
    expect(design).toMatchObject({
      vdc: 400,
      fundamentalFrequency: 50,
      carrierFrequency: 1050,
      modulation: { method: 'sine-triangle', scheme: 'bipolar', ma: 0.8 },
    });
    // Bipolar naturally sampled sine-triangle, ma ≤ 1: V1 = ma·Vdc at the bridge (Holmes and
    // Lipo 2003, ch. 3). The only other terms at order 1 are the sidebands with m·mf + n = 1,
    // weighted by J_20(0.4π) ≈ 4e-23 and smaller (Black's double Fourier series), and the
    // library integrates the exact waveform, so 1e-9 relative leaves room for rounding only.
    expect(Math.abs(analyseDesign(design).bridge.fundamental / (0.8 * 400) - 1)).toBeLessThan(1e-9);
  });

  it('keeps the values of a switched-off load and filter in the draft but leaves them out of the design', () => {
    const draft = {
      ...draftOf(DESIGNS[0] as InverterDesign, study),
      loadOn: false,
      filterOn: false,
    };
    expect(designOf(draft)).toMatchObject({ load: null, filter: null });
    expect(designOf({ ...draft, loadOn: true }).load).toEqual(DESIGNS[0]?.load);
  });

  it('leaves the carrier out of a pattern design and keeps the pattern when the method is switched away and back', () => {
    const draft = draftOf(DESIGNS[3] as InverterDesign, study);
    expect('carrierFrequency' in designOf(draft)).toBe(false);
    const away = designOf({ ...draft, method: 'sine-triangle' });
    expect(away.carrierFrequency).toBe(1050);
    expect(designOf({ ...draft, method: 'selective-harmonic-elimination' })).toEqual(DESIGNS[3]);
  });

  it('reads a space-vector index stored as m as ma = 2m/√3 (Holmes and Lipo 2003, ch. 5), through the library', () => {
    const draft = draftOf(
      {
        vdc: 600,
        fundamentalFrequency: 50,
        carrierFrequency: 2250,
        modulation: { method: 'space-vector', m: 0.75 },
      },
      study,
    );
    expect(draft.ma).toBeCloseTo((2 * 0.75) / Math.sqrt(3), 12);
  });
});
