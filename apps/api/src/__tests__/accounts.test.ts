import { randomUUID } from 'node:crypto';
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { createApp } from '../app.js';
import { loadConfig } from '../config.js';
import { openDatabase } from '../db/database.js';
import { migrate } from '../db/migrate.js';
import {
  DEMO,
  DEMO_PASSWORD,
  deliveredTo,
  deliveredToken,
  signIn,
  testApp,
  type TestApp,
} from './helpers.js';

// Regression tests for the account findings of issue 11 (docs/security.md, "Issue 11"): each
// failed on the code before the fix.

const bearer = (token: string) => ({ Authorization: `Bearer ${token}` });
const LIVE_ONE_TIME_TOKEN = /pwt_[A-Za-z0-9_-]{16,}/;

/** A second team in the same deployment, with its own admin, as an attacker could run. */
async function secondTeam(t: TestApp): Promise<{ teamId: string; admin: string }> {
  const { models, auth } = t.app.services;
  const team = await models.Team.create({ name: 'Osprey Power' });
  const user = await models.User.create({
    email: 'admin@osprey.example',
    name: 'Osprey Admin',
    passwordHash: await auth.hashPassword('osprey-admin-password'),
  });
  await models.Membership.create({ teamId: team.id, userId: user.id, role: 'admin' });
  return {
    teamId: team.id,
    admin: await signIn(t.app, 'admin@osprey.example', 'osprey-admin-password'),
  };
}

describe('invitations to an address that already has an account', () => {
  let t: TestApp;
  let osprey: { teamId: string; admin: string };
  beforeAll(async () => {
    t = await testApp();
    osprey = await secondTeam(t);
  });
  afterAll(async () => t.dispose());

  it('never set the password or the name: accepting with a new password is refused and changes nothing', async () => {
    const invited = await request(t.app)
      .post('/api/v1/invitations')
      .set(bearer(osprey.admin))
      .send({ email: DEMO.engineer, role: 'admin' });
    expect(invited.status).toBe(201);
    // Even the holder of the delivered link cannot take the account over with it.
    const token = deliveredToken(t, DEMO.engineer);
    const takeover = await request(t.app)
      .post('/api/v1/invitations/accept')
      .send({ token, name: 'Mallory', password: 'attacker-chosen-password' });
    expect(takeover.status).toBe(401);
    expect(takeover.headers['content-type']).toMatch(/problem\+json/);
    expect(takeover.body.detail).toContain('already has a Pulsewright account');
    expect(takeover.body.errors[0]).toMatchObject({ path: 'password' });
    expect(
      (
        await request(t.app)
          .post('/api/v1/auth/login')
          .send({ email: DEMO.engineer, password: 'attacker-chosen-password' })
      ).status,
    ).toBe(401);
    const own = await signIn(t.app, DEMO.engineer);
    const me = await request(t.app).get('/api/v1/me').set(bearer(own));
    expect(me.body).toMatchObject({
      team: { name: 'Kestrel Drives' },
      user: { name: expect.not.stringContaining('Mallory') },
    });
    const user = await t.app.services.models.User.findOne({ where: { email: DEMO.engineer } });
    expect(
      await t.app.services.models.Membership.count({
        where: { userId: user!.id, teamId: osprey.teamId },
      }),
    ).toBe(0);
    const listed = await request(t.app).get('/api/v1/invitations').set(bearer(osprey.admin));
    expect(listed.body.find((i: { id: string }) => i.id === invited.body.id).status).toBe('open');
    // The invitation itself tells the person how to join.
    expect(deliveredTo(t, DEMO.engineer).text).toContain(
      'already has a Pulsewright account: sign in with its current password',
    );
  });

  it('add the membership once the account signs in with its own password, which stays as it was', async () => {
    const token = deliveredToken(t, DEMO.engineer);
    const user = await t.app.services.models.User.findOne({ where: { email: DEMO.engineer } });
    const before = { name: user!.name, passwordHash: user!.passwordHash };
    const accepted = await request(t.app)
      .post('/api/v1/invitations/accept')
      .send({ token, name: 'Ignored Name', password: DEMO_PASSWORD });
    expect(accepted.status).toBe(200);
    const me = await request(t.app).get('/api/v1/me').set(bearer(accepted.body.token));
    expect(me.body).toMatchObject({
      role: 'admin',
      team: { id: osprey.teamId, name: 'Osprey Power' },
      user: { email: DEMO.engineer, name: before.name },
    });
    await user!.reload();
    expect({ name: user!.name, passwordHash: user!.passwordHash }).toEqual(before);
    expect(await signIn(t.app, DEMO.engineer)).toMatch(/^pws_/);
    const again = await request(t.app)
      .post('/api/v1/invitations/accept')
      .send({ token, name: 'x', password: DEMO_PASSWORD });
    expect(again.status).toBe(400);
  });
});

