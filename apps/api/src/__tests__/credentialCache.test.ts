import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, signIn, testApp, type TestApp } from './helpers.js';

// Issue 11, throughput: verified credentials are served from a cache (services/credentialCache.ts)
// that a change of rights invalidates before the change's answer is sent
// (services/credentialEpoch.ts). Each case uses a credential once so it is cached, changes its
// rights, and expects the very next request to see the change. The same holds across PostgreSQL
// replicas (tests/robustness/replicas.test.ts).
describe('credential cache', () => {
  let t: TestApp;
  let admin: Record<string, string>;
  beforeAll(async () => {
    t = await testApp();
    admin = { Authorization: `Bearer ${await signIn(t.app, DEMO.admin)}` };
  });
  afterAll(() => t.dispose());

  const me = (token: string) =>
    request(t.app)
      .get('/api/v1/me')
      .set({ Authorization: `Bearer ${token}` });

  it('a revoked API key is refused on the next request', async () => {
    const made = await request(t.app)
      .post('/api/v1/api-keys')
      .set(admin)
      .send({ name: 'cached', role: 'viewer' });
    expect(made.status).toBe(201);
    expect((await me(made.body.key)).status).toBe(200);
    expect((await me(made.body.key)).status).toBe(200); // served from the cache
    const revoked = await request(t.app).delete(`/api/v1/api-keys/${made.body.id}`).set(admin);
    expect(revoked.status).toBe(204);
    expect((await me(made.body.key)).status).toBe(401);
  });

  it('a lowered role applies to the next request, and a removed member is refused', async () => {
    const token = await signIn(t.app, DEMO.engineer2);
    const before = await me(token);
    expect(before.body.role).toBe('engineer');
    const members = await request(t.app).get('/api/v1/members').set(admin);
    const member = members.body.find(
      (m: { user: { email: string } }) => m.user.email === DEMO.engineer2,
    );
    const lowered = await request(t.app)
      .patch(`/api/v1/members/${member.user.id}`)
      .set(admin)
      .send({ role: 'viewer' });
    expect(lowered.status).toBe(200);
    expect((await me(token)).body.role).toBe('viewer');
    const removed = await request(t.app).delete(`/api/v1/members/${member.user.id}`).set(admin);
    expect(removed.status).toBe(204);
    expect((await me(token)).status).toBe(401);
  });

  it('a signed-out session is refused on the next request', async () => {
    const token = await signIn(t.app, DEMO.viewer);
    expect((await me(token)).status).toBe(200);
    const out = await request(t.app)
      .post('/api/v1/auth/logout')
      .set({ Authorization: `Bearer ${token}` });
    expect(out.status).toBe(204);
    expect((await me(token)).status).toBe(401);
  });
});
