import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Schema } from '@pulsewright/client';
import { api, unwrap, type BodyOf } from './client';
import type { Job } from './jobs';
import { queryKeys } from './queryKeys';

// Programmed patterns to firmware (issue 17): the optimal-pattern sweep job, angle tables for
// controllers with their interpolation errors, and a stored pattern's compare events.

export type OptimalSweepResult = Schema<'OptimalSweepResult'>;
export type AngleTableRequest = BodyOf<'computeAngleTable'>;
export type AngleTableDocument = Schema<'AngleTableDocument'>;
export type PatternEventsRequest = BodyOf<'computePatternCompareEvents'>;
export type PatternCompareEvents = Schema<'PatternCompareEvents'>;

export async function createOptimalSweep(body: BodyOf<'createOptimalSweep'>): Promise<Job> {
  return unwrap(await api.POST('/api/v1/jobs/optimal-sweeps', { body }));
}
export function useCreateOptimalSweep() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: createOptimalSweep,
    onSuccess: () => client.invalidateQueries({ queryKey: queryKeys.jobs.list }),
  });
}

/** The result of a succeeded optimal-pattern sweep (null for another kind of job, or before it has succeeded). */
export function optimalSweepResultOf(job: Job | undefined): OptimalSweepResult | null {
  return job?.kind === 'optimal-sweep' && job.result && 'points' in job.result ? job.result : null;
}

/** The table as JSON: rows, midpoint errors and fixed-point values. */
export async function getAngleTable(body: AngleTableRequest): Promise<AngleTableDocument> {
  // The route answers JSON, CSV or a C header by `format`; with json the body is the document.
  return unwrap(
    await api.POST('/api/v1/angle-tables', { body, params: { query: { format: 'json' } } }),
  ) as AngleTableDocument;
}
export function useAngleTable() {
  return useMutation({ mutationFn: getAngleTable });
}

/** The same table as the file a controller build takes: CSV or a C header, as text. */
export async function getAngleTableFile(
  body: AngleTableRequest,
  format: 'csv' | 'c-header',
): Promise<string> {
  return unwrap(
    await api.POST('/api/v1/angle-tables', {
      body,
      params: { query: { format } },
      parseAs: 'text',
    }),
  );
}

export async function getPatternCompareEvents(
  body: PatternEventsRequest,
): Promise<PatternCompareEvents> {
  return unwrap(await api.POST('/api/v1/pattern-compare-events', { body }));
}
export function usePatternCompareEvents() {
  return useMutation({ mutationFn: getPatternCompareEvents });
}

// Per-cell patterns of a cascaded H-bridge string (issue 13): one unipolar pattern per cell
// solved jointly, with the string's waveforms and exact spectrum.

export type CascadedSolveRequest = BodyOf<'solveCascadedPattern'>;
export type CascadedPatternSolution = Schema<'CascadedPatternSolution'>;

export async function solveCascadedPattern(
  body: CascadedSolveRequest,
): Promise<CascadedPatternSolution> {
  return unwrap(await api.POST('/api/v1/cascaded-patterns/solve', { body }));
}
export function useSolveCascadedPattern() {
  return useMutation({ mutationFn: solveCascadedPattern });
}