describe('the outbox', () => {
  let t: TestApp;
  let osprey: { teamId: string; admin: string };
  let kestrelAdmin: string;
  beforeAll(async () => {
    t = await testApp();
    osprey = await secondTeam(t);
    kestrelAdmin = await signIn(t.app, DEMO.admin);
    await request(t.app)
      .post('/api/v1/auth/password-reset')
      .send({ email: DEMO.viewer })
      .expect(202);
    await request(t.app)
      .post('/api/v1/invitations')
      .set(bearer(kestrelAdmin))
      .send({ email: 'newcomer@kestrel.example', role: 'viewer' })
      .expect(201);
    await request(t.app)
      .post('/api/v1/invitations')
      .set(bearer(osprey.admin))
      .send({ email: 'newcomer@osprey.example', role: 'viewer' })
      .expect(201);
    await request(t.app)
      .post('/api/v1/auth/password-reset')
      .send({ email: 'admin@osprey.example' })
      .expect(202);
  });
  afterAll(async () => t.dispose());

  it("shows an admin only their own team's mail", async () => {
    const kestrel = (await request(t.app).get('/api/v1/outbox').set(bearer(kestrelAdmin))).body as {
      to: string;
    }[];
    const ospreyMail = (await request(t.app).get('/api/v1/outbox').set(bearer(osprey.admin)))
      .body as { to: string }[];
    expect(kestrel.map((m) => m.to).sort()).toEqual(['newcomer@kestrel.example', DEMO.viewer]);
    expect(ospreyMail.map((m) => m.to).sort()).toEqual([
      'admin@osprey.example',
      'newcomer@osprey.example',
    ]);
  });

  it('never shows a live one-time token: the outbox masks it, the delivered message holds it', async () => {
    for (const admin of [kestrelAdmin, osprey.admin]) {
      const res = await request(t.app).get('/api/v1/outbox').set(bearer(admin));
      expect(res.status).toBe(200);
      expect(res.text).not.toMatch(LIVE_ONE_TIME_TOKEN);
      expect(res.text).toContain('pwt_[hidden]');
    }
    const delivered = deliveredToken(t, DEMO.viewer);
    expect(delivered).toMatch(LIVE_ONE_TIME_TOKEN);
    // The delivered link works (the mask is not a broken token in the real message).
    expect(
      (
        await request(t.app)
          .post('/api/v1/auth/password-reset/confirm')
          .send({ token: delivered, password: 'viewer-new-password' })
      ).status,
    ).toBe(204);
    await request(t.app)
      .post('/api/v1/auth/password-reset/confirm')
      .send({ token: delivered, password: 'x-long-password' })
      .expect(400);
  });

  it('keeps no live one-time token in the database either (scan of the SQLite file and its WAL)', async () => {
    const tokens = [
      deliveredToken(t, 'newcomer@kestrel.example'),
      deliveredToken(t, 'newcomer@osprey.example'),
      deliveredToken(t, 'admin@osprey.example'),
    ];
    const bytes = [t.file, `${t.file}-wal`].filter(existsSync).map((f) => readFileSync(f));
    for (const token of tokens) {
      for (const content of bytes)
        expect(content.includes(Buffer.from(token.slice(4))), `found ${token.slice(0, 8)}…`).toBe(
          false,
        );
    }
  });
});

