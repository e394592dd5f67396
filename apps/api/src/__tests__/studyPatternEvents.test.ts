import { solveShe } from '@pulsewright/modulation';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, signIn, testApp, type TestApp } from './helpers.js';

// A 3-angle bipolar pattern eliminating the 5th and 7th at 80 V peak from 100 V (Patel and Hoft,
// IEEE Trans. Ind. Appl., 1973).
const angles = solveShe({
  kind: 'bipolar',
  vdc: 100,
  count: 3,
  eliminate: [5, 7],
  fundamental: 80,
}).angles;
const OPTIONS = { fundamentalFrequency: 50, timerClock: 1e6, deadTime: 2e-6, orders: [5, 7] };

describe('compare events of a saved pattern study (issue 17)', () => {
  let t: TestApp;
  let engineer: { Authorization: string };
  let viewer: { Authorization: string };
  let projectId: string;
  const save = async (design: object) =>
    (
      await request(t.app)
        .post('/api/v1/studies')
        .set(engineer)
        .send({ projectId, name: 'Pattern', design, note: '' })
    ).body as { id: string };

  beforeAll(async () => {
    t = await testApp();
    engineer = { Authorization: `Bearer ${await signIn(t.app, DEMO.engineer)}` };
    viewer = { Authorization: `Bearer ${await signIn(t.app, DEMO.viewer)}` };
    projectId = (
      await request(t.app)
        .post('/api/v1/projects')
        .set(engineer)
        .send({ name: 'Patterns', description: 'test' })
    ).body.id;
  });
  afterAll(async () => t.dispose());

  it('a saved SHE study gives the same events and figures as its angles sent inline', async () => {
    const study = await save({
      vdc: 100,
      fundamentalFrequency: 50,
      modulation: {
        method: 'selective-harmonic-elimination',
        kind: 'bipolar',
        angles,
        eliminate: [5, 7],
      },
    });
    expect(study.id).toBeDefined();
    const byStudy = await request(t.app)
      .post('/api/v1/pattern-compare-events')
      .set(viewer)
      .send({ studyId: study.id, ...OPTIONS });
    expect(byStudy.status, JSON.stringify(byStudy.body)).toBe(200);
    const inline = await request(t.app)
      .post('/api/v1/pattern-compare-events')
      .set(viewer)
      .send({ pattern: { kind: 'bipolar', vdc: 100, angles }, ...OPTIONS });
    expect(inline.status).toBe(200);
    expect(byStudy.body).toEqual(inline.body);
    // The exact angles eliminate the 5th and 7th: below 1e-9 of the fundamental (Patel and Hoft).
    const ideal = byStudy.body.ideal as { fundamental: number; orders: { amplitude: number }[] };
    for (const order of ideal.orders)
      expect(order.amplitude).toBeLessThan(1e-9 * ideal.fundamental);
  });

  it('a study of another method is a 400 naming studyId', async () => {
    const study = await save({
      vdc: 400,
      fundamentalFrequency: 50,
      carrierFrequency: 1050,
      modulation: { method: 'sine-triangle', scheme: 'bipolar', ma: 0.8 },
    });
    const res = await request(t.app)
      .post('/api/v1/pattern-compare-events')
      .set(viewer)
      .send({ studyId: study.id, ...OPTIONS });
    expect(res.status).toBe(400);
    expect(res.body.errors[0].path).toBe('studyId');
    expect(res.body.detail).toContain('sine-triangle');
  });

  it("a study the caller cannot see (another team's, or none) is a 404", async () => {
    const { models, auth } = t.app.services;
    const team = await models.Team.create({ name: 'Osprey Power' });
    const user = await models.User.create({
      email: 'viewer@osprey.example',
      name: 'Osprey Viewer',
      passwordHash: await auth.hashPassword('osprey-viewer-password'),
    });
    await models.Membership.create({ teamId: team.id, userId: user.id, role: 'viewer' });
    const outsider = {
      Authorization: `Bearer ${await signIn(t.app, 'viewer@osprey.example', 'osprey-viewer-password')}`,
    };
    const study = await save({
      vdc: 100,
      fundamentalFrequency: 50,
      modulation: { method: 'optimal-pattern', kind: 'bipolar', angles },
    });
    const theirs = await request(t.app)
      .post('/api/v1/pattern-compare-events')
      .set(outsider)
      .send({ studyId: study.id, ...OPTIONS });
    expect(theirs.status).toBe(404);
    const none = await request(t.app)
      .post('/api/v1/pattern-compare-events')
      .set(viewer)
      .send({ studyId: '00000000-0000-4000-8000-000000000000', ...OPTIONS });
    expect(none.status).toBe(404);
  });

  it('one of pattern or studyId: both, or neither, is a 400 naming the field', async () => {
    const both = await request(t.app)
      .post('/api/v1/pattern-compare-events')
      .set(viewer)
      .send({
        studyId: '00000000-0000-4000-8000-000000000000',
        pattern: { kind: 'bipolar', vdc: 100, angles },
        ...OPTIONS,
      });
    expect(both.status).toBe(400);
    expect(both.body.errors[0].path).toBe('studyId');
    const neither = await request(t.app)
      .post('/api/v1/pattern-compare-events')
      .set(viewer)
      .send(OPTIONS);
    expect(neither.status).toBe(400);
    expect(neither.body.errors[0].path).toBe('pattern');
  });
});
