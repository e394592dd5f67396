import type { StudyReport } from '../../../../lib/api';
import { FigureCards } from '../../../../components/charts/FigureCards';
import { formatNumber } from '../../../../lib/format';

type Multilevel = NonNullable<StudyReport['multilevel']>;

/**
 * The multilevel bridge's figures as the report gives them: topology, levels and carriers, each
 * leg's output levels and edges, and how often each device of leg a turns on (with the mean over
 * every device of every leg, the figure Compare sets equal, and the effective output frequency).
 * Nothing is computed here.
 */
export function MultilevelFiguresPanel({ multilevel }: { multilevel: Multilevel }) {
  return (
    <section
      aria-label="Multilevel bridge"
      className="flex flex-col gap-2 rounded-lg border border-rule bg-panel p-3 shadow-sm"
    >
      <h2 className="text-sm font-semibold tracking-wide uppercase">Multilevel bridge</h2>
      <p className="text-xs text-ink-soft">
        {multilevel.topologyLabel}, {multilevel.levels} levels a leg.
        {multilevel.carriersLabel ? ` Carriers: ${multilevel.carriersLabel}.` : ''}
      </p>
      <FigureCards
        label="Multilevel switching"
        figures={[
          {
            label: 'Mean device switching frequency',
            value: `${formatNumber(multilevel.averageDeviceFrequency)} Hz`,
            note: 'turn-ons per second, mean over every device of every leg',
          },
          {
            label: 'Highest device switching frequency',
            value: `${formatNumber(multilevel.maxDeviceFrequency)} Hz`,
            note: 'the busiest device of the bridge',
          },
          {
            label: 'Effective output frequency',
            value: `${formatNumber(multilevel.effectiveOutputFrequency)} Hz`,
            note: "leg a's output edges per period over 2, times the fundamental",
          },
        ]}
      />
      <div className="grid gap-3 sm:grid-cols-2">
        <table className="w-full text-xs" aria-label="Legs">
          <thead className="text-left text-ink-soft">
            <tr>
              <th className="font-medium">Leg</th>
              <th className="font-medium">Levels (V)</th>
              <th className="font-medium">Edges a period</th>
            </tr>
          </thead>
          <tbody className="num">
            {multilevel.legs.map((leg) => (
              <tr key={leg.name} className="border-t border-rule/60">
                <td className="font-sans">{leg.name}</td>
                <td>{leg.levels.map((v) => formatNumber(v)).join(', ')}</td>
                <td>{leg.edgesPerPeriod}</td>
              </tr>
            ))}
          </tbody>
        </table>
        <table className="w-full text-xs" aria-label="Device switching frequencies">
          <thead className="text-left text-ink-soft">
            <tr>
              <th className="font-medium">Device of leg a</th>
              <th className="font-medium">Turn-ons a period</th>
              <th className="font-medium">Switching frequency (Hz)</th>
            </tr>
          </thead>
          <tbody className="num">
            {multilevel.devices.map((device) => (
              <tr key={device.name} className="border-t border-rule/60">
                <td className="font-sans">{device.name}</td>
                <td>{device.turnOnsPerPeriod}</td>
                <td>{formatNumber(device.frequency)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}