describe('migration 0003 on a database of the previous release', () => {
  it('masks the live links the old local outbox kept, and shows those team-less rows to no admin', async () => {
    const dir = mkdtempSync(path.join(tmpdir(), 'pulsewright-0003-'));
    const file = path.join(dir, 'previous.sqlite');
    try {
      const sequelize = await openDatabase(`sqlite:${file}`);
      await migrate(sequelize, '0002-study-design');
      const live = `pwt_${'A1b2C3d4E5f6G7h8I9j0K1l2M3n4O5p6Q7r8S9t0U1v'}`;
      const stamps = { createdAt: new Date(), updatedAt: new Date() };
      const text = `Accept within 7 days: http://localhost:3000/accept-invitation?token=${live}\n`;
      await sequelize.getQueryInterface().bulkInsert('outbox', [
        {
          id: randomUUID(),
          to: 'someone@kestrel.example',
          subject: 'Invitation',
          text,
          message: JSON.stringify({ text }),
          status: 'saved',
          ...stamps,
        },
      ]);
      await sequelize.close();

      const app = await createApp({
        databaseUrl: `sqlite:${file}`,
        bcryptRounds: 4,
        logErrors: false,
        webDist: path.join(dir, 'none'),
        demoPassword: DEMO_PASSWORD,
      });
      try {
        const [row] = await app.services.models.Outbox.findAll();
        expect(row!.text).toBe(
          'Accept within 7 days: http://localhost:3000/accept-invitation?token=pwt_[hidden]\n',
        );
        expect(row!.message).not.toContain(live.slice(4));
        expect(row!.teamId).toBeNull();
        const team = await app.services.models.Team.create({ name: 'Any team' });
        expect(await app.services.mailer.list(team.id, 50, 0)).toEqual([]);
      } finally {
        await app.close();
      }
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});

describe('single-use tokens under concurrency', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await testApp();
  });
  afterAll(async () => t.dispose());

  it('three concurrent confirmations of one reset token: one 204, the others a 400 naming the token, one password set', async () => {
    await request(t.app)
      .post('/api/v1/auth/password-reset')
      .send({ email: DEMO.viewer })
      .expect(202);
    const token = deliveredToken(t, DEMO.viewer);
    const passwords = ['first-new-password', 'second-new-password', 'third-new-password'];
    const answers = await Promise.all(
      passwords.map((password) =>
        request(t.app).post('/api/v1/auth/password-reset/confirm').send({ token, password }),
      ),
    );
    expect(answers.map((a) => a.status).sort()).toEqual([204, 400, 400]);
    for (const refused of answers.filter((a) => a.status === 400)) {
      expect(refused.body.errors[0]).toMatchObject({ path: 'token' });
      expect(refused.body.detail).toMatch(/used/);
    }
    const winner = passwords[answers.findIndex((a) => a.status === 204)];
    const signIns = await Promise.all(
      passwords.map((password) =>
        request(t.app).post('/api/v1/auth/login').send({ email: DEMO.viewer, password }),
      ),
    );
    expect(signIns.map((s, i) => [passwords[i], s.status])).toEqual(
      passwords.map((p) => [p, p === winner ? 200 : 401]),
    );
  });

  it('three concurrent acceptances of one invitation: one session, the others 400, one account and one membership', async () => {
    const admin = await signIn(t.app, DEMO.admin);
    await request(t.app)
      .post('/api/v1/invitations')
      .set(bearer(admin))
      .send({ email: 'racer@kestrel.example', role: 'engineer' })
      .expect(201);
    const token = deliveredToken(t, 'racer@kestrel.example');
    const answers = await Promise.all(
      [1, 2, 3].map((n) =>
        request(t.app)
          .post('/api/v1/invitations/accept')
          .send({ token, name: `Racer ${n}`, password: `racer-password-${n}` }),
      ),
    );
    expect(answers.map((a) => a.status).sort()).toEqual([200, 400, 400]);
    const { models } = t.app.services;
    const users = await models.User.findAll({ where: { email: 'racer@kestrel.example' } });
    expect(users).toHaveLength(1);
    expect(await models.Membership.count({ where: { userId: users[0]!.id } })).toBe(1);
    expect(await models.Session.count({ where: { userId: users[0]!.id } })).toBe(1);
  });
});

