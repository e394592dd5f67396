import { useParams } from 'react-router-dom';
import { CAUTION_TEXT } from '../../../components/ui/Caution';
import { Button } from '../../../components/ui/Button';
import { ErrorState, Loading } from '../../../components/ui/QueryState';
import { formatDate, formatNumber } from '../../../lib/format';
import { roleAtLeast, useMe } from '../../../lib/me';
import { useStudy, useStudyRevisions } from '../api/studies';
import { computePreview } from '../model/computePreview';
import { draftFromStudy, type StudyDraft } from '../model/studyDraft';
import { ShareReportForm } from './ShareReportForm';
import { StudyCharts } from './StudyCharts';

function parameterRows(draft: StudyDraft): [string, string][] {
  if (draft.method === 'selective-harmonic-elimination' && draft.she) {
    const she = draft.she;
    return [
      ['Method', draft.method],
      ['Pattern', she.kind],
      ['DC level', `${formatNumber(draft.vdc)} V`],
      ['First-quarter angles', she.angles.map((a) => `${formatNumber((a * 180) / Math.PI, 6)}°`).join(', ')],
      ['Eliminated orders', she.eliminate.join(', ') || '—'],
      ...(she.fundamental !== undefined ? ([['Solved for', `${formatNumber(she.fundamental)} V peak`]] as [string, string][]) : []),
      ['Fundamental', `${formatNumber(draft.frequency)} Hz`],
      ['Load R', `${formatNumber(draft.r)} Ω`],
      ['Load L', `${formatNumber(draft.l * 1e3)} mH`],
    ];
  }
  const rows: [string, string][] = [
    ['Method', draft.method],
    ...(draft.method === 'sine-triangle' ? ([['Bridge scheme', draft.scheme]] as [string, string][]) : []),
    ...(draft.method === 'three-phase' ? ([['Zero sequence', draft.zeroSequence]] as [string, string][]) : []),
    ...(draft.method === 'space-vector' ? ([['Switching sequence', draft.sequence]] as [string, string][]) : []),
    ...(draft.method !== 'space-vector' ? ([['Sampling', draft.sampling]] as [string, string][]) : []),
    ['DC bus', `${formatNumber(draft.vdc)} V`],
    ['Modulation index ma', formatNumber(draft.ma)],
    ['Frequency ratio mf', String(draft.mf)],
    ['Fundamental', `${formatNumber(draft.frequency)} Hz`],
    ['Load R', `${formatNumber(draft.r)} Ω`],
    ['Load L', `${formatNumber(draft.l * 1e3)} mH`],
    ['Back-EMF', `${formatNumber(draft.emf)} V peak at ${formatNumber((draft.emfPhase * 180) / Math.PI)}°`],
  ];
  if (draft.filterOn) rows.push(['Filter L', `${formatNumber(draft.filterL * 1e3)} mH`], ['Filter C', `${formatNumber(draft.filterC * 1e6)} µF`], ['Filter damping R', `${formatNumber(draft.filterR)} Ω`]);
  return rows;
}

/** A printable report of one study: parameters with units, charts, summary, revision, author, cautions. */
export function StudyReportPage() {
  const { studyId } = useParams();
  const study = useStudy(studyId);
  const revisions = useStudyRevisions(studyId);
  const me = useMe();
  if (study.isPending) return <Loading label="Preparing the report…" />;
  if (study.isError) return <ErrorState error={study.error} onRetry={() => study.refetch()} />;
  const draft = draftFromStudy(study.data);
  const { preview, errors } = computePreview(draft);
  const current = revisions.data?.find((r) => r.revision === study.data.revision);
  const link = `${window.location.origin}/studies/${study.data.id}/report`;
  return (
    <article className="mx-auto max-w-4xl bg-panel p-6 shadow-sm print:shadow-none">
      <div className="no-print mb-4 flex flex-wrap gap-2">
        <Button onClick={() => window.print()}>Print</Button>
        <Button variant="secondary" onClick={() => navigator.clipboard?.writeText(link)}>
          Copy link
        </Button>
      </div>
      <ShareReportForm studyId={study.data.id} canShare={roleAtLeast(me.data?.role, 'engineer')} />
      <header className="mb-4 border-b border-rule pb-3">
        <p className="text-xs tracking-wide text-ink-soft uppercase">Pulsewright study report</p>
        <h1 className="text-2xl font-semibold">{study.data.name}</h1>
        <p className="text-sm text-ink-soft">
          Revision {study.data.revision}
          {current ? ` by ${current.authorEmail ?? 'unknown'} on ${formatDate(current.createdAt)}` : ''} · printed {formatDate(new Date().toISOString())}
        </p>
        {study.data.note ? <p className="mt-2 text-sm">{study.data.note}</p> : null}
      </header>
      <section aria-label="Caution" className="mb-4 border-l-4 border-signal bg-signal-soft p-3 text-sm">
        <strong>Caution.</strong> {CAUTION_TEXT}
      </section>
      <section className="mb-4">
        <h2 className="mb-2 text-sm font-semibold tracking-wide uppercase">Parameters</h2>
        <table className="text-sm">
          <tbody>
            {parameterRows(draft).map(([label, value]) => (
              <tr key={label} className="border-t border-rule/60">
                <th scope="row" className="py-0.5 pr-6 text-left font-normal text-ink-soft">{label}</th>
                <td className="num py-0.5">{value}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </section>
      {errors.length ? <ErrorState error={new Error(errors.map((e) => e.message).join('; '))} /> : null}
      {preview ? <StudyCharts preview={preview} fileStem={`report-${study.data.id.slice(0, 8)}`} /> : null}
    </article>
  );
}
