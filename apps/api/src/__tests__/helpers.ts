import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { createApp, type AppConfig, type PulsewrightApp } from '../app.js';

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
  /** Closes the app and deletes the temporary database. */
  dispose(): Promise<void>;
}

/** A fresh app on a new temporary SQLite file, seeded with the demo (bcrypt cost 4 for speed). */
export async function testApp(overrides: Partial<AppConfig> = {}, dir?: string): Promise<TestApp> {
  const folder = dir ?? mkdtempSync(path.join(tmpdir(), 'pulsewright-api-'));
  const file = path.join(folder, 'test.sqlite');
  const app = await createApp({
    databaseUrl: `sqlite:${file}`,
    demoPassword: DEMO_PASSWORD,
    bcryptRounds: 4,
    logErrors: process.env.LOG_ERRORS === 'true',
    loginRateLimit: 1000,
    keyRateLimit: 1000,
    webDist: path.join(folder, 'no-web'),
    smtpUrl: '',
    ...overrides,
  });
  return {
    app,
    file,
    dir: folder,
    async dispose() {
      await app.close();
      rmSync(folder, { recursive: true, force: true });
    },
  };
}

export async function signIn(app: PulsewrightApp, email: string, password = DEMO_PASSWORD): Promise<string> {
  const res = await request(app).post('/api/v1/auth/login').send({ email, password });
  if (res.status !== 200) throw new Error(`sign-in of ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return res.body.token as string;
}

/** Session tokens of the four demo users. */
export async function demoTokens(app: PulsewrightApp): Promise<Record<keyof typeof DEMO, string>> {
  const entries = await Promise.all(
    (Object.keys(DEMO) as (keyof typeof DEMO)[]).map(async (k) => [k, await signIn(app, DEMO[k])] as const),
  );
  return Object.fromEntries(entries) as Record<keyof typeof DEMO, string>;
}