describe('API key lineage', () => {
  let t: TestApp;
  let session: string;
  beforeAll(async () => {
    t = await testApp();
    session = await signIn(t.app, DEMO.engineer);
  });
  afterAll(async () => t.dispose());

  const makeKey = (credential: string, body: Record<string, unknown>) =>
    request(t.app)
      .post('/api/v1/api-keys')
      .set(bearer(credential))
      .send({ name: 'lineage', ...body });

  it('a key made with a key that expires in a day cannot outlive it: no expiry inherits the parent’s, a later one is refused', async () => {
    const parent = await makeKey(session, { role: 'engineer', expiresInDays: 1 });
    expect(parent.status).toBe(201);
    const child = await makeKey(parent.body.key, { role: 'viewer' });
    expect(child.status).toBe(201);
    expect(child.body.expiresAt).toBe(parent.body.expiresAt);
    const longer = await makeKey(parent.body.key, { role: 'viewer', expiresInDays: 30 });
    expect(longer.status).toBe(400);
    expect(longer.body.errors[0]).toMatchObject({ path: 'expiresInDays' });
    expect(longer.body.detail).toMatch(/cannot outlive/);
    const shorter = await makeKey(parent.body.key, { role: 'viewer', expiresInDays: 1 });
    expect(shorter.status).toBe(201);
    expect(Date.parse(shorter.body.expiresAt)).toBeLessThanOrEqual(
      Date.parse(parent.body.expiresAt),
    );
  });

  it('cannot outrank its parent', async () => {
    const parent = await makeKey(session, { role: 'viewer' });
    expect(parent.status).toBe(201);
    // A viewer key cannot make keys at all (key creation needs the engineer role).
    expect((await makeKey(parent.body.key, { role: 'viewer' })).status).toBe(403);
    const engineerKey = await makeKey(session, { role: 'engineer' });
    const admin = await makeKey(engineerKey.body.key, { role: 'admin' });
    expect(admin.status).toBe(403);
  });

  it('revoking a key revokes every key made with it, down the line, on the very next request', async () => {
    const parent = await makeKey(session, { role: 'engineer' });
    const child = await makeKey(parent.body.key, { role: 'engineer' });
    const grandchild = await makeKey(child.body.key, { role: 'viewer' });
    const sibling = await makeKey(session, { role: 'viewer' });
    for (const key of [parent, child, grandchild, sibling]) {
      expect(key.status).toBe(201);
      expect((await request(t.app).get('/api/v1/me').set(bearer(key.body.key))).status).toBe(200);
    }
    expect(
      (await request(t.app).delete(`/api/v1/api-keys/${parent.body.id}`).set(bearer(session)))
        .status,
    ).toBe(204);
    for (const key of [parent, child, grandchild]) {
      expect((await request(t.app).get('/api/v1/me').set(bearer(key.body.key))).status).toBe(401);
    }
    expect((await request(t.app).get('/api/v1/me').set(bearer(sibling.body.key))).status).toBe(200);
    const listed = (await request(t.app).get('/api/v1/api-keys').set(bearer(session))).body as {
      id: string;
      revokedAt: string | null;
    }[];
    for (const key of [child, grandchild])
      expect(listed.find((k) => k.id === key.body.id)?.revokedAt).not.toBeNull();
  });

  it('a key whose parent was revoked by other means (a race with its creation) is refused all the same', async () => {
    const parent = await makeKey(session, { role: 'engineer' });
    const child = await makeKey(parent.body.key, { role: 'viewer' });
    await t.app.services.models.ApiKey.update(
      { revokedAt: new Date() },
      { where: { id: parent.body.id } },
    );
    expect((await request(t.app).get('/api/v1/me').set(bearer(child.body.key))).status).toBe(401);
  });

  it('a key made with a revoked key is refused before it exists', async () => {
    const parent = await makeKey(session, { role: 'engineer' });
    await request(t.app)
      .delete(`/api/v1/api-keys/${parent.body.id}`)
      .set(bearer(session))
      .expect(204);
    expect((await makeKey(parent.body.key, { role: 'viewer' })).status).toBe(401);
  });
});

