import { Button } from '../../../components/ui/Button';
import { Panel } from '../../../components/ui/Panel';
import { downloadText } from '../../../lib/download';
import { formatNumber } from '../../../lib/format';
import type { TimerTable } from '@pulsewright/modulation';
import { timerTableExports } from '../model/timerTables';

/**
 * The timer table: period register, length, realised carrier (Hz) and dead time (ticks and ns),
 * the library's warnings, the first 400 entries per channel (duty, high- and low-side compare
 * values, and each entry's compare sense when the table has entries of sense above: the middle
 * phase of azspwm1 and nspwm against the inverted carrier), and JSON, CSV and C header downloads
 * (the header only with a valid name prefix).
 */
export function TimerTablePanel({
  table,
  stem,
  prefix,
  prefixError,
}: {
  table: TimerTable;
  /** File name stem of the downloads. */
  stem: string;
  /** Prefix of the C header's names. */
  prefix: string;
  prefixError: string | undefined;
}) {
  const withSense = table.channels.some((c) => c.sense.includes('above'));
  return (
    <Panel
      title="Table"
      actions={
        <>
          <Button
            variant="secondary"
            onClick={() =>
              downloadText(timerTableExports(table).json(), `${stem}.json`, 'application/json')
            }
          >
            JSON
          </Button>
          <Button
            variant="secondary"
            onClick={() => downloadText(timerTableExports(table).csv(), `${stem}.csv`, 'text/csv')}
          >
            CSV
          </Button>
          <Button
            variant="secondary"
            disabled={prefixError !== undefined}
            title={prefixError ? 'Correct the name prefix first' : undefined}
            onClick={() =>
              downloadText(
                timerTableExports(table).cHeader(prefix),
                `${prefix.toLowerCase()}.h`,
                'text/x-c',
              )
            }
          >
            C header
          </Button>
        </>
      }
    >
      <p className="mb-2 text-sm">
        Period register {table.periodRegister} · {table.parameters.tableLength} entries · carrier
        realised {formatNumber(table.realisedCarrierFrequency)} Hz · dead time{' '}
        {table.deadTimeCounts} ticks ({formatNumber(table.realisedDeadTime * 1e9)} ns)
      </p>
      {withSense ? (
        <p className="mb-2 text-sm" data-testid="compare-sense-note">
          Compare sense per entry: <strong>below</strong>, the high side is on while the counter is
          below its high-side value; <strong>above</strong> (the middle phase, against the inverted
          carrier), while it is above it, the low side below its low-side value. Switch the
          channel&apos;s output polarity at the update event that loads each entry.
        </p>
      ) : null}
      {table.warnings.length ? (
        <ul className="mb-2 list-disc pl-5 text-sm text-signal">
          {table.warnings.map((w) => (
            <li key={w.field + w.message}>{w.message}</li>
          ))}
        </ul>
      ) : null}
      <div className="max-h-72 overflow-auto">
        <table className="num w-full text-xs">
          <thead className="sticky top-0 bg-panel text-left">
            <tr>
              <th scope="col">#</th>
              <th scope="col">angle (rad)</th>
              {table.channels.map((c) => (
                <th key={c.name} scope="col">
                  {c.name}: duty / {withSense ? 'sense / ' : ''}high / low
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {table.entryAngles.slice(0, 400).map((angle, i) => (
              <tr key={i} className="border-t border-rule/50">
                <td>{i}</td>
                <td>{formatNumber(angle)}</td>
                {table.channels.map((c) => (
                  <td key={c.name}>
                    {formatNumber(c.duty[i] ?? 0, 4)} /{' '}
                    {withSense ? (
                      <>{c.sense[i] === 'above' ? <strong>above</strong> : 'below'} / </>
                    ) : null}
                    {c.highSide[i]} / {c.lowSide[i]}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </Panel>
  );
}
