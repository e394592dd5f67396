import {
  keepPreviousData,
  queryOptions,
  useMutation,
  useQuery,
  useQueryClient,
} from '@tanstack/react-query';
import type { Schema } from '@pulsewright/client';
import { api, unwrap, type QueryOf } from './client';
import { queryKeys } from './queryKeys';

export type Study = Schema<'Study'>;
export type StudyRevision = Schema<'StudyRevision'>;
export type StudyCreate = Schema<'StudyCreate'>;
export type StudyUpdate = Schema<'StudyUpdate'>;
/** The design report as the service sends it (the library's `analyseDesign`); the live preview's library report is assignable to it. */
export type StudyReport = Schema<'DesignReport'>;
export type StudyReportOptions = QueryOf<'getStudyReport'>;
export type StudyShareResult = Schema<'StudyShareResult'>;

export interface StudyFilter {
  projectId?: string | undefined;
  q?: string | undefined;
}

/** The most studies one list shows (the service's page size for the dashboard). */
const STUDY_LIST_LIMIT = 200;

export async function getStudies({ projectId, q }: StudyFilter = {}): Promise<Study[]> {
  const query: { projectId?: string; q?: string; limit: number } = { limit: STUDY_LIST_LIMIT };
  if (projectId) query.projectId = projectId;
  if (q) query.q = q;
  return unwrap(await api.GET('/api/v1/studies', { params: { query } }));
}
/** The team's studies, of one project and matching `q` when given; the last list stays on screen while the next loads. */
export const studiesQueryOptions = (filter: StudyFilter = {}) =>
  queryOptions({
    queryKey: queryKeys.studies.list(filter.projectId ?? '', filter.q ?? ''),
    queryFn: () => getStudies(filter),
    placeholderData: keepPreviousData,
  });
export function useStudies(filter: StudyFilter = {}) {
  return useQuery(studiesQueryOptions(filter));
}

export async function getStudy(id: string): Promise<Study> {
  return unwrap(await api.GET('/api/v1/studies/{id}', { params: { path: { id } } }));
}
export const studyQueryOptions = (id: string) =>
  queryOptions({ queryKey: queryKeys.studies.one(id), queryFn: () => getStudy(id) });
export function useStudy(id: string | undefined) {
  return useQuery({ ...studyQueryOptions(id ?? ''), enabled: Boolean(id) });
}

export async function createStudy(body: StudyCreate): Promise<Study> {
  return unwrap(await api.POST('/api/v1/studies', { body }));
}
/** Saves a new study; the lists and the projects' study counts refetch. */
export function useCreateStudy() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: createStudy,
    // Not awaited: the saved study is shown at once and the lists refresh behind it.
    onSuccess: () => {
      void client.invalidateQueries({ queryKey: queryKeys.studies.all });
      void client.invalidateQueries({ queryKey: queryKeys.projects.all });
    },
  });
}

export async function updateStudy({ id, body }: { id: string; body: StudyUpdate }): Promise<Study> {
  return unwrap(await api.PUT('/api/v1/studies/{id}', { params: { path: { id } }, body }));
}
export function useUpdateStudy() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: updateStudy,
    onSuccess: (study) => {
      client.setQueryData(queryKeys.studies.one(study.id), study);
      void client.invalidateQueries({ queryKey: queryKeys.studies.lists });
      void client.invalidateQueries({ queryKey: queryKeys.studies.revisions(study.id) });
      void client.invalidateQueries({ queryKey: queryKeys.studies.reports(study.id) });
    },
  });
}

export async function duplicateStudy({ id, name }: { id: string; name?: string }): Promise<Study> {
  return unwrap(
    await api.POST('/api/v1/studies/{id}/duplicate', {
      params: { path: { id } },
      body: name ? { name } : {},
    }),
  );
}
export function useDuplicateStudy() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: duplicateStudy,
    onSuccess: () => client.invalidateQueries({ queryKey: queryKeys.studies.lists }),
  });
}

export async function shareStudyReport({
  id,
  email,
  message,
}: {
  id: string;
  email: string;
  message?: string;
}): Promise<StudyShareResult> {
  return unwrap(
    await api.POST('/api/v1/studies/{id}/share', {
      params: { path: { id } },
      body: message ? { email, message } : { email },
    }),
  );
}
export function useShareStudyReport() {
  return useMutation({ mutationFn: shareStudyReport });
}

export async function getStudyRevisions(id: string): Promise<StudyRevision[]> {
  return unwrap(await api.GET('/api/v1/studies/{id}/revisions', { params: { path: { id } } }));
}
export const studyRevisionsQueryOptions = (id: string) =>
  queryOptions({
    queryKey: queryKeys.studies.revisions(id),
    queryFn: () => getStudyRevisions(id),
  });
export function useStudyRevisions(id: string | undefined) {
  return useQuery({ ...studyRevisionsQueryOptions(id ?? ''), enabled: Boolean(id) });
}

export async function restoreStudyRevision({
  id,
  revision,
  baseRevision,
}: {
  id: string;
  revision: number;
  baseRevision: number;
}): Promise<Study> {
  return unwrap(
    await api.POST('/api/v1/studies/{id}/revisions/{revision}/restore', {
      params: { path: { id, revision } },
      body: { baseRevision },
    }),
  );
}
export function useRestoreStudyRevision() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: restoreStudyRevision,
    onSuccess: (study) => {
      client.setQueryData(queryKeys.studies.one(study.id), study);
      void client.invalidateQueries({ queryKey: queryKeys.studies.all });
    },
  });
}

export async function getStudyReport(
  id: string,
  options: StudyReportOptions = {},
): Promise<StudyReport> {
  // The route answers the report's spectra as CSV with ?format=csv; without it (json, the
  // default) the body is the report.
  return unwrap(
    await api.GET('/api/v1/studies/{id}/report', { params: { path: { id }, query: options } }),
  ) as StudyReport;
}
/** The report of a study's current revision; a save of that study refetches it. */
export const studyReportQueryOptions = (id: string, options: StudyReportOptions = {}) =>
  queryOptions({
    queryKey: queryKeys.studies.report(id, options),
    queryFn: () => getStudyReport(id, options),
  });
export function useStudyReport(id: string | undefined, options: StudyReportOptions = {}) {
  return useQuery({ ...studyReportQueryOptions(id ?? '', options), enabled: Boolean(id) });
}
