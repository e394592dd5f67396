import { analyseDesign, EXAMPLE_IGBT, type InverterDesign } from '@pulsewright/modulation';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { reportCost } from '../services/cost.js';
import { DEMO, signIn, testApp, type TestApp } from './helpers.js';

/**
 * Multilevel designs through the service (issue 13): a study with an NPC design saved, its
 * report read back as the library computes it, its record exported and imported unchanged; a bad
 * level count answered 400 naming `design.modulation.levels` with the topology's range; the
 * largest multilevel design refused by the cost model before any work.
 */

/** A three-phase NPC drive on an 800 V link, PD carriers at 2.45 kHz, R–L load (invented values). */
const NPC_DESIGN = {
  vdc: 800,
  fundamentalFrequency: 50,
  carrierFrequency: 50 * 49,
  modulation: {
    method: 'multilevel-carrier',
    topology: 'npc',
    levels: 3,
    carriers: 'pd',
    phaseCount: 3,
    ma: 0.95,
    zeroSequence: 'min-max',
  },
  load: { r: 6, l: 0.008 },
} as const satisfies InverterDesign;

/** The most expensive multilevel design the schema allows: 17-level cascaded strings, mf 1000. */
const LARGEST_CASCADED = {
  vdc: 600,
  fundamentalFrequency: 50,
  carrierFrequency: 50 * 1000,
  modulation: {
    method: 'multilevel-carrier',
    topology: 'cascaded-h-bridge',
    levels: 17,
    carriers: 'phase-shifted',
    phaseCount: 3,
    ma: 0.9,
  },
  filter: { l: 1e-3, c: 10e-6 },
  load: { r: 10, l: 1e-3 },
} as const satisfies InverterDesign;

type Problem = { status: number; detail: string; errors: { path: string; message: string }[] };

