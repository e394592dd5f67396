import { rmSync } from 'node:fs';
import path from 'node:path';
// In-process suites drive the service's own source through vitest's TypeScript transform, so
// they test the code as it is now, without a build of apps/api.
import { createApp, type ConfigOverrides, type PulsewrightApp } from '../../../apps/api/src/app.js';
import { DEMO_PASSWORD, tempDir } from '../../support/server.js';

export type { PulsewrightApp };

export interface InProcessApp {
  app: PulsewrightApp;
  file: string;
  dir: string;
  /** Closes the app and deletes its temporary database folder. */
  dispose(): Promise<void>;
}

/** createApp on a fresh temporary SQLite file, seeded with the demo, bcrypt cost 4. */
export async function inProcessApp(
  label: string,
  overrides: ConfigOverrides = {},
): Promise<InProcessApp> {
  const dir = tempDir(label);
  const file = path.join(dir, 'robustness.sqlite');
  const app = await createApp({
    databaseUrl: `sqlite:${file}`,
    demoPassword: DEMO_PASSWORD,
    bcryptRounds: 4,
    logErrors: false,
    loginRateLimit: 1_000_000,
    loginAccountRateLimit: 1_000_000,
    resetRateLimit: 1_000_000,
    resetAccountRateLimit: 1_000_000,
    acceptRateLimit: 1_000_000,
    keyRateLimit: 1_000_000,
    webDist: path.join(dir, 'no-web'),
    smtpUrl: '',
    ...overrides,
  });
  return {
    app,
    file,
    dir,
    async dispose() {
      await app.close();
      rmSync(dir, { recursive: true, force: true });
    },
  };
}
