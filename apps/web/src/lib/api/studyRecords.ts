import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Schema } from '@pulsewright/client';
import { api, unwrap } from './client';
import { queryKeys } from './queryKeys';
import type { Study } from './studies';

/** A study as a versioned JSON document with no ids (GET /studies/{id}/record). */
export type StudyRecord = Schema<'StudyRecord'>;

export async function getStudyRecord(id: string): Promise<StudyRecord> {
  return unwrap(await api.GET('/api/v1/studies/{id}/record', { params: { path: { id } } }));
}

/** Imports a record as a new study in a project; the service checks it as a new study. */
export async function importStudyRecord({
  projectId,
  record,
}: {
  projectId: string;
  record: StudyRecord;
}): Promise<Study> {
  return unwrap(
    await api.POST('/api/v1/projects/{id}/study-records', {
      params: { path: { id: projectId } },
      body: record,
    }),
  );
}
/** Imports a record; the study lists and the projects' study counts refetch. */
export function useImportStudyRecord() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: importStudyRecord,
    onSuccess: () => {
      void client.invalidateQueries({ queryKey: queryKeys.studies.all });
      void client.invalidateQueries({ queryKey: queryKeys.projects.all });
    },
  });
}
