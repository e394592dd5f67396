import autocannon from 'autocannon';
import { rmSync } from 'node:fs';
import path from 'node:path';
import { afterAll, afterEach, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import {
  call,
  DEMO,
  signInOver,
  startChildServer,
  tempDir,
  type ChildServer,
} from '../support/server.js';

/**
 * Load: autocannon with 50 connections against the built service (node apps/api/dist/index.js)
 * listening on 127.0.0.1 and a free port, on a compute route and on study writes. Each run is
 * bounded by LOAD_SECONDS (3 s in `npm test`, 30 s in `npm run test:load`). Every answer must
 * be a 2xx, and every write the service acknowledged must be readable afterwards by its id.
 */

const SECONDS = Number(process.env.LOAD_SECONDS ?? 3);
const CONNECTIONS = Number(process.env.LOAD_CONNECTIONS ?? 50);

interface Row {
  scenario: string;
  requests: number;
  rps: number;
  p50: number;
  p99: number;
  errors: number;
  timeouts: number;
  non2xx: number;
  acknowledged?: number;
  verified?: number;
  /** Milliseconds until GET /api/health answered once the run had stopped (the backlog left). */
  recovery: number;
}

const rows: Row[] = [];
let dir: string;
let server: ChildServer;
let token: string;
let projectId: string;

beforeAll(() => {
  dir = tempDir('load');
});

// Each scenario gets its own service and database, so a backlog left by one cannot slow the next.
let serial = 0;
beforeEach(async () => {
  server = await startChildServer({
    databaseUrl: `sqlite:${path.join(dir, `load-${++serial}.sqlite`)}`,
  });
  token = await signInOver(server.baseUrl, DEMO.admin);
  const project = await call(server.baseUrl, 'POST', '/api/v1/projects', token, {
    name: 'Load run',
    description: 'Written by tests/robustness/load.test.ts',
  });
  expect(project.status).toBe(201);
  projectId = (project.body as { id: string }).id;
});

afterEach(async () => {
  // SIGKILL: a service still working off a backlog would make SIGTERM wait for it.
  await server?.kill();
});

afterAll(() => {
  if (dir) rmSync(dir, { recursive: true, force: true });
  if (rows.length) {
    const table = [
      `load: ${CONNECTIONS} connections, ${SECONDS} s per scenario, 127.0.0.1, built service (apps/api/dist), SQLite WAL`,
      '',
      '| scenario | requests | requests/s | p50 (ms) | p99 (ms) | errors | timeouts | non-2xx | writes acknowledged | read back | health after (ms) |',
      '|---|---|---|---|---|---|---|---|---|---|---|',
      ...rows.map(
        (r) =>
          `| ${r.scenario} | ${r.requests} | ${r.rps.toFixed(0)} | ${r.p50} | ${r.p99} | ${r.errors} | ${r.timeouts} | ${r.non2xx} | ${r.acknowledged ?? '–'} | ${r.verified ?? '–'} | ${r.recovery >= RECOVERY_CAP_MS ? `> ${RECOVERY_CAP_MS}` : r.recovery} |`,
      ),
    ].join('\n');
    console.log(table);
  }
});

const headers = (): Record<string, string> => ({
  authorization: `Bearer ${token}`,
  'content-type': 'application/json',
});

function run(options: autocannon.Options): Promise<autocannon.Result> {
  return new Promise((resolve, reject) => {
    // timeout 10 s (autocannon's default): an answer slower than that counts as a timeout.
    autocannon(
      { connections: CONNECTIONS, duration: SECONDS, timeout: 10, ...options },
      (error, result) =>
        error ? reject(new Error('autocannon failed', { cause: error })) : resolve(result),
    );
  });
}

/** Longest wait for the health check after a run; a service that needs longer is still working off queued requests. */
const RECOVERY_CAP_MS = 10_000;
/** What "responsive again" means here: the health check answers within 2 s of the load stopping (common practice for an interactive service, no single source). */
const RECOVERY_LIMIT_MS = 2_000;

/** Milliseconds until GET /api/health answers 200, capped at RECOVERY_CAP_MS. */
async function recoveryTime(): Promise<number> {
  const started = Date.now();
  try {
    const response = await fetch(`${server.baseUrl}/api/health`, {
      signal: AbortSignal.timeout(RECOVERY_CAP_MS),
    });
    return response.ok ? Date.now() - started : RECOVERY_CAP_MS;
  } catch {
    return RECOVERY_CAP_MS;
  }
}

function record(
  scenario: string,
  result: autocannon.Result,
  extra: Partial<Row> & { recovery: number },
): Row {
  const row: Row = {
    scenario,
    requests: result.requests.total,
    rps: result.requests.average,
    p50: result.latency.p50,
    p99: result.latency.p99,
    errors: result.errors,
    timeouts: result.timeouts,
    non2xx: result.non2xx,
    ...extra,
  };
  rows.push(row);
  return row;
}

/** The load was held: no errors, timeouts or non-2xx, and health answered soon after the run. */
function expectLoadHeld(row: Row): void {
  expect
    .soft({ errors: row.errors, timeouts: row.timeouts, non2xx: row.non2xx })
    .toEqual({ errors: 0, timeouts: 0, non2xx: 0 });
  expect
    .soft(row.recovery, 'ms until /api/health answered after the run')
    .toBeLessThanOrEqual(RECOVERY_LIMIT_MS);
}

/** Reads every id back, a few at a time, and returns those that are missing or wrong. */
async function readBack<T>(items: T[], check: (item: T) => Promise<boolean>): Promise<T[]> {
  const missing: T[] = [];
  for (let i = 0; i < items.length; i += 25) {
    const batch = items.slice(i, i + 25);
    const results = await Promise.all(batch.map(check));
    results.forEach((ok, k) => {
      if (!ok) missing.push(batch[k] as T);
    });
  }
  return missing;
}

const MODULATION = { method: 'sine-triangle', scheme: 'unipolar', ma: 0.86, mf: 41, vdc: 375 };
/** The same bridge as a stored study's design (the design supplies vdc and the carrier frequency). */
const DESIGN = {
  vdc: 375,
  fundamentalFrequency: 50,
  carrierFrequency: 41 * 50,
  modulation: { method: 'sine-triangle', scheme: 'unipolar', ma: 0.86 },
};

describe(`load: ${CONNECTIONS} connections for ${SECONDS} s each`, () => {
  it(
    'POST /api/v1/spectra answers every request with 200',
    async () => {
      const result = await run({
        url: `${server.baseUrl}/api/v1/spectra`,
        method: 'POST',
        headers: headers(),
        body: JSON.stringify({ modulation: MODULATION, maxOrder: 200 }),
      });
      const row = record('POST /api/v1/spectra', result, { recovery: await recoveryTime() });
      expect(row.requests).toBeGreaterThan(0);
      expectLoadHeld(row);
    },
    SECONDS * 1000 + 30_000,
  );

  it(
    'POST /api/v1/studies: every answer 201, every acknowledged study readable by its id',
    async () => {
      let counter = 0;
      const acknowledged: { id: string; name: string }[] = [];
      const result = await run({
        url: server.baseUrl,
        headers: headers(),
        requests: [
          {
            method: 'POST',
            path: '/api/v1/studies',
            setupRequest: (request) => {
              const name = `load study ${++counter}`;
              return {
                ...request,
                body: JSON.stringify({
                  projectId,
                  name,
                  design: {
                    ...DESIGN,
                    modulation: { ...DESIGN.modulation, ma: 0.5 + (counter % 40) / 100 },
                  },
                  note: name,
                }),
              };
            },
            onResponse: (status, body) => {
              if (status === 201) {
                const study = JSON.parse(body) as { id: string; name: string };
                acknowledged.push({ id: study.id, name: study.name });
              }
            },
          },
        ],
      });
      const recovery = await recoveryTime();
      // Reading back behind a backlog would only measure the backlog; the recovery check reports it.
      const missing =
        recovery < RECOVERY_CAP_MS
          ? await readBack(acknowledged, async ({ id, name }) => {
              const res = await call(server.baseUrl, 'GET', `/api/v1/studies/${id}`, token);
              return res.status === 200 && (res.body as { name: string }).name === name;
            })
          : undefined;
      const row = record('POST /api/v1/studies', result, {
        acknowledged: acknowledged.length,
        ...(missing ? { verified: acknowledged.length - missing.length } : {}),
        recovery,
      });
      expect(acknowledged.length).toBeGreaterThan(0);
      expectLoadHeld(row);
      expect(missing, 'acknowledged studies missing on read-back').toEqual([]);
    },
    SECONDS * 1000 + 60_000,
  );

  it(
    'PUT /api/v1/studies/{id}: one study per connection, every acknowledged revision in its history',
    async () => {
      // Each connection edits its own study and sends back the revision it was answered, so the
      // optimistic-concurrency check (409 on a stale baseRevision) is never the cause of a refusal.
      const pool: string[] = [];
      for (let i = 0; i < CONNECTIONS; i++) {
        const res = await call(server.baseUrl, 'POST', '/api/v1/studies', token, {
          projectId,
          name: `edited under load ${i}`,
          design: DESIGN,
        });
        expect(res.status).toBe(201);
        pool.push((res.body as { id: string }).id);
      }
      // autocannon renews a connection's context after every answer, so the studies wait in a
      // queue: a request takes one, its answer puts it back with the revision it was given.
      const free = pool.map((id) => ({ id, revision: 1 }));
      const acknowledged: { id: string; revision: number; note: string }[] = [];
      let edits = 0;
      type Context = { study?: { id: string; revision: number } };
      const result = await run({
        url: server.baseUrl,
        headers: headers(),
        requests: [
          {
            method: 'PUT',
            setupRequest: (request, context: Context) => {
              const study = free.shift() ?? { id: pool[0] as string, revision: 1 };
              context.study = study;
              const note = `edit ${++edits} on revision ${study.revision}`;
              return {
                ...request,
                path: `/api/v1/studies/${study.id}`,
                body: JSON.stringify({
                  baseRevision: study.revision,
                  name: 'edited under load',
                  design: {
                    ...DESIGN,
                    modulation: { ...DESIGN.modulation, ma: 0.5 + (edits % 40) / 100 },
                  },
                  note,
                }),
              };
            },
            onResponse: (status, body, context: Context) => {
              const study = context.study;
              if (!study) return;
              if (status === 200) {
                const saved = JSON.parse(body) as { id: string; revision: number; note: string };
                acknowledged.push({ id: saved.id, revision: saved.revision, note: saved.note });
                study.revision = saved.revision;
              }
              free.push(study);
            },
          },
        ],
      });
      const byStudy = new Map<string, { revision: number; note: string }[]>();
      for (const a of acknowledged) byStudy.set(a.id, [...(byStudy.get(a.id) ?? []), a]);
      const recovery = await recoveryTime();
      const missing =
        recovery < RECOVERY_CAP_MS
          ? await readBack([...byStudy.entries()], async ([id, writes]) => {
              const res = await call(
                server.baseUrl,
                'GET',
                `/api/v1/studies/${id}/revisions`,
                token,
              );
              if (res.status !== 200) return false;
              const history = new Map(
                (res.body as { revision: number; note: string }[]).map((r) => [r.revision, r.note]),
              );
              return writes.every((w) => history.get(w.revision) === w.note);
            })
          : undefined;
      const lost = missing?.reduce((n, [, w]) => n + w.length, 0);
      const row = record('PUT /api/v1/studies/{id}', result, {
        acknowledged: acknowledged.length,
        ...(lost !== undefined ? { verified: acknowledged.length - lost } : {}),
        recovery,
      });
      expect(acknowledged.length).toBeGreaterThan(0);
      expectLoadHeld(row);
      expect(
        missing?.map(([id]) => id),
        'studies whose acknowledged revisions are missing',
      ).toEqual([]);
    },
    SECONDS * 1000 + 90_000,
  );
});
