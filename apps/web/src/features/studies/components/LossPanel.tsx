import { StackedBarChart } from '../../../components/charts/StackedBarChart';
import type { StudyReport } from '../../../lib/api';
import { formatNumber, formatPercent } from '../../../lib/format';

type Losses = NonNullable<StudyReport['losses']>;
type LegLosses = Losses['legs'][number];

const DEVICES = [
  ['upperTransistor', 'upper transistor'],
  ['upperDiode', 'upper diode'],
  ['lowerTransistor', 'lower transistor'],
  ['lowerDiode', 'lower diode'],
] as const satisfies readonly (readonly [keyof LegLosses, string])[];

const PARTS = [
  { name: 'conduction', color: 'var(--color-trace-out)' },
  { name: 'switching', color: 'var(--color-signal)' },
];

/**
 * The semiconductor losses of a design with a device: a bar per device of each leg (conduction
 * and switching stacked, watts) and the totals with the output power and efficiency. Draws what
 * the report holds; nothing is computed here but the bars' order.
 */
export function LossPanel({ report, fileStem }: { report: StudyReport; fileStem: string }) {
  const { losses } = report;
  if (!losses) return null;
  const bars = losses.legs.flatMap((leg) =>
    DEVICES.map(([key, label]) => ({
      name: `${leg.name}, ${label}`,
      values: [leg[key].conduction, leg[key].switching],
    })),
  );
  return (
    <section aria-label="Semiconductor losses" className="flex flex-col gap-2">
      <StackedBarChart
        title={`Losses by device (${losses.deviceKind === 'igbt' ? 'IGBT and diode' : 'MOSFET'})`}
        fileName={`${fileStem}-losses`}
        bars={bars}
        parts={PARTS}
        unit="W"
      />
      <div className="rounded-md border border-rule bg-panel px-3 py-2">
        <table className="w-full text-xs" aria-label="Loss figures">
          <tbody className="num">
            <tr className="border-t border-rule/60">
              <th className="text-left font-sans font-medium">Conduction (W)</th>
              <td data-figure="conduction">{formatNumber(losses.conduction)}</td>
            </tr>
            <tr className="border-t border-rule/60">
              <th className="text-left font-sans font-medium">Switching (W)</th>
              <td data-figure="switching">{formatNumber(losses.switching)}</td>
            </tr>
            <tr className="border-t border-rule/60">
              <th className="text-left font-sans font-medium">Total (W)</th>
              <td data-figure="total">{formatNumber(losses.total)}</td>
            </tr>
            <tr className="border-t border-rule/60">
              <th className="text-left font-sans font-medium">Output power (W)</th>
              <td data-figure="output power">{formatNumber(losses.outputPower)}</td>
            </tr>
            <tr className="border-t border-rule/60">
              <th className="text-left font-sans font-medium">Efficiency</th>
              <td data-figure="efficiency">
                {losses.efficiency === null ? '—' : formatPercent(losses.efficiency, 3)}
              </td>
            </tr>
          </tbody>
        </table>
        <p className="text-xs text-ink-soft">
          From the phase currents above and the exact leg waveforms: conduction over the period,
          switching at each edge with the current there, energies scaled linearly with voltage and
          current from the datasheet point (common practice). Switching loss grows in proportion to
          the carrier frequency. No temperature, dead time or stray inductance is modelled: check
          with measurement and the device maker&apos;s thermal data.
        </p>
      </div>
    </section>
  );
}
