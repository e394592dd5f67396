import { StackedBarChart } from '../../../../components/charts/StackedBarChart';
import type { StudyReport } from '../../../../lib/api';
import { formatNumber } from '../../../../lib/format';

type Losses = NonNullable<NonNullable<StudyReport['multilevel']>['losses']>;

const PARTS = [
  { name: 'conduction', color: 'var(--color-trace-out)' },
  { name: 'switching', color: 'var(--color-signal)' },
];

/**
 * The semiconductor losses of an NPC or T-type bridge with a device, as the report's
 * `multilevel.losses` gives them: a bar per device position of each leg (transistor and diode
 * together, conduction and switching stacked, watts) and the totals by device class with the
 * hottest position of each. Nothing is computed here but the sums of a position's two parts.
 */
export function MultilevelLossPanel({ losses, fileStem }: { losses: Losses; fileStem: string }) {
  const bars = losses.legs.flatMap((leg) =>
    leg.positions.map((p) => ({
      name: `${leg.name}, ${p.position} (${p.deviceClass})`,
      values: [
        p.transistor.conduction + p.diode.conduction,
        p.transistor.switching + p.diode.switching,
      ],
    })),
  );
  return (
    <section aria-label="Multilevel losses" className="flex flex-col gap-2">
      <StackedBarChart
        title={`Losses by device position (${losses.topology === 'npc' ? 'NPC' : 'T-type'})`}
        fileName={`${fileStem}-multilevel-losses`}
        bars={bars}
        parts={PARTS}
        unit="W"
      />
      <div className="rounded-md border border-rule bg-panel px-3 py-2">
        <table className="w-full text-xs" aria-label="Losses by device class">
          <thead className="text-left text-ink-soft">
            <tr>
              <th className="font-medium">Device class</th>
              <th className="font-medium">Positions</th>
              <th className="font-medium">Transistors (W)</th>
              <th className="font-medium">Diodes (W)</th>
              <th className="font-medium">Total (W)</th>
              <th className="font-medium">Hottest position (W)</th>
            </tr>
          </thead>
          <tbody className="num">
            {losses.classes.map((c) => (
              <tr
                key={c.deviceClass}
                className="border-t border-rule/60"
                data-class={c.deviceClass}
              >
                <td className="font-sans">{c.deviceClass}</td>
                <td className="font-sans">{c.positions.join(', ')}</td>
                <td>{formatNumber(c.transistor.total)}</td>
                <td>{formatNumber(c.diode.total)}</td>
                <td>{formatNumber(c.total)}</td>
                <td>{formatNumber(c.hottestPosition)}</td>
              </tr>
            ))}
            <tr className="border-t border-rule/60">
              <th className="text-left font-sans font-medium" colSpan={4}>
                Conduction, switching, total (W)
              </th>
              <td colSpan={2} data-figure="bridge total">
                {formatNumber(losses.conduction)}, {formatNumber(losses.switching)},{' '}
                {formatNumber(losses.total)}
              </td>
            </tr>
          </tbody>
        </table>
        <p className="text-xs text-ink-soft">
          From the phase currents above and the exact leg waveforms: conduction over each
          state&apos;s intervals, switching at each edge with the current there and half the DC link
          commutated, energies scaled linearly from the datasheet point (common practice). No
          temperature, dead time or stray inductance is modelled: check with measurement and the
          device maker&apos;s thermal data.
        </p>
      </div>
    </section>
  );
}
