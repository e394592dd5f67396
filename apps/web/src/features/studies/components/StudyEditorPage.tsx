import { designResonance, type AnalyseDesignOptions } from '@pulsewright/modulation';
import { useCallback, useMemo, useState } from 'react';
import { Link, useLocation, useNavigate, useParams, useSearchParams } from 'react-router-dom';
import { paths } from '../../../config/paths';
import { errorMessage, fieldErrorOf, roleAtLeast, useMe } from '../../../lib/api';
import { formatNumber, formatPercent } from '../../../lib/format';
import { ReadOnlyNotice } from '../../../components/role/ReadOnlyNotice';
import { RoleGate } from '../../../components/role/RoleGate';
import { Button } from '../../../components/ui/Button';
import { PageHeader, Panel } from '../../../components/ui/Panel';
import { ErrorState, Loading } from '../../../components/ui/QueryState';
import {
  useCreateStudy,
  useDuplicateStudy,
  useProjects,
  useStudy,
  useStudyReport,
  useUpdateStudy,
  type Study,
  type StudyCreate,
} from '../../../lib/api';
import {
  defaultDraft,
  designOf,
  draftFormErrors,
  draftOf,
  type StudyDraft,
} from '../model/studyDraft';
import { HarmonicLimitsPanel } from './HarmonicLimitsPanel';
import { ReportCautions } from './ReportCautions';
import { RevisionHistory } from './RevisionHistory';
import { hasAsynchronousCarrier } from '../model/asynchronousCarrier';
import { AsynchronousSpectraPanel } from './AsynchronousSpectraPanel';
import { StudyCharts } from './StudyCharts';
import { StudyForm } from './StudyForm';
import { usePreview } from './usePreview';
import { ExportRecordButton } from './ExportRecordButton';
import { ThreeLevelVectorDiagram } from './multilevel/ThreeLevelVectorDiagram';

/** The study editor: the design on the left, the library's live report on the right. */
export function StudyEditorPage() {
  const { studyId } = useParams();
  const study = useStudy(studyId);
  if (studyId && study.isPending) return <Loading label="Loading the study…" />;
  if (studyId && study.isError)
    return <ErrorState error={study.error} onRetry={() => study.refetch()} />;
  return (
    <StudyEditor key={`${studyId ?? 'new'}-${study.data?.revision ?? 0}`} study={study.data} />
  );
}

/** Fields a save's field errors can land on (the rest are shown above the form). */
const FORM_PATHS = [
  'name',
  'projectId',
  'note',
  'design.vdc',
  'design.fundamentalFrequency',
  'design.carrierFrequency',
  'design.modulation',
  'design.load',
  'design.filter',
];

