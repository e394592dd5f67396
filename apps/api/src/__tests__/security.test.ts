import { readFileSync, existsSync } from 'node:fs';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO, DEMO_PASSWORD, deliveredToken, signIn, testApp, type TestApp } from './helpers.js';
import { SINE_TRIANGLE } from './fixtures.js';

const bearer = (token: string) => ({ Authorization: `Bearer ${token}` });

describe('sign-in, keys and roles', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await testApp();
  });
  afterAll(async () => t.dispose());

  it('refuses a wrong password with the same answer as an unknown e-mail', async () => {
    const wrong = await request(t.app)
      .post('/api/v1/auth/login')
      .send({ email: DEMO.engineer, password: 'not-it' });
    const unknown = await request(t.app)
      .post('/api/v1/auth/login')
      .send({ email: 'ghost@kestrel.example', password: 'not-it' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body.detail).toBe(unknown.body.detail);
  });

  it('shows a key once, lists it without the secret, and a revoked key fails on the very next request', async () => {
    const session = await signIn(t.app, DEMO.engineer);
    const created = await request(t.app)
      .post('/api/v1/api-keys')
      .set(bearer(session))
      .send({ name: 'ci', role: 'viewer' });
    expect(created.status).toBe(201);
    const key = created.body.key as string;
    expect(key.startsWith(created.body.prefix)).toBe(true);
    const listed = await request(t.app).get('/api/v1/api-keys').set(bearer(session));
    expect(JSON.stringify(listed.body)).not.toContain(key);
    expect(listed.body.find((k: { id: string }) => k.id === created.body.id)).toMatchObject({
      prefix: created.body.prefix,
      revokedAt: null,
    });

    const me = await request(t.app).get('/api/v1/me').set(bearer(key));
    expect(me.status).toBe(200);
    expect(me.body).toMatchObject({
      role: 'viewer',
      authMethod: 'api-key',
      user: { email: DEMO.engineer },
    });
    expect(
      (
        await request(t.app)
          .post('/api/v1/spectra')
          .set(bearer(key))
          .send({ modulation: SINE_TRIANGLE, maxOrder: 5 })
      ).status,
    ).toBe(200);

    expect(
      (await request(t.app).delete(`/api/v1/api-keys/${created.body.id}`).set(bearer(session)))
        .status,
    ).toBe(204);
    const after = await request(t.app).get('/api/v1/me').set(bearer(key));
    expect(after.status).toBe(401);
    expect(after.headers['www-authenticate']).toContain('Bearer');
  });

  it('caps a key at its creator: no key above your role, and a demotion lowers existing keys', async () => {
    const viewer = await signIn(t.app, DEMO.viewer);
    expect(
      (
        await request(t.app)
          .post('/api/v1/api-keys')
          .set(bearer(viewer))
          .send({ name: 'x', role: 'viewer' })
      ).status,
    ).toBe(403);
    const engineer = await signIn(t.app, DEMO.engineer2);
    const tooHigh = await request(t.app)
      .post('/api/v1/api-keys')
      .set(bearer(engineer))
      .send({ name: 'x', role: 'admin' });
    expect(tooHigh.status).toBe(403);
    expect(tooHigh.body.detail).toContain('role admin is above your own role (engineer)');
    const key = (
      await request(t.app)
        .post('/api/v1/api-keys')
        .set(bearer(engineer))
        .send({ name: 'eng', role: 'engineer' })
    ).body.key;
    expect(
      (await request(t.app).post('/api/v1/projects').set(bearer(key)).send({ name: 'by key' }))
        .status,
    ).toBe(201);

    const admin = await signIn(t.app, DEMO.admin);
    const members = await request(t.app).get('/api/v1/members').set(bearer(admin));
    const lena = members.body.find(
      (m: { user: { email: string } }) => m.user.email === DEMO.engineer2,
    );
    expect(
      (
        await request(t.app)
          .patch(`/api/v1/members/${lena.user.id}`)
          .set(bearer(admin))
          .send({ role: 'viewer' })
      ).status,
    ).toBe(200);
    const demoted = await request(t.app)
      .post('/api/v1/projects')
      .set(bearer(key))
      .send({ name: 'by key again' });
    expect(demoted.status).toBe(403);
    expect(demoted.body.detail).toContain('this API key acts as viewer');
    await request(t.app)
      .patch(`/api/v1/members/${lena.user.id}`)
      .set(bearer(admin))
      .send({ role: 'engineer' });
  });

  it('keeps at least one admin', async () => {
    const admin = await signIn(t.app, DEMO.admin);
    const me = await request(t.app).get('/api/v1/me').set(bearer(admin));
    const res = await request(t.app)
      .patch(`/api/v1/members/${me.body.user.id}`)
      .set(bearer(admin))
      .send({ role: 'viewer' });
    expect(res.status).toBe(409);
    expect(res.body.detail).toContain('at least one admin');
  });

  it('signing out ends the session', async () => {
    const session = await signIn(t.app, DEMO.viewer);
    expect((await request(t.app).post('/api/v1/auth/logout').set(bearer(session))).status).toBe(
      204,
    );
    expect((await request(t.app).get('/api/v1/me').set(bearer(session))).status).toBe(401);
  });

  it('invites by e-mail (the outbox copy masked); accepting the delivered link sets the password and joins with the role', async () => {
    const admin = await signIn(t.app, DEMO.admin);
    const invited = await request(t.app)
      .post('/api/v1/invitations')
      .set(bearer(admin))
      .send({ email: 'Mira@Kestrel.example', role: 'engineer' });
    expect(invited.status).toBe(201);
    const outbox = await request(t.app).get('/api/v1/outbox').set(bearer(admin));
    const mail = outbox.body.find((m: { to: string }) => m.to === 'mira@kestrel.example');
    expect(mail.subject).toContain('Kestrel Drives');
    expect(mail.text).toContain('accept-invitation?token=pwt_[hidden]');
    const token = deliveredToken(t, 'mira@kestrel.example');
    expect(mail.text).not.toContain(token);
    const accepted = await request(t.app)
      .post('/api/v1/invitations/accept')
      .send({ token, name: 'Mira Holt', password: 'mira-long-password' });
    expect(accepted.status).toBe(200);
    const me = await request(t.app).get('/api/v1/me').set(bearer(accepted.body.token));
    expect(me.body).toMatchObject({
      role: 'engineer',
      user: { email: 'mira@kestrel.example', name: 'Mira Holt' },
    });
    expect(await signIn(t.app, 'mira@kestrel.example', 'mira-long-password')).toMatch(/^pws_/);
    const again = await request(t.app)
      .post('/api/v1/invitations/accept')
      .send({ token, name: 'Mira', password: 'another-long-password' });
    expect(again.status).toBe(400);
  });

  it('resets a password by e-mail and ends the old sessions', async () => {
    const old = await signIn(t.app, DEMO.engineer2);
    expect(
      (await request(t.app).post('/api/v1/auth/password-reset').send({ email: DEMO.engineer2 }))
        .status,
    ).toBe(202);
    const token = deliveredToken(t, DEMO.engineer2);
    expect(
      (
        await request(t.app)
          .post('/api/v1/auth/password-reset/confirm')
          .send({ token, password: 'lena-new-password' })
      ).status,
    ).toBe(204);
    expect((await request(t.app).get('/api/v1/me').set(bearer(old))).status).toBe(401);
    expect(await signIn(t.app, DEMO.engineer2, 'lena-new-password')).toMatch(/^pws_/);
    const weak = await request(t.app)
      .post('/api/v1/auth/password-reset/confirm')
      .send({ token, password: 'short' });
    expect(weak.status).toBe(400);
    expect(weak.body.errors[0]).toMatchObject({ path: 'password' });
  });

  it('a removed member is locked out at once, sessions and keys alike', async () => {
    const admin = await signIn(t.app, DEMO.admin);
    const invited = await request(t.app)
      .post('/api/v1/invitations')
      .set(bearer(admin))
      .send({ email: 'leaver@kestrel.example', role: 'engineer' });
    expect(invited.status).toBe(201);
    const token = deliveredToken(t, 'leaver@kestrel.example');
    const session = (
      await request(t.app)
        .post('/api/v1/invitations/accept')
        .send({ token, name: 'Leaver', password: 'leaver-password' })
    ).body.token;
    const key = (
      await request(t.app)
        .post('/api/v1/api-keys')
        .set(bearer(session))
        .send({ name: 'k', role: 'engineer' })
    ).body.key;
    const me = await request(t.app).get('/api/v1/me').set(bearer(session));
    expect(
      (await request(t.app).delete(`/api/v1/members/${me.body.user.id}`).set(bearer(admin))).status,
    ).toBe(204);
    expect((await request(t.app).get('/api/v1/me').set(bearer(session))).status).toBe(401);
    expect((await request(t.app).get('/api/v1/me').set(bearer(key))).status).toBe(401);
  });

  it('records who did what in the audit log', async () => {
    const admin = await signIn(t.app, DEMO.admin);
    const events = await request(t.app)
      .get('/api/v1/audit-events')
      .set(bearer(admin))
      .query({ limit: 200 });
    const actions = new Set(events.body.map((e: { action: string }) => e.action));
    for (const action of [
      'auth.login',
      'auth.login-failed',
      'api-key.create',
      'api-key.revoke',
      'member.role-change',
      'invitation.accept',
      'member.remove',
    ]) {
      expect(actions.has(action), action).toBe(true);
    }
  });

  it('sends helmet headers and no CORS headers (same origin only)', async () => {
    const res = await request(t.app).get('/api/health').set('Origin', 'https://elsewhere.example');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['content-security-policy']).toContain("default-src 'self'");
    expect(res.headers['access-control-allow-origin']).toBeUndefined();
    expect(res.headers['x-powered-by']).toBeUndefined();
  });

  it('never stores a plain password, session token or API key (scan of the database files)', async () => {
    const session = await signIn(t.app, DEMO.engineer);
    const key = (
      await request(t.app)
        .post('/api/v1/api-keys')
        .set(bearer(session))
        .send({ name: 'scan', role: 'viewer' })
    ).body.key as string;
    await request(t.app).get('/api/v1/me').set(bearer(key));
    const secretPart = key.split('_').slice(2).join('_');
    const bytes = [t.file, `${t.file}-wal`].filter(existsSync).map((f) => readFileSync(f));
    expect(bytes.length).toBeGreaterThan(0);
    for (const needle of [
      DEMO_PASSWORD,
      'mira-long-password',
      'lena-new-password',
      session,
      key,
      secretPart,
      session.slice(4),
    ]) {
      for (const content of bytes)
        expect(content.includes(Buffer.from(needle)), `found ${needle.slice(0, 8)}…`).toBe(false);
    }
    // The bcrypt hashes are there instead.
    expect(bytes.some((b) => b.includes(Buffer.from('$2b$04$')))).toBe(true);
  });
});

