import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, signIn, testApp, type TestApp } from './helpers.js';
import { SINE_TRIANGLE_DESIGN as DESIGN, THREE_PHASE_DESIGN, withMa } from './fixtures.js';

describe('studies keep every revision', () => {
  let t: TestApp;
  let auth: { Authorization: string };
  let auth2: { Authorization: string };
  let projectId: string;
  beforeAll(async () => {
    t = await testApp();
    auth = { Authorization: `Bearer ${await signIn(t.app, DEMO.engineer)}` };
    auth2 = { Authorization: `Bearer ${await signIn(t.app, DEMO.engineer2)}` };
    projectId = (
      await request(t.app)
        .post('/api/v1/projects')
        .set(auth)
        .send({ name: 'Revisions', description: 'test' })
    ).body.id;
  });
  afterAll(async () => t.dispose());

  const create = async (name = 'Candidate A') =>
    (
      await request(t.app)
        .post('/api/v1/studies')
        .set(auth)
        .send({ projectId, name, design: { ...DESIGN, load: { r: 5, l: 0.01 } }, note: 'first' })
    ).body;

  it('saves an edit as a new revision and refuses a stale one with 409, saving nothing', async () => {
    const study = await create();
    expect(study.revision).toBe(1);
    const edited = await request(t.app)
      .put(`/api/v1/studies/${study.id}`)
      .set(auth)
      .send({ baseRevision: 1, name: 'Candidate A', design: withMa(DESIGN, 0.9) });
    expect(edited.status).toBe(200);
    expect(edited.body).toMatchObject({ revision: 2, design: { modulation: { ma: 0.9 } } });
    const stale = await request(t.app)
      .put(`/api/v1/studies/${study.id}`)
      .set(auth2)
      .send({ baseRevision: 1, name: 'Candidate A', design: withMa(DESIGN, 0.5) });
    expect(stale.status).toBe(409);
    expect(stale.headers['content-type']).toMatch(/problem\+json/);
    expect(stale.body.detail).toContain('you edited revision 1, the latest is 2');
    expect(stale.body.detail).toContain('Nothing was saved');
    const revisions = await request(t.app).get(`/api/v1/studies/${study.id}/revisions`).set(auth);
    expect(revisions.body.map((r: { revision: number }) => r.revision)).toEqual([2, 1]);
    expect(revisions.body[1]).toMatchObject({
      design: { modulation: { ma: 0.8 }, load: { r: 5, l: 0.01 } },
      note: 'first',
      authorEmail: DEMO.engineer,
    });
  });

  it('concurrent edits from one base: exactly one wins, the others get 409, no revision is lost', async () => {
    const study = await create('Race');
    const edits = Array.from({ length: 6 }, (_, i) =>
      request(t.app)
        .put(`/api/v1/studies/${study.id}`)
        .set(i % 2 ? auth : auth2)
        .send({ baseRevision: 1, name: `Race ${i}`, design: withMa(DESIGN, 0.5 + i / 100) }),
    );
    const results = await Promise.all(edits);
    expect(results.map((r) => r.status).sort()).toEqual([200, 409, 409, 409, 409, 409]);
    const revisions = (await request(t.app).get(`/api/v1/studies/${study.id}/revisions`).set(auth))
      .body;
    expect(revisions).toHaveLength(2);
    const winner = results.find((r) => r.status === 200)!.body;
    expect(revisions[0].name).toBe(winner.name);
  });

  it('concurrent writers that reload and retry on 409 all get their edit saved as its own revision', async () => {
    const study = await create('Retry');
    const writer = async (i: number) => {
      for (let attempt = 0; attempt < 50; attempt++) {
        const current = (await request(t.app).get(`/api/v1/studies/${study.id}`).set(auth)).body;
        const res = await request(t.app)
          .put(`/api/v1/studies/${study.id}`)
          .set(auth)
          .send({
            baseRevision: current.revision,
            name: `Writer ${i}`,
            design: { ...DESIGN, carrierFrequency: 50 * (31 + 2 * i) },
          });
        if (res.status === 200) return;
        expect(res.status).toBe(409);
      }
      throw new Error(`writer ${i} never saved`);
    };
    await Promise.all([0, 1, 2, 3, 4].map(writer));
    const revisions = (await request(t.app).get(`/api/v1/studies/${study.id}/revisions`).set(auth))
      .body;
    expect(revisions.map((r: { revision: number }) => r.revision)).toEqual([6, 5, 4, 3, 2, 1]);
    expect(
      revisions
        .slice(0, 5)
        .map((r: { name: string }) => r.name)
        .sort(),
    ).toEqual(['Writer 0', 'Writer 1', 'Writer 2', 'Writer 3', 'Writer 4']);
  });

  it('restores an old revision as a new one, and duplicates into a new study', async () => {
    const study = await create('Restore');
    await request(t.app).put(`/api/v1/studies/${study.id}`).set(auth).send({
      baseRevision: 1,
      name: 'Restore',
      design: THREE_PHASE_DESIGN,
      note: 'went three-phase',
    });
    const restored = await request(t.app)
      .post(`/api/v1/studies/${study.id}/revisions/1/restore`)
      .set(auth)
      .send({ baseRevision: 2 });
    expect(restored.status).toBe(200);
    expect(restored.body).toMatchObject({
      revision: 3,
      method: 'sine-triangle',
      design: DESIGN,
      note: 'first',
    });
    const revisions = (await request(t.app).get(`/api/v1/studies/${study.id}/revisions`).set(auth))
      .body;
    expect(revisions[0]).toMatchObject({ revision: 3, restoredFrom: 1 });
    expect(revisions[1]).toMatchObject({ revision: 2, design: THREE_PHASE_DESIGN });
    const missing = await request(t.app)
      .post(`/api/v1/studies/${study.id}/revisions/9/restore`)
      .set(auth)
      .send({ baseRevision: 3 });
    expect(missing.status).toBe(404);

    const copy = await request(t.app)
      .post(`/api/v1/studies/${study.id}/duplicate`)
      .set(auth)
      .send({});
    expect(copy.status).toBe(201);
    expect(copy.body).toMatchObject({ name: 'Restore (copy)', revision: 1, design: DESIGN });
    expect(copy.body.id).not.toBe(study.id);
  });

  it('lists by project and searches by name', async () => {
    await create('Searchable unipolar candidate');
    const found = await request(t.app)
      .get('/api/v1/studies')
      .query({ projectId, q: 'SEARCHABLE' })
      .set(auth);
    expect(found.body.map((s: { name: string }) => s.name)).toEqual([
      'Searchable unipolar candidate',
    ]);
    const none = await request(t.app).get('/api/v1/studies').query({ q: '100%_' }).set(auth);
    expect(none.body).toEqual([]);
    const project = await request(t.app).get(`/api/v1/projects/${projectId}`).set(auth);
    expect(project.body.studyCount).toBeGreaterThanOrEqual(5);
  });

  it('predicts the spectrum of the current revision (fundamental = ma·vdc in the linear range)', async () => {
    const study = await create('Prediction');
    const res = await request(t.app)
      .get(`/api/v1/studies/${study.id}/spectrum`)
      .query({ maxOrder: 30 })
      .set(auth);
    expect(res.status).toBe(200);
    // Bipolar naturally sampled PWM, ma ≤ 1: fundamental = ma·vdc (Holmes and Lipo, 2003, ch. 3).
    expect(res.body.harmonics[1].amplitude).toBeCloseTo(0.8 * 400, 6);
  });
});
