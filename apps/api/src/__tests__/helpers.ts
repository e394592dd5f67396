import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { createApp, type ConfigOverrides, type PulsewrightApp } from '../app.js';
import { readMailDrop, type DeliveredMail } from '../services/mail.js';

export const DEMO_PASSWORD = 'test-demo-password';

export const DEMO = {
  admin: 'admin@kestrel.example',
  engineer: 'engineer@kestrel.example',
  engineer2: 'engineer2@kestrel.example',
  viewer: 'viewer@kestrel.example',
} as const;

export interface TestApp {
  app: PulsewrightApp;
  file: string;
  dir: string;
  /** The local mail drop: messages as delivered, one-time links live (the outbox masks them). */
  mailDir: string;
  /** Closes the app and deletes the temporary database. */
  dispose(): Promise<void>;
}

/** A fresh app on a new temporary SQLite file, seeded with the demo (bcrypt cost 4 for speed). */
export async function testApp(overrides: ConfigOverrides = {}, dir?: string): Promise<TestApp> {
  const folder = dir ?? mkdtempSync(path.join(tmpdir(), 'pulsewright-api-'));
  const file = path.join(folder, 'test.sqlite');
  const app = await createApp({
    databaseUrl: `sqlite:${file}`,
    demoPassword: DEMO_PASSWORD,
    bcryptRounds: 4,
    logErrors: process.env.LOG_ERRORS === 'true',
    loginRateLimit: 1000,
    loginAccountRateLimit: 1000,
    resetRateLimit: 1000,
    resetAccountRateLimit: 1000,
    acceptRateLimit: 1000,
    keyRateLimit: 1000,
    webDist: path.join(folder, 'no-web'),
    smtpUrl: '',
    mailDir: path.join(folder, 'mail'),
    ...overrides,
  });
  return {
    app,
    file,
    dir: folder,
    mailDir: path.join(folder, 'mail'),
    async dispose() {
      await app.close();
      rmSync(folder, { recursive: true, force: true });
    },
  };
}

export async function signIn(
  app: PulsewrightApp,
  email: string,
  password = DEMO_PASSWORD,
): Promise<string> {
  const res = await request(app).post('/api/v1/auth/login').send({ email, password });
  if (res.status !== 200)
    throw new Error(`sign-in of ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body.token as string;
}

/** Session tokens of the four demo users. */
export async function demoTokens(app: PulsewrightApp): Promise<Record<keyof typeof DEMO, string>> {
  const entries = await Promise.all(
    (Object.keys(DEMO) as (keyof typeof DEMO)[]).map(
      async (k) => [k, await signIn(app, DEMO[k])] as const,
    ),
  );
  return Object.fromEntries(entries) as Record<keyof typeof DEMO, string>;
}

/** The newest message delivered to `to` (as the recipient's mail client would show it). */
export function deliveredTo(t: TestApp, to: string): DeliveredMail {
  const mail = readMailDrop(t.mailDir)
    .filter((m) => m.to === to)
    .at(-1);
  if (!mail) throw new Error(`no mail was delivered to ${to}`);
  return mail;
}

/** The one-time token (`pwt_…`) in the newest message delivered to `to`. */
export function deliveredToken(t: TestApp, to: string): string {
  const token = /pwt_[A-Za-z0-9_-]+/.exec(deliveredTo(t, to).text)?.[0];
  if (!token) throw new Error(`the newest mail to ${to} holds no one-time token`);
  return token;
}
