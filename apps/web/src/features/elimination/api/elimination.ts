import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { analyseDesign } from '@pulsewright/modulation';
import type { Schema } from '@pulsewright/client';
import { api, unwrap } from '../../../lib/api';

export type SheSweepRequest = Schema<'SheSweepRequest'>;
export type Job = Schema<'Job'>;

/** A point of a solution branch: peak volts and first-quarter angles (radians). */
export interface ShePoint {
  fundamental: number;
  angles: number[];
  converged: boolean;
}

export interface SheBranchView {
  points: ShePoint[];
}

/**
 * The branches of a finished SHE job. The service answers one followed branch
 * (`{ points, solvedFraction }`); the library's multi-branch form (`{ branches }`) is read too.
 */
export function branchesOf(result: unknown): {
  branches: SheBranchView[];
  solvedFraction: number | null;
  message: string | null;
} {
  const r = result as {
    points?: ShePoint[];
    branches?: SheBranchView[];
    solvedFraction?: number;
    message?: string;
  } | null;
  if (!r) return { branches: [], solvedFraction: null, message: null };
  const branches = Array.isArray(r.branches)
    ? r.branches
    : Array.isArray(r.points)
      ? [{ points: r.points }]
      : [];
  return {
    branches,
    solvedFraction: typeof r.solvedFraction === 'number' ? r.solvedFraction : null,
    message: typeof r.message === 'string' ? r.message : null,
  };
}

export async function createSheSweep(body: SheSweepRequest): Promise<Job> {
  return unwrap(await api.POST('/api/v1/jobs/she-sweeps', { body }));
}
export function useCreateSheSweep() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: createSheSweep,
    onSuccess: () => client.invalidateQueries({ queryKey: ['jobs', 'list'] }),
  });
}

export async function getSheJob(id: string): Promise<Job> {
  return unwrap(await api.GET('/api/v1/jobs/{id}', { params: { path: { id } } }));
}
/** Polls the job every 400 ms until it has finished (same key as the sweeps screen's job query). */
export const sheJobQueryOptions = (id: string) =>
  queryOptions({
    queryKey: ['jobs', 'one', id],
    queryFn: () => getSheJob(id),
    refetchInterval: (query) =>
      query.state.data?.status === 'succeeded' || query.state.data?.status === 'failed'
        ? false
        : 400,
  });
export function useSheJob(id: string | null) {
  return useQuery({ ...sheJobQueryOptions(id ?? ''), enabled: Boolean(id) });
}

/**
 * The picked point's figures from the library's design report (the same model as every other
 * page): the bridge or staircase voltage's labelled spectrum and its exact whole-waveform THD.
 * The fundamental frequency does not change a voltage spectrum; 50 Hz is only a placeholder.
 */
export function pointSpectrum(
  kind: 'bipolar' | 'staircase',
  vdc: number,
  angles: number[],
  eliminate: number[],
) {
  const report = analyseDesign({
    vdc,
    fundamentalFrequency: 50,
    modulation: { method: 'selective-harmonic-elimination', kind, angles, eliminate },
  });
  return { spectrum: report.bridge.spectrum, thd: report.bridge.thd };
}

export async function saveSheStudy(body: Schema<'StudyCreate'>) {
  return unwrap(await api.POST('/api/v1/studies', { body }));
}
export async function getEliminationProjects() {
  return unwrap(await api.GET('/api/v1/projects'));
}
export function useSaveSheStudy() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: saveSheStudy,
    onSuccess: () => client.invalidateQueries({ queryKey: ['studies'] }),
  });
}
