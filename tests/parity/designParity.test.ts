/**
 * One design, one analysis (issue 9): random valid designs of every method go through the
 * service (POST /api/v1/designs/report on the API's createApp, with supertest, no port) and
 * through the dashboard's live preview (the editor's own path: the stored design read into the
 * editor's draft, written back, and analysed by `previewDesign`), and every figure the product
 * shows must agree to 1e-12 relative: THD and WTHD, fundamentals, the filter output, each
 * phase's currents (RMS, ripple), load power and the limit check.
 */
import fc from 'fast-check';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DesignReport, InverterDesign } from '@pulsewright/modulation';
import { DEMO, signIn, testApp, type TestApp } from '../../apps/api/src/__tests__/helpers.js';
import { previewDesign } from '../../apps/web/src/features/studies/model/designPreview.js';
import { designOf, draftOf } from '../../apps/web/src/features/studies/model/studyDraft.js';

/** Relative agreement asked of every figure: the same library on both sides, JSON in between. */
const RELATIVE = 1e-12;

/**
 * The same options on both sides. Fewer samples per period than the editor's 1200 keep the
 * service's answer (its time series) small; every figure is computed the same way at any count.
 */
const OPTIONS = { points: 64 } as const;

const TAU = 2 * Math.PI;
const frequency = fc.constantFrom(50, 60, 400, 16.7);
const ratio = fc.integer({ min: 3, max: 101 });
const vdc = fc.double({ min: 20, max: 900, noNaN: true });
const carrierPhase = fc.double({ min: -Math.PI, max: Math.PI, noNaN: true });

const load = fc.option(
  fc.record(
    {
      r: fc.double({ min: 0.5, max: 50, noNaN: true }),
      l: fc.double({ min: 0, max: 0.05, noNaN: true }),
      emf: fc.record({
        amplitude: fc.oneof(fc.constant(0), fc.double({ min: 0.1, max: 100, noNaN: true })),
        phase: fc.double({ min: -TAU, max: TAU, noNaN: true }),
      }),
    },
    { requiredKeys: ['r', 'l'] },
  ),
  { nil: null },
);

const filter = fc.option(
  fc.oneof(
    fc.record({
      l: fc.double({ min: 2e-4, max: 5e-3, noNaN: true }),
      c: fc.double({ min: 2e-6, max: 60e-6, noNaN: true }),
      rDamping: fc.oneof(fc.constant(0), fc.double({ min: 0.01, max: 5, noNaN: true })),
    }),
    fc.record({
      l: fc.double({ min: 2e-4, max: 5e-3, noNaN: true }),
      c: fc.double({ min: 2e-6, max: 60e-6, noNaN: true }),
      rDamping: fc.double({ min: 0.1, max: 5, noNaN: true }),
      dampingPlacement: fc.constant('parallel-rc' as const),
      cDamping: fc.double({ min: 5e-6, max: 200e-6, noNaN: true }),
    }),
    fc.record({
      l: fc.double({ min: 2e-4, max: 5e-3, noNaN: true }),
      c: fc.double({ min: 2e-6, max: 60e-6, noNaN: true }),
      rDamping: fc.double({ min: 1, max: 100, noNaN: true }),
      dampingPlacement: fc.constant('parallel-with-inductor' as const),
    }),
  ),
  { nil: null },
);

/** First-quarter angles: 1 to 7 distinct, ascending, well inside (0, π/2). */
const angles = fc
  .uniqueArray(fc.double({ min: 0.02, max: Math.PI / 2 - 0.02, noNaN: true }), {
    minLength: 1,
    maxLength: 7,
    comparator: (a, b) => Math.abs(a - b) < 1e-3,
  })
  .map((list) => [...list].sort((a, b) => a - b));

const carrier = <T extends InverterDesign['modulation']>(modulation: fc.Arbitrary<T>) =>
  fc
    .record({ vdc, fundamentalFrequency: frequency, ratio, modulation, load, filter })
    .map(({ ratio: mf, ...rest }): InverterDesign => ({
      ...rest,
      carrierFrequency: mf * rest.fundamentalFrequency,
    }));

