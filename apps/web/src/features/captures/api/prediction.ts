import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Schema } from '@pulsewright/client';
import { api, unwrap } from '../../../lib/api';

// The captures screen lists studies to compare with; features do not import each other, so
// it has its own fetcher for the same endpoint (same query key, shared cache).

export async function getCaptureStudies(): Promise<Schema<'Study'>[]> {
  return unwrap(await api.GET('/api/v1/studies', { params: { query: { limit: 200 } } }));
}
export const captureStudiesQueryOptions = () =>
  queryOptions({ queryKey: ['studies', 'list', '', ''], queryFn: getCaptureStudies });
export function useCaptureStudies() {
  return useQuery(captureStudiesQueryOptions());
}
