import { formatDate } from '../../../lib/format';
import {
  errorMessage,
  useRestoreStudyRevision,
  useStudyRevisions,
  type Study,
} from '../../../lib/api';
import { Button } from '../../../components/ui/Button';
import { Panel } from '../../../components/ui/Panel';
import { QueryView } from '../../../components/ui/QueryState';

/** Every revision of a study, newest first, with restore for editors. */
export function RevisionHistory({ study, canEdit }: { study: Study; canEdit: boolean }) {
  const revisions = useStudyRevisions(study.id);
  const restore = useRestoreStudyRevision();
  return (
    <Panel title="Revision history">
      <QueryView query={revisions} empty="No revisions yet.">
        {(list) => (
          <ol className="flex flex-col gap-2 text-sm" aria-label="Revisions">
            {list.map((r) => (
              <li
                key={r.revision}
                className="flex items-start justify-between gap-2 border-b border-rule/60 pb-2"
              >
                <div>
                  <p className="font-medium">
                    Revision {r.revision}
                    {r.revision === study.revision ? (
                      <span className="ml-2 rounded bg-signal-soft px-1 text-xs">current</span>
                    ) : null}
                  </p>
                  <p className="text-xs text-ink-soft">
                    {r.authorEmail ?? 'unknown author'} · {formatDate(r.createdAt)}
                    {r.restoredFrom ? ` · restored from ${r.restoredFrom}` : ''}
                  </p>
                </div>
                {canEdit && r.revision !== study.revision ? (
                  <Button
                    variant="secondary"
                    busy={restore.isPending && restore.variables?.revision === r.revision}
                    onClick={() =>
                      restore.mutate({
                        id: study.id,
                        revision: r.revision,
                        baseRevision: study.revision,
                      })
                    }
                  >
                    Restore
                  </Button>
                ) : null}
              </li>
            ))}
          </ol>
        )}
      </QueryView>
      {restore.isError ? (
        <p role="alert" className="mt-2 text-xs text-bad">
          {errorMessage(restore.error)}
        </p>
      ) : null}
    </Panel>
  );
}
