import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Schema } from '@pulsewright/client';
import { api, unwrap } from '../../../lib/api';

// The captures screen needs the study list and a study's prediction; features do not import
// each other, so it has its own fetchers for the same endpoints (same query keys, shared cache).

export async function getCaptureStudies(): Promise<Schema<'Study'>[]> {
  return unwrap(await api.GET('/api/v1/studies', { params: { query: { limit: 200 } } }));
}
export const captureStudiesQueryOptions = () => queryOptions({ queryKey: ['studies', 'list', '', ''], queryFn: getCaptureStudies });
export function useCaptureStudies() {
  return useQuery(captureStudiesQueryOptions());
}

export async function getStudyPrediction(id: string, maxOrder: number): Promise<Schema<'SpectrumResult'>> {
  return unwrap(await api.GET('/api/v1/studies/{id}/spectrum', { params: { path: { id }, query: { maxOrder } } }));
}
export function useStudyPrediction(id: string | null, maxOrder: number) {
  return useQuery({ queryKey: ['studies', 'spectrum', id ?? '', maxOrder], queryFn: () => getStudyPrediction(id ?? '', maxOrder), enabled: Boolean(id) });
}
