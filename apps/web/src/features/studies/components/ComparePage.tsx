import {
  EQUAL_CONDITION_LABELS,
  EQUAL_CONDITIONS,
  type EqualCondition,
} from '@pulsewright/modulation';
import { useState } from 'react';
import { SelectField } from '../../../components/ui/Field';
import { PageHeader } from '../../../components/ui/Panel';
import { Empty, ErrorState, Loading } from '../../../components/ui/QueryState';
import { CompareFiguresTable, type FigureSort } from './CompareFiguresTable';
import { CompareSpectra, type SpectrumChoice } from './CompareSpectra';
import { CompareStudyPicker } from './CompareStudyPicker';
import { useComparedStudies } from './useComparedStudies';
import { useEqualConditions } from './useEqualConditions';

const CONDITION_OPTIONS = EQUAL_CONDITIONS.map((value) => ({
  value,
  label: EQUAL_CONDITION_LABELS[value],
}));

/**
 * Two or more studies side by side: a table of their report figures and overlaid labelled spectra
 * (from the service), at the condition the user picks: each at its own carrier, or each carrier
 * scaled by the library to the first study's average device switching frequency or switching loss.
 */
export function ComparePage() {
  const { ids, toggle, pending: loading, failed: loadFailed, rows: studied } = useComparedStudies();
  const [condition, setCondition] = useState<EqualCondition>('equal-carrier');
  const conditioned = useEqualConditions(studied, condition);
  const rows = conditioned.rows;
  const pending = loading || conditioned.pending;
  const failed = loadFailed ?? conditioned.failed;
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
          {ids.length > 1 ? (
            <div className="flex flex-wrap items-end gap-3" data-testid="compare-condition">
              <SelectField
                label="Compare at"
                value={condition}
                options={CONDITION_OPTIONS}
                onValueChange={setCondition}
                error={conditioned.refusal ?? undefined}
              />
              <p className="max-w-xl text-xs text-ink-soft">
                {condition === 'equal-carrier'
                  ? 'Each study at the carrier it was designed with.'
                  : `Each carrier scaled so that its ${condition === 'equal-device-frequency' ? 'average device switching frequency' : 'switching loss'} equals the first study's${studied[0] ? ` (${studied[0].study.name})` : ''}, kept as scaled (mf a fraction p/q, reported over its q periods; rounded to a whole mf with a multilevel method); the figures are those of the adjusted designs. Switching loss is proportional to the carrier frequency in the loss model.`}
              </p>
            </div>
          ) : null}
          {rows.length ? (
            <>
              <CompareFiguresTable
                rows={rows}
                sort={sort}
                onSort={setSort}
                condition={EQUAL_CONDITION_LABELS[condition].toLowerCase()}
              />
              <CompareSpectra rows={rows} choice={choice} onChoice={setChoice} />
            </>
          ) : null}
        </div>
      </div>
    </div>
  );
}
