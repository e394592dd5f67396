import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { Schema } from '@pulsewright/client';
import { api, unwrap, type BodyOf } from './client';
import { queryKeys } from './queryKeys';

// Long work (index sweeps, harmonic-elimination branches) runs as a job on the service; a screen
// starts it with a mutation and watches it with `useJob`, the one polling hook of the dashboard.

export type Job = Schema<'Job'>;
export type MaSweepResult = Schema<'MaSweepResult'>;
export type SheSweepResult = Schema<'SheSweepResult'>;

/** How often a job that is still queued or running is asked for again, milliseconds. */
export const JOB_POLL_INTERVAL_MS = 400;
/** How often the list of recent jobs is refreshed while one of them is working, milliseconds. */
export const JOB_LIST_POLL_INTERVAL_MS = 1000;

/** Whether a job has ended (succeeded or failed): its answer will not change any more. */
export function isJobFinished(job: Pick<Job, 'status'> | undefined): boolean {
  return job?.status === 'succeeded' || job?.status === 'failed';
}

export async function getJob(id: string): Promise<Job> {
  return unwrap(await api.GET('/api/v1/jobs/{id}', { params: { path: { id } } }));
}
/** One job, asked for every {@link JOB_POLL_INTERVAL_MS} until it has finished. */
export const jobQueryOptions = (id: string) =>
  queryOptions({
    queryKey: queryKeys.jobs.one(id),
    queryFn: () => getJob(id),
    refetchInterval: (query) => (isJobFinished(query.state.data) ? false : JOB_POLL_INTERVAL_MS),
  });
/** Watches a job to its end (progress while it runs, its result once it has succeeded); idle while `id` is null. */
export function useJob(id: string | null) {
  return useQuery({ ...jobQueryOptions(id ?? ''), enabled: Boolean(id) });
}

export async function getJobs(): Promise<Job[]> {
  return unwrap(await api.GET('/api/v1/jobs', { params: { query: { limit: 20 } } }));
}
/** The team's recent jobs, refreshed while any of them is still working. */
export const jobsQueryOptions = () =>
  queryOptions({
    queryKey: queryKeys.jobs.list,
    queryFn: getJobs,
    refetchInterval: (query) =>
      query.state.data?.every(isJobFinished) === false ? JOB_LIST_POLL_INTERVAL_MS : false,
  });
export function useJobs() {
  return useQuery(jobsQueryOptions());
}

export async function createMaSweep(body: BodyOf<'createMaSweep'>): Promise<Job> {
  return unwrap(await api.POST('/api/v1/jobs/ma-sweeps', { body }));
}
export function useCreateMaSweep() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: createMaSweep,
    onSuccess: () => client.invalidateQueries({ queryKey: queryKeys.jobs.list }),
  });
}

export async function createSheSweep(body: BodyOf<'createSheSweep'>): Promise<Job> {
  return unwrap(await api.POST('/api/v1/jobs/she-sweeps', { body }));
}
export function useCreateSheSweep() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: createSheSweep,
    onSuccess: () => client.invalidateQueries({ queryKey: queryKeys.jobs.list }),
  });
}

/** The result of a succeeded index sweep (null for another kind of job, or before it has succeeded). */
export function maSweepResultOf(job: Job | undefined): MaSweepResult | null {
  return job?.kind === 'ma-sweep' && job.result && 'ma' in job.result ? job.result : null;
}

/** The result of a succeeded harmonic-elimination sweep: the followed branch's points (null otherwise). */
export function sheSweepResultOf(job: Job | undefined): SheSweepResult | null {
  return job?.kind === 'she-sweep' && job.result && 'points' in job.result ? job.result : null;
}
