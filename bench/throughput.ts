/**
 * Benchmark (not a test), issue 11's throughput item: in one run, a bare `node:http` server doing
 * the same library call and serialisation as `POST /api/v1/spectra` (bipolar sine-triangle,
 * mf 21, maxOrder 1050), and the service's own route through its whole stack (helmet, JSON
 * parsing, OpenAPI request validation, API-key authentication (verified against SQLite once,
 * then from the credential cache while the credential epoch holds), the cost model,
 * serialisation; response validation as in production, off; and once more with it on), under
 * autocannon with 50 connections for the same time on 127.0.0.1. Prints requests per second, p99 latency, errors and
 * the ratios service ÷ bare. Issue 11's goal: at least 70 % of the bare server's requests per
 * second with p99 at most twice the bare server's, no errors. No timing is asserted.
 *
 * Run: `npx tsx bench/throughput.ts` (after `npx turbo run build --filter=@pulsewright/api`);
 * THROUGHPUT_SECONDS (default 5) a load, THROUGHPUT_ROUNDS (default 3) rounds of them taken in
 * turn (bare, service, service with response validation, …) after an untimed load of
 * THROUGHPUT_WARM_UP_SECONDS (default 2) on each, THROUGHPUT_CONNECTIONS (default 50);
 * THROUGHPUT_COMPARE_API=<another build's apps/api/dist/app.js> adds that build's figures;
 * THROUGHPUT_NODE_DEFAULTS=1 runs with Node's memory defaults instead of the service's settings.
 *
 * Figures (docs/robustness.md, throughput): on a quiet machine, 2 December 22:54 UTC, bare 1477
 * requests/s and p99 50 ms, service 844 and 115 ms (57 %, 2.3×), CPU per answer 0.71 and 1.29 ms.
 * On a loaded machine CPU time per answer moves by ±30 % between loads; instructions per answer
 * counted by valgrind (each server alone, 1000 answers after 300) do not: bare 5.7–5.8 M, the
 * service 9.5–9.9 M before the fourth pass and 9.4–9.7 M with a compute fast path and the one-shot
 * token hash (57–61 %); the fast path (2–5 %) was taken out again (docs/robustness.md). Fifth
 * pass (3 December): one passport middleware, the spectrum's finiteness read unboxed and the
 * header not joined to the body took the service from 8.88 M to 8.44 M instructions an answer;
 * on a quiet machine four runs gave 61–70 % (the build before 3 points lower in the same run).
 * Sixth pass: the answers had been two-byte strings (the OpenAPI document's names, read from two-
 * byte YAML text, were the first copies V8 kept); loaded one-byte, the service answers 10–15 %
 * faster, but this bench's bare server shares the process and its string table and gained as
 * much: 58–71 % in six runs (median 64 %), p99 1.5–2.2× (docs/robustness.md, sixth pass).
 * Seventh pass: Express changed every request's and response's prototype after node:http had
 * built them; the service's server now builds them on the app's own prototypes, and passport's
 * per-request middleware is gone (7.19 → 6.51 M instructions an answer; bare 5.58 M). Four runs
 * after, with an untimed warm-up load per target: 78–90 %, p99 1.1–1.2×, no errors: the goal is
 * met (docs/robustness.md, seventh pass).
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import autocannon from 'autocannon';
import {
  modulationVoltages,
  voltageSpectrumFigures,
  type Modulation,
} from '@pulsewright/modulation';
import { createApp } from '@pulsewright/api';
import { printTable } from './measure.js';

/**
 * The service's Node.js settings as `npm start` gives them (scripts/start.mjs, SERVICE_NODE_FLAGS:
 * a 64 MB semi-space). The bare server and the service share this process, so both run with them;
 * without them in NODE_OPTIONS or on the command line this script runs itself again with them.
 * THROUGHPUT_NODE_DEFAULTS=1 measures with Node's defaults instead.
 */
const SERVICE_NODE_FLAGS = ['--max-semi-space-size=64'];
const given = [...process.execArgv, ...(process.env.NODE_OPTIONS ?? '').split(/\s+/)];
if (
  process.env.THROUGHPUT_NODE_DEFAULTS !== '1' &&
  !SERVICE_NODE_FLAGS.every((flag) => given.includes(flag))
) {
  const again = spawnSync(
    process.execPath,
    [...process.execArgv, ...SERVICE_NODE_FLAGS, ...process.argv.slice(1)],
    { stdio: 'inherit' },
  );
  process.exit(again.status ?? 1);
}
const NODE_FLAGS =
  process.env.THROUGHPUT_NODE_DEFAULTS === '1' ? "Node's defaults" : SERVICE_NODE_FLAGS.join(' ');

