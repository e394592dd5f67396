import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { timerTable, timerTableToSpiceNetlist } from '@pulsewright/modulation';
import { DEMO, signIn, testApp, type TestApp } from './helpers.js';
import { SINE_TRIANGLE, THREE_PHASE, THREE_PHASE_DESIGN } from './fixtures.js';

/** The rows of an RFC 4180 text with no quoted cells (numbers and plain names), CRLF line ends. */
function csvRows(text: string): string[][] {
  expect(text.endsWith('\r\n')).toBe(true);
  expect(text).not.toContain('"');
  return text
    .slice(0, -2)
    .split('\r\n')
    .map((line) => line.split(','));
}

describe('exports: netlists, CSV and study records', () => {
  let t: TestApp;
  let engineer: { Authorization: string };
  let viewer: { Authorization: string };
  let projectId: string;
  let otherProjectId: string;
  beforeAll(async () => {
    t = await testApp();
    engineer = { Authorization: `Bearer ${await signIn(t.app, DEMO.engineer)}` };
    viewer = { Authorization: `Bearer ${await signIn(t.app, DEMO.viewer)}` };
    const project = async (name: string) =>
      (
        await request(t.app)
          .post('/api/v1/projects')
          .set(engineer)
          .send({ name, description: 'exports' })
      ).body.id as string;
    projectId = await project('Records out');
    otherProjectId = await project('Records in');
  });
  afterAll(async () => t.dispose());

  const TABLE = {
    modulation: { method: 'three-phase', zeroSequence: 'third-harmonic', ma: 0.9 },
    fundamentalFrequency: 50,
    carrierFrequency: 5000,
    timerClock: 72e6,
    deadTime: 1e-6,
    vdc: 650,
    prefix: 'drive_pattern',
  } as const;

  describe('POST /api/v1/netlists', () => {
    it("answers the library's netlist of the table as a text file, for a viewer", async () => {
      const options = { riseTime: 5e-8, fallTime: 3e-8, periods: 2, gateVoltage: 15 };
      const res = await request(t.app)
        .post('/api/v1/netlists')
        .set(viewer)
        .send({ timerTable: TABLE, ...options, currentAngle: 0.3 })
        .buffer(true);
      expect(res.status, res.text).toBe(200);
      expect(res.headers['content-type']).toMatch(/^text\/plain/);
      expect(res.headers['content-disposition']).toBe('attachment; filename="drive_pattern.cir"');
      const { prefix: _prefix, ...tableOptions } = TABLE;
      // The service hands over the library's text unchanged; tests/reference/netlistRoute.test.ts
      // reads this route's answers back with the SPICE reader and checks every edge.
      expect(res.text).toBe(
        timerTableToSpiceNetlist(timerTable(tableOptions), { ...options, currentAngle: 0.3 }),
      );
      expect(res.text).toMatch(/^\.tran 3e-8 4e-2$/m); // 2 periods of 50 Hz
    });

    it("takes the devices' on-state drops into the leg voltages, as the library writes them", async () => {
      const onStateDrop = { transistor: 1.1, diode: 1.5 };
      const res = await request(t.app)
        .post('/api/v1/netlists')
        .set(viewer)
        .send({ timerTable: TABLE, currentAngle: 0.3, onStateDrop })
        .buffer(true);
      expect(res.status, res.text).toBe(200);
      const { prefix: _prefix, ...tableOptions } = TABLE;
      expect(res.text).toBe(
        timerTableToSpiceNetlist(timerTable(tableOptions), { currentAngle: 0.3, onStateDrop }),
      );
      // Leg levels with the current out of the leg: 325 − 1.1 V on the transistor, −325 − 1.5 V
      // on the diode (SPICE numbers written as the library writes them).
      expect(res.text).toContain(' 3.239e+2');
      expect(res.text).toContain(' -3.265e+2');
      const bad = await request(t.app)
        .post('/api/v1/netlists')
        .set(viewer)
        .send({ timerTable: TABLE, onStateDrop: { transistor: -1, diode: 1 } });
      expect(bad.status).toBe(400);
      expect(bad.body.errors[0].path).toMatch(
        /onStateDrop\/?\.?transistor|onStateDrop\.transistor/,
      );
    });

    it('names the field: a ramp longer than a pulse, a table field, too many periods', async () => {
      const ask = (body: object) =>
        request(t.app)
          .post('/api/v1/netlists')
          .set(viewer)
          .send({ timerTable: TABLE, ...body });
      const ramp = await ask({ riseTime: 5e-5 });
      expect(ramp.status).toBe(400);
      expect(ramp.headers['content-type']).toMatch(/problem\+json/);
      expect(ramp.body.errors[0].path).toMatch(/^(riseTime|fallTime)$/);
      expect(ramp.body.detail).toMatch(
        /(riseTime|fallTime) must be shorter than the shortest time between two edges/,
      );
      const ma = await request(t.app)
        .post('/api/v1/netlists')
        .set(viewer)
        .send({ timerTable: { ...TABLE, modulation: { ...TABLE.modulation, ma: -1 } } });
      expect(ma.status).toBe(400);
      expect(ma.body.errors[0].path).toBe('timerTable.modulation.ma');
      // 100 carrier periods × 9 sources × 1000 periods: several MB, more than one answer may hold.
      const long = await ask({ periods: 1000 });
      expect(long.status).toBe(400);
      expect(long.body.errors.map((e: { path: string }) => e.path)).toContain('periods');
      const none = await request(t.app).post('/api/v1/netlists').send({ timerTable: TABLE });
      expect(none.status).toBe(401);
    });

    it("the cost model's estimate of points and bytes matches what the netlist holds", async () => {
      const res = await request(t.app)
        .post('/api/v1/netlists')
        .set(viewer)
        .send({ timerTable: TABLE, periods: 3 })
        .buffer(true);
      const points = res.text.split(/\s+/).filter((f) => /^-?\d/.test(f)).length / 2;
      // The cost model's estimate (services/cost.ts netlistCost): 9 sources × (4 points × 100
      // carrier periods × 3 periods + 2), and 26 bytes a point.
      expect(points).toBeGreaterThan(0.9 * 9 * (4 * 100 * 3 + 2));
      expect(points).toBeLessThanOrEqual(9 * (4 * 100 * 3 + 2) * 1.01);
      expect(res.text.length / points).toBeLessThanOrEqual(26);
    });
  });

  describe('CSV with units in the header', () => {
    it('spectra: one row per order, the values of the JSON answer', async () => {
      const body = { modulation: SINE_TRIANGLE, maxOrder: 60 };
      const json = await request(t.app).post('/api/v1/spectra').set(viewer).send(body);
      const csv = await request(t.app)
        .post('/api/v1/spectra')
        .query({ format: 'csv' })
        .set(viewer)
        .send(body)
        .buffer(true);
      expect(csv.status, csv.text).toBe(200);
      expect(csv.headers['content-type']).toMatch(/^text\/csv/);
      expect(csv.headers['content-disposition']).toBe('attachment; filename="spectra.csv"');
      const [header, ...rows] = csvRows(csv.text);
      expect(header).toEqual(['order', 'amplitude_V_peak', 'phase_rad']);
      expect(rows).toHaveLength(61);
      expect(rows.map((r) => r.map(Number))).toEqual(
        json.body.harmonics.map((h: { order: number; amplitude: number; phase: number }) => [
          h.order,
          h.amplitude,
          h.phase,
        ]),
      );
    });

    it('waveforms: every edge of every trace, angle in radians and level in volts', async () => {
      const body = { modulation: THREE_PHASE };
      const json = await request(t.app).post('/api/v1/waveforms').set(viewer).send(body);
      const csv = await request(t.app)
        .post('/api/v1/waveforms')
        .query({ format: 'csv' })
        .set(viewer)
        .send(body)
        .buffer(true);
      expect(csv.status, csv.text).toBe(200);
      const [header, ...rows] = csvRows(csv.text);
      expect(header).toEqual(['voltage', 'edge', 'angle_rad', 'level_V']);
      const expected = json.body.traces.flatMap(
        (trace: { name: string; waveform: { edges: number[]; levels: number[] } }) =>
          trace.waveform.edges.map((angle, i) => [trace.name, i, angle, trace.waveform.levels[i]]),
      );
      expect(
        rows.map(([name, i, angle, level]) => [name, Number(i), Number(angle), Number(level)]),
      ).toEqual(expected);
      const bad = await request(t.app)
        .post('/api/v1/waveforms')
        .query({ format: 'xlsx' })
        .set(viewer)
        .send(body);
      expect(bad.status).toBe(400);
      expect(bad.body.errors[0].path).toBe('format');
    });
  });

  describe('study records', () => {
    const DESIGN = { ...THREE_PHASE_DESIGN, load: { r: 4, l: 0.012 } };
    const createStudy = async () =>
      (
        await request(t.app)
          .post('/api/v1/studies')
          .set(engineer)
          .send({ projectId, name: 'Pump drive / 7.5 kW', design: DESIGN, note: 'for review' })
      ).body as { id: string };

    it('export → import → export gives the same design, name, note and figures', async () => {
      const study = await createStudy();
      const first = await request(t.app).get(`/api/v1/studies/${study.id}/record`).set(viewer);
      expect(first.status, first.text).toBe(200);
      expect(first.headers['content-disposition']).toBe(
        'attachment; filename="Pump-drive-7-5-kW.study.json"',
      );
      expect(first.body).toMatchObject({
        format: 'pulsewright-study-record',
        formatVersion: 1,
        name: 'Pump drive / 7.5 kW',
        note: 'for review',
        design: DESIGN,
        source: { revision: 1 },
      });
      expect(JSON.stringify(first.body)).not.toContain(study.id);
      expect(JSON.stringify(first.body)).not.toContain(projectId);
      const imported = await request(t.app)
        .post(`/api/v1/projects/${otherProjectId}/study-records`)
        .set(engineer)
        .send(first.body);
      expect(imported.status, imported.text).toBe(201);
      expect(imported.body).toMatchObject({ projectId: otherProjectId, revision: 1 });
      expect(imported.body.id).not.toBe(study.id);
      const second = await request(t.app)
        .get(`/api/v1/studies/${imported.body.id}/record`)
        .set(viewer);
      const { source: _a, ...firstContent } = first.body;
      const { source: _b, ...secondContent } = second.body;
      expect(secondContent).toEqual(firstContent);
      const report = async (id: string) =>
        (await request(t.app).get(`/api/v1/studies/${id}/report`).set(viewer)).body;
      expect(await report(imported.body.id)).toEqual(await report(study.id));
    });

    it('refuses a bad record with the words of a bad study, and a newer format saying so', async () => {
      const study = await createStudy();
      const record = (await request(t.app).get(`/api/v1/studies/${study.id}/record`).set(viewer))
        .body;
      const importRecord = (body: object, auth = engineer) =>
        request(t.app)
          .post(`/api/v1/projects/${otherProjectId}/study-records`)
          .set(auth)
          .send(body);
      const badDesign = { ...DESIGN, modulation: { ...DESIGN.modulation, ma: 9 } };
      const asRecord = await importRecord({ ...record, design: badDesign });
      const asStudy = await request(t.app)
        .post('/api/v1/studies')
        .set(engineer)
        .send({ projectId: otherProjectId, name: 'x', design: badDesign });
      expect(asRecord.status).toBe(400);
      expect(asStudy.status).toBe(400);
      expect(asRecord.body.errors).toEqual(asStudy.body.errors);
      expect(asRecord.body.errors[0].path).toBe('design.modulation.ma');
      const newer = await importRecord({ ...record, formatVersion: 2 });
      expect(newer.status).toBe(400);
      expect(newer.body.errors[0].path).toBe('formatVersion');
      expect(newer.body.detail).toMatch(/formatVersion 2 is newer than this service reads \(1\)/);
      const notRecord = await importRecord({ ...record, format: 'something-else' });
      expect(notRecord.status).toBe(400);
      expect(notRecord.body.errors[0].path).toBe('format');
      const { name: _name, ...nameless } = record;
      const missing = await importRecord(nameless);
      expect(missing.status).toBe(400);
      expect(missing.body.errors[0].path).toBe('name');
      // Importing creates a study: the role that creates studies.
      const asViewer = await importRecord(record, viewer);
      expect(asViewer.status).toBe(403);
      const nowhere = await request(t.app)
        .post('/api/v1/projects/00000000-0000-4000-8000-000000000000/study-records')
        .set(engineer)
        .send(record);
      expect(nowhere.status).toBe(404);
    });

    it("gives the spectra of a study's report as CSV, every voltage the report analyses", async () => {
      const study = await createStudy();
      const query = { maxOrder: 60, points: 64 };
      const json = (
        await request(t.app).get(`/api/v1/studies/${study.id}/report`).query(query).set(viewer)
      ).body;
      const csv = await request(t.app)
        .get(`/api/v1/studies/${study.id}/report`)
        .query({ ...query, format: 'csv' })
        .set(viewer)
        .buffer(true);
      expect(csv.status, csv.text).toBe(200);
      expect(csv.headers['content-disposition']).toBe('attachment; filename="report.csv"');
      const [header, ...rows] = csvRows(csv.text);
      expect(header).toEqual([
        'voltage',
        'order',
        'label',
        'frequency_Hz',
        'amplitude_V_peak',
        'phase_rad',
      ]);
      const voltages = [json.bridge, json.lineToLine];
      expect(rows).toHaveLength(voltages.length * 61);
      const line = rows.filter((r) => r[0] === json.lineToLine.name);
      expect(line.map((r) => Number(r[4]))).toEqual(
        json.lineToLine.spectrum.map((h: { amplitude: number }) => h.amplitude),
      );
      expect(line.map((r) => Number(r[3]))).toEqual(line.map((r) => Number(r[1]) * 50));
      // Three-phase carrier PWM with third-harmonic injection in the linear range: the line-to-line
      // fundamental is √3·ma·vdc/2 and the injected (triplen) orders cancel between the phases
      // (Holmes and Lipo, 2003, ch. 5; common practice). That closed form ignores the overlap of
      // carrier sidebands onto order 1, which at mf = 15 moves it by 2.5e-6 relative (measured
      // here): the check allows 1e-5.
      const at = (order: number) => Number(line.find((r) => Number(r[1]) === order)?.[4]);
      const expected = (Math.sqrt(3) * 0.9 * 650) / 2;
      expect(Math.abs(at(1) - expected) / expected).toBeLessThan(1e-5);
      expect(at(3)).toBeLessThan(1e-9 * at(1));
      expect(at(9)).toBeLessThan(1e-9 * at(1));
    });

    it("gives a study's spectrum as CSV too", async () => {
      const study = await createStudy();
      const json = await request(t.app).get(`/api/v1/studies/${study.id}/spectrum`).set(viewer);
      const csv = await request(t.app)
        .get(`/api/v1/studies/${study.id}/spectrum`)
        .query({ format: 'csv', maxOrder: 100 })
        .set(viewer)
        .buffer(true);
      expect(csv.status, csv.text).toBe(200);
      const [header, ...rows] = csvRows(csv.text);
      expect(header).toEqual(['order', 'amplitude_V_peak', 'phase_rad']);
      expect(rows.map((r) => Number(r[1]))).toEqual(
        json.body.harmonics.map((h: { amplitude: number }) => h.amplitude),
      );
    });
  });
});