const pattern = <T extends InverterDesign['modulation']>(modulation: fc.Arbitrary<T>) =>
  fc
    .record({ vdc, fundamentalFrequency: frequency, modulation, load, filter })
    .map((design): InverterDesign => design);

const designs: fc.Arbitrary<InverterDesign> = fc.oneof(
  carrier(
    fc.record(
      {
        method: fc.constant('sine-triangle' as const),
        scheme: fc.constantFrom('bipolar' as const, 'unipolar' as const),
        ma: fc.double({ min: 0.05, max: 1.3, noNaN: true }),
        sampling: fc.constantFrom(
          'natural' as const,
          'regular-symmetric' as const,
          'regular-asymmetric' as const,
        ),
        carrierPhase,
      },
      { requiredKeys: ['method', 'scheme', 'ma'] },
    ),
  ),
  carrier(
    fc.record(
      {
        method: fc.constant('three-phase' as const),
        ma: fc.double({ min: 0.05, max: 1.15, noNaN: true }),
        zeroSequence: fc.constantFrom(
          'none' as const,
          'third-harmonic' as const,
          'min-max' as const,
          'dpwm1' as const,
          'dpwm0' as const,
          'dpwm2' as const,
          'dpwm-max' as const,
          'dpwm-min' as const,
        ),
        sampling: fc.constantFrom(
          'natural' as const,
          'regular-symmetric' as const,
          'regular-asymmetric' as const,
        ),
        carrierPhase,
      },
      { requiredKeys: ['method', 'ma'] },
    ),
  ),
  // The reduced common-mode methods refuse symmetric regular sampling (their inverted carrier).
  carrier(
    fc.record(
      {
        method: fc.constant('three-phase' as const),
        ma: fc.double({ min: 0.05, max: 1.15, noNaN: true }),
        zeroSequence: fc.constantFrom('azspwm1' as const, 'nspwm' as const),
        sampling: fc.constantFrom('natural' as const, 'regular-asymmetric' as const),
        carrierPhase,
      },
      { requiredKeys: ['method', 'ma', 'zeroSequence'] },
    ),
  ),
  carrier(
    fc.oneof(
      fc.record(
        {
          method: fc.constant('space-vector' as const),
          ma: fc.double({ min: 0.05, max: 1.27, noNaN: true }),
          sequence: fc.constant('seven-segment' as const),
          sampling: fc.constantFrom('symmetric' as const, 'asymmetric' as const),
          zeroSplit: fc.double({ min: 0, max: 1, noNaN: true }),
          overmodulation: fc.constantFrom('two-mode' as const, 'hexagon-limit' as const),
        },
        { requiredKeys: ['method', 'ma'] },
      ),
      fc.record(
        {
          method: fc.constant('space-vector' as const),
          ma: fc.double({ min: 0.05, max: 1.27, noNaN: true }),
          sequence: fc.constant('five-segment' as const),
          sampling: fc.constantFrom('symmetric' as const, 'asymmetric' as const),
          clamping: fc.constantFrom(
            'dpwm-min' as const,
            'dpwm-max' as const,
            'dpwm0' as const,
            'dpwm1' as const,
            'dpwm2' as const,
            'dpwm3' as const,
          ),
          overmodulation: fc.constantFrom('two-mode' as const, 'hexagon-limit' as const),
        },
        { requiredKeys: ['method', 'ma', 'sequence'] },
      ),
    ),
  ),
  // Multilevel carrier bridges (issue 13): every topology with the arrangements it accepts; a
  // zero sequence only on a three-phase bridge.
  carrier(
    fc
      .record({
        method: fc.constant('multilevel-carrier' as const),
        bridge: fc.constantFrom(
          { topology: 'npc' as const, levels: 3, carriers: 'pd' as const },
          { topology: 't-type' as const, levels: 3, carriers: 'apod' as const },
          { topology: 'npc' as const, levels: 3, carriers: 'pod' as const },
          { topology: 'flying-capacitor' as const, levels: 4, carriers: 'phase-shifted' as const },
          { topology: 'cascaded-h-bridge' as const, levels: 5, carriers: 'phase-shifted' as const },
          { topology: 'cascaded-h-bridge' as const, levels: 7, carriers: 'pd' as const },
        ),
        phaseCount: fc.constantFrom(1 as const, 3 as const),
        zeroSequence: fc.constantFrom(
          'none' as const,
          'third-harmonic' as const,
          'min-max' as const,
        ),
        ma: fc.double({ min: 0.05, max: 1.15, noNaN: true }),
        sampling: fc.constantFrom(
          'natural' as const,
          'regular-symmetric' as const,
          'regular-asymmetric' as const,
        ),
      })
      .map(({ bridge, phaseCount, zeroSequence, ...rest }) => ({
        ...rest,
        ...bridge,
        phaseCount,
        zeroSequence: phaseCount === 3 ? zeroSequence : ('none' as const),
      })),
  ),
  carrier(
    fc.record(
      {
        method: fc.constant('multilevel-space-vector' as const),
        topology: fc.constantFrom('npc' as const, 't-type' as const),
        ma: fc.double({ min: 0.05, max: 1.15, noNaN: true }),
        sampling: fc.constantFrom('symmetric' as const, 'asymmetric' as const),
        smallVectorSplit: fc.double({ min: 0, max: 1, noNaN: true }),
      },
      { requiredKeys: ['method', 'ma'] },
    ),
  ),
  pattern(
    fc.record(
      {
        method: fc.constant('selective-harmonic-elimination' as const),
        kind: fc.constantFrom('bipolar' as const, 'staircase' as const),
        angles,
        eliminate: fc.uniqueArray(
          fc.integer({ min: 1, max: 20 }).map((k) => 2 * k + 1),
          { maxLength: 4 },
        ),
        fundamental: fc.double({ min: 1, max: 1000, noNaN: true }),
      },
      { requiredKeys: ['method', 'kind', 'angles'] },
    ),
  ),
  pattern(
    fc.record(
      {
        method: fc.constant('optimal-pattern' as const),
        kind: fc.constantFrom('bipolar' as const, 'staircase' as const),
        angles,
        fundamental: fc.double({ min: 1, max: 1000, noNaN: true }),
      },
      { requiredKeys: ['method', 'kind', 'angles'] },
    ),
  ),
);

