import { useState } from 'react';
import { LineChart } from '../charts/LineChart';
import { Button } from '../ui/Button';
import { NumberField, SelectField, TextField } from '../ui/Field';
import { Panel } from '../ui/Panel';
import {
  errorMessage,
  fieldErrorOf,
  getAngleTableFile,
  useAngleTable,
  type AngleTableDocument,
  type AngleTableRequest,
} from '../../lib/api';
import { downloadText } from '../../lib/download';
import { formatNumber } from '../../lib/format';

/** The pattern an angle table follows, as the API takes it. */
export type AngleTablePatternInput = AngleTableRequest['pattern'];

/** How the number of rows is chosen. */
type RowChoice = 'rows' | 'target';
type Metric = 'eliminated-residual' | 'fundamental-error' | 'wthd-change';

const METRIC_OPTIONS: { value: Metric; label: string }[] = [
  { value: 'eliminated-residual', label: 'Worst eliminated order |Vn|/V1' },
  { value: 'fundamental-error', label: 'Fundamental error |ΔV1|/V1' },
  { value: 'wthd-change', label: 'WTHD change' },
];

const ERROR_SERIES: {
  key: 'worstResidual' | 'fundamentalError' | 'wthdChange';
  name: string;
  color: string;
}[] = [
  { key: 'worstResidual', name: 'worst eliminated order |Vn|/V1', color: '#c2462e' },
  { key: 'fundamentalError', name: 'fundamental error |ΔV1|/V1', color: '#12263a' },
  { key: 'wthdChange', name: 'WTHD change (absolute)', color: '#2a8c82' },
];

export interface AngleTablePanelProps {
  /** The pattern (with the page's own fields), or null while there is none to tabulate. */
  pattern: AngleTablePatternInput | null;
  /** Angles at the start of the range (a point picked on a branch). */
  angles?: number[] | undefined;
  /** The ma range to start with. */
  initialRange?: { from: number; to: number };
  /** The fundamental frequency to start with, hertz. */
  initialFrequency?: number;
}

/**
 * An angle table for a controller (POST /api/v1/angle-tables): N rows or an error target, the ma
 * range, the fixed-point format and the timer; shows per interval the exact error of linear
 * interpolation at its midpoint, the rows, and downloads as CSV, C header or JSON. The service
 * computes every figure; this panel draws what it returns.
 */
export function AngleTablePanel({
  pattern,
  angles,
  initialRange = { from: 0.2, to: 1.0 },
  initialFrequency = 50,
}: AngleTablePanelProps) {
  const [form, setForm] = useState({
    choice: 'rows' as RowChoice,
    rows: 32,
    metric: 'eliminated-residual' as Metric,
    target: 1e-3,
    maxRows: 256,
    from: initialRange.from,
    to: initialRange.to,
    fractionBits: 16,
    timerClock: 72e6,
    fundamentalFrequency: initialFrequency,
    prefix: 'angle_table',
  });
  const build = useAngleTable();
  const [downloadError, setDownloadError] = useState<string | null>(null);
  const optimal = pattern?.method === 'optimal-pattern';
  const metric: Metric =
    optimal && form.metric === 'eliminated-residual' ? 'wthd-change' : form.metric;
  const request: AngleTableRequest | null = pattern
    ? {
        pattern,
        ma: { from: form.from, to: form.to },
        ...(form.choice === 'rows'
          ? { rows: form.rows }
          : { target: { metric, value: form.target }, maxRows: form.maxRows }),
        ...(angles ? { angles } : {}),
        fractionBits: form.fractionBits,
        timerClock: form.timerClock,
        fundamentalFrequency: form.fundamentalFrequency,
        prefix: form.prefix,
      }
    : null;
  // A table answers the pattern it was built for; once the pattern changes it is no longer shown.
  const patternKey = JSON.stringify(pattern);
  const [builtFor, setBuiltFor] = useState<string | null>(null);
  const current = builtFor === patternKey;
  const error = (field: string) => (current ? fieldErrorOf(build.error, field) : undefined);
  const document: AngleTableDocument | undefined = current ? build.data : undefined;
  const download = async (format: 'csv' | 'c-header' | 'json') => {
    if (!request) return;
    setDownloadError(null);
    try {
      if (format === 'json') {
        downloadText(JSON.stringify(document, null, 2), `${form.prefix}.json`, 'application/json');
      } else {
        const text = await getAngleTableFile(request, format);
        downloadText(
          text,
          `${form.prefix}.${format === 'csv' ? 'csv' : 'h'}`,
          format === 'csv' ? 'text/csv' : 'text/x-c',
        );
      }
    } catch (failure) {
      setDownloadError(errorMessage(failure));
    }
  };
  const set =
    <K extends keyof typeof form>(key: K) =>
    (value: (typeof form)[K]) =>
      setForm((f) => ({ ...f, [key]: value }));

  return (
    <Panel title="Angle table for a controller">
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        <SelectField<RowChoice>
          label="Rows"
          value={form.choice}
          onValueChange={set('choice')}
          options={[
            { value: 'rows', label: 'A number of rows' },
            { value: 'target', label: 'The fewest meeting an error target' },
          ]}
        />
        {form.choice === 'rows' ? (
          <NumberField
            label="Number of rows"
            value={form.rows}
            onChange={set('rows')}
            hint="2 to 1024"
            error={error('rows')}
          />
        ) : (
          <>
            <SelectField<Metric>
              label="Error measured"
              value={metric}
              onValueChange={set('metric')}
              options={METRIC_OPTIONS.filter((o) => !optimal || o.value !== 'eliminated-residual')}
              error={error('target.metric')}
            />
            <NumberField
              label="Target"
              value={form.target}
              onChange={set('target')}
              hint="largest midpoint error, a ratio"
              error={error('target.value')}
            />
            <NumberField
              label="Most rows"
              value={form.maxRows}
              onChange={set('maxRows')}
              error={error('maxRows')}
            />
          </>
        )}
        <NumberField
          label="ma from"
          value={form.from}
          onChange={set('from')}
          hint="V1/(L·vdc), in (0, 4/π)"
          error={error('ma.from')}
        />
        <NumberField label="ma to" value={form.to} onChange={set('to')} error={error('ma.to')} />
        <NumberField
          label="Fraction bits"
          value={form.fractionBits}
          onChange={set('fractionBits')}
          hint="Q0.n of the period, 8 to 32"
          error={error('fractionBits')}
        />
        <NumberField
          label="Timer clock"
          unit="MHz"
          scale={1e-6}
          value={form.timerClock}
          onChange={set('timerClock')}
          error={error('timerClock')}
        />
        <NumberField
          label="Fundamental frequency"
          unit="Hz"
          value={form.fundamentalFrequency}
          onChange={set('fundamentalFrequency')}
          error={error('fundamentalFrequency')}
        />
        <TextField
          label="C prefix"
          value={form.prefix}
          onChange={(e) => set('prefix')(e.target.value)}
          error={error('prefix')}
        />
      </div>
      <div className="mt-3 flex flex-wrap items-center gap-2">
        <Button
          onClick={() => {
            if (!request) return;
            setBuiltFor(patternKey);
            build.mutate(request);
          }}
          busy={build.isPending}
          disabled={!request}
        >
          Build the table
        </Button>
        {!pattern ? <span className="text-xs text-ink-soft">Solve a pattern first.</span> : null}
        {document ? (
          <>
            <Button variant="secondary" onClick={() => void download('c-header')}>
              C header
            </Button>
            <Button variant="secondary" onClick={() => void download('csv')}>
              CSV
            </Button>
            <Button variant="secondary" onClick={() => void download('json')}>
              JSON
            </Button>
          </>
        ) : null}
      </div>
      {current && build.isError ? (
        <p role="alert" className="mt-2 text-sm text-bad">
          {errorMessage(build.error)}
        </p>
      ) : null}
      {downloadError ? (
        <p role="alert" className="mt-2 text-sm text-bad">
          {downloadError}
        </p>
      ) : null}
      {document ? <AngleTableResult document={document} /> : null}
    </Panel>
  );
}