const SECONDS = Number(process.env.THROUGHPUT_SECONDS ?? 5);
const ROUNDS = Number(process.env.THROUGHPUT_ROUNDS ?? 3);
/** Untimed load on each target before the rounds (THROUGHPUT_WARM_UP_SECONDS, default 2). */
const WARM_UP_SECONDS = Number(process.env.THROUGHPUT_WARM_UP_SECONDS ?? 2);
const CONNECTIONS = Number(process.env.THROUGHPUT_CONNECTIONS ?? 50);
const BODY = JSON.stringify({
  modulation: { method: 'sine-triangle', scheme: 'bipolar', ma: 0.9, mf: 21, vdc: 400 },
  maxOrder: 1050,
});

interface Run {
  rps: number;
  p99: number;
  errors: number;
  non2xx: number;
  /** Answers by status code, e.g. `200: 980, 503: 20`. */
  statuses: string;
  /**
   * CPU time of this process (every thread, the load generator's share included) per answer,
   * ms: what bounds requests per second on an idle machine, and steadier than them on a busy
   * one, where the process gets a changing share of the cores.
   */
  cpuMs: number;
}

async function listen(server: Server): Promise<number> {
  server.listen(0, '127.0.0.1');
  await new Promise<void>((resolve) => server.once('listening', () => resolve()));
  return (server.address() as AddressInfo).port;
}

async function load(
  url: string,
  headers: Record<string, string>,
  seconds: number = SECONDS,
): Promise<Run> {
  const cpu = process.cpuUsage();
  const result = await autocannon({
    url,
    method: 'POST',
    headers: { 'content-type': 'application/json', ...headers },
    body: BODY,
    connections: CONNECTIONS,
    duration: seconds,
  });
  const used = process.cpuUsage(cpu);
  return {
    cpuMs: (used.user + used.system) / 1000 / Math.max(1, result.requests.total),
    rps: result.requests.average,
    p99: result.latency.p99,
    errors: result.errors + result.timeouts,
    non2xx: result.non2xx,
    statuses: Object.entries(result.statusCodeStats ?? {})
      .map(([code, { count }]) => `${code}: ${count}`)
      .join(', '),
  };
}

/** A server under test: where to send the load, with which headers, and how to stop it. */
interface Target {
  url: string;
  headers: Record<string, string>;
  close(): Promise<void>;
}

/**
 * The same work as the route: the bridge voltage and its figures from the same library call
 * (voltageSpectrumFigures: spectrum, exact THD and WTHD), in the route's shape, as JSON.
 */
async function bare(): Promise<Target> {
  const server = createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on('data', (chunk: Buffer) => chunks.push(chunk));
    req.on('end', () => {
      const { modulation, maxOrder } = JSON.parse(Buffer.concat(chunks).toString('utf8')) as {
        modulation: Modulation;
        maxOrder: number;
      };
      const { name, spectrum, thd, wthd, spectrumThd } = voltageSpectrumFigures(
        modulationVoltages(modulation).phases[0]!,
        { maxOrder },
      );
      const body = JSON.stringify({ name, harmonics: spectrum, thd, wthd, spectrumThd });
      res.writeHead(200, { 'content-type': 'application/json; charset=utf-8' }).end(body);
    });
  });
  const port = await listen(server);
  return {
    url: `http://127.0.0.1:${port}/`,
    headers: {},
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

/** The service's createApp, or that of another build given by THROUGHPUT_COMPARE_API. */
type CreateApp = typeof createApp;

/** The service on a fresh SQLite file, called with a viewer's API key as a script would. */
async function service(validateResponses: boolean, build: CreateApp = createApp): Promise<Target> {
  const dir = mkdtempSync(path.join(tmpdir(), 'pulsewright-throughput-'));
  const app = await build({
    databaseUrl: `sqlite:${path.join(dir, 'bench.sqlite')}`,
    bcryptRounds: 4,
    webDist: path.join(dir, 'no-web'),
    validateResponses,
  });
  // The service's own server (src/index.ts listens on the same); a build from before it had one
  // (THROUGHPUT_COMPARE_API) is served as it was then.
  const server =
    typeof (app as Partial<typeof app>).httpServer === 'function'
      ? app.httpServer()
      : createServer(app);
  const port = await listen(server);
  const login = await fetch(`http://127.0.0.1:${port}/api/v1/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email: 'engineer@kestrel.example', password: 'pulsewright-demo' }),
  });
  const { token } = (await login.json()) as { token: string };
  const made = await fetch(`http://127.0.0.1:${port}/api/v1/api-keys`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', authorization: `Bearer ${token}` },
    body: JSON.stringify({ name: 'throughput', role: 'viewer' }),
  });
  const { key } = (await made.json()) as { key: string };
  return {
    url: `http://127.0.0.1:${port}/api/v1/spectra`,
    headers: { authorization: `Bearer ${key}` },
    async close() {
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await app.close();
      rmSync(dir, { recursive: true, force: true });
    },
  };
}

