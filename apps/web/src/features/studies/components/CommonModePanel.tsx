import type { StudyReport } from '../../../lib/api';
import { WaveformChart } from '../../../components/charts/WaveformChart';
import { formatNumber } from '../../../lib/format';

/**
 * The common-mode voltage of a three-phase design (star point to DC midpoint) with its levels and
 * steps, how often the legs switch, and for a reduced common-mode method the range of ma over which
 * it holds ±Vdc/6. Draws what the report holds; nothing is computed here.
 */
export function CommonModePanel({ report, fileStem }: { report: StudyReport; fileStem: string }) {
  const { commonMode, switching } = report;
  if (!commonMode) return null;
  const range = commonMode.reducedRange;
  return (
    <section aria-label="Common-mode voltage" className="flex flex-col gap-2">
      <WaveformChart
        title="Common-mode voltage"
        output={commonMode.waveform}
        outputName={commonMode.name}
        fileName={`${fileStem}-common-mode`}
        {...(report.carrierSpan ? { fundamentalPeriods: report.carrierSpan.q } : {})}
      />
      <div className="rounded-md border border-rule bg-panel px-3 py-2">
        <table className="w-full text-xs" aria-label="Common-mode figures">
          <tbody className="num">
            <tr className="border-t border-rule/60">
              <th className="text-left font-sans font-medium">Levels (V)</th>
              <td>{commonMode.levels.map((level) => formatNumber(level)).join(', ')}</td>
            </tr>
            <tr className="border-t border-rule/60">
              <th className="text-left font-sans font-medium">RMS (V)</th>
              <td>{formatNumber(commonMode.rms)}</td>
            </tr>
            <tr className="border-t border-rule/60">
              <th className="text-left font-sans font-medium">Steps (dv/dt events)</th>
              <td>
                {formatNumber(commonMode.stepsPerPeriod, 6)} a period
                {commonMode.stepsPerCarrierPeriod !== null
                  ? `, ${formatNumber(commonMode.stepsPerCarrierPeriod)} a carrier period`
                  : ''}
              </td>
            </tr>
            {switching ? (
              <tr className="border-t border-rule/60">
                <th className="text-left font-sans font-medium">Leg switching</th>
                <td>
                  {formatNumber(switching.legEdgesPerPeriod, 6)} edges a period; each switch on{' '}
                  {formatNumber(switching.averageDeviceFrequency)} times a second on average
                </td>
              </tr>
            ) : null}
          </tbody>
        </table>
        {range ? (
          <p className="text-xs text-ink-soft" data-testid="reduced-common-mode-range">
            This method keeps the common mode at ±Vdc/6 for ma from {formatNumber(range.min)} to{' '}
            {formatNumber(range.max)} (A. M. Hava and E. Ün, 2009); outside that range the levels
            above show what it does. It costs more line-voltage ripple than the standard method at
            the same carrier.
          </p>
        ) : null}
      </div>
    </section>
  );
}
