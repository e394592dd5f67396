import type { StudyReport } from '../../../lib/api';
import { NumberField } from '../../../components/ui/Field';
import { Panel } from '../../../components/ui/Panel';
import { formatNumber, formatPercent, formatWorstOrder } from '../../../lib/format';
import { limitPointName } from '../model/reportFigures';

/** Digits of the percentages shown for single orders. */
const ORDER_PERCENT_DIGITS = 3;

export interface HarmonicLimitsPanelProps {
  /** The design report whose `limitCheck` is shown. */
  report: StudyReport;
  /** The bus voltage asked for (V rms line to line); undefined uses the report's default, the checked voltage's own. */
  busVoltage?: number | undefined;
  onBusVoltage?: ((value: number | undefined) => void) | undefined;
  /** The library's refusal of the bus voltage, if any. */
  busVoltageError?: string | undefined;
  /** Print the per-order table open (the printed report) instead of behind a disclosure. */
  expanded?: boolean;
}

/**
 * The report's harmonic-limit check of the voltage at the point of coupling (the filter's output
 * where there is one): pass or fail, the table's THD to order 50 and the whole waveform's, the
 * worst order, the note on content above the table, the per-order table and the caution.
 */
export function HarmonicLimitsPanel({
  report,
  busVoltage,
  onBusVoltage,
  busVoltageError,
  expanded = false,
}: HarmonicLimitsPanelProps) {
  const check = report.limitCheck;
  const failed = new Set(check.violations.map((v) => v.order));
  return (
    <Panel title="Harmonic limits">
      <div data-testid="limit-result" data-pass={check.pass ? 'true' : 'false'} className="text-sm">
        <p className={`font-semibold ${check.pass ? 'text-good' : 'text-bad'}`}>
          {check.pass ? 'Within the limits' : `${check.violations.length} limit(s) exceeded`}
        </p>
        <p className="text-xs text-ink-soft">Voltage checked: {limitPointName(report)}</p>
        {onBusVoltage ? (
          <div className="no-print my-2">
            <NumberField
              label="Bus voltage at the point of coupling"
              unit="V rms, line to line"
              value={busVoltage ?? Number.NaN}
              placeholder={formatNumber(check.busVoltage)}
              hint={
                busVoltage === undefined
                  ? `empty: the checked voltage's own, ${formatNumber(check.busVoltage)} V`
                  : undefined
              }
              error={busVoltageError}
              onChange={(v) => onBusVoltage(Number.isNaN(v) ? undefined : v)}
            />
          </div>
        ) : null}
        <dl className="mt-1 grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5 text-xs">
          <dt className="text-ink-soft">Row</dt>
          <dd>
            {check.limits.busRange} (bus {formatNumber(check.busVoltage)} V): each order ≤{' '}
            {formatPercent(check.limits.individual, 1)}, THD ≤ {formatPercent(check.limits.thd, 1)}
          </dd>
          <dt className="text-ink-soft">THD to order {check.limits.maxOrder}</dt>
          <dd
            className={`num ${failed.has('thd') ? 'text-bad' : ''}`}
            data-figure="Limit THD to the table's order"
          >
            {formatPercent(check.thd)}
          </dd>
          <dt className="text-ink-soft">THD, whole waveform</dt>
          <dd
            className={`num ${failed.has('thd-whole-waveform') ? 'text-bad' : ''}`}
            data-figure="Limit THD, whole waveform"
          >
            {formatPercent(check.thdWholeWaveform)}
          </dd>
          <dt className="text-ink-soft">Above order {check.limits.maxOrder}</dt>
          <dd className="num">{formatPercent(check.thdAboveTable)}</dd>
          <dt className="text-ink-soft">Worst single order</dt>
          <dd className="num" data-figure="Limit worst single order">
            {formatWorstOrder(check.worstIndividual, ORDER_PERCENT_DIGITS)}
          </dd>
        </dl>
        {check.note ? (
          <p className="mt-2 rounded bg-signal-soft px-2 py-1 text-xs" data-testid="limit-note">
            {check.note}
          </p>
        ) : null}
        {expanded ? (
          <>
            <h3 className="mt-3 text-xs font-semibold tracking-wide uppercase">
              Order by order to {check.limits.maxOrder}
            </h3>
            <div className="grid grid-cols-1 gap-x-6 text-xs sm:grid-cols-3">
              {[0, 1, 2].map((part) => (
                <OrderTable
                  key={part}
                  rows={check.table.filter(
                    (_, i) => Math.floor((i * 3) / check.table.length) === part,
                  )}
                />
              ))}
            </div>
          </>
        ) : (
          <details className="mt-2 text-xs">
            <summary className="cursor-pointer text-ink-soft">
              Order by order to {check.limits.maxOrder}
            </summary>
            <OrderTable rows={check.table} />
          </details>
        )}
        <p className="mt-2 text-xs text-ink-soft">
          {check.standard.name} {check.standard.edition}, {check.standard.table}
          {check.standard.recalledFromMemory
            ? ' (recalled from memory: confirm with the standard and the local utility)'
            : ''}
          .
        </p>
        <p className="mt-1 text-xs text-ink-soft">{check.caution}</p>
      </div>
    </Panel>
  );
}

function OrderTable({ rows }: { rows: StudyReport['limitCheck']['table'] }) {
  return (
    <table
      className="mt-1 w-full whitespace-nowrap [&_td]:pr-2 [&_th]:pr-2"
      aria-label={`Limit check, orders ${rows[0]?.order ?? ''} to ${rows[rows.length - 1]?.order ?? ''}`}
    >
      <thead className="text-left text-ink-soft">
        <tr>
          <th className="font-medium">Order</th>
          <th className="font-medium">% of order 1</th>
          <th className="font-medium">Limit</th>
          <th className="font-medium">Result</th>
        </tr>
      </thead>
      <tbody className="num">
        {rows.map((row) => (
          <tr key={row.order} className={row.pass ? '' : 'text-bad'}>
            <td>{row.order}</td>
            <td>{formatPercent(row.ratio, ORDER_PERCENT_DIGITS)}</td>
            <td>{formatPercent(row.limit, 1)}</td>
            <td className="font-sans">{row.pass ? 'pass' : 'over'}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
