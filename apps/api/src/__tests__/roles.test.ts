import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { listOperations, loadOpenApiDocument, type OperationInfo } from '../openapi.js';
import { FIXTURES, makeIds, ROLE_ORDER, send, type Fixture, type Ids } from './fixtures.js';
import { DEMO, DEMO_PASSWORD, deliveredToken, signIn, testApp, type TestApp } from './helpers.js';

// Every operation of the OpenAPI document, called by every role: the table comes from the
// document itself, so a new route without a fixture fails the first test.
const operations = listOperations(loadOpenApiDocument());
const roles = ['viewer', 'engineer', 'admin'] as const;

describe('every route against every role', () => {
  let t: TestApp;
  let tokens: Record<(typeof roles)[number], string>;
  let ids: Ids;
  let counter = 0;

  beforeAll(async () => {
    t = await testApp();
    tokens = {
      viewer: await signIn(t.app, DEMO.viewer),
      engineer: await signIn(t.app, DEMO.engineer),
      admin: await signIn(t.app, DEMO.admin),
    };
    ids = await makeIds(t.app, tokens.engineer);
  });
  afterAll(async () => t.dispose());

  /** Fresh things a destructive operation may consume: a member with a key, an invitation, a reset token. */
  const fresh = async () => {
    counter += 1;
    const { models, auth, team } = t.app.services;
    const teamRow = await models.Team.findOne();
    const user = await models.User.create({
      email: `member${counter}@kestrel.example`,
      name: `Member ${counter}`,
      passwordHash: await auth.hashPassword(DEMO_PASSWORD),
    });
    await models.Membership.create({ teamId: teamRow!.id, userId: user.id, role: 'viewer' });
    const engineerKey = await request(t.app)
      .post('/api/v1/api-keys')
      .set('Authorization', `Bearer ${tokens.engineer}`)
      .send({ name: `fresh ${counter}`, role: 'viewer' });
    const invitation = await request(t.app)
      .post('/api/v1/invitations')
      .set('Authorization', `Bearer ${tokens.admin}`)
      .send({ email: `invitee${counter}@kestrel.example`, role: 'viewer' });
    await team.requestPasswordReset(user.email);
    // The one-time links as delivered (the outbox masks them).
    return {
      userId: user.id,
      keyId: engineerKey.body.id as string,
      invitationId: invitation.body.id as string,
      invitationToken: deliveredToken(t, `invitee${counter}@kestrel.example`),
      resetToken: deliveredToken(t, user.email),
    };
  };

  it('has a fixture for every operation in the document (and none left over)', () => {
    expect(operations.length).toBeGreaterThan(30);
    expect(operations.map((o) => o.operationId).sort()).toEqual(Object.keys(FIXTURES).sort());
  });

  const rank = (role: string) => ROLE_ORDER.indexOf(role as (typeof ROLE_ORDER)[number]);

  for (const op of operations) {
    const label = `${op.method.toUpperCase()} ${op.path} (${op.role})`;
    const fixture = FIXTURES[op.operationId] as Fixture;
    if (op.role !== 'public') {
      it(`${label}: 401 problem+json without a token or with a bad one`, async () => {
        const spec = await fixture({ app: t.app, ids, tokens, fresh });
        for (const token of [undefined, 'pws_not-a-real-session', 'pwk_nope_nope']) {
          const res = await send(t.app, op.method, spec, token);
          expect(res.status, `${label} token ${token}`).toBe(401);
          expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
          expect(res.body).toMatchObject({
            status: 401,
            title: expect.any(String),
            detail: expect.any(String),
          });
        }
      });
    }
    for (const role of roles) {
      const allowed = rank(role) >= rank(op.role);
      it(`${label} as ${role}: ${allowed ? 'allowed' : '403'}`, async () => {
        const spec = await fixture({ app: t.app, ids, tokens, fresh });
        // Signing out ends the session it is sent with, so it gets a session of its own.
        const token = op.operationId === 'logout' ? await signIn(t.app, DEMO[role]) : tokens[role];
        const res = await send(t.app, op.method, spec, token);
        if (allowed) {
          expect(
            res.status,
            `${label} as ${role}: ${JSON.stringify(res.body)}`,
          ).toBeGreaterThanOrEqual(200);
          expect(res.status, `${label} as ${role}: ${JSON.stringify(res.body)}`).toBeLessThan(300);
        } else {
          expect(res.status, `${label} as ${role}: ${JSON.stringify(res.body)}`).toBe(403);
          expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
          expect(res.body.detail).toContain(`needs the ${op.role} role`);
        }
      });
    }
  }

  // The forms passport-http-bearer reads (its README and lib/strategy.js): the scheme's name in
  // any case, exactly one space-separated token, and a token in the body's access_token only
  // when there is no header. Anything else is a failed attempt, answered as our 401.
  it('reads the bearer token as passport-http-bearer does, and answers 401 for every other form', async () => {
    const spectrum = {
      modulation: { method: 'sine-triangle', scheme: 'bipolar', ma: 0.9, mf: 21, vdc: 400 },
    };
    const post = (authorization: string | undefined, body: object = spectrum) => {
      const call = request(t.app).post('/api/v1/spectra');
      return (authorization === undefined ? call : call.set('Authorization', authorization)).send(
        body,
      );
    };
    const key = tokens.viewer;
    expect((await post(`Bearer ${key}`)).status).toBe(200);
    expect((await post(`bearer ${key}`)).status).toBe(200);
    for (const refused of [
      'Bearer',
      `Bearer ${key} extra`,
      `Basic ${Buffer.from('engineer@kestrel.example:pulsewright-demo').toString('base64')}`,
      `Token ${key}`,
    ]) {
      const res = await post(refused);
      expect(res.status, refused).toBe(401);
      expect(res.headers['content-type']).toMatch(/^application\/problem\+json/);
    }
    // Two tokens at once (header and body) are refused even when both are the caller's own.
    const twice = await post(`Bearer ${key}`, { ...spectrum, access_token: key });
    expect(twice.status).toBe(401);
  });

  it('marks exactly the sign-in, reset, invitation-accept and health operations public', () => {
    const publicOps = operations
      .filter((o: OperationInfo) => o.role === 'public')
      .map((o) => o.operationId)
      .sort();
    expect(publicOps).toEqual([
      'acceptInvitation',
      'confirmPasswordReset',
      'getHealth',
      'login',
      'requestPasswordReset',
    ]);
  });
});
