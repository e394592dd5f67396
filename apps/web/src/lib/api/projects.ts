import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { Schema } from '@pulsewright/client';
import { api, unwrap, type BodyOf } from './client';
import { queryKeys } from './queryKeys';

export type Project = Schema<'Project'>;

export async function getProjects(q?: string): Promise<Project[]> {
  return unwrap(await api.GET('/api/v1/projects', { params: { query: q ? { q } : {} } }));
}
/** The team's projects, optionally those whose name matches `q`. */
export const projectsQueryOptions = (q?: string) =>
  queryOptions({ queryKey: queryKeys.projects.list(q ?? ''), queryFn: () => getProjects(q) });
export function useProjects(q?: string) {
  return useQuery(projectsQueryOptions(q));
}

export async function createProject(body: BodyOf<'createProject'>): Promise<Project> {
  return unwrap(await api.POST('/api/v1/projects', { body }));
}
export function useCreateProject() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: createProject,
    onSuccess: () => client.invalidateQueries({ queryKey: queryKeys.projects.all }),
  });
}
