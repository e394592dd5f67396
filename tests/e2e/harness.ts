import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium, type Browser, type Page } from 'playwright-core';

export const repoRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
export const screenshotDir = path.join(repoRoot, 'tests', 'e2e', 'screenshots');
export const DEMO_PASSWORD = 'pulsewright-demo';

/** A free loopback port, asked of the OS. */
async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.unref();
    server.on('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const address = server.address();
      server.close(() => (typeof address === 'object' && address ? resolve(address.port) : reject(new Error('no port'))));
    });
  });
}

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
  const webIndex = path.join(repoRoot, 'apps', 'web', 'dist', 'index.html');
  if (!existsSync(webIndex)) throw new Error('apps/web/dist is missing: run `npm run build` (turbo builds the dashboard) before the browser tests.');
  const apiEntry = path.join(repoRoot, 'apps', 'api', 'dist', 'index.js');
  if (!existsSync(apiEntry)) throw new Error('apps/api/dist/index.js is missing: run `npm run build` before the browser tests.');
  const port = await freePort();
  const dataDir = mkdtempSync(path.join(tmpdir(), 'pulsewright-e2e-'));
  let output = '';
  const child: ChildProcess = spawn(process.execPath, [apiEntry], {
    cwd: repoRoot,
    env: {
      ...process.env,
      PORT: String(port),
      HOST: '127.0.0.1',
      DATABASE_URL: `sqlite:${path.join(dataDir, 'e2e.sqlite')}`,
      DEMO_PASSWORD,
      PUBLIC_URL: `http://127.0.0.1:${port}`,
      BCRYPT_ROUNDS: '4',
      LOGIN_RATE_LIMIT: '1000',
      KEY_RATE_LIMIT: '1000',
      SMTP_URL: '',
      SCARF_ANALYTICS: 'false',
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  child.stdout?.on('data', (chunk: Buffer) => (output += chunk.toString()));
  child.stderr?.on('data', (chunk: Buffer) => (output += chunk.toString()));
  const baseUrl = `http://127.0.0.1:${port}`;
  const deadline = Date.now() + 30_000;
  for (;;) {
    if (child.exitCode !== null) throw new Error(`The API exited with ${child.exitCode}:\n${output}`);
    try {
      const response = await fetch(`${baseUrl}/api/health`);
      if (response.ok) break;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline) {
      child.kill('SIGTERM');
      throw new Error(`The API did not answer /api/health within 30 s:\n${output}`);
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  return {
    baseUrl,
    log: () => output,
    async stop() {
      if (child.exitCode === null) {
        const exited = new Promise((r) => child.once('exit', r));
        child.kill('SIGTERM');
        await Promise.race([exited, new Promise((r) => setTimeout(r, 5000))]);
        if (child.exitCode === null) child.kill('SIGKILL');
      }
      rmSync(dataDir, { recursive: true, force: true });
    },
  };
}

export async function launchBrowser(): Promise<Browser> {
  const executablePath = process.env.CHROMIUM_PATH || '/usr/bin/chromium';
  if (!existsSync(executablePath)) throw new Error(`No chromium at ${executablePath}: apt-get install -y chromium (.ci/run does).`);
  return chromium.launch({
    executablePath,
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run', '--disable-quic'],
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
