import { generationRowReason } from '@pulsewright/modulation';
import { useState, type ReactNode } from 'react';
import type { StudyReport } from '../../../lib/api';
import { SpectrumChart } from '../../../components/charts/SpectrumChart';
import { formatNumber, formatPercent, formatWorstOrder } from '../../../lib/format';

type Grid = NonNullable<StudyReport['grid']>;
type Standard = keyof Grid['limits'];

const STANDARD_NAMES: Record<Standard, string> = {
  ieee519: 'IEEE Std 519',
  ieee1547: 'IEEE Std 1547',
};

const selectClass = 'rounded border border-rule bg-panel px-1.5 py-0.5 text-xs';

function Row({ name, children }: { name: string; children: ReactNode }) {
  return (
    <tr className="border-t border-rule/60">
      <th className="text-left font-sans font-medium">{name}</th>
      <td>{children}</td>
    </tr>
  );
}

/**
 * A grid-connected design (the report's `grid`): the grid current's harmonics against the
 * current-distortion limits of IEEE Std 519 or 1547 (as the library recalls them, from memory),
 * the grid and inverter current spectra, the LCL resonance and its distances, the damping loss,
 * the capacitor's current and the power exchanged; when IEEE 519's first row is applied by its
 * footnote for generating equipment although I_SC/I_L is higher, the library's sentence why. Over a carrier span (a ratio p/q) the limits
 * are read on harmonic groups of the n/q components (`harmonicGrouping`): the rule and each
 * group's components are listed with the caution to confirm with the standard and the utility.
 * Draws what the report holds; nothing is computed here but percentages of the reference current.
 */