/**
 * The targets' loads in ROUNDS rounds, one target after another within each round, so that a
 * change in the machine's other work falls on all of them alike; requests per second over all
 * rounds, p99 the median of the rounds' p99, errors and statuses summed.
 */
async function interleaved(targets: Target[]): Promise<Run[]> {
  const runs: Run[][] = targets.map(() => []);
  // Untimed: each target's code reaches its optimised form before any round counts (the
  // service has far more of it to compile than the bare server, and a first round measured cold
  // would count that against it).
  for (const target of targets) await load(target.url, target.headers, WARM_UP_SECONDS);
  for (let round = 0; round < ROUNDS; round++) {
    for (const [index, target] of targets.entries())
      runs[index]!.push(await load(target.url, target.headers));
  }
  return runs.map((rounds) => {
    const p99s = rounds.map((r) => r.p99).sort((x, y) => x - y);
    return {
      rps: rounds.reduce((sum, r) => sum + r.rps, 0) / rounds.length,
      p99: p99s[Math.floor(p99s.length / 2)]!,
      errors: rounds.reduce((sum, r) => sum + r.errors, 0),
      non2xx: rounds.reduce((sum, r) => sum + r.non2xx, 0),
      statuses: rounds.map((r) => r.statuses).join('; '),
      cpuMs: rounds.reduce((sum, r) => sum + r.cpuMs, 0) / rounds.length,
    };
  });
}

// Another build's apps/api/dist/app.js (e.g. the commit before a change), measured in the same
// run for a before/after figure; without it that row is left out.
const COMPARE = process.env.THROUGHPUT_COMPARE_API;
const compareBuild = COMPARE
  ? ((await import(path.resolve(COMPARE))) as { createApp: CreateApp }).createApp
  : undefined;

const targets = [
  await bare(),
  await service(false),
  await service(true),
  ...(compareBuild ? [await service(false, compareBuild)] : []),
];
const [base, full, checked, compared] = (await interleaved(targets)) as [
  Run,
  Run,
  Run,
  Run | undefined,
];
for (const target of targets) await target.close();
printTable(
  `POST /api/v1/spectra (mf 21, maxOrder 1050) against a bare node:http server doing the same work, ${CONNECTIONS} connections, ${ROUNDS} rounds of ${SECONDS} s each, Node.js ${NODE_FLAGS}`,
  [
    ['bare server: requests per second, p99', `${base.rps.toFixed(0)}, ${base.p99} ms`],
    ['service: requests per second, p99', `${full.rps.toFixed(0)}, ${full.p99} ms`],
    [
      'service ÷ bare, requests per second (goal ≥ 70 %)',
      `${((100 * full.rps) / base.rps).toFixed(0)} %`,
    ],
    ['service ÷ bare, p99 (goal ≤ 2)', (full.p99 / base.p99).toFixed(1)],
    [
      'CPU ms per answer, bare; service; bare ÷ service (the requests/s ratio of an idle machine)',
      `${base.cpuMs.toFixed(2)}; ${full.cpuMs.toFixed(2)}; ${((100 * base.cpuMs) / full.cpuMs).toFixed(0)} %`,
    ],
    [
      'errors and non-2xx (bare; service), answers by status',
      `${base.errors + base.non2xx}; ${full.errors + full.non2xx} (${full.statuses})`,
    ],
    [
      'service with response validation (development, tests): requests per second, p99',
      `${checked.rps.toFixed(0)}, ${checked.p99} ms`,
    ],
    ...(compared
      ? [
          [
            `THROUGHPUT_COMPARE_API build: requests per second, p99; ÷ bare; CPU ms per answer, bare ÷ it`,
            `${compared.rps.toFixed(0)}, ${compared.p99} ms; ${((100 * compared.rps) / base.rps).toFixed(0)} %, ${(compared.p99 / base.p99).toFixed(1)}; ${compared.cpuMs.toFixed(2)}, ${((100 * base.cpuMs) / compared.cpuMs).toFixed(0)} %`,
          ] as [string, string],
        ]
      : []),
  ],
);