describe('rate limits', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await testApp({ loginRateLimit: 3, keyRateLimit: 2 });
  });
  afterAll(async () => t.dispose());

  it('limits sign-in attempts per address with a 429 problem', async () => {
    const statuses: number[] = [];
    for (let i = 0; i < 4; i++) {
      statuses.push(
        (
          await request(t.app)
            .post('/api/v1/auth/login')
            .send({ email: DEMO.viewer, password: 'guess' })
        ).status,
      );
    }
    expect(statuses).toEqual([401, 401, 401, 429]);
    const limited = await request(t.app)
      .post('/api/v1/auth/login')
      .send({ email: DEMO.viewer, password: DEMO_PASSWORD });
    expect(limited.status).toBe(429);
    expect(limited.headers['content-type']).toMatch(/problem\+json/);
  });

  it('limits key creation per user', async () => {
    const session = (
      await t.app.services.auth.startSession(
        (await t.app.services.models.User.findOne({ where: { email: DEMO.engineer } }))!.id,
        (await t.app.services.models.Team.findOne())!.id,
      )
    ).token;
    const statuses: number[] = [];
    for (let i = 0; i < 3; i++) {
      statuses.push(
        (
          await request(t.app)
            .post('/api/v1/api-keys')
            .set(bearer(session))
            .send({ name: `k${i}`, role: 'viewer' })
        ).status,
      );
    }
    expect(statuses).toEqual([201, 201, 429]);
  });
});