/** Asserts a and b agree to RELATIVE of the larger magnitude (exactly, for zero). */
function expectClose(
  a: number | null | undefined,
  b: number | null | undefined,
  what: string,
): void {
  if (a === null || a === undefined || b === null || b === undefined) {
    expect(a ?? null, what).toBe(b ?? null);
    return;
  }
  const scale = Math.max(Math.abs(a), Math.abs(b));
  expect(Math.abs(a - b), `${what}: service ${a}, dashboard ${b}`).toBeLessThanOrEqual(
    RELATIVE * scale,
  );
}

/** Every figure the product shows, compared. */
function expectSameFigures(service: DesignReport, dashboard: DesignReport): void {
  expect(service.method).toBe(dashboard.method);
  expect(service.maxOrder).toBe(dashboard.maxOrder);
  for (const key of ['bridge', 'lineToLine', 'output'] as const) {
    const s = service[key];
    const d = dashboard[key];
    expect(s === null, `${key} present on both sides`).toBe(d === null);
    if (!s || !d) continue;
    expect(s.name).toBe(d.name);
    for (const figure of [
      'fundamental',
      'rms',
      'thd',
      'thdUpperBound',
      'wthd',
      'spectrumThd',
    ] as const)
      expectClose(s[figure], d[figure], `${key}.${figure}`);
    // The labelled spectrum: same labels, same amplitudes (compared against the fundamental).
    expect(s.spectrum.map((h) => h.label)).toEqual(d.spectrum.map((h) => h.label));
    s.spectrum.forEach((h, i) =>
      expect(Math.abs(h.amplitude - (d.spectrum[i]?.amplitude ?? Number.NaN))).toBeLessThanOrEqual(
        RELATIVE * s.fundamental,
      ),
    );
  }
  expect(service.currents.length).toBe(dashboard.currents.length);
  service.currents.forEach((phase, k) => {
    const other = dashboard.currents[k];
    for (const which of ['inverter', 'capacitor', 'load'] as const) {
      const s = phase[which];
      const d = other?.[which] ?? null;
      expect(s === null, `${which} current of phase ${phase.phase} on both sides`).toBe(d === null);
      if (!s || !d) continue;
      for (const figure of ['rms', 'peak', 'fundamental', 'rippleRms', 'ripplePeakToPeak'] as const)
        expectClose(s[figure], d[figure], `${which} current ${phase.phase}.${figure}`);
    }
  });
  expectClose(service.loadPower, dashboard.loadPower, 'loadPower');
  expectClose(
    service.filter?.characteristics.resonanceFrequency,
    dashboard.filter?.characteristics.resonanceFrequency,
    'filter resonance',
  );
  expectClose(
    service.filter?.gainAtCarrier,
    dashboard.filter?.gainAtCarrier,
    'filter gain at the carrier',
  );
  const s = service.limitCheck;
  const d = dashboard.limitCheck;
  expect(s.pass).toBe(d.pass);
  expectClose(s.thd, d.thd, 'limitCheck.thd');
  expectClose(s.thdWholeWaveform, d.thdWholeWaveform, 'limitCheck.thdWholeWaveform');
  expect(s.violations.map((v) => v.order)).toEqual(d.violations.map((v) => v.order));
  expect(service.cautions).toEqual(dashboard.cautions);
  const sm = service.multilevel;
  const dm = dashboard.multilevel;
  expect(sm === null, 'multilevel figures on both sides').toBe(dm === null);
  if (sm && dm) {
    expect(sm.legs.map((l) => [l.name, l.edgesPerPeriod])).toEqual(
      dm.legs.map((l) => [l.name, l.edgesPerPeriod]),
    );
    expect(sm.devices).toEqual(dm.devices);
    expectClose(sm.averageDeviceFrequency, dm.averageDeviceFrequency, 'averageDeviceFrequency');
    expectClose(
      sm.balance?.neutralPoint?.lowFrequencyRipple,
      dm.balance?.neutralPoint?.lowFrequencyRipple,
      'neutral-point ripple',
    );
    expectClose(
      sm.balance?.cellPower?.strings[0]?.power,
      dm.balance?.cellPower?.strings[0]?.power,
      'string a power',
    );
  }
}

