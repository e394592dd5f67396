/**
 * Benchmark (not a test): POST /api/v1/spectra (bipolar sine-triangle, mf = 21, maxOrder 1050)
 * through the whole service (helmet, JSON parsing, OpenAPI request and response validation,
 * bearer API-key authentication against SQLite, the library call, serialisation) under
 * autocannon on 127.0.0.1 for a bounded time, against the library's own compute time for the
 * same request measured in the same run. Prints requests per second, p99 latency and the
 * ratio mean API latency / library compute time. No timing is asserted.
 *
 * Run directly: `npx tsx bench/api-spectra.ts` (after `npx turbo run build --filter=@pulsewright/api`),
 * or import `runApiSpectraBench()`.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import autocannon from 'autocannon';
import { harmonics, sineTriangle, thd, wthd } from '@pulsewright/modulation';
import { createApp } from '@pulsewright/api';
import { medianTime, printTable } from './measure.js';

export interface ApiSpectraBenchReport {
  requestsPerSecond: number;
  p99LatencyMs: number;
  meanLatencyMs: number;
  libraryComputeMs: number;
  ratio: number;
  errors: number;
  non2xx: number;
}

const MODULATION = {
  method: 'sine-triangle',
  scheme: 'bipolar',
  ma: 0.9,
  mf: 21,
  vdc: 400,
} as const;
const MAX_ORDER = 1050;

export async function runApiSpectraBench({
  durationSeconds = 5,
  connections = 8,
} = {}): Promise<ApiSpectraBenchReport> {
  const dir = mkdtempSync(path.join(tmpdir(), 'pulsewright-bench-'));
  const app = await createApp({
    databaseUrl: `sqlite:${path.join(dir, 'bench.sqlite')}`,
    bcryptRounds: 4,
    logErrors: true,
    webDist: path.join(dir, 'no-web'),
    keyRateLimit: 1000,
  });
  const server = app.listen(0, '127.0.0.1');
  await new Promise<void>((resolve) => server.once('listening', () => resolve()));
  try {
    const { port } = server.address() as AddressInfo;
    const engineer = await app.services.models.User.findOne({
      where: { email: 'engineer@kestrel.example' },
    });
    const membership = await app.services.models.Membership.findOne({
      where: { userId: engineer!.id },
    });
    const team = await app.services.models.Team.findByPk(membership!.teamId);
    const { key } = await app.services.apiKeys.create(
      {
        user: { id: engineer!.id, email: engineer!.email, name: engineer!.name },
        teamId: team!.id,
        teamName: team!.name,
        role: 'engineer',
        authMethod: 'session',
        credentialId: 'bench',
      },
      { name: 'bench', role: 'viewer' },
    );

    // The library's part of one request: the same waveform, spectrum, THD and WTHD.
    const { method: _method, ...options } = MODULATION;
    const libraryComputeMs = medianTime(
      () => {
        const spectrum = harmonics(sineTriangle(options), MAX_ORDER);
        return thd(spectrum) + wthd(spectrum);
      },
      100,
      100,
    );

    const result = await autocannon({
      url: `http://127.0.0.1:${port}/api/v1/spectra`,
      method: 'POST',
      headers: { 'content-type': 'application/json', authorization: `Bearer ${key}` },
      body: JSON.stringify({ modulation: MODULATION, maxOrder: MAX_ORDER }),
      connections,
      duration: durationSeconds,
    });
    const report: ApiSpectraBenchReport = {
      requestsPerSecond: result.requests.average,
      p99LatencyMs: result.latency.p99,
      meanLatencyMs: result.latency.average,
      libraryComputeMs,
      ratio: result.latency.average / libraryComputeMs,
      errors: result.errors,
      non2xx: result.non2xx,
    };
    printTable(
      `POST /api/v1/spectra, mf = 21, maxOrder ${MAX_ORDER}, ${connections} connections, ${durationSeconds} s on 127.0.0.1`,
      [
        ['requests per second', report.requestsPerSecond.toFixed(1)],
        ['p99 latency', `${report.p99LatencyMs.toFixed(1)} ms`],
        ['mean latency', `${report.meanLatencyMs.toFixed(2)} ms`],
        ['library compute time (median, same run)', `${report.libraryComputeMs.toFixed(3)} ms`],
        ['ratio mean API latency / library compute', report.ratio.toFixed(1)],
        ['errors / non-2xx answers', `${report.errors} / ${report.non2xx}`],
      ],
    );
    console.log(
      `\nWith ${connections} connections the mean latency includes queueing (about connections / requests per second); ` +
        `the per-request service overhead is about 1000 / (requests per second) − library time = ` +
        `${(1000 / report.requestsPerSecond - libraryComputeMs).toFixed(2)} ms.`,
    );
    return report;
  } finally {
    await new Promise<void>((resolve) => server.close(() => resolve()));
    await app.close();
    rmSync(dir, { recursive: true, force: true });
  }
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  await runApiSpectraBench();
}
