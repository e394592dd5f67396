import {
  keepPreviousData,
  queryOptions,
  useMutation,
  useQuery,
  useQueryClient,
} from '@tanstack/react-query';
import type { Schema } from '@pulsewright/client';
import { api, unwrap } from '../../../lib/api';

export type Project = Schema<'Project'>;
export type Study = Schema<'Study'>;
export type StudyRevision = Schema<'StudyRevision'>;
export type StudyCreate = Schema<'StudyCreate'>;
export type StudyUpdate = Schema<'StudyUpdate'>;
/** The design report as the service sends it (the library's `analyseDesign`); the live preview's library report is assignable to it. */
export type StudyReport = Schema<'DesignReport'>;
export type StudyReportOptions = Schema<'AnalyseDesignOptions'>;

// Projects ----------------------------------------------------------------------------------

export async function getProjects(q?: string): Promise<Project[]> {
  return unwrap(await api.GET('/api/v1/projects', { params: { query: q ? { q } : {} } }));
}
export const projectsQueryOptions = (q?: string) =>
  queryOptions({ queryKey: ['projects', q ?? ''], queryFn: () => getProjects(q) });
export function useProjects(q?: string) {
  return useQuery(projectsQueryOptions(q));
}

export async function createProject(body: Schema<'ProjectInput'>): Promise<Project> {
  return unwrap(await api.POST('/api/v1/projects', { body }));
}
export function useCreateProject() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: createProject,
    onSuccess: () => client.invalidateQueries({ queryKey: ['projects'] }),
  });
}

// Studies -----------------------------------------------------------------------------------

export interface StudyFilter {
  projectId?: string | undefined;
  q?: string | undefined;
}

export async function getStudies({ projectId, q }: StudyFilter = {}): Promise<Study[]> {
  const query: { projectId?: string; q?: string; limit: number } = { limit: 200 };
  if (projectId) query.projectId = projectId;
  if (q) query.q = q;
  return unwrap(await api.GET('/api/v1/studies', { params: { query } }));
}
export const studiesQueryOptions = (filter: StudyFilter = {}) =>
  queryOptions({
    queryKey: ['studies', 'list', filter.projectId ?? '', filter.q ?? ''],
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
  queryOptions({ queryKey: ['studies', 'one', id], queryFn: () => getStudy(id) });
export function useStudy(id: string | undefined) {
  return useQuery({ ...studyQueryOptions(id ?? ''), enabled: Boolean(id) });
}

export async function createStudy(body: StudyCreate): Promise<Study> {
  return unwrap(await api.POST('/api/v1/studies', { body }));
}
export function useCreateStudy() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: createStudy,
    onSuccess: () => {
      client.invalidateQueries({ queryKey: ['studies'] });
      client.invalidateQueries({ queryKey: ['projects'] });
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
      client.setQueryData(studyQueryOptions(study.id).queryKey, study);
      client.invalidateQueries({ queryKey: ['studies', 'list'] });
      client.invalidateQueries({ queryKey: ['studies', 'revisions', study.id] });
      client.invalidateQueries({ queryKey: ['studies', 'report', study.id] });
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
    onSuccess: () => client.invalidateQueries({ queryKey: ['studies', 'list'] }),
  });
}

export type StudyShareResult = Schema<'StudyShareResult'>;

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
  queryOptions({ queryKey: ['studies', 'revisions', id], queryFn: () => getStudyRevisions(id) });
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
      client.setQueryData(studyQueryOptions(study.id).queryKey, study);
      client.invalidateQueries({ queryKey: ['studies'] });
    },
  });
}

export async function getStudyReport(
  id: string,
  options: StudyReportOptions = {},
): Promise<StudyReport> {
  return unwrap(
    await api.GET('/api/v1/studies/{id}/report', { params: { path: { id }, query: options } }),
  );
}
/** The report of a study's current revision; the key holds the id, so a save of that study refetches it. */
export const studyReportQueryOptions = (id: string, options: StudyReportOptions = {}) =>
  queryOptions({
    queryKey: ['studies', 'report', id, options],
    queryFn: () => getStudyReport(id, options),
  });
export function useStudyReport(id: string | undefined, options: StudyReportOptions = {}) {
  return useQuery({ ...studyReportQueryOptions(id ?? '', options), enabled: Boolean(id) });
}