export function GridPanel({ report, fileStem }: { report: StudyReport; fileStem: string }) {
  const [standard, setStandard] = useState<Standard>('ieee519');
  const { grid } = report;
  if (!grid) return null;
  const check = grid.limits[standard];
  // Why IEEE 519's < 20 row applies to generating equipment although I_SC/I_L is higher.
  const rowReason = generationRowReason(check.row, check.shortCircuitRatio);
  const resonance = grid.resonance;
  // The report names phase a's currents (no phase on a single-phase bridge).
  const gridCurrentName = report.currents[0]?.load?.name ?? 'grid current';
  const inverterCurrentName = report.currents[0]?.inverter.name ?? 'inverter (switch) current';
  return (
    <section aria-label="Grid connection" className="flex flex-col gap-2">
      <SpectrumChart
        title={`Grid current against ${check.standard.name}-${check.standard.edition} (% of the reference current)`}
        unit="%"
        fileName={`${fileStem}-grid-limits`}
        series={[
          {
            name: gridCurrentName,
            color: 'var(--color-ink)',
            harmonics: check.table.map((row) => ({ order: row.order, amplitude: 100 * row.ratio })),
          },
          {
            name: 'limit',
            color: 'var(--color-signal)',
            harmonics: check.table.map((row) => ({ order: row.order, amplitude: 100 * row.limit })),
          },
        ]}
        controls={
          <select
            aria-label="Limits of"
            className={selectClass}
            value={standard}
            onChange={(e) => setStandard(e.target.value as Standard)}
          >
            {(Object.keys(STANDARD_NAMES) as Standard[]).map((key) => (
              <option key={key} value={key}>
                {STANDARD_NAMES[key]}-{grid.limits[key].standard.edition}
              </option>
            ))}
          </select>
        }
      />
      <SpectrumChart
        title={`Grid and inverter currents to order ${report.maxOrder}`}
        unit="A"
        fileName={`${fileStem}-grid-currents`}
        fundamentalFrequency={report.fundamentalFrequency}
        series={[
          {
            name: gridCurrentName,
            color: 'var(--color-ink)',
            harmonics: grid.gridCurrentSpectrum,
          },
          {
            name: inverterCurrentName,
            color: 'var(--color-trace-current)',
            harmonics: grid.inverterCurrentSpectrum,
          },
        ]}
      />
      <div className="rounded-md border border-rule bg-panel px-3 py-2">
        <p className="text-xs" data-testid="grid-verdict">
          {check.pass ? 'Within' : 'Over'} the {check.standard.name}-{check.standard.edition} limits
          ({check.row.label}
          {check.row.byGenerationRule ? ', the row for generating equipment' : ''}):{' '}
          {standard === 'ieee519' ? 'TDD' : 'TRD'} {formatPercent(check.total)} to order{' '}
          {check.standard.maxOrder}, {formatPercent(check.totalWholeWaveform)} over the whole
          waveform, limit {formatPercent(check.totalLimit)}; worst order{' '}
          {formatWorstOrder(check.worstIndividual)}.
          {check.violations.length ? ` ${check.violations.length} figure(s) over their limit.` : ''}
        </p>
        {rowReason ? (
          <p className="text-xs" data-testid="grid-row-reason">
            {rowReason}
          </p>
        ) : null}
        {check.note ? <p className="text-xs">{check.note}</p> : null}
        <table className="mt-2 w-full text-xs" aria-label="Grid figures">
          <tbody className="num">
            <Row name="Grid current (A peak, THD)">
              {formatNumber(grid.gridCurrentFundamental)}, {formatPercent(grid.gridCurrentThd)}
            </Row>
            <Row name="Power into the grid (W, var, power factor)">
              {formatNumber(grid.power)}, {formatNumber(grid.reactivePower)},{' '}
              {formatNumber(grid.powerFactor)}
            </Row>
            <Row name="Short-circuit current (A rms), I_SC/I_L">
              {formatNumber(grid.shortCircuitCurrent)}, {formatNumber(grid.shortCircuitRatio)}
            </Row>
            <Row name="LCL resonance (Hz)">
              {resonance === null ? (
                'none (no filter, or no inductance on the grid side)'
              ) : (
                <>
                  {formatNumber(resonance.frequency)}
                  {resonance.carrierRatio !== null
                    ? `; carrier ${formatNumber(resonance.carrierRatio)}× above it`
                    : ''}
                  {resonance.controlBandwidthRatio !== null
                    ? `; ${formatNumber(resonance.controlBandwidthRatio)}× the control bandwidth`
                    : ''}
                  {resonance.withinLiserreRange === null
                    ? ''
                    : resonance.withinLiserreRange
                      ? '; within 10·f₁ to f_carrier/2'
                      : '; outside 10·f₁ to f_carrier/2'}
                </>
              )}
            </Row>
            <Row name="Damping loss (W, all phases)">{formatNumber(grid.dampingLoss)}</Row>
            {grid.capacitor ? (
              <Row name="Capacitor current (A rms), reactive power supplied (var)">
                {formatNumber(grid.capacitor.fundamentalCurrent)},{' '}
                {formatNumber(grid.capacitor.reactivePower)}
              </Row>
            ) : null}
          </tbody>
        </table>
        {grid.harmonicGrouping ? (
          <HarmonicGrouping grouping={grid.harmonicGrouping} reference={check.referenceCurrent} />
        ) : null}
        <p className="mt-2 text-xs text-ink-soft" data-testid="grid-caution">
          {check.caution}
        </p>
      </div>
    </section>
  );
}

/**
 * The harmonic groups a span's limits were read on: the rule in the report's words, and per group
 * its value, the harmonic's own and the inter- and sub-harmonics it took, in % of the reference.
 */
function HarmonicGrouping({
  grouping,
  reference,
}: {
  grouping: NonNullable<Grid['harmonicGrouping']>;
  reference: number;
}) {
  const pct = (amplitude: number) => formatPercent(amplitude / reference);
  return (
    <details className="mt-2 text-xs" data-testid="grid-grouping">
      <summary>
        Limits read on harmonic groups of the span&apos;s components (IEC 61000-4-7, from memory;
        confirm with the standard and the utility)
      </summary>
      <p className="mt-1">{grouping.rule}</p>
      <table className="mt-1 w-full" aria-label="Harmonic groups">
        <thead>
          <tr className="text-left">
            <th>Order</th>
            <th>Group</th>
            <th>Harmonic alone</th>
            <th>Components grouped (order: % of the reference)</th>
          </tr>
        </thead>
        <tbody className="num">
          {grouping.groups.map((group) => (
            <tr key={group.order} className="border-t border-rule/60">
              <td>{group.order}</td>
              <td>{pct(group.amplitude)}</td>
              <td>{pct(group.harmonicAmplitude)}</td>
              <td>
                {group.grouped
                  .map(
                    (c) =>
                      `${formatNumber(c.order, 4)}: ${pct(c.amplitude)}${c.share === 1 ? '' : ' (half)'}`,
                  )
                  .join(', ')}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </details>
  );
}