describe('password reset policy: every session and every API key of the user end', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await testApp();
  });
  afterAll(async () => t.dispose());

  it('ends all sessions, revokes all keys (made in a session or with a key) and voids other open reset links', async () => {
    const sessions = [await signIn(t.app, DEMO.engineer), await signIn(t.app, DEMO.engineer)];
    const key = (
      await request(t.app)
        .post('/api/v1/api-keys')
        .set(bearer(sessions[0]!))
        .send({ name: 'ci', role: 'engineer' })
    ).body;
    const derived = (
      await request(t.app)
        .post('/api/v1/api-keys')
        .set(bearer(key.key))
        .send({ name: 'derived', role: 'viewer' })
    ).body;
    const otherUser = (
      await request(t.app)
        .post('/api/v1/api-keys')
        .set(bearer(await signIn(t.app, DEMO.engineer2)))
        .send({ name: 'lena', role: 'viewer' })
    ).body;
    for (const credential of [...sessions, key.key, derived.key, otherUser.key]) {
      expect((await request(t.app).get('/api/v1/me').set(bearer(credential))).status).toBe(200);
    }
    await request(t.app)
      .post('/api/v1/auth/password-reset')
      .send({ email: DEMO.engineer })
      .expect(202);
    const older = deliveredToken(t, DEMO.engineer);
    await request(t.app)
      .post('/api/v1/auth/password-reset')
      .send({ email: DEMO.engineer })
      .expect(202);
    const newer = deliveredToken(t, DEMO.engineer);
    expect(newer).not.toBe(older);
    await request(t.app)
      .post('/api/v1/auth/password-reset/confirm')
      .send({ token: newer, password: 'engineer-new-password' })
      .expect(204);

    for (const credential of [...sessions, key.key, derived.key]) {
      expect((await request(t.app).get('/api/v1/me').set(bearer(credential))).status).toBe(401);
    }
    // Someone else's key is untouched; the older link no longer works.
    expect((await request(t.app).get('/api/v1/me').set(bearer(otherUser.key))).status).toBe(200);
    expect(
      (
        await request(t.app)
          .post('/api/v1/auth/password-reset/confirm')
          .send({ token: older, password: 'another-new-password' })
      ).status,
    ).toBe(400);
    const fresh = await signIn(t.app, DEMO.engineer, 'engineer-new-password');
    const listed = (await request(t.app).get('/api/v1/api-keys').set(bearer(fresh))).body as {
      id: string;
      revokedAt: string | null;
    }[];
    expect(listed.filter((k) => k.revokedAt === null)).toEqual([]);
    const admin = await signIn(t.app, DEMO.admin);
    const events = (
      await request(t.app).get('/api/v1/audit-events').set(bearer(admin)).query({ limit: 200 })
    ).body as { action: string; details: Record<string, unknown> }[];
    expect(events.find((e) => e.action === 'auth.password-reset')?.details).toMatchObject({
      sessionsEnded: 2,
      keysRevoked: 2,
    });
  });
});

