import { useState } from 'react';
import type { TimerTable } from '@pulsewright/modulation';
import { Button } from '../../../components/ui/Button';
import { NumberField } from '../../../components/ui/Field';
import { Panel } from '../../../components/ui/Panel';
import { downloadText } from '../../../lib/download';
import { formatNumber, formatPercent } from '../../../lib/format';
import { compensationOf, timerTableExports } from '../model/timerTables';

/**
 * Dead-time compensation of the table: every compare value moved by the dead time's ticks, by
 * the sign of the phase current predicted at the chosen load angle (the library's
 * `deadTimeCompensation`; T. Murai et al., IEEE Trans. Ind. Appl., 1987). Shows the first
 * output's fundamental and low orders with no dead time, with it, and corrected, as the library
 * computes them from the exact waveforms, and downloads the corrected table.
 */
export function DeadTimeCompensationPanel({
  table,
  fileStem,
  prefix,
}: {
  table: TimerTable;
  fileStem: string;
  prefix: string;
}) {
  const [angleDegrees, setAngleDegrees] = useState(30);
  if (table.deadTimeCounts === 0) return null;
  const outcome = compensationOf(table, (angleDegrees * Math.PI) / 180);
  const result = outcome.result;
  const rows = result
    ? [
        { name: 'No dead time', figures: result.ideal },
        { name: 'Dead time', figures: result.uncompensated },
        { name: 'Dead time, corrected', figures: result.compensated },
      ]
    : [];
  const corrected = result ? timerTableExports(result.table) : null;
  return (
    <Panel
      title="Dead-time compensation"
      actions={
        corrected ? (
          <>
            <Button
              variant="secondary"
              onClick={() => downloadText(corrected.csv(), `${fileStem}-corrected.csv`, 'text/csv')}
            >
              Corrected CSV
            </Button>
            <Button
              variant="secondary"
              onClick={() =>
                downloadText(
                  corrected.cHeader(prefix),
                  `${prefix.toLowerCase()}_corrected.h`,
                  'text/x-c',
                )
              }
            >
              Corrected C header
            </Button>
          </>
        ) : null
      }
    >
      <div className="mb-2 max-w-xs">
        <NumberField
          label="Predicted load angle (current lagging)"
          unit="°"
          value={angleDegrees}
          onChange={setAngleDegrees}
          error={outcome.error?.message}
        />
      </div>
      {result ? (
        <>
          <p className="mb-2 text-sm">
            Each compare value moves by {formatNumber(result.correctionTicks.positive)} ticks of
            high time per carrier period against the dead time's{' '}
            {formatNumber(result.deadTimeTicks.positive)}, by the sign of the predicted current;
            clamped entries are left alone. A wrong load angle makes the error worse, not better:
            check the corrected table on the bench.
          </p>
          <table className="num w-full text-xs" aria-label="Compensation figures">
            <thead className="text-left text-ink-soft">
              <tr>
                <th className="font-medium">Output</th>
                <th className="font-medium">Fundamental (V peak)</th>
                {result.ideal.harmonics.map((h) => (
                  <th key={h.order} className="font-medium">
                    Order {h.order} (V)
                  </th>
                ))}
                <th className="font-medium">THD</th>
              </tr>
            </thead>
            <tbody>
              {rows.map(({ name, figures }) => (
                <tr key={name} className="border-t border-rule/60">
                  <td className="font-sans">{name}</td>
                  <td>{formatNumber(figures.fundamental)}</td>
                  {figures.harmonics.map((h) => (
                    <td key={h.order}>{formatNumber(h.amplitude)}</td>
                  ))}
                  <td>{formatPercent(figures.thd)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </>
      ) : null}
    </Panel>
  );
}
