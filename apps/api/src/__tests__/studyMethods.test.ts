import { solveShe } from '@pulsewright/modulation';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, signIn, testApp, type TestApp } from './helpers.js';
import { SINE_TRIANGLE, SPACE_VECTOR, SPACE_VECTOR_DESIGN } from './fixtures.js';

/** A stored pattern's design at 50 Hz (no carrier). */
const patternDesign = (modulation: object, vdc: number) => ({
  vdc,
  fundamentalFrequency: 50,
  modulation,
});

/**
 * Studies of the two methods beyond the carrier ones: space-vector PWM and a solved
 * selective-harmonic-elimination (SHE) pattern, from create to the saved study's spectrum.
 */
describe('space-vector and harmonic-elimination studies', () => {
  let t: TestApp;
  let auth: { Authorization: string };
  let projectId: string;
  beforeAll(async () => {
    t = await testApp();
    auth = { Authorization: `Bearer ${await signIn(t.app, DEMO.engineer)}` };
    projectId = (
      await request(t.app).post('/api/v1/projects').set(auth).send({ name: 'Other methods' })
    ).body.id;
  });
  afterAll(async () => t.dispose());

  const studyCount = async () =>
    (await request(t.app).get('/api/v1/studies').query({ projectId }).set(auth)).body
      .length as number;
  const spectrumOf = async (id: string, maxOrder: number) => {
    const res = await request(t.app)
      .get(`/api/v1/studies/${id}/spectrum`)
      .query({ maxOrder })
      .set(auth);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    return res.body as {
      harmonics: { order: number; amplitude: number; phase: number }[];
      thd: number;
      wthd: number;
    };
  };

  it('saves a staircase SHE pattern solved for the 3rd harmonic; its spectrum has no 3rd', async () => {
    const vdc = 100;
    const solved = solveShe({ kind: 'staircase', vdc, count: 1, eliminate: [3] });
    expect(solved.converged).toBe(true);
    // One step removes the 3rd where cos 3α = 0, α = π/6 (Patel and Hoft, IEEE Trans. Ind. Appl., 1973).
    expect(solved.angles[0]).toBeCloseTo(Math.PI / 6, 12);
    const design = patternDesign(
      {
        method: 'selective-harmonic-elimination',
        kind: 'staircase',
        angles: solved.angles,
        eliminate: [3],
      },
      vdc,
    );
    const created = await request(t.app)
      .post('/api/v1/studies')
      .set(auth)
      .send({ projectId, name: 'One-step staircase', design });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    expect(created.body).toMatchObject({ method: 'selective-harmonic-elimination', design });
    const spectrum = await spectrumOf(created.body.id, 49);
    const h = spectrum.harmonics;
    // Staircase Fourier series b_n = (4·vdc/(nπ))·Σ cos nα_k (Patel and Hoft 1973): b_1 = (4·vdc/π)·cos(π/6).
    expect(h[1]!.amplitude).toBeCloseTo(((4 * vdc) / Math.PI) * Math.cos(Math.PI / 6), 9);
    // The eliminated order, by the exact spectrum, below 1e-9 of the fundamental (docs/references.md, SHE).
    expect(h[3]!.amplitude / h[1]!.amplitude).toBeLessThan(1e-9);
    // b_5 = (4·vdc/(5π))·|cos(5π/6)| from the same series.
    expect(h[5]!.amplitude).toBeCloseTo(((4 * vdc) / (5 * Math.PI)) * Math.cos(Math.PI / 6), 9);
    // Quarter- and half-wave symmetry: no DC and no even harmonics (common practice).
    for (const x of h.filter((x) => x.order % 2 === 0)) expect(x.amplitude).toBeLessThan(1e-9);
  });

  it('saves and revises a bipolar SHE study; the revision keeps the eliminated orders nulled', async () => {
    const vdc = 200;
    const first = solveShe({ kind: 'bipolar', vdc, count: 3, eliminate: [5, 7], fundamental: 150 });
    const second = solveShe({
      kind: 'bipolar',
      vdc,
      count: 3,
      eliminate: [5, 7],
      fundamental: 170,
      angles: first.angles,
    });
    expect(first.converged && second.converged).toBe(true);
    const design = (angles: number[], fundamental: number) =>
      patternDesign(
        {
          method: 'selective-harmonic-elimination',
          kind: 'bipolar',
          angles,
          eliminate: [5, 7],
          fundamental,
        },
        vdc,
      );
    const created = await request(t.app)
      .post('/api/v1/studies')
      .set(auth)
      .send({ projectId, name: 'Bipolar 3 angles', design: design(first.angles, 150) });
    expect(created.status).toBe(201);
    const updated = await request(t.app)
      .put(`/api/v1/studies/${created.body.id}`)
      .set(auth)
      .send({ baseRevision: 1, name: 'Bipolar 3 angles', design: design(second.angles, 170) });
    expect(updated.status, JSON.stringify(updated.body)).toBe(200);
    expect(updated.body).toMatchObject({
      revision: 2,
      design: { modulation: { angles: second.angles, fundamental: 170 } },
    });
    const h = (await spectrumOf(created.body.id, 25)).harmonics;
    // The solve's goal, checked on the saved study by the exact spectrum (docs/references.md, SHE residuals).
    expect(h[1]!.amplitude).toBeCloseTo(170, 6);
    expect(h[5]!.amplitude / h[1]!.amplitude).toBeLessThan(1e-9);
    expect(h[7]!.amplitude / h[1]!.amplitude).toBeLessThan(1e-9);
  });

  it('refuses descending angles, angles at or past π/2 and even orders with 400 naming the field, saving nothing', async () => {
    const before = await studyCount();
    const base = { method: 'selective-harmonic-elimination', kind: 'bipolar' };
    const cases: { modulation: object; path: string; words: string[] }[] = [
      {
        modulation: { ...base, angles: [0.5, 0.3] },
        path: 'design.modulation.angles[1]',
        words: ['strictly greater than'],
      },
      {
        modulation: { ...base, angles: [0.4, 0.4] },
        path: 'design.modulation.angles[1]',
        words: ['strictly greater than'],
      },
      {
        modulation: { ...base, angles: [0.3, Math.PI / 2] },
        path: 'design.modulation.angles',
        words: ['< 1.5707963267948966'],
      },
      {
        modulation: { ...base, angles: [0.3, 1.6] },
        path: 'design.modulation.angles',
        words: ['1.6'],
      },
      { modulation: { ...base, angles: [] }, path: 'design.modulation.angles', words: [] },
      {
        modulation: { ...base, angles: Array.from({ length: 32 }, (_, k) => (k + 1) * 0.04) },
        path: 'design.modulation.angles',
        words: ['31'],
      },
      {
        modulation: { ...base, angles: [0.3], eliminate: [4] },
        path: 'design.modulation.eliminate[0]',
        words: ['odd'],
      },
      {
        modulation: { ...base, kind: 'tripolar', angles: [0.3] },
        path: 'design.modulation.kind',
        words: ['bipolar', 'staircase'],
      },
    ];
    for (const c of cases) {
      const res = await request(t.app)
        .post('/api/v1/studies')
        .set(auth)
        .send({ projectId, name: 'Bad pattern', design: patternDesign(c.modulation, 100) });
      expect(res.status, JSON.stringify(c.modulation)).toBe(400);
      expect(res.headers['content-type']).toMatch(/application\/problem\+json/);
      const paths = (res.body.errors as { path: string }[]).map((e) => e.path);
      expect(
        paths.some((p) => p.startsWith(c.path)),
        `${JSON.stringify(paths)} names ${c.path}`,
      ).toBe(true);
      for (const w of c.words) expect(JSON.stringify(res.body)).toContain(w);
    }
    expect(await studyCount()).toBe(before);

    // An edit with bad angles is refused too, and the study keeps its one revision.
    const study = (
      await request(t.app)
        .post('/api/v1/studies')
        .set(auth)
        .send({
          projectId,
          name: 'Good pattern',
          design: patternDesign({ ...base, angles: [0.3, 0.6] }, 100),
        })
    ).body;
    const bad = await request(t.app)
      .put(`/api/v1/studies/${study.id}`)
      .set(auth)
      .send({
        baseRevision: 1,
        name: 'Good pattern',
        design: patternDesign({ ...base, angles: [0.6, 0.3] }, 100),
      });
    expect(bad.status).toBe(400);
    expect(bad.body.errors[0].path).toBe('design.modulation.angles[1]');
    // A stored pattern has no carrier: a carrierFrequency is refused naming it.
    const carrier = await request(t.app)
      .post('/api/v1/studies')
      .set(auth)
      .send({
        projectId,
        name: 'Pattern with carrier',
        design: { ...patternDesign({ ...base, angles: [0.3] }, 100), carrierFrequency: 1000 },
      });
    expect(carrier.status).toBe(400);
    expect(carrier.body.errors[0].path).toBe('design.carrierFrequency');
    const revisions = (await request(t.app).get(`/api/v1/studies/${study.id}/revisions`).set(auth))
      .body;
    expect(revisions).toHaveLength(1);
  });

  it('saves a space-vector study whose line-to-line fundamental is m·vdc', async () => {
    const created = await request(t.app)
      .post('/api/v1/studies')
      .set(auth)
      .send({
        projectId,
        name: 'SVM 0.8',
        design: { ...SPACE_VECTOR_DESIGN, load: { r: 5, l: 0.01 } },
      });
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    expect(created.body).toMatchObject({ method: 'space-vector', design: SPACE_VECTOR_DESIGN });
    const { m, vdc, frequencyRatio: n } = SPACE_VECTOR;
    const h = (await spectrumOf(created.body.id, 40)).harmonics;
    // Linear range: |V_LL| = √3·|Vref| = m·vdc (van der Broeck, Skudelny, Stanke, IEEE Trans. Ind.
    // Appl., 1988). Regular sampling holds each sample for a switching period; a zero-order hold's
    // gain sin(π/N)/(π/N) ≈ 1 − 4·10⁻⁵ at N = 201 (standard sampled-data result) sets the tolerance.
    expect(Math.abs(h[1]!.amplitude / (m * vdc) - 1)).toBeLessThan(1e-4);
    // v_ab leads v_a by π/6 (balanced three-phase phasors); the pulse centred half a switching
    // period after its sample delays it by π/N (Bowes, Proc. IEE, 1975, regular sampling).
    expect(h[1]!.phase).toBeCloseTo(Math.PI / 6 - Math.PI / n, 3);
    // The line-to-line voltage holds no triplen harmonics (balanced three-phase, common practice).
    for (const order of [3, 9, 15, 21, 27, 33, 39])
      expect(h[order]!.amplitude).toBeLessThan(1e-9 * h[1]!.amplitude);

    // Revised to ma instead of m: the phase-to-star-point fundamental is |Vref| = ma·vdc/2.
    const updated = await request(t.app)
      .put(`/api/v1/studies/${created.body.id}`)
      .set(auth)
      .send({
        baseRevision: 1,
        name: 'SVM ma',
        design: {
          ...SPACE_VECTOR_DESIGN,
          modulation: {
            method: 'space-vector',
            ma: 0.9,
            sequence: 'five-segment',
            clamping: 'dpwm1',
          },
        },
      });
    expect(updated.status, JSON.stringify(updated.body)).toBe(200);
    const report = await request(t.app)
      .get(`/api/v1/studies/${created.body.id}/report`)
      .query({ maxOrder: 50, points: 64 })
      .set(auth);
    expect(report.status, JSON.stringify(report.body).slice(0, 300)).toBe(200);
    expect(report.body.bridge.name).toBe('phase a to star point');
    // ma = 2|Vref|/vdc (carrier-style index; Holmes and Lipo 2003, ch. 5), same tolerance as above.
    expect(Math.abs(report.body.bridge.fundamental / ((0.9 * vdc) / 2) - 1)).toBeLessThan(1e-4);
  });

  it('refuses a space-vector study with both or neither of m and ma, or m past six-step, saving nothing', async () => {
    const before = await studyCount();
    const modulation = SPACE_VECTOR_DESIGN.modulation;
    const cases: { design: object; path: string }[] = [
      {
        design: { ...SPACE_VECTOR_DESIGN, modulation: { ...modulation, ma: 0.9 } },
        path: 'design.modulation.ma',
      },
      {
        design: { ...SPACE_VECTOR_DESIGN, modulation: { method: 'space-vector' } },
        path: 'design.modulation.m',
      },
      {
        design: { ...SPACE_VECTOR_DESIGN, modulation: { ...modulation, m: 1.2 } },
        path: 'design.modulation.m',
      },
      {
        // A ratio of 41/2 is analysed over two periods through a filter too; 3000/37 costs too much.
        design: {
          ...SPACE_VECTOR_DESIGN,
          fundamentalFrequency: 37,
          carrierFrequency: 3000,
          filter: { l: 0.002, c: 50e-6 },
        },
        path: 'design.carrierFrequency',
      },
      {
        design: { ...SPACE_VECTOR_DESIGN, modulation: { ...modulation, zeroSplit: 2 } },
        path: 'design.modulation.zeroSplit',
      },
      {
        design: { ...SPACE_VECTOR_DESIGN, modulation: { ...modulation, sampling: 'natural' } },
        path: 'design.modulation.sampling',
      },
      {
        design: { ...SPACE_VECTOR_DESIGN, modulation: { ...modulation, frequencyRatio: 201 } },
        path: 'design.modulation.frequencyRatio',
      },
    ];
    for (const c of cases) {
      const res = await request(t.app)
        .post('/api/v1/studies')
        .set(auth)
        .send({ projectId, name: 'Bad SVM', design: c.design });
      expect(res.status, JSON.stringify(c.design)).toBe(400);
      expect(res.headers['content-type']).toMatch(/application\/problem\+json/);
      expect(
        (res.body.errors as { path: string }[]).map((e) => e.path),
        JSON.stringify(c.design),
      ).toContain(c.path);
    }
    expect(await studyCount()).toBe(before);
  });

  it('computes both methods on POST /spectra and /waveforms, and keeps ma sweeps to carrier methods', async () => {
    const spectrum = await request(t.app)
      .post('/api/v1/spectra')
      .set(auth)
      .send({ modulation: SPACE_VECTOR, maxOrder: 20 });
    expect(spectrum.status).toBe(200);
    // |V_LL| = m·vdc (van der Broeck et al. 1988), tolerance as in the study test above.
    expect(
      Math.abs(spectrum.body.harmonics[1].amplitude / (SPACE_VECTOR.m * SPACE_VECTOR.vdc) - 1),
    ).toBeLessThan(1e-4);
    const waves = await request(t.app)
      .post('/api/v1/waveforms')
      .set(auth)
      .send({ modulation: SPACE_VECTOR });
    expect(waves.status).toBe(200);
    expect(waves.body.name).toBe('line a−b');
    expect(waves.body.traces.map((x: { name: string }) => x.name)).toEqual([
      'phase a to star point',
      'phase b to star point',
      'phase c to star point',
      'leg a to DC midpoint',
      'leg b to DC midpoint',
      'leg c to DC midpoint',
      'line a−b',
      'line b−c',
      'line c−a',
    ]);
    // Leg levels ±vdc/2, line levels 0 and ±vdc (two-level legs).
    expect(new Set(waves.body.traces[3].waveform.levels)).toEqual(new Set([300, -300]));
    expect(new Set(waves.body.traces[6].waveform.levels)).toEqual(new Set([600, 0, -600]));

    const she = {
      method: 'selective-harmonic-elimination',
      kind: 'staircase',
      vdc: 50,
      angles: [0.2, 0.5, 0.9],
    };
    const sheWaves = await request(t.app)
      .post('/api/v1/waveforms')
      .set(auth)
      .send({ modulation: she });
    expect(sheWaves.status).toBe(200);
    // A staircase of three cells: levels 0, ±vdc, ±2vdc, ±3vdc (SheKind conventions); the level is
    // 0 either side of θ = 0 and π, so each angle gives 4 edges (α, π − α, π + α, 2π − α).
    expect(Math.max(...sheWaves.body.waveform.levels)).toBe(150);
    expect(sheWaves.body.waveform.edges).toHaveLength(12);
    const sheSpectrum = await request(t.app)
      .post('/api/v1/spectra')
      .set(auth)
      .send({ modulation: she, maxOrder: 9 });
    expect(sheSpectrum.status).toBe(200);
    // b_1 = (4·vdc/π)·Σ cos α_k (Patel and Hoft 1973).
    const expected = ((4 * 50) / Math.PI) * (Math.cos(0.2) + Math.cos(0.5) + Math.cos(0.9));
    expect(sheSpectrum.body.harmonics[1].amplitude).toBeCloseTo(expected, 9);

    const sweep = await request(t.app)
      .post('/api/v1/jobs/ma-sweeps')
      .set(auth)
      .send({ modulation: she, ma: { from: 0.2, to: 1, points: 3 } });
    expect(sweep.status).toBe(400);
    expect(sweep.body.errors.map((e: { path: string }) => e.path)).toContain('modulation.method');
    const carrier = await request(t.app)
      .post('/api/v1/jobs/ma-sweeps')
      .set(auth)
      .send({ modulation: SINE_TRIANGLE, ma: { from: 0.2, to: 1, points: 3 } });
    expect(carrier.status).toBe(202);
  });
});
