import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, signIn, testApp, type TestApp } from './helpers.js';
import type { DesignReport } from '@pulsewright/modulation';
import { SINE_TRIANGLE_DESIGN as DESIGN, withMa } from './fixtures.js';

interface OutboxItem {
  to: string;
  subject: string;
  text: string;
  status: string;
}

describe('e-mailing a study report', () => {
  let t: TestApp;
  let engineer: { Authorization: string };
  let viewer: { Authorization: string };
  let admin: { Authorization: string };
  let studyId: string;
  const publicUrl = 'https://pulsewright.kestrel.example';

  beforeAll(async () => {
    t = await testApp({ publicUrl, shareRateLimit: 3 });
    engineer = { Authorization: `Bearer ${await signIn(t.app, DEMO.engineer)}` };
    viewer = { Authorization: `Bearer ${await signIn(t.app, DEMO.viewer)}` };
    admin = { Authorization: `Bearer ${await signIn(t.app, DEMO.admin)}` };
    const projectId = (
      await request(t.app)
        .post('/api/v1/projects')
        .set(engineer)
        .send({ name: 'Sharing', description: 'test' })
    ).body.id;
    const study = (
      await request(t.app)
        .post('/api/v1/studies')
        .set(engineer)
        .send({ projectId, name: 'Shared candidate', design: DESIGN })
    ).body;
    await request(t.app)
      .put(`/api/v1/studies/${study.id}`)
      .set(engineer)
      .send({ baseRevision: 1, name: 'Shared candidate', design: withMa(DESIGN, 0.7) });
    studyId = study.id;
  });
  afterAll(async () => t.dispose());

  const outbox = async (): Promise<OutboxItem[]> =>
    (await request(t.app).get('/api/v1/outbox').set(admin)).body as OutboxItem[];

  it('an engineer shares: 202, and the outbox holds a mail to that address with the link, revision, author, sender, message and caution', async () => {
    const res = await request(t.app)
      .post(`/api/v1/studies/${studyId}/share`)
      .set(engineer)
      .send({ email: 'Reviewer@Kestrel.example', message: 'Please check the 19th sideband.' });
    expect(res.status).toBe(202);
    const link = `${publicUrl}/studies/${studyId}/report`;
    expect(res.body).toEqual({ sent: true, to: 'reviewer@kestrel.example', revision: 2, link });
    const mail = (await outbox()).find((m) => m.to === 'reviewer@kestrel.example');
    expect(mail, 'a mail to the address').toBeDefined();
    expect(mail!.subject).toContain('Shared candidate');
    expect(mail!.text).toContain(link);
    expect(mail!.text).toContain('Revision: 2');
    expect(mail!.text).toContain(DEMO.engineer); // author of revision 2 and the sender
    expect(mail!.text).toContain('Please check the 19th sideband.');
    // The caution sentence of docs/references.md, "Cautions".
    expect(mail!.text).toContain('Inverter DC buses and outputs are lethal.');
    // Its figures are the design report's of revision 2 (the exact whole-waveform THD, the limit result).
    const report = (await request(t.app).get(`/api/v1/studies/${studyId}/report`).set(engineer))
      .body;
    expect(mail!.text).toContain(
      `THD ${(100 * report.bridge.thd).toFixed(2)} %, WTHD ${(100 * report.bridge.wthd).toFixed(2)} % (exact, whole waveform)`,
    );
    expect(mail!.text).toContain(
      `voltage limits (recalled from memory): ${report.limitCheck.pass ? 'pass' : 'fail'}`,
    );
    const audit = (await request(t.app).get('/api/v1/audit-events').set(admin)).body as {
      action: string;
      subjectId: string;
      details: Record<string, unknown>;
    }[];
    expect(audit.find((e) => e.action === 'study.share')).toMatchObject({
      subjectId: studyId,
      details: { to: 'reviewer@kestrel.example', revision: 2 },
    });
  });

  it('refuses a viewer with 403 and sends nothing', async () => {
    const before = (await outbox()).length;
    const res = await request(t.app)
      .post(`/api/v1/studies/${studyId}/share`)
      .set(viewer)
      .send({ email: 'someone@kestrel.example' });
    expect(res.status).toBe(403);
    expect(res.headers['content-type']).toMatch(/problem\+json/);
    expect((await outbox()).length).toBe(before);
  });

  it('answers 400 naming email for a bad address, and message for one over 2000 characters', async () => {
    const bad = await request(t.app)
      .post(`/api/v1/studies/${studyId}/share`)
      .set(engineer)
      .send({ email: 'not an address' });
    expect(bad.status).toBe(400);
    expect(bad.headers['content-type']).toMatch(/problem\+json/);
    expect(bad.body.errors.map((e: { path: string }) => e.path)).toContain('email');
    const long = await request(t.app)
      .post(`/api/v1/studies/${studyId}/share`)
      .set(engineer)
      .send({ email: 'a@kestrel.example', message: 'x'.repeat(2001) });
    expect(long.status).toBe(400);
    expect(long.body.errors.map((e: { path: string }) => e.path)).toContain('message');
  });

  it('answers 404 for an unknown study', async () => {
    const res = await request(t.app)
      .post('/api/v1/studies/00000000-0000-4000-8000-000000000000/share')
      .set(engineer)
      .send({ email: 'a@kestrel.example' });
    expect(res.status).toBe(404);
    expect(res.headers['content-type']).toMatch(/problem\+json/);
  });

  it('limits shares per user per hour with a 429 problem', async () => {
    // shareRateLimit is 3 per user. Requests refused by validation (400) or by role (403) never
    // reach the limiter; the first test's share and the 404 did, so one share is left.
    const statuses: number[] = [];
    for (let i = 0; i < 3; i++) {
      statuses.push(
        (
          await request(t.app)
            .post(`/api/v1/studies/${studyId}/share`)
            .set(engineer)
            .send({ email: `r${i}@kestrel.example` })
        ).status,
      );
    }
    expect(statuses).toEqual([202, 429, 429]);
    const limited = await request(t.app)
      .post(`/api/v1/studies/${studyId}/share`)
      .set(engineer)
      .send({ email: 'r9@kestrel.example' });
    expect(limited.headers['content-type']).toMatch(/problem\+json/);
  });

  it('a grid-tied study (whole ratio, and a span at 500/3) mails its grid, impedance, LCL and each standard’s verdict on the grid current with the from-memory caution, not a load', async () => {
    // Invented: 700 V bus into a 400 V grid through an LCL; 50 Hz with a 10 kHz carrier (mf 200),
    // and 60 Hz with the same carrier (mf 500/3, analysed over 3 periods). Shared by the admin
    // (the engineer's shares are spent by the rate-limit test above).
    const base = {
      vdc: 700,
      fundamentalFrequency: 50,
      carrierFrequency: 10_000,
      modulation: { method: 'three-phase', ma: 1, zeroSequence: 'third-harmonic' },
      filter: { l: 0.002, c: 10e-6, rDamping: 2 },
      grid: { lineVoltage: 400, r: 0.05, l: 0.2e-3, l2: 0.5e-3 },
    };
    const projectId = (
      await request(t.app)
        .post('/api/v1/projects')
        .set(admin)
        .send({ name: 'Grid sharing', description: 'test' })
    ).body.id;
    for (const [frequency, grouped] of [
      [50, false],
      [60, true],
    ] as const) {
      const design = { ...base, fundamentalFrequency: frequency };
      const created = await request(t.app)
        .post('/api/v1/studies')
        .set(admin)
        .send({ projectId, name: `Grid at ${frequency} Hz`, design });
      expect(created.status).toBe(201);
      const to = `grid${frequency}@kestrel.example`;
      const res = await request(t.app)
        .post(`/api/v1/studies/${created.body.id}/share`)
        .set(admin)
        .send({ email: to });
      expect(res.status).toBe(202);
      const text = (await outbox()).find((m) => m.to === to)!.text;
      const { grid } = (
        await request(t.app).get(`/api/v1/studies/${created.body.id}/report`).set(admin)
      ).body as DesignReport;
      expect(text).not.toMatch(/load/i); // a grid design has no load (InverterDesign.grid)
      expect(text).toContain(`- Grid: 400 V rms line to line, ${frequency} Hz`);
      // I_SC = V_ph/|r + jω₁l| (hand-worked): 50 Hz 2876 A rms, 60 Hz 230.94/|0.05 + j0.0754| = 2553 A rms.
      expect(text).toContain(
        `- Grid impedance per phase (star): R 0.05 Ω, L 0.2 mH; short-circuit current ${frequency === 50 ? 2876 : 2553} A rms`,
      );
      // (1/2π)·√((L1 + L2')/(L1·L2'·C)) = 2210 Hz (Liserre, Blaabjerg and Hansen, 2005), named as
      // the LCL's with the carrier 10 kHz/2210 Hz = 4.524× above it (hand-worked); L1 with C
      // alone, 1/(2π√(LC)) = 1125 Hz, is not the grid design's resonance and is not mailed.
      expect(text).toContain(
        '- LCL filter per phase (star): L1 2 mH, C 10 µF, L2 0.5 mH; LCL resonance 2210 Hz (carrier 4.524× above it)',
      );
      expect(text).toContain('- LCL resonance: 2210 Hz (carrier 4.524× above it)');
      expect(text).not.toContain('1125');
      // I_SC/I_L is above 20, yet generating equipment takes IEEE 519's first row (Table 2's
      // footnote, from memory): the verdict says why.
      expect(grid!.shortCircuitRatio).toBeGreaterThan(20);
      expect(text).toContain(
        `The I_SC/I_L < 20 row is used although I_SC/I_L is ${Number(grid!.shortCircuitRatio.toPrecision(4))}: the table’s footnote applies it to generating equipment`,
      );
      const { ieee519, ieee1547 } = grid!.limits;
      expect(text).toContain(
        `- grid current, IEEE Std 519-2022 (${ieee519.row.label}, the row for generating equipment): ${ieee519.pass ? 'within' : 'over'} the limits; TDD`,
      );
      expect(text).toContain(
        `- grid current, IEEE Std 1547-2018 (${ieee1547.row.label}): ${ieee1547.pass ? 'within' : 'over'} the limits; TRD`,
      );
      expect(text).toMatch(/Grid caution\. The current limits .* recalled from memory/);
      expect(text.includes('read on harmonic groups of the span’s components')).toBe(grouped);
      expect(text.includes('Harmonic groups after IEC 61000-4-7')).toBe(grouped);
    }
  });
});
