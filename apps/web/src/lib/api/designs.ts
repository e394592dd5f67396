import { queryOptions } from '@tanstack/react-query';
import { api, unwrap, type BodyOf } from './client';
import { queryKeys } from './queryKeys';
import type { StudyReport } from './studies';

/** What POST /designs/report takes: a design (not saved) and the report's options. */
export type DesignReportRequest = BodyOf<'analyseDesign'>;

/** The design report of a design that is not saved (the library's analyseDesign, from the service). */
export async function getDesignReport(body: DesignReportRequest): Promise<StudyReport> {
  return unwrap(await api.POST('/api/v1/designs/report', { body }));
}

/** What POST /filters/lcl-design takes: the rated power, grid, switching frequency and DC bus. */
export type LclDesignRequest = BodyOf<'designLclFilter'>;

/** An LCL filter sized by the library's designLclFilter (Liserre, Blaabjerg and Hansen, 2005), from the service. */
export async function sizeLclFilter(body: LclDesignRequest) {
  return unwrap(await api.POST('/api/v1/filters/lcl-design', { body }));
}

/**
 * The report of one design: a pure function of the body, so an answer never goes stale (Compare
 * asks for the designs it adjusts to equal conditions).
 */
export const designReportQueryOptions = (body: DesignReportRequest) =>
  queryOptions({
    queryKey: queryKeys.designs.report(body),
    queryFn: () => getDesignReport(body),
    staleTime: Infinity,
  });
