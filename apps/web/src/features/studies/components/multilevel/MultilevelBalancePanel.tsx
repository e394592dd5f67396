import { PeriodChart } from '../../../../components/charts/PeriodChart';
import type { StudyReport } from '../../../../lib/api';
import { formatNumber } from '../../../../lib/format';

type Balance = NonNullable<NonNullable<StudyReport['multilevel']>['balance']>;

/** Coulombs shown as microcoulombs (a carrier period's charge is µC at these currents). */
const MICRO = 1e6;
const TRACE_COLOURS = [
  'var(--color-trace-current)',
  'var(--color-trace-carrier)',
  'var(--color-trace-ref)',
  'var(--color-ink)',
  'var(--color-signal)',
];
const colour = (i: number) => TRACE_COLOURS[i % TRACE_COLOURS.length] ?? 'var(--color-ink)';

const orNone = (value: number | null, unit: string, none: string) =>
  value === null ? none : `${formatNumber(value)} ${unit}`;

/** The NPC/T-type DC midpoint current: its carrier-period averages over the period and its figures. */
function NeutralPoint({
  figures,
  fileStem,
}: {
  figures: NonNullable<Balance['neutralPoint']>;
  fileStem: string;
}) {
  return (
    <PeriodChart
      title="Neutral-point current, carrier-period averages"
      fileName={`${fileStem}-neutral-point`}
      unit="amperes"
      traces={[
        {
          name: 'DC midpoint current, average over each carrier period',
          color: 'var(--color-trace-current)',
          ...figures.carrierAverages,
        },
      ]}
      footer={
        <table className="mt-2 w-full text-xs" aria-label="Neutral-point figures">
          <tbody className="num">
            <tr className="border-t border-rule/60">
              <th className="text-left font-sans font-medium">Mean over the fundamental (A)</th>
              <td>{formatNumber(figures.mean)}</td>
            </tr>
            <tr className="border-t border-rule/60">
              <th className="text-left font-sans font-medium">RMS, pulses included (A)</th>
              <td>{formatNumber(figures.rms)}</td>
            </tr>
            <tr className="border-t border-rule/60">
              <th className="text-left font-sans font-medium">
                Low-frequency ripple, peak-to-peak of the averages (A)
              </th>
              <td>{formatNumber(figures.lowFrequencyRipple)}</td>
            </tr>
            <tr className="border-t border-rule/60">
              <th className="text-left font-sans font-medium">Midpoint voltage ripple</th>
              <td>
                {orNone(figures.midpointVoltageRipple, 'V', 'not given: no DC-link capacitance')}
              </td>
            </tr>
          </tbody>
        </table>
      }
    />
  );
}

/** Each flying capacitor's charge per carrier period (leg a drawn) and every leg's figures. */
function FlyingCapacitors({
  figures,
  fileStem,
}: {
  figures: NonNullable<Balance['flyingCapacitors']>;
  fileStem: string;
}) {
  const legA = figures.legs[0];
  return (
    <PeriodChart
      title={`Flying-capacitor charge per carrier period${legA ? `, ${legA.name}` : ''}`}
      fileName={`${fileStem}-flying-capacitors`}
      unit="microcoulombs"
      traces={(legA?.capacitors ?? []).map((c, i) => ({
        name: c.name,
        color: colour(i),
        angles: c.chargePerCarrierPeriod.angles,
        values: c.chargePerCarrierPeriod.values.map((q) => q * MICRO),
      }))}
      footer={
        <table className="mt-2 w-full text-xs" aria-label="Flying-capacitor figures">
          <thead className="text-left text-ink-soft">
            <tr>
              <th className="font-medium">Capacitor</th>
              <th className="font-medium">Largest charge a carrier period (µC)</th>
              <th className="font-medium">Net charge a period (µC)</th>
              <th className="font-medium">RMS current (A)</th>
              <th className="font-medium">Voltage ripple</th>
            </tr>
          </thead>
          <tbody className="num">
            {figures.legs.flatMap((leg) =>
              leg.capacitors.map((c) => (
                <tr key={`${leg.name}-${c.name}`} className="border-t border-rule/60">
                  <td className="font-sans">
                    {leg.name}, {c.name}
                  </td>
                  <td>{formatNumber(c.maxChargePerCarrierPeriod * MICRO)}</td>
                  <td>{formatNumber(c.netCharge * MICRO)}</td>
                  <td>{formatNumber(c.rmsCurrent)}</td>
                  <td>{orNone(c.voltageRipple, 'V', 'no capacitance given')}</td>
                </tr>
              )),
            )}
          </tbody>
        </table>
      }
    />
  );
}

/** Each cascaded cell source's current and power, string by string, and the spread between cells. */
function CellPower({ figures }: { figures: NonNullable<Balance['cellPower']> }) {
  return (
    <div className="rounded-lg border border-rule bg-panel p-3 shadow-sm">
      <h3 className="text-sm font-semibold tracking-wide uppercase">Cell sources</h3>
      <p className="text-xs text-ink-soft" data-testid="cell-power-spread">
        Spread between the cells of a string (highest − lowest over the mean):{' '}
        {figures.powerSpread === null ? 'none (no power)' : formatNumber(figures.powerSpread)}; 0 is
        an even share.
      </p>
      <table className="mt-2 w-full text-xs" aria-label="Cell source figures">
        <thead className="text-left text-ink-soft">
          <tr>
            <th className="font-medium">Cell</th>
            <th className="font-medium">Mean current (A)</th>
            <th className="font-medium">RMS current (A)</th>
            <th className="font-medium">Power (W)</th>
          </tr>
        </thead>
        <tbody className="num">
          {figures.strings.flatMap((string) => [
            ...string.cells.map((cell) => (
              <tr key={`${string.name}-${cell.name}`} className="border-t border-rule/60">
                <td className="font-sans">
                  {string.name}, {cell.name}
                </td>
                <td>{formatNumber(cell.meanCurrent)}</td>
                <td>{formatNumber(cell.rmsCurrent)}</td>
                <td>{formatNumber(cell.power)}</td>
              </tr>
            )),
            <tr key={`${string.name}-total`} className="border-t border-rule font-semibold">
              <td className="font-sans">{string.name}, all cells</td>
              <td />
              <td />
              <td>{formatNumber(string.power)}</td>
            </tr>,
          ])}
        </tbody>
      </table>
    </div>
  );
}

/**
 * The balance of a multilevel bridge at the design's load, as the report gives it: the NPC or
 * T-type DC midpoint current, the flying capacitors' charge, or the cascaded cells' sources
 * (whichever the topology has). Nothing is computed here; charge is shown in µC.
 */
export function MultilevelBalancePanel({
  balance,
  fileStem,
}: {
  balance: Balance;
  fileStem: string;
}) {
  return (
    <section aria-label="Multilevel balance" className="flex flex-col gap-2">
      {balance.neutralPoint ? (
        <NeutralPoint figures={balance.neutralPoint} fileStem={fileStem} />
      ) : null}
      {balance.flyingCapacitors ? (
        <FlyingCapacitors figures={balance.flyingCapacitors} fileStem={fileStem} />
      ) : null}
      {balance.cellPower ? <CellPower figures={balance.cellPower} /> : null}
    </section>
  );
}
