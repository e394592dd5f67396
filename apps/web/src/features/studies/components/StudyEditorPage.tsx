import { useCallback, useState } from 'react';
import { Link, useLocation, useNavigate, useParams, useSearchParams } from 'react-router-dom';
import { paths } from '../../../config/paths';
import { errorMessage, fieldErrorOf } from '../../../lib/api';
import { formatNumber, formatPercent } from '../../../lib/format';
import { Button } from '../../../components/ui/Button';
import { PageHeader, Panel } from '../../../components/ui/Panel';
import { ErrorState, Loading } from '../../../components/ui/QueryState';
import { roleAtLeast, useMe } from '../../../lib/me';
import { useCreateStudy, useDuplicateStudy, useProjects, useStudy, useStudySpectrum, useUpdateStudy, type Study } from '../api/studies';
import { defaultDraft, draftFromStudy, draftRangeErrors, modulationOf, studyContentOf, type StudyDraft } from '../model/studyDraft';
import { HarmonicLimitsPanel } from './HarmonicLimitsPanel';
import { RevisionHistory } from './RevisionHistory';
import { StudyCharts } from './StudyCharts';
import { StudyForm } from './StudyForm';
import { usePreview } from './usePreview';

/** The study editor: parameters on the left, the library's live preview on the right. */
export function StudyEditorPage() {
  const { studyId } = useParams();
  const study = useStudy(studyId);
  if (studyId && study.isPending) return <Loading label="Loading the study…" />;
  if (studyId && study.isError) return <ErrorState error={study.error} onRetry={() => study.refetch()} />;
  return <StudyEditor key={`${studyId ?? 'new'}-${study.data?.revision ?? 0}`} study={study.data} />;
}

function StudyEditor({ study }: { study: Study | undefined }) {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const location = useLocation();
  // The editor remounts at each new revision; the save's confirmation travels in the history state.
  const savedRevision = (location.state as { savedRevision?: number } | null)?.savedRevision;
  const me = useMe();
  const projects = useProjects();
  const canEdit = roleAtLeast(me.data?.role, 'engineer');
  const [draft, setDraft] = useState<StudyDraft>(() => (study ? draftFromStudy(study) : defaultDraft(params.get('projectId') ?? '')));
  const [dirty, setDirty] = useState(false);
  const onChange = useCallback((patch: Partial<StudyDraft>) => {
    setDraft((current) => ({ ...current, ...patch }));
    setDirty(true);
  }, []);
  // Pick the first project for a new study once the list arrives.
  if (!study && !draft.projectId && projects.data?.[0]) setDraft((d) => ({ ...d, projectId: projects.data[0]?.id ?? '' }));

  const outcome = usePreview(draft);
  const create = useCreateStudy();
  const update = useUpdateStudy();
  const duplicate = useDuplicateStudy();
  const saveError = study ? update.error : create.error;
  const [rangeErrors, setRangeErrors] = useState<{ field: string; message: string }[]>([]);
  const serverSpectrum = useStudySpectrum(study?.id, outcome.preview?.maxOrder ?? 100);

  const save = () => {
    const problems = draftRangeErrors(draft);
    setRangeErrors(problems);
    if (problems.length) return;
    const content = studyContentOf(draft);
    if (study) {
      const { projectId: _projectId, ...rest } = content;
      update.mutate(
        { id: study.id, body: { ...rest, baseRevision: study.revision } },
        { onSuccess: (saved) => navigate(location.pathname, { replace: true, state: { savedRevision: saved.revision } }) },
      );
    } else {
      create.mutate(content, { onSuccess: (created) => navigate(paths.study.getHref(created.id), { replace: true, state: { savedRevision: created.revision } }) });
    }
  };

  const saving = create.isPending || update.isPending;
  const generalSaveError = saveError && !['name', 'projectId', 'ma', 'm', 'mf', 'frequencyRatio', 'sequence', 'vdc', 'r', 'l', 'frequency', 'emf', 'method', 'scheme', 'sampling'].some((f) => fieldErrorOf(saveError, f));

  return (
    <div>
      <PageHeader
        title={study ? study.name : 'New study'}
        subtitle={study ? `Revision ${study.revision} · ${study.method}` : 'Choose a method and its parameters; the preview follows every change.'}
        actions={
          <>
            {study ? (
              <>
                <Link className="rounded-md border border-rule px-3 py-1.5 text-sm" to={paths.studyReport.getHref(study.id)}>
                  Printable report
                </Link>
                <Link className="rounded-md border border-rule px-3 py-1.5 text-sm" to={paths.compare.getHref([study.id])}>
                  Compare
                </Link>
                {canEdit ? (
                  <Button variant="secondary" busy={duplicate.isPending} onClick={() => duplicate.mutate({ id: study.id, name: `${study.name} (copy)`.slice(0, 120) }, { onSuccess: (copy) => navigate(paths.study.getHref(copy.id)) })}>
                    Duplicate
                  </Button>
                ) : null}
              </>
            ) : null}
            <Button onClick={save} busy={saving} disabled={!canEdit} title={canEdit ? undefined : 'Viewers can read and compute but not save'}>
              {study ? 'Save revision' : 'Create study'}
            </Button>
          </>
        }
      />
      {!canEdit && me.data ? (
        <p className="mb-4 rounded-md border border-rule bg-panel px-3 py-2 text-sm" role="note" data-testid="read-only">
          You have the <strong>{me.data.role}</strong> role: you can explore the preview, but saving needs an engineer.
        </p>
      ) : null}
      {generalSaveError ? <div className="mb-3"><ErrorState error={saveError} /></div> : null}
      {rangeErrors.length ? (
        <ul role="alert" className="mb-3 list-disc rounded-md bg-bad-soft py-2 pl-8 text-sm text-bad">
          {rangeErrors.map((e) => (
            <li key={e.field}>{e.message}</li>
          ))}
        </ul>
      ) : null}
      {savedRevision && savedRevision === study?.revision && !dirty ? <p role="status" className="mb-3 text-sm text-good">Saved as revision {savedRevision}.</p> : null}

      <div className="grid gap-5 lg:grid-cols-[340px_minmax(0,1fr)]">
        <div className="flex flex-col gap-4">
          <Panel>
            <StudyForm
              draft={draft}
              onChange={onChange}
              readOnly={!canEdit && Boolean(me.data)}
              projects={projects.data ?? []}
              saveError={saveError}
              previewErrors={[...outcome.errors, ...rangeErrors]}
            />
          </Panel>
          <HarmonicLimitsPanel modulation={modulationOf(draft)} />
          {study ? <RevisionHistory study={study} canEdit={canEdit} /> : null}
        </div>
        <div className="flex min-w-0 flex-col gap-4" aria-live="off">
          <p className="text-xs text-ink-soft" data-testid="preview-time">
            Live preview by the library in this browser: {formatNumber(outcome.milliseconds, 3)} ms.
            {study && serverSpectrum.data ? ` Saved revision on the server: THD ${formatPercent(serverSpectrum.data.thd)}.` : ''}
            {study && serverSpectrum.isError ? ` Server spectrum unavailable: ${errorMessage(serverSpectrum.error)}` : ''}
          </p>
          {outcome.preview ? (
            <StudyCharts preview={outcome.preview} fileStem={draft.name.replace(/\W+/g, '-').toLowerCase() || 'study'} />
          ) : (
            <ErrorState error={new Error(outcome.errors.map((e) => e.message).join('; ') || 'No preview')} />
          )}
        </div>
      </div>
    </div>
  );
}
