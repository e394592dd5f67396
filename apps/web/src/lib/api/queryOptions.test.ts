import { QueryClient } from '@tanstack/react-query';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { ApiError } from './ApiError';
import { captureSpectrumQueryOptions } from './captures';
import {
  isJobFinished,
  JOB_POLL_INTERVAL_MS,
  jobQueryOptions,
  jobsQueryOptions,
  maSweepResultOf,
  sheSweepResultOf,
  type Job,
} from './jobs';
import { projectsQueryOptions } from './projects';
import { queryKeys } from './queryKeys';
import { studiesQueryOptions, studyReportQueryOptions } from './studies';

// The factories are checked against the API document's paths (apps/api/openapi.yaml) and the
// keys against queryKeys.ts: a screen that reads an endpoint with the same parameters as another
// must land on the same cache entry, and the request must be the one the document describes.

const ID = '00000000-0000-4000-8000-00000000000a';
const json = (status: number, body: unknown) =>
  new Response(JSON.stringify(body), {
    status,
    headers: { 'Content-Type': status < 400 ? 'application/json' : 'application/problem+json' },
  });
/** Runs a query through a real QueryClient with fetch answering `body`; returns the request made and the data or error. */
async function requestOf(
  run: (client: QueryClient) => Promise<unknown>,
  body: unknown,
  status = 200,
): Promise<{ request: Request; data: unknown }> {
  const fetch = vi.fn(() => Promise.resolve(json(status, body)));
  vi.stubGlobal('fetch', fetch);
  const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  const data = await run(client).catch((error: unknown) => error);
  const [request] = fetch.mock.calls[0] as unknown as [Request];
  return { request, data };
}

const job = (
  status: Job['status'],
  kind: Job['kind'] = 'ma-sweep',
  result: Job['result'] = null,
): Job =>
  // Kind and result are chosen independently (Job ties each kind to its result), so the
  // helpers' checks of the pair can be tried with mismatched ones.
  ({
    id: ID,
    kind,
    status,
    progress: status === 'succeeded' ? 1 : 0.5,
    result,
    error: null,
    createdAt: '2026-01-01T00:00:00Z',
    startedAt: null,
    finishedAt: null,
  }) as Job;

afterEach(() => vi.unstubAllGlobals());

describe('query-options factories', () => {
  it('lists studies with the filter in the query string, keyed so every screen shares the unfiltered list', async () => {
    expect(studiesQueryOptions().queryKey).toEqual(queryKeys.studies.list('', ''));
    expect(studiesQueryOptions({ projectId: ID, q: 'pump' }).queryKey).toEqual([
      'studies',
      'list',
      ID,
      'pump',
    ]);
    const { request, data } = await requestOf(
      (client) => client.fetchQuery(studiesQueryOptions({ projectId: ID, q: 'pump' })),
      [],
    );
    const url = new URL(request.url);
    expect(request.method).toBe('GET');
    expect(url.pathname).toBe('/api/v1/studies');
    expect(Object.fromEntries(url.searchParams)).toEqual({
      projectId: ID,
      q: 'pump',
      limit: '200',
    });
    expect(data).toEqual([]);
  });

  it('keys a report by study and options, under the prefix a save of that study invalidates', () => {
    const key = studyReportQueryOptions(ID, { maxOrder: 50 }).queryKey;
    expect(key).toEqual(['studies', 'report', ID, { maxOrder: 50 }]);
    expect(key.slice(0, 3)).toEqual([...queryKeys.studies.reports(ID)]);
  });

  it('asks for a capture spectrum with the window and order in the body', async () => {
    const options = captureSpectrumQueryOptions(ID, 'flat-top', 30);
    expect(options.queryKey).toEqual(['captures', 'spectrum', ID, 'flat-top', 30]);
    const { request } = await requestOf((client) => client.fetchQuery(options), {});
    expect(request.method).toBe('POST');
    expect(new URL(request.url).pathname).toBe(`/api/v1/captures/${ID}/spectrum`);
    expect(await request.json()).toEqual({ window: 'flat-top', maxOrder: 30 });
  });

  it('turns a problem+json answer into an ApiError that names the field', async () => {
    const problem = {
      type: 'about:blank',
      title: 'Bad request',
      status: 400,
      detail: 'q must be at most 200 characters',
      errors: [{ path: '/query/q', message: 'must NOT have more than 200 characters' }],
    };
    const { data } = await requestOf(
      (client) => client.fetchQuery(projectsQueryOptions('x')),
      problem,
      400,
    );
    expect(data).toBeInstanceOf(ApiError);
    expect((data as ApiError).status).toBe(400);
    expect((data as ApiError).fieldError('q')).toBe('must NOT have more than 200 characters');
  });
});

describe('job polling', () => {
  const interval = (options: ReturnType<typeof jobQueryOptions>, data: Job | undefined) => {
    const refetch = options.refetchInterval as (query: {
      state: { data: Job | undefined };
    }) => number | false;
    return refetch({ state: { data } });
  };

  it('asks again while a job is queued or running and stops once it has succeeded or failed', () => {
    const options = jobQueryOptions(ID);
    expect(options.queryKey).toEqual(queryKeys.jobs.one(ID));
    expect(interval(options, undefined)).toBe(JOB_POLL_INTERVAL_MS);
    expect(interval(options, job('queued'))).toBe(JOB_POLL_INTERVAL_MS);
    expect(interval(options, job('running'))).toBe(JOB_POLL_INTERVAL_MS);
    expect(interval(options, job('succeeded'))).toBe(false);
    expect(interval(options, job('failed'))).toBe(false);
  });

  it('refreshes the list only while one of its jobs is working', () => {
    const refetch = jobsQueryOptions().refetchInterval as (query: {
      state: { data: Job[] | undefined };
    }) => number | false;
    expect(refetch({ state: { data: [job('succeeded'), job('running')] } })).not.toBe(false);
    expect(refetch({ state: { data: [job('succeeded'), job('failed')] } })).toBe(false);
    expect(isJobFinished(undefined)).toBe(false);
  });

  it('gives each kind of job its own typed result, and none before it has one', () => {
    const ma = { ma: [0.5], fundamental: [200], thd: [1.2], wthd: [0.05], harmonics: [] };
    const she = {
      points: [{ fundamental: 100, angles: [0.3], converged: true }],
      solvedFraction: 1,
      iterations: 4,
    };
    expect(maSweepResultOf(job('succeeded', 'ma-sweep', ma))).toEqual(ma);
    expect(sheSweepResultOf(job('succeeded', 'ma-sweep', ma))).toBeNull();
    expect(sheSweepResultOf(job('succeeded', 'she-sweep', she))).toEqual(she);
    expect(maSweepResultOf(job('running', 'ma-sweep'))).toBeNull();
  });
});
