import { existsSync, mkdirSync, rmSync } from 'node:fs';
import path from 'node:path';
import { chromium, type Browser, type Page } from 'playwright-core';
import { DEMO_PASSWORD, repoRoot, startChildServer, tempDir } from '../support/server.js';

export const screenshotDir = path.join(repoRoot, 'tests', 'e2e', 'screenshots');

export interface Service {
  baseUrl: string;
  stop(): Promise<void>;
  log(): string;
}

/**
 * Starts the built API (apps/api/dist) on a free loopback port with a fresh temporary SQLite
 * database seeded with the demo, serving the built dashboard (apps/web/dist). Builds nothing.
 */
export async function startService(): Promise<Service> {
  const webDist = path.join(repoRoot, 'apps', 'web', 'dist');
  if (!existsSync(path.join(webDist, 'index.html'))) {
    throw new Error(
      'apps/web/dist is missing: run `npm run build` (turbo builds the dashboard) before the browser tests.',
    );
  }
  const dataDir = tempDir('e2e');
  const server = await startChildServer({
    databaseUrl: `sqlite:${path.join(dataDir, 'e2e.sqlite')}`,
    env: { WEB_DIST: webDist },
  });
  return {
    baseUrl: server.baseUrl,
    log: server.output,
    async stop() {
      await server.stop();
      rmSync(dataDir, { recursive: true, force: true });
    },
  };
}

export async function launchBrowser(): Promise<Browser> {
  const executablePath = process.env.CHROMIUM_PATH || '/usr/bin/chromium';
  if (!existsSync(executablePath))
    throw new Error(
      `No chromium at ${executablePath}: apt-get install -y chromium (.ci/run does).`,
    );
  return chromium.launch({
    executablePath,
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
      '--no-first-run',
      '--disable-quic',
    ],
  });
}

export async function screenshot(page: Page, name: string): Promise<void> {
  mkdirSync(screenshotDir, { recursive: true });
  await page.screenshot({ path: path.join(screenshotDir, `${name}.png`), fullPage: true });
}

/** Signs in through the form and waits for the studies page and the role badge. */
export async function signIn(page: Page, baseUrl: string, email: string): Promise<void> {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByTestId('role').waitFor({ timeout: 15_000 });
}

export function assert(condition: unknown, message: string): asserts condition {
  if (!condition) throw new Error(`Assertion failed: ${message}`);
}