describe('sign-in timing', () => {
  let t: TestApp;
  beforeAll(async () => {
    // A real cost (tests elsewhere use 4 for speed), so a bcrypt compare dominates the answer.
    t = await testApp({ bcryptRounds: 10 });
  }, 60_000);
  afterAll(async () => t.dispose());

  const median = (values: number[]): number => {
    const sorted = [...values].sort((a, b) => a - b);
    return sorted[Math.floor(sorted.length / 2)] as number;
  };

  it('takes the same time for an unknown address as for a known one with a wrong password', async () => {
    const time = async (email: string): Promise<number> => {
      const started = performance.now();
      const res = await request(t.app)
        .post('/api/v1/auth/login')
        .send({ email, password: 'a-wrong-password' });
      expect(res.status).toBe(401);
      return performance.now() - started;
    };
    await time(DEMO.viewer); // warm-up (the dummy hash, connections, JIT)
    await time('warm-up@nowhere.example');
    const known: number[] = [];
    const unknown: number[] = [];
    for (let i = 0; i < 7; i++) {
      known.push(await time(DEMO.viewer));
      unknown.push(await time(`nobody${i}@nowhere.example`));
    }
    const ratio = median(unknown) / median(known);
    console.info(
      `sign-in median: known ${median(known).toFixed(1)} ms, unknown ${median(unknown).toFixed(1)} ms, ratio ${ratio.toFixed(2)}`,
    );
    // Before the fix the ratio was about 0.03 (a cost-4 dummy hash against cost-10 hashes);
    // equal costs give about 1. Generous bounds for a busy test machine.
    expect(ratio).toBeGreaterThan(0.6);
    expect(ratio).toBeLessThan(1.7);
  }, 60_000);
});

