/**
 * Benchmark (not a test), issue 11's throughput item: in one run, a bare `node:http` server doing
 * the same library call and serialisation as `POST /api/v1/spectra` (bipolar sine-triangle,
 * mf 21, maxOrder 1050), then the service's own route through its whole stack (helmet, JSON
 * parsing, OpenAPI request validation, API-key authentication against SQLite, the cost model,
 * serialisation; response validation as in production, off; and once more with it on), under autocannon with 50
 * connections for the same time on 127.0.0.1. Prints requests per second, p99 latency, errors and
 * the ratios service ÷ bare. Issue 11's goal: at least 70 % of the bare server's requests per
 * second with p99 at most twice the bare server's, no errors. No timing is asserted.
 *
 * Run: `npx tsx bench/throughput.ts` (after `npx turbo run build --filter=@pulsewright/api`);
 * THROUGHPUT_SECONDS (default 5) and THROUGHPUT_CONNECTIONS (default 50).
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import autocannon from 'autocannon';
import { modulationVoltages, voltageFigures, type Modulation } from '@pulsewright/modulation';
import { createApp } from '@pulsewright/api';
import { printTable } from './measure.js';

const SECONDS = Number(process.env.THROUGHPUT_SECONDS ?? 5);
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
}

async function listen(server: Server): Promise<number> {
  server.listen(0, '127.0.0.1');
  await new Promise<void>((resolve) => server.once('listening', () => resolve()));
  return (server.address() as AddressInfo).port;
}

async function load(url: string, headers: Record<string, string>): Promise<Run> {
  const result = await autocannon({
    url,
    method: 'POST',
    headers: { 'content-type': 'application/json', ...headers },
    body: BODY,
    connections: CONNECTIONS,
    duration: SECONDS,
  });
  return {
    rps: result.requests.average,
    p99: result.latency.p99,
    errors: result.errors + result.timeouts,
    non2xx: result.non2xx,
  };
}

/**
 * The same work as the route: the bridge voltage and its figures from the same library call
 * (voltageFigures: spectrum, exact THD and WTHD), in the route's shape, as JSON.
 */
async function bare(): Promise<Run> {
  const server = createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on('data', (chunk: Buffer) => chunks.push(chunk));
    req.on('end', () => {
      const { modulation, maxOrder } = JSON.parse(Buffer.concat(chunks).toString('utf8')) as {
        modulation: Modulation;
        maxOrder: number;
      };
      const figures = voltageFigures(modulationVoltages(modulation).phases[0]!, { maxOrder });
      const body = JSON.stringify({
        name: figures.name,
        harmonics: figures.spectrum.map(({ order, amplitude, phase }) => ({
          order,
          amplitude,
          phase,
        })),
        thd: figures.thd,
        wthd: figures.wthd,
        spectrumThd: figures.spectrumThd,
      });
      res.writeHead(200, { 'content-type': 'application/json; charset=utf-8' }).end(body);
    });
  });
  const port = await listen(server);
  try {
    return await load(`http://127.0.0.1:${port}/`, {});
  } finally {
    await new Promise<void>((resolve) => server.close(() => resolve()));
  }
}

async function service(validateResponses: boolean): Promise<Run> {
  const dir = mkdtempSync(path.join(tmpdir(), 'pulsewright-throughput-'));
  const app = await createApp({
    databaseUrl: `sqlite:${path.join(dir, 'bench.sqlite')}`,
    bcryptRounds: 4,
    webDist: path.join(dir, 'no-web'),
    validateResponses,
  });
  const server = createServer(app);
  const port = await listen(server);
  try {
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
    return await load(`http://127.0.0.1:${port}/api/v1/spectra`, {
      authorization: `Bearer ${key}`,
    });
  } finally {
    await new Promise<void>((resolve) => server.close(() => resolve()));
    await app.close();
    rmSync(dir, { recursive: true, force: true });
  }
}

const base = await bare();
const full = await service(false);
const checked = await service(true);
printTable(
  `POST /api/v1/spectra (mf 21, maxOrder 1050) against a bare node:http server doing the same work, ${CONNECTIONS} connections, ${SECONDS} s each`,
  [
    ['bare server: requests per second, p99', `${base.rps.toFixed(0)}, ${base.p99} ms`],
    ['service: requests per second, p99', `${full.rps.toFixed(0)}, ${full.p99} ms`],
    [
      'service ÷ bare, requests per second (goal ≥ 70 %)',
      `${((100 * full.rps) / base.rps).toFixed(0)} %`,
    ],
    ['service ÷ bare, p99 (goal ≤ 2)', (full.p99 / base.p99).toFixed(1)],
    [
      'errors and non-2xx (bare; service)',
      `${base.errors + base.non2xx}; ${full.errors + full.non2xx}`,
    ],
    [
      'service with response validation (development, tests): requests per second, p99',
      `${checked.rps.toFixed(0)}, ${checked.p99} ms`,
    ],
  ],
);
