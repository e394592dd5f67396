import { SpectrumChart } from '../../../components/charts/SpectrumChart';
import { Panel } from '../../../components/ui/Panel';
import { formatNumber, formatPercent } from '../../../lib/format';
import type { TimerTable } from '@pulsewright/modulation';
import { firmwareEffectSpectra, type TimerTableOutcome } from '../model/timerTables';

/**
 * What the table does to the output: the fundamental (V) and THD of the ideal duties against the
 * realised table (rounding, minimum pulse, dead time and, when given, the devices' on-state drops
 * together), the drops' own effect, and both spectra.
 */
export function OutputEffectPanels({
  table,
  effects,
  stem,
}: {
  table: TimerTable;
  effects: NonNullable<TimerTableOutcome['effects']>;
  /** File name stem of the spectrum's download. */
  stem: string;
}) {
  const spectra = firmwareEffectSpectra(effects.combined, table.carrierPeriodsPerFundamental);
  return (
    <>
      <Panel title="Effect on the output">
        <p className="text-sm">
          Fundamental {formatNumber(effects.combined.referenceFundamental)} →{' '}
          {formatNumber(effects.combined.realisedFundamental)} V; THD{' '}
          {formatPercent(effects.combined.referenceThd)} →{' '}
          {formatPercent(effects.combined.realisedThd)} (rounding, minimum pulse, dead time
          {effects.onStateDrop ? ' and on-state drops' : ''} together).
        </p>
        {effects.onStateDrop ? (
          <p className="text-sm" data-testid="on-state-drop-effect">
            On-state drops alone (against ideal switches, dead time included): fundamental{' '}
            {formatNumber(effects.onStateDrop.referenceFundamental)} →{' '}
            {formatNumber(effects.onStateDrop.realisedFundamental)} V; THD{' '}
            {formatPercent(effects.onStateDrop.referenceThd)} →{' '}
            {formatPercent(effects.onStateDrop.realisedThd)}.
          </p>
        ) : null}
      </Panel>
      {spectra ? (
        <SpectrumChart
          title="Spectrum: ideal against the table"
          fileName={`${stem}-spectrum`}
          fundamentalFrequency={table.realisedFundamentalFrequency}
          series={[
            {
              name: 'Ideal duties',
              color: 'var(--color-ink)',
              harmonics: spectra.reference,
            },
            {
              name: 'Realised by the table',
              color: 'var(--color-signal)',
              harmonics: spectra.realised,
            },
          ]}
        />
      ) : null}
    </>
  );
}