describe('rate limits', () => {
  it('successful sign-ins are not counted; failures are, per client address', async () => {
    const t = await testApp({ loginRateLimit: 3 });
    try {
      for (let i = 0; i < 8; i++) {
        expect(
          (
            await request(t.app)
              .post('/api/v1/auth/login')
              .send({ email: DEMO.viewer, password: DEMO_PASSWORD })
          ).status,
        ).toBe(200);
      }
      const statuses: number[] = [];
      for (const email of [DEMO.admin, DEMO.engineer, DEMO.engineer2, DEMO.viewer]) {
        statuses.push(
          (await request(t.app).post('/api/v1/auth/login').send({ email, password: 'guess' }))
            .status,
        );
      }
      expect(statuses).toEqual([401, 401, 401, 429]);
    } finally {
      await t.dispose();
    }
  });

  it('sign-in, password reset and invitation acceptance have separate buckets', async () => {
    const t = await testApp({
      loginRateLimit: 2,
      loginAccountRateLimit: 2,
      resetRateLimit: 2,
      acceptRateLimit: 2,
    });
    try {
      const wrong = () =>
        request(t.app).post('/api/v1/auth/login').send({ email: DEMO.viewer, password: 'guess' });
      expect([(await wrong()).status, (await wrong()).status, (await wrong()).status]).toEqual([
        401, 401, 429,
      ]);
      // Sign-in is exhausted; the other doors are not.
      expect(
        (await request(t.app).post('/api/v1/auth/password-reset').send({ email: DEMO.viewer }))
          .status,
      ).toBe(202);
      const badToken = { token: 'pwt_not-a-real-token-at-all', password: 'a-long-password' };
      expect(
        (await request(t.app).post('/api/v1/auth/password-reset/confirm').send(badToken)).status,
      ).toBe(400);
      expect(
        (
          await request(t.app)
            .post('/api/v1/invitations/accept')
            .send({ ...badToken, name: 'X' })
        ).status,
      ).toBe(400);
      expect(
        (
          await request(t.app)
            .post('/api/v1/invitations/accept')
            .send({ ...badToken, name: 'X' })
        ).status,
      ).toBe(400);
      const limited = await request(t.app)
        .post('/api/v1/invitations/accept')
        .send({ ...badToken, name: 'X' });
      expect(limited.status).toBe(429);
      expect(limited.body.detail).toMatch(/invitation acceptances/);
    } finally {
      await t.dispose();
    }
  });

  it('limits failed sign-ins per account from any address (TRUST_PROXY names the client), and resets per address', async () => {
    const t = await testApp({
      trustProxy: 1,
      loginRateLimit: 100,
      loginAccountRateLimit: 3,
      resetAccountRateLimit: 2,
    });
    try {
      const from = (ip: string, email: string) =>
        request(t.app)
          .post('/api/v1/auth/login')
          .set('X-Forwarded-For', ip)
          .send({ email, password: 'guess' });
      const statuses: number[] = [];
      for (const ip of ['192.0.2.1', '192.0.2.2', '192.0.2.3', '192.0.2.4'])
        statuses.push((await from(ip, DEMO.admin)).status);
      expect(statuses).toEqual([401, 401, 401, 429]);
      const limited = await from('192.0.2.5', DEMO.admin);
      expect(limited.body.detail).toMatch(/failed sign-ins to this account/);
      // Another account from the same addresses is not affected.
      expect((await from('192.0.2.1', DEMO.engineer)).status).toBe(401);

      const reset = (email: string) =>
        request(t.app)
          .post('/api/v1/auth/password-reset')
          .set('X-Forwarded-For', '198.51.100.7')
          .send({ email });
      expect([
        (await reset(DEMO.viewer)).status,
        (await reset(DEMO.viewer)).status,
        (await reset(DEMO.viewer)).status,
      ]).toEqual([202, 202, 429]);
      expect((await reset(DEMO.engineer)).status).toBe(202);
    } finally {
      await t.dispose();
    }
  });

  it('without TRUST_PROXY (the default) X-Forwarded-For is ignored: rotating it does not escape the per-address limit', async () => {
    const t = await testApp({ loginRateLimit: 3, loginAccountRateLimit: 100 });
    // express-rate-limit says once in the log that a proxy seems to be in front without TRUST_PROXY.
    const warnings = vi.spyOn(console, 'error').mockImplementation(() => undefined);
    try {
      const statuses: number[] = [];
      for (const [n, email] of [DEMO.admin, DEMO.engineer, DEMO.engineer2, DEMO.viewer].entries()) {
        statuses.push(
          (
            await request(t.app)
              .post('/api/v1/auth/login')
              .set('X-Forwarded-For', `203.0.113.${n + 1}`)
              .send({ email, password: 'guess' })
          ).status,
        );
      }
      expect(statuses).toEqual([401, 401, 401, 429]);
      expect(String(warnings.mock.calls[0]?.[0])).toMatch(/trust proxy/);
    } finally {
      warnings.mockRestore();
      await t.dispose();
    }
  });

  it('TRUST_PROXY is off by default, takes hop counts and addresses, and refuses `true`', () => {
    expect(loadConfig({}).trustProxy).toBe(false);
    expect(loadConfig({ TRUST_PROXY: '1' }).trustProxy).toBe(1);
    expect(loadConfig({ TRUST_PROXY: 'loopback, 10.0.0.0/8' }).trustProxy).toBe(
      'loopback, 10.0.0.0/8',
    );
    expect(() => loadConfig({ TRUST_PROXY: 'true' })).toThrow(/TRUST_PROXY=true/);
  });
});

describe('malformed URLs', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await testApp({ logErrors: true });
  });
  afterAll(async () => t.dispose());

  it('answer 400 problem+json naming the path, and log nothing', async () => {
    const errors = vi.spyOn(console, 'error').mockImplementation(() => undefined);
    try {
      for (const path of ['/%', '/%E0%A4%A', '/assets/%', '/studies/%zz', '/api/%', '/api/v1/%']) {
        const res = await request(t.app).get(path);
        expect(res.status, path).toBe(400);
        expect(res.headers['content-type'], path).toMatch(/^application\/problem\+json/);
        expect(res.body.errors[0], path).toMatchObject({ path: 'path' });
        expect(res.headers['x-content-type-options'], path).toBe('nosniff');
      }
      expect(errors).not.toHaveBeenCalled();
    } finally {
      errors.mockRestore();
    }
  });
});
