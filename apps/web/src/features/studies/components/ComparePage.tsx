import { useState } from 'react';
import { PageHeader } from '../../../components/ui/Panel';
import { Empty, ErrorState, Loading } from '../../../components/ui/QueryState';
import { CompareFiguresTable, type FigureSort } from './CompareFiguresTable';
import { CompareSpectra, type SpectrumChoice } from './CompareSpectra';
import { CompareStudyPicker } from './CompareStudyPicker';
import { useComparedStudies } from './useComparedStudies';

/** Two or more studies side by side: a table of their report figures and overlaid labelled spectra (from the service). */
export function ComparePage() {
  const { ids, toggle, pending, failed, rows } = useComparedStudies();
  const [choice, setChoice] = useState<SpectrumChoice>('bridge');
  // The column the figures are sorted by (in the order picked when null), ascending or not.
  const [sort, setSort] = useState<FigureSort | null>(null);

  return (
    <div>
      <PageHeader
        title="Compare studies"
        subtitle="Pick two or more studies: their figures and spectra come from each one's design report, computed by the service at its current revision."
      />
      <div className="grid gap-5 lg:grid-cols-[280px_minmax(0,1fr)]">
        <CompareStudyPicker ids={ids} onToggle={toggle} />
        <div className="flex min-w-0 flex-col gap-4">
          {ids.length < 2 ? (
            <Empty>Select at least two studies to compare their figures and spectra.</Empty>
          ) : null}
          {ids.length > 0 && pending ? <Loading label="Analysing the designs…" /> : null}
          {failed ? <ErrorState error={failed.error} onRetry={() => failed.refetch()} /> : null}
          {rows.length ? (
            <>
              <CompareFiguresTable rows={rows} sort={sort} onSort={setSort} />
              <CompareSpectra rows={rows} choice={choice} onChoice={setChoice} />
            </>
          ) : null}
        </div>
      </div>
    </div>
  );
}
