import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { Schema } from '@pulsewright/client';
import { api, unwrap } from '../../../lib/api';

export type Job = Schema<'Job'>;
export type MaSweepRequest = Schema<'MaSweepRequest'>;
export type ZeroSequence = Schema<'ZeroSequence'>;

export async function getJob(id: string): Promise<Job> {
  return unwrap(await api.GET('/api/v1/jobs/{id}', { params: { path: { id } } }));
}

/** Polls every 400 ms while the job is queued or running. */
export const jobQueryOptions = (id: string) =>
  queryOptions({
    queryKey: ['jobs', 'one', id],
    queryFn: () => getJob(id),
    refetchInterval: (query) => {
      const status = query.state.data?.status;
      return status === 'succeeded' || status === 'failed' ? false : 400;
    },
  });

export function useJob(id: string | null) {
  return useQuery({ ...jobQueryOptions(id ?? ''), enabled: Boolean(id) });
}

export async function getJobs(): Promise<Job[]> {
  return unwrap(await api.GET('/api/v1/jobs', { params: { query: { limit: 20 } } }));
}
export const jobsQueryOptions = () =>
  queryOptions({
    queryKey: ['jobs', 'list'],
    queryFn: getJobs,
    // Keep the list fresh while any job is still working.
    refetchInterval: (query) =>
      query.state.data?.some((j) => j.status === 'queued' || j.status === 'running') ? 1000 : false,
  });
export function useJobs() {
  return useQuery(jobsQueryOptions());
}

export async function createMaSweep(body: MaSweepRequest): Promise<Job> {
  return unwrap(await api.POST('/api/v1/jobs/ma-sweeps', { body }));
}
export function useCreateMaSweep() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: createMaSweep,
    onSuccess: () => client.invalidateQueries({ queryKey: ['jobs', 'list'] }),
  });
}