describe('service and dashboard give the same figures for the same design', () => {
  let api: TestApp;
  let token: string;
  beforeAll(async () => {
    api = await testApp();
    token = await signIn(api.app, DEMO.viewer);
  });
  afterAll(async () => {
    await api?.dispose();
  });

  it('for random valid designs of every method, to 1e-12 relative', async () => {
    const methods = new Set<string>();
    await fc.assert(
      fc.asyncProperty(designs, async (design) => {
        methods.add(design.modulation.method);
        const response = await request(api.app)
          .post('/api/v1/designs/report')
          .set('Authorization', `Bearer ${token}`)
          .send({ design, ...OPTIONS });
        expect(response.status, JSON.stringify(response.body).slice(0, 400)).toBe(200);
        // What the editor shows for this design once saved: read into its draft, written back, analysed.
        const { report, errors } = previewDesign(
          designOf(draftOf(design, { name: 'parity', projectId: 'p' })),
          OPTIONS,
        );
        expect(errors).toEqual([]);
        expectSameFigures(response.body as DesignReport, report as DesignReport);
      }),
      { numRuns: 80, seed: 20260901 },
    );
    expect([...methods].sort()).toEqual([
      'multilevel-carrier',
      'multilevel-space-vector',
      'optimal-pattern',
      'selective-harmonic-elimination',
      'sine-triangle',
      'space-vector',
      'three-phase',
    ]);
  }, 60_000);
});