describe('multilevel designs in the service', () => {
  let t: TestApp;
  let engineer: { Authorization: string };
  let projectId: string;
  let otherProjectId: string;
  beforeAll(async () => {
    t = await testApp();
    engineer = { Authorization: `Bearer ${await signIn(t.app, DEMO.engineer)}` };
    const project = (name: string) =>
      request(t.app).post('/api/v1/projects').set(engineer).send({ name });
    projectId = (await project('Central inverter')).body.id as string;
    otherProjectId = (await project('Central inverter, review')).body.id as string;
  });
  afterAll(async () => t.dispose());

  it('saves a study with an NPC design and reads back the library’s report, multilevel section included', async () => {
    const created = await request(t.app)
      .post('/api/v1/studies')
      .set(engineer)
      .send({ projectId, name: 'NPC 800 V drive', design: NPC_DESIGN });
    expect(created.status, JSON.stringify(created.body).slice(0, 400)).toBe(201);
    const options = { maxOrder: 200, points: 256 };
    const report = await request(t.app)
      .get(`/api/v1/studies/${created.body.id as string}/report`)
      .query(options)
      .set(engineer);
    expect(report.status, JSON.stringify(report.body).slice(0, 400)).toBe(200);
    // JSON keeps every double: the service's answer is the library's report itself.
    expect(report.body).toEqual(JSON.parse(JSON.stringify(analyseDesign(NPC_DESIGN, options))));
    expect(report.body.multilevel).toMatchObject({ topology: 'npc', levels: 3, carriers: 'pd' });
    expect(report.body.multilevel.devices.map((d: { name: string }) => d.name)).toEqual([
      'S1',
      'S2',
      'S3',
      'S4',
    ]);
    // Linear range with min-max: the phase fundamental is ma·vdc/2 (Holmes and Lipo 2003,
    // ch. 11), within 1 % at mf 49.
    expect(Math.abs(report.body.bridge.fundamental - 0.95 * 400)).toBeLessThan(3.8);
    expect(report.body.switching.averageDeviceFrequency).toBe(
      report.body.multilevel.averageDeviceFrequency,
    );
  });

  it('POST /spectra and /waveforms take a full multilevel modulation: the library’s line voltage and named legs', async () => {
    const modulation = { ...NPC_DESIGN.modulation, mf: 49, vdc: 800 };
    const spectrum = await request(t.app)
      .post('/api/v1/spectra')
      .set(engineer)
      .send({ modulation, maxOrder: 200 });
    expect(spectrum.status, JSON.stringify(spectrum.body).slice(0, 400)).toBe(200);
    const report = analyseDesign(NPC_DESIGN, { maxOrder: 200 });
    expect(spectrum.body.name).toBe('line a−b');
    expect(spectrum.body.thd).toBe(report.lineToLine?.thd);
    const waveforms = await request(t.app)
      .post('/api/v1/waveforms')
      .set(engineer)
      .send({ modulation, output: 'leg' });
    expect(waveforms.status, JSON.stringify(waveforms.body).slice(0, 400)).toBe(200);
    expect(waveforms.body.name).toBe('leg a to DC midpoint');
  });

  it('POST /designs/report takes a three-level space-vector design: the library’s report, midpoint balance and losses included', async () => {
    const design = {
      ...NPC_DESIGN,
      carrierFrequency: 50 * 36,
      modulation: {
        method: 'multilevel-space-vector',
        m: 0.85,
        smallVectorSplit: 0.3,
        topology: 't-type',
      },
      device: EXAMPLE_IGBT,
    } as const satisfies InverterDesign;
    const options = { maxOrder: 150, points: 128 };
    const res = await request(t.app)
      .post('/api/v1/designs/report')
      .set(engineer)
      .send({ design, ...options });
    expect(res.status, JSON.stringify(res.body).slice(0, 400)).toBe(200);
    expect(res.body).toEqual(JSON.parse(JSON.stringify(analyseDesign(design, options))));
    expect(res.body.multilevel.balance.neutralPoint.carrierAverages.values).toHaveLength(36);
    // With a device, the losses by device class (the T-type's outer and middle switches).
    expect(
      res.body.multilevel.losses.classes.map((c: { deviceClass: string }) => c.deviceClass),
    ).toEqual(['outer switch', 'middle switch']);
  });

  it('answers 400 naming design.modulation.levels and the topology’s range for a bad level count', async () => {
    for (const [modulation, words] of [
      [{ ...NPC_DESIGN.modulation, levels: 5 }, "3 for topology 'npc'"],
      [
        { ...NPC_DESIGN.modulation, topology: 'cascaded-h-bridge', levels: 8 },
        "an odd integer in [3, 17] for topology 'cascaded-h-bridge'",
      ],
    ] as const) {
      const design = { ...NPC_DESIGN, modulation };
      for (const [path, body] of [
        ['/api/v1/designs/report', { design }],
        ['/api/v1/studies', { projectId, name: 'bad', design }],
      ] as const) {
        const res = await request(t.app).post(path).set(engineer).send(body);
        const problem = res.body as Problem;
        expect(res.status, JSON.stringify(problem)).toBe(400);
        expect(problem.errors.map((e) => e.path)).toEqual(['design.modulation.levels']);
        expect(problem.errors[0]?.message).toContain(words);
      }
    }
    // Beyond every topology's range the schema itself answers, with the same path.
    const schema = await request(t.app)
      .post('/api/v1/designs/report')
      .set(engineer)
      .send({ design: { ...NPC_DESIGN, modulation: { ...NPC_DESIGN.modulation, levels: 19 } } });
    expect(schema.status).toBe(400);
    expect((schema.body as Problem).errors.map((e) => e.path)).toContain(
      'design.modulation.levels',
    );
  });

  it('refuses the largest multilevel design before any work, naming the fields to lower', async () => {
    const cost = reportCost(LARGEST_CASCADED, {});
    expect(cost.work).toBeGreaterThan(2.5e8);
    const started = performance.now();
    const res = await request(t.app)
      .post('/api/v1/designs/report')
      .set(engineer)
      .send({ design: LARGEST_CASCADED });
    const elapsed = performance.now() - started;
    const problem = res.body as Problem;
    expect(res.status, JSON.stringify(problem).slice(0, 400)).toBe(400);
    expect(problem.errors.map((e) => e.path)).toEqual(
      expect.arrayContaining(['design.carrierFrequency', 'design.modulation.levels']),
    );
    expect(problem.detail).toContain('COMPUTE_WORK_BUDGET');
    // Refused, not computed: well under the seconds the analysis would take (generous for a busy machine).
    expect(elapsed).toBeLessThan(1500);
  });

  it('a study record round-trips a multilevel design: export, import, export give the same design and report', async () => {
    const design = {
      ...NPC_DESIGN,
      modulation: {
        method: 'multilevel-carrier',
        topology: 'flying-capacitor',
        levels: 5,
        carriers: 'phase-shifted',
        phaseCount: 1,
        ma: 0.8,
        sampling: 'regular-symmetric',
        carrierPhase: 0.25,
      },
    } as const satisfies InverterDesign;
    const study = await request(t.app)
      .post('/api/v1/studies')
      .set(engineer)
      .send({ projectId, name: 'Flying capacitor, single-phase', design });
    expect(study.status, JSON.stringify(study.body).slice(0, 400)).toBe(201);
    const first = await request(t.app)
      .get(`/api/v1/studies/${study.body.id as string}/record`)
      .set(engineer);
    expect(first.status, first.text).toBe(200);
    expect(first.body.design).toEqual(design);
    const imported = await request(t.app)
      .post(`/api/v1/projects/${otherProjectId}/study-records`)
      .set(engineer)
      .send(first.body);
    expect(imported.status, imported.text).toBe(201);
    const second = await request(t.app)
      .get(`/api/v1/studies/${imported.body.id as string}/record`)
      .set(engineer);
    const { source: _a, ...firstContent } = first.body as Record<string, unknown>;
    const { source: _b, ...secondContent } = second.body as Record<string, unknown>;
    expect(secondContent).toEqual(firstContent);
    const report = async (id: string) =>
      (await request(t.app).get(`/api/v1/studies/${id}/report`).set(engineer)).body as unknown;
    expect(await report(imported.body.id as string)).toEqual(await report(study.body.id as string));
  });
});
