import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { harmonics, labelHarmonics, sheWaveform, thd } from '@pulsewright/modulation';
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
export function branchesOf(result: unknown): { branches: SheBranchView[]; solvedFraction: number | null; message: string | null } {
  const r = result as { points?: ShePoint[]; branches?: SheBranchView[]; solvedFraction?: number; message?: string } | null;
  if (!r) return { branches: [], solvedFraction: null, message: null };
  const branches = Array.isArray(r.branches) ? r.branches : Array.isArray(r.points) ? [{ points: r.points }] : [];
  return { branches, solvedFraction: typeof r.solvedFraction === 'number' ? r.solvedFraction : null, message: typeof r.message === 'string' ? r.message : null };
}

export async function createSheSweep(body: SheSweepRequest): Promise<Job> {
  return unwrap(await api.POST('/api/v1/jobs/she-sweeps', { body }));
}
export function useCreateSheSweep() {
  const client = useQueryClient();
  return useMutation({ mutationFn: createSheSweep, onSuccess: () => client.invalidateQueries({ queryKey: ['jobs', 'list'] }) });
}

export async function getSheJob(id: string): Promise<Job> {
  return unwrap(await api.GET('/api/v1/jobs/{id}', { params: { path: { id } } }));
}
/** Polls the job every 400 ms until it has finished (same key as the sweeps screen's job query). */
export const sheJobQueryOptions = (id: string) =>
  queryOptions({
    queryKey: ['jobs', 'one', id],
    queryFn: () => getSheJob(id),
    refetchInterval: (query) => (query.state.data?.status === 'succeeded' || query.state.data?.status === 'failed' ? false : 400),
  });
export function useSheJob(id: string | null) {
  return useQuery({ ...sheJobQueryOptions(id ?? ''), enabled: Boolean(id) });
}

/** The spectrum of one solved point (quarter-wave angles) by the library, for the picked point. */
export function pointSpectrum(kind: 'bipolar' | 'staircase', vdc: number, angles: number[], maxOrder = 49) {
  const waveform = sheWaveform(angles, { kind, vdc });
  const spectrum = harmonics(waveform, maxOrder);
  // No carrier: a ratio past every analysed order labels each harmonic by its order alone.
  return { spectrum: labelHarmonics(spectrum, 2 * maxOrder + 1), thd: thd(spectrum) };
}

export async function saveSheStudy(body: Schema<'StudyCreate'>) {
  return unwrap(await api.POST('/api/v1/studies', { body }));
}
export async function getEliminationProjects() {
  return unwrap(await api.GET('/api/v1/projects'));
}
export function useSaveSheStudy() {
  const client = useQueryClient();
  return useMutation({ mutationFn: saveSheStudy, onSuccess: () => client.invalidateQueries({ queryKey: ['studies'] }) });
}
