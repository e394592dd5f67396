import { fork } from 'node:child_process';
import { rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  call,
  DEMO,
  signInOver,
  startChildServer,
  tempDir,
  type ChildServer,
} from '../support/server.js';

/**
 * Stall: the built service (node apps/api/dist/index.js) as a child process, with four of the
 * largest jobs the schema and the job budget allow (SHE sweeps of 31 angles over 400 points,
 * one from each of four demo users, as the per-user quota allows) and four loops of heavy
 * compute requests (a three-phase design report at mf 999 with a filter, 4000 points; spectra at
 * mf 999 to order 5000). While they run, GET /api/health is timed one request after another and
 * a sign-in every 100 ms; both must keep a 90th percentile under 100 ms (issue 11: with jobs
 * chunked on the request thread, health took more than 5 s).
 *
 * STALL_SECONDS (default 8) is how long the latency is sampled.
 */

const SECONDS = Number(process.env.STALL_SECONDS ?? 8);

const SHE_LARGEST = {
  kind: 'bipolar',
  vdc: 400,
  count: 31,
  eliminate: Array.from({ length: 30 }, (_, i) => 3 + 2 * i),
  fundamental: { from: 50, to: 350, points: 400 },
};

const HEAVY_REPORT = {
  design: {
    vdc: 600,
    fundamentalFrequency: 50,
    carrierFrequency: 50 * 999,
    modulation: { method: 'three-phase', ma: 0.9, zeroSequence: 'none' },
    filter: { l: 1e-3, c: 10e-6 },
    load: { r: 10, l: 1e-3 },
  },
  points: 4000,
};

const HEAVY_SPECTRUM = {
  modulation: { method: 'three-phase', ma: 0.8, mf: 999, vdc: 400 },
  maxOrder: 5000,
};

const percentile = (values: number[], p: number): number => {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.floor(p * sorted.length))] ?? Number.NaN;
};

async function timed(run: () => Promise<Response>): Promise<{ ms: number; status: number }> {
  const start = performance.now();
  const response = await run();
  await response.arrayBuffer();
  return { ms: performance.now() - start, status: response.status };
}

/**
 * Loops of POST requests in a child process, each loop back to back; `stop()` ends them and
 * resolves with the count of answers by status.
 */
function heavyLoad(baseUrl: string, loops: { token: string; path: string; body: unknown }[]) {
  const script = `
    const { baseUrl, loops } = JSON.parse(process.env.STALL_LOAD);
    const counts = {};
    let stop = false;
    process.on('message', () => (stop = true));
    await Promise.all(loops.map(async ({ token, path, body }) => {
      const text = JSON.stringify(body);
      while (!stop) {
        try {
          const response = await fetch(baseUrl + path, {
            method: 'POST',
            headers: { authorization: 'Bearer ' + token, 'content-type': 'application/json' },
            body: text,
          });
          await response.arrayBuffer();
          counts[response.status] = (counts[response.status] ?? 0) + 1;
        } catch {
          counts.error = (counts.error ?? 0) + 1;
        }
      }
    }));
    process.send(counts, () => process.exit(0));
  `;
  const file = path.join(dir, 'heavy-load.mjs');
  writeFileSync(file, script);
  const child = fork(file, [], {
    execArgv: [],
    env: { ...process.env, STALL_LOAD: JSON.stringify({ baseUrl, loops }) },
    stdio: ['ignore', 'inherit', 'inherit', 'ipc'],
  });
  const counts = new Promise<Record<string, number>>((resolve) =>
    child.once('message', (m) => resolve(m as Record<string, number>)),
  );
  return {
    async stop(): Promise<Record<string, number>> {
      child.send('stop');
      return counts;
    },
  };
}

let dir: string;
let server: ChildServer;

beforeAll(async () => {
  dir = tempDir('stall');
  server = await startChildServer({ databaseUrl: `sqlite:${path.join(dir, 'stall.sqlite')}` });
});

afterAll(async () => {
  await server?.kill();
  rmSync(dir, { recursive: true, force: true });
});

describe('no request stalls the service', () => {
  it(`health and sign-in keep a p90 under 100 ms while four of the largest jobs and heavy compute requests run (${SECONDS} s)`, async () => {
    const { baseUrl } = server;
    const users = [DEMO.admin, DEMO.engineer, DEMO.engineer2, DEMO.viewer];
    const tokens = await Promise.all(users.map((email) => signInOver(baseUrl, email)));

    // Four of the largest jobs, one per user.
    const jobs = await Promise.all(
      tokens.map((token) => call(baseUrl, 'POST', '/api/v1/jobs/she-sweeps', token, SHE_LARGEST)),
    );
    for (const job of jobs) expect(job.status, JSON.stringify(job.body)).toBe(202);
    const jobIds = jobs.map((job) => (job.body as { id: string }).id);

    // Heavy compute requests, back to back, from a separate process (so reading their answers
    // does not delay this process's timing of health and sign-in), until the sampling ends.
    const load = heavyLoad(baseUrl, [
      { token: tokens[0]!, path: '/api/v1/designs/report', body: HEAVY_REPORT },
      { token: tokens[1]!, path: '/api/v1/designs/report', body: HEAVY_REPORT },
      { token: tokens[2]!, path: '/api/v1/spectra', body: HEAVY_SPECTRUM },
      { token: tokens[3]!, path: '/api/v1/spectra', body: HEAVY_SPECTRUM },
    ]);

    const health: number[] = [];
    const signIn: number[] = [];
    const until = Date.now() + SECONDS * 1000;
    const healthLoop = (async () => {
      while (Date.now() < until) {
        const { ms, status } = await timed(() => fetch(`${baseUrl}/api/health`));
        expect(status).toBe(200);
        health.push(ms);
        await new Promise((r) => setTimeout(r, 20));
      }
    })();
    const signInLoop = (async () => {
      while (Date.now() < until) {
        const { ms, status } = await timed(() =>
          fetch(`${baseUrl}/api/v1/auth/login`, {
            method: 'POST',
            headers: { 'content-type': 'application/json' },
            body: JSON.stringify({ email: DEMO.viewer, password: 'pulsewright-demo' }),
          }),
        );
        expect(status).toBe(200);
        signIn.push(ms);
        await new Promise((r) => setTimeout(r, 100));
      }
    })();
    await Promise.all([healthLoop, signInLoop]);
    const heavy = await load.stop();

    const states = await Promise.all(
      jobIds.map(
        async (id, i) =>
          (await call(baseUrl, 'GET', `/api/v1/jobs/${id}`, tokens[i])).body as {
            status: string;
            progress: number;
          },
      ),
    );
    const figures = {
      healthSamples: health.length,
      healthP50: percentile(health, 0.5),
      healthP90: percentile(health, 0.9),
      healthMax: Math.max(...health),
      signInSamples: signIn.length,
      signInP90: percentile(signIn, 0.9),
      heavyAnswered: Object.values(heavy).reduce((sum, n) => sum + n, 0),
      heavyStatuses: heavy,
      jobs: states.map((s) => `${s.status} ${(100 * s.progress).toFixed(0)} %`),
    };
    console.log('stall figures', JSON.stringify(figures));

    expect(figures.healthP90).toBeLessThan(100);
    expect(figures.signInP90).toBeLessThan(100);
    // The load was real: the jobs moved on and heavy requests were answered, each 200 or a 503
    // of the pool's own limits (never a 5xx of another kind).
    expect(states.some((s) => s.progress > 1 / 40)).toBe(true);
    expect(heavy['200'] ?? 0).toBeGreaterThan(0);
    for (const status of Object.keys(heavy)) expect(['200', '503']).toContain(status);
  });
});