/** The table's summary, its midpoint errors against ma and its rows. */
function AngleTableResult({ document }: { document: AngleTableDocument }) {
  const { table, midpointErrors } = document;
  const intervals = midpointErrors?.intervals ?? [];
  const usable = intervals.filter((v) => v.interpolable);
  const series = ERROR_SERIES.map(({ key, name, color }) => ({
    name,
    color,
    x: usable.map((v) => (v.from + v.to) / 2),
    y: usable.map((v) => Math.abs(v[key] ?? Number.NaN)),
  })).filter((s) => s.y.some(Number.isFinite));
  const worst = (value: number | null | undefined) =>
    value === null || value === undefined ? '—' : value.toExponential(2);
  return (
    <div className="mt-4 flex flex-col gap-3">
      <p className="text-sm" data-testid="angle-table-summary">
        {table.message} {table.rows.length} rows, ma step {formatNumber(table.step)}. Worst midpoint
        error: eliminated order {worst(midpointErrors?.worstResidual)}, fundamental{' '}
        {worst(midpointErrors?.worstFundamentalError)}, WTHD{' '}
        {worst(midpointErrors?.worstWthdChange)}.
      </p>
      {series.length > 0 ? (
        <LineChart
          title="Error of linear interpolation at each interval's midpoint"
          fileName="angle-table-midpoint-errors"
          xLabel="ma at the midpoint"
          yLabel="error (ratio)"
          yScale="log"
          series={series}
        />
      ) : null}
      <div className="max-h-72 overflow-auto">
        <table className="num w-full text-xs" aria-label="Angle table rows">
          <thead>
            <tr className="text-left text-ink-soft">
              <th className="pr-3">row</th>
              <th className="pr-3">ma</th>
              {Array.from({ length: table.parameters.count }, (_, k) => (
                <th key={k} className="pr-3">{`α${k + 1} (°)`}</th>
              ))}
              <th className="pr-3">to next row</th>
            </tr>
          </thead>
          <tbody>
            {table.rows.map((row, i) => {
              const interval = intervals[i];
              return (
                <tr key={i} className={row.solved ? '' : 'text-bad'}>
                  <td className="pr-3">{i}</td>
                  <td className="pr-3">{formatNumber(row.ma)}</td>
                  {Array.from({ length: table.parameters.count }, (_, k) => (
                    <td key={k} className="pr-3">
                      {row.solved
                        ? formatNumber(((row.angles[k] ?? Number.NaN) * 180) / Math.PI)
                        : 'no solution'}
                    </td>
                  ))}
                  <td className="pr-3">
                    {interval === undefined
                      ? ''
                      : interval.interpolable
                        ? `residual ${worst(interval.worstResidual)}, ΔV1 ${worst(interval.fundamentalError)}`
                        : `do not interpolate: ${interval.reason}`}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      <p className="text-xs text-ink-soft">
        Idealised angles (ideal switches, no dead time): check the table on the bench, behind
        protection, before it drives a power stage; inverter DC buses and outputs are lethal.
      </p>
    </div>
  );
}
