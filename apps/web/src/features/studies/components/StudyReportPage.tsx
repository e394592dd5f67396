import { useParams } from 'react-router-dom';
import { Button } from '../../../components/ui/Button';
import { ErrorState, Loading } from '../../../components/ui/QueryState';
import { formatDate } from '../../../lib/format';
import { roleAtLeast, useMe, useStudy, useStudyReport, useStudyRevisions } from '../../../lib/api';
import { DesignTable } from './DesignTable';
import { HarmonicLimitsPanel } from './HarmonicLimitsPanel';
import { ReportCautions } from './ReportCautions';
import { RoleGate } from '../../../components/role/RoleGate';
import { ShareReportForm } from './ShareReportForm';
import { StudyCharts } from './StudyCharts';

/**
 * A printable report of one study: the whole design with units, and every figure, chart and the
 * limit check from the service's design report of the current revision, with revision, author
 * and cautions.
 */
export function StudyReportPage() {
  const { studyId } = useParams();
  const study = useStudy(studyId);
  const report = useStudyReport(studyId);
  const revisions = useStudyRevisions(studyId);
  const me = useMe();
  if (study.isPending) return <Loading label="Preparing the report…" />;
  if (study.isError) return <ErrorState error={study.error} onRetry={() => study.refetch()} />;
  const current = revisions.data?.find((r) => r.revision === study.data.revision);
  const link = `${window.location.origin}/studies/${study.data.id}/report`;
  return (
    <article className="mx-auto max-w-4xl bg-panel p-6 shadow-sm print:max-w-none print:p-0 print:shadow-none">
      <div className="no-print mb-4 flex flex-wrap gap-2">
        <Button onClick={() => window.print()}>Print</Button>
        <Button variant="secondary" onClick={() => navigator.clipboard?.writeText(link)}>
          Copy link
        </Button>
      </div>
      <RoleGate role="engineer">
        <ShareReportForm
          studyId={study.data.id}
          canShare={roleAtLeast(me.data?.role, 'engineer')}
        />
      </RoleGate>
      <header className="mb-4 border-b border-rule pb-3">
        <p className="text-xs tracking-wide text-ink-soft uppercase">Pulsewright study report</p>
        <h1 className="text-2xl font-semibold">{study.data.name}</h1>
        <p className="text-sm text-ink-soft">
          Revision {study.data.revision}
          {current
            ? ` by ${current.authorEmail ?? 'unknown'} on ${formatDate(current.createdAt)}`
            : ''}{' '}
          · printed {formatDate(new Date().toISOString())}
        </p>
        {study.data.note ? <p className="mt-2 text-sm">{study.data.note}</p> : null}
      </header>
      <section className="mb-4" aria-label="Design">
        <h2 className="mb-2 text-sm font-semibold tracking-wide uppercase">Design</h2>
        <DesignTable design={study.data.design} grid={report.data?.grid} />
      </section>
      {report.isPending ? <Loading label="Analysing the design on the service…" /> : null}
      {report.isError ? <ErrorState error={report.error} onRetry={() => report.refetch()} /> : null}
      {report.data ? (
        <div className="flex flex-col gap-4">
          <ReportCautions
            cautions={report.data.cautions}
            except={[report.data.limitCheck.caution]}
          />
          <StudyCharts report={report.data} fileStem={`report-${study.data.id.slice(0, 8)}`} />
          <HarmonicLimitsPanel report={report.data} expanded />
        </div>
      ) : null}
    </article>
  );
}
