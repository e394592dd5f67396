import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { DEMO, signIn, testApp, type TestApp } from './helpers.js';
import { SINE_TRIANGLE_DESIGN as DESIGN, withMa } from './fixtures.js';

describe('the studies list', () => {
  let t: TestApp;
  let auth: { Authorization: string };
  let projectId = '';
  let teamId = '';
  const ids: string[] = [];
  beforeAll(async () => {
    t = await testApp();
    auth = { Authorization: `Bearer ${await signIn(t.app, DEMO.engineer)}` };
    teamId = (await request(t.app).get('/api/v1/me').set(auth)).body.team.id;
    projectId = (await request(t.app).post('/api/v1/projects').set(auth).send({ name: 'Queries' }))
      .body.id;
    for (const name of ['Q one', 'Q two', 'Q three', 'Q four', 'Q five']) {
      ids.push(
        (
          await request(t.app)
            .post('/api/v1/studies')
            .set(auth)
            .send({ projectId, name, design: DESIGN })
        ).body.id,
      );
    }
    // Two of them saved again, so the current revision is not always the first.
    for (const [i, id] of [ids[1], ids[3]].entries()) {
      await request(t.app)
        .put(`/api/v1/studies/${id}`)
        .set(auth)
        .send({ baseRevision: 1, name: `Q edited ${i}`, design: withMa(DESIGN, 0.5 + 0.1 * i) });
    }
  });
  afterAll(async () => t.dispose());

  it('reads any number of studies with their current revision in one query', async () => {
    const sequelize = t.app.services.models.sequelize;
    const query = vi.spyOn(sequelize, 'query');
    try {
      const listed = await t.app.services.studies.list(teamId, {
        projectId,
        limit: 50,
        offset: 0,
      });
      expect(query).toHaveBeenCalledTimes(1);
      expect(listed).toHaveLength(5);
      const byId = new Map(listed.map((s) => [s.id, s]));
      expect(byId.get(ids[1] as string)).toMatchObject({
        revision: 2,
        name: 'Q edited 0',
        design: { modulation: { ma: 0.5 } },
      });
      expect(byId.get(ids[3] as string)).toMatchObject({ revision: 2, name: 'Q edited 1' });
      expect(byId.get(ids[0] as string)).toMatchObject({ revision: 1, name: 'Q one' });

      query.mockClear();
      const searched = await t.app.services.studies.list(teamId, {
        projectId,
        q: 'edited',
        limit: 1,
        offset: 1,
      });
      expect(query).toHaveBeenCalledTimes(1);
      expect(searched).toHaveLength(1);
      expect(searched[0]?.name).toMatch(/^Q edited/);
    } finally {
      query.mockRestore();
    }
  });

  it('answers the same through the route', async () => {
    const res = await request(t.app).get('/api/v1/studies').query({ projectId }).set(auth);
    expect(res.status).toBe(200);
    expect(res.body.map((s: { name: string }) => s.name).sort()).toEqual([
      'Q edited 0',
      'Q edited 1',
      'Q five',
      'Q one',
      'Q three',
    ]);
  });
});