function StudyEditor({ study }: { study: Study | undefined }) {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const location = useLocation();
  // The editor remounts at each new revision; the save's confirmation travels in the history state.
  const savedRevision = (location.state as { savedRevision?: number } | null)?.savedRevision;
  const me = useMe();
  const projects = useProjects();
  const canEdit = roleAtLeast(me.data?.role, 'engineer');
  const [draft, setDraft] = useState<StudyDraft>(() =>
    study ? draftOf(study.design, study) : defaultDraft(params.get('projectId') ?? ''),
  );
  const [dirty, setDirty] = useState(false);
  const onChange = useCallback((patch: Partial<StudyDraft>) => {
    setDraft((current) => ({ ...current, ...patch }));
    setDirty(true);
  }, []);
  // Pick the first project for a new study once the list arrives.
  if (!study && !draft.projectId && projects.data?.[0])
    setDraft((d) => ({ ...d, projectId: projects.data[0]?.id ?? '' }));

  const design = useMemo(() => designOf(draft), [draft]);
  const [busVoltage, setBusVoltage] = useState<number | undefined>(undefined);
  const options = useMemo<AnalyseDesignOptions>(
    () => (busVoltage === undefined ? {} : { busVoltage }),
    [busVoltage],
  );
  const preview = usePreview(design, options);
  const saved = useStudyReport(study?.id);
  const create = useCreateStudy();
  const update = useUpdateStudy();
  const duplicate = useDuplicateStudy();
  const saveError = study ? update.error : create.error;
  const formErrors = draftFormErrors(draft);
  // The bus voltage is an option of the check, not part of the design: its refusal does not stop a save.
  const designErrors = (preview?.errors ?? []).filter((e) => e.field !== 'busVoltage');
  const blocked = !preview || preview.stale || designErrors.length > 0 || formErrors.length > 0;

  const save = () => {
    if (blocked) return;
    const content: StudyCreate = {
      projectId: draft.projectId,
      name: draft.name,
      note: draft.note,
      design,
    };
    if (study) {
      const { projectId: _projectId, ...rest } = content;
      update.mutate(
        { id: study.id, body: { ...rest, baseRevision: study.revision } },
        {
          onSuccess: (next) =>
            navigate(location.pathname, { replace: true, state: { savedRevision: next.revision } }),
        },
      );
    } else {
      create.mutate(content, {
        onSuccess: (created) =>
          navigate(paths.study.getHref(created.id), {
            replace: true,
            state: { savedRevision: created.revision },
          }),
      });
    }
  };

  const saving = create.isPending || update.isPending;
  const generalSaveError = saveError && !FORM_PATHS.some((f) => fieldErrorOf(saveError, f));
  const report = preview?.report ?? null;
  const fileStem = draft.name.replace(/\W+/g, '-').toLowerCase() || 'study';

  return (
    <div>
      <PageHeader
        title={study ? study.name : 'New study'}
        subtitle={
          study
            ? `Revision ${study.revision} · ${study.method}`
            : 'Choose a method and its parameters; the preview follows every change.'
        }
        actions={
          <>
            {study ? (
              <>
                <Link
                  className="rounded-md border border-rule px-3 py-1.5 text-sm"
                  to={paths.studyReport.getHref(study.id)}
                >
                  Printable report
                </Link>
                <Link
                  className="rounded-md border border-rule px-3 py-1.5 text-sm"
                  to={paths.compare.getHref([study.id])}
                >
                  Compare
                </Link>
                <ExportRecordButton studyId={study.id} fileStem={fileStem} />
                {canEdit ? (
                  <Button
                    variant="secondary"
                    busy={duplicate.isPending}
                    onClick={() =>
                      duplicate.mutate(
                        { id: study.id, name: `${study.name} (copy)`.slice(0, 120) },
                        { onSuccess: (copy) => navigate(paths.study.getHref(copy.id)) },
                      )
                    }
                  >
                    Duplicate
                  </Button>
                ) : null}
              </>
            ) : null}
            <RoleGate role="engineer">
              <Button
                onClick={save}
                busy={saving}
                disabled={blocked}
                title={blocked ? 'Correct the marked fields to save' : undefined}
              >
                {study ? 'Save revision' : 'Create study'}
              </Button>
            </RoleGate>
          </>
        }
      />
      <ReadOnlyNotice
        can="you can read this design as saved, its live report, limit check and revisions, compare it and print its report"
        needs="Creating, saving, duplicating and restoring studies need"
      />
      {generalSaveError ? (
        <div className="mb-3">
          <ErrorState error={saveError} />
        </div>
      ) : null}
      {canEdit && (designErrors.length > 0 || formErrors.length > 0) ? (
        <p role="status" className="mb-3 text-sm text-bad" data-testid="save-blocked">
          {study ? 'Save revision' : 'Create study'} waits until the marked fields are corrected.
        </p>
      ) : null}
      {savedRevision && savedRevision === study?.revision && !dirty ? (
        <p role="status" className="mb-3 text-sm text-good">
          Saved as revision {savedRevision}.
        </p>
      ) : null}

      <div className="grid gap-5 lg:grid-cols-[360px_minmax(0,1fr)]">
        <div className="flex flex-col gap-4">
          <Panel>
            <StudyForm
              draft={draft}
              onChange={onChange}
              readOnly={!canEdit && Boolean(me.data)}
              projects={projects.data ?? []}
              saveError={saveError}
              previewErrors={[...designErrors, ...(dirty ? formErrors : [])]}
              filterResonance={report ? designResonance(report) : undefined}
            />
          </Panel>
          {report ? (
            <HarmonicLimitsPanel
              report={report}
              busVoltage={busVoltage}
              onBusVoltage={setBusVoltage}
              busVoltageError={preview?.errors.find((e) => e.field === 'busVoltage')?.message}
            />
          ) : null}
          {study ? <RevisionHistory study={study} canEdit={canEdit} /> : null}
        </div>
        <div className="flex min-w-0 flex-col gap-4" aria-live="off">
          <p className="text-xs text-ink-soft" data-testid="preview-time">
            {preview
              ? `Live report by the library in this browser: ${formatNumber(preview.milliseconds, 3)} ms${preview.stale ? ' (updating…)' : ''}.`
              : 'Computing the live report…'}
            {study && saved.data
              ? ` Saved revision on the server: THD ${formatPercent(saved.data.bridge.thd)} (exact, ${saved.data.bridge.name}).`
              : ''}
            {study && saved.isError
              ? ` Server report unavailable: ${errorMessage(saved.error)}`
              : ''}
          </p>
          {report ? (
            <>
              <ReportCautions cautions={report.cautions} except={[report.limitCheck.caution]} />
              <StudyCharts report={report} fileStem={fileStem} />
              {report.multilevel?.vectorDiagram ? (
                <ThreeLevelVectorDiagram
                  data={report.multilevel.vectorDiagram}
                  fileStem={fileStem}
                />
              ) : null}
            </>
          ) : preview ? (
            // Each refusal is on its field (or listed above the form) in the field's unit; the
            // library's own words (SI, "got NaN" for an emptied box) are not repeated here.
            <p
              role="status"
              className="rounded-md border border-rule bg-panel px-3 py-2 text-sm"
              data-testid="preview-waits"
            >
              The live report waits until the fields marked on the left are corrected.
            </p>
          ) : (
            <Loading label="Computing the live report…" />
          )}
          {hasAsynchronousCarrier(draft) && !report?.carrierSpan ? (
            <AsynchronousSpectraPanel design={design} />
          ) : null}
        </div>
      </div>
    </div>
  );
}
