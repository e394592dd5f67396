import { spawn } from 'node:child_process';
import { rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import {
  call,
  DEMO,
  DEMO_PASSWORD,
  freePort,
  repoRoot,
  signInOver,
  tempDir,
} from '../support/server.js';
import { waitFor } from './support/waitFor.js';

/**
 * Supervision: `node scripts/start.mjs` (what `npm start` runs after installing), without its
 * build step, on a built tree. The service child is killed with SIGKILL while a job runs; the
 * supervisor must start it again, the new process must answer health and sign-in and mark the
 * interrupted job failed, and SIGTERM to the supervisor must stop both.
 */

const SHE_LONG = {
  kind: 'bipolar',
  vdc: 400,
  count: 31,
  eliminate: Array.from({ length: 30 }, (_, i) => 3 + 2 * i),
  fundamental: { from: 50, to: 350, points: 400 },
};

const dirs: string[] = [];
afterAll(() => dirs.forEach((dir) => rmSync(dir, { recursive: true, force: true })));

async function healthy(baseUrl: string): Promise<true | undefined> {
  try {
    return (await fetch(`${baseUrl}/api/health`)).ok ? true : undefined;
  } catch {
    return undefined;
  }
}

const alive = (pid: number): boolean => {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
};

function supervise(dir: string, port: number, extra: Record<string, string> = {}) {
  const child = spawn(process.execPath, [path.join(repoRoot, 'scripts', 'start.mjs')], {
    cwd: repoRoot,
    env: {
      PATH: process.env.PATH ?? '',
      PULSEWRIGHT_NO_BUILD: '1',
      NODE_ENV: 'production',
      PORT: String(port),
      HOST: '127.0.0.1',
      DATABASE_URL: `sqlite:${path.join(dir, 'supervised.sqlite')}`,
      DEMO_PASSWORD,
      BCRYPT_ROUNDS: '4',
      MAIL_DIR: path.join(dir, 'mail'),
      WEB_DIST: path.join(tmpdir(), 'pulsewright-no-web'),
      SCARF_ANALYTICS: 'false',
      ...extra,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  child.stdout.on('data', (chunk: Buffer) => (output += chunk.toString()));
  child.stderr.on('data', (chunk: Buffer) => (output += chunk.toString()));
  const exited = new Promise<number | string | null>((resolve) =>
    child.once('exit', (code, signal) => resolve(code ?? signal)),
  );
  return { child, exited, output: () => output };
}

describe('supervision of npm start', () => {
  it('stops with exit code 1 on a crash loop (a setting the service refuses at start), after five quick exits', async () => {
    const dir = tempDir('supervisor-loop');
    dirs.push(dir);
    const { child, exited, output } = supervise(dir, await freePort(), {
      TRUST_PROXY: 'true',
      RESTART_DELAY_MS: '50',
    });
    try {
      expect(await exited).toBe(1);
      expect(output().match(/service started \(pid \d+\)/g)).toHaveLength(5);
      expect(output()).toContain('restarting it in 0.05 s');
      expect(output()).toContain('restarting it in 0.4 s');
      expect(output()).toContain('5 times in a row within 10 s of starting; not restarting it');
      expect(output()).toContain('TRUST_PROXY=true would trust any X-Forwarded-For');
    } finally {
      if (child.exitCode === null && child.signalCode === null) child.kill('SIGKILL');
    }
  });

  it('restarts the service after SIGKILL, marks the interrupted job failed, and stops on SIGTERM', async () => {
    const dir = tempDir('supervisor');
    dirs.push(dir);
    const port = await freePort();
    const baseUrl = `http://127.0.0.1:${port}`;
    const { child: supervisor, exited, output: log } = supervise(dir, port);
    const pids = () =>
      [...log().matchAll(/service started \(pid (\d+)\)/g)].map((m) => Number(m[1]));
    try {
      await waitFor('the first start', () => healthy(baseUrl));
      const [first] = pids();
      expect(first).toBeGreaterThan(0);

      const token = await signInOver(baseUrl, DEMO.viewer);
      const job = await call(baseUrl, 'POST', '/api/v1/jobs/she-sweeps', token, SHE_LONG);
      expect(job.status, JSON.stringify(job.body)).toBe(202);
      const jobId = (job.body as { id: string }).id;
      expect(['running', 'queued']).toContain((job.body as { status: string }).status);

      process.kill(first!, 'SIGKILL');
      const second = await waitFor('a second start', () => pids()[1]);
      expect(second).not.toBe(first);
      expect(alive(first!)).toBe(false);
      await waitFor('the restarted service', () => healthy(baseUrl));
      expect(log()).toContain('the service exited (signal SIGKILL)');
      expect(log()).toMatch(/restarting it in 1 s/);

      // Sessions live in the database, so the old token still works; a new sign-in does too.
      const again = await signInOver(baseUrl, DEMO.viewer);
      const after = await call(baseUrl, 'GET', `/api/v1/jobs/${jobId}`, again);
      expect(after.status).toBe(200);
      expect(after.body).toMatchObject({
        status: 'failed',
        error: 'The service stopped while this job was running; start it again.',
      });
      expect((await call(baseUrl, 'GET', '/api/v1/me', token)).status).toBe(200);

      supervisor.kill('SIGTERM');
      expect(await exited).toBe(0);
      expect(alive(second)).toBe(false);
      expect(await healthy(baseUrl)).toBeUndefined();
    } finally {
      if (supervisor.exitCode === null && supervisor.signalCode === null)
        supervisor.kill('SIGKILL');
      for (const pid of pids()) if (alive(pid)) process.kill(pid, 'SIGKILL');
    }
  });
});
