import type { DesignReport, VoltageFigures } from '@pulsewright/modulation';
import { formatNumber, formatPercent, formatRadians } from './formatNumber.js';
import { formatTable } from './formatTable.js';

/** Orders below this fraction of the fundamental are left out of the table unless `all`. */
const SHOWN_FRACTION = 1e-3;

/** The spectrum of one voltage as text a person reads: headline figures, then a table of orders. */
export function formatSpectrum(
  report: DesignReport,
  figures: VoltageFigures,
  all: boolean,
): string {
  const ratio = report.frequencyRatio === null ? '' : `, mf ${report.frequencyRatio}`;
  const thd = figures.exact
    ? `${formatPercent(figures.thd)} % (exact, whole waveform)`
    : `${formatPercent(figures.thd)} % to order ${report.analysisOrder} (≤ ${formatPercent(figures.thdUpperBound)} % over the whole waveform)`;
  const head =
    `${figures.name}: ${report.methodLabel}${ratio}, ${formatNumber(report.fundamentalFrequency)} Hz\n` +
    `fundamental ${formatNumber(figures.fundamental)} V peak (phase ${formatRadians(figures.fundamentalPhase)} rad), rms ${formatNumber(figures.rms)} V\n` +
    `THD ${thd}, WTHD ${formatPercent(figures.wthd)} %, THD of orders 2..${report.maxOrder} ${formatPercent(figures.spectrumThd)} %\n\n`;
  const threshold = all ? -1 : SHOWN_FRACTION * Math.abs(figures.fundamental);
  const shown = figures.spectrum.filter((h) => h.amplitude > threshold);
  const table = formatTable(
    ['order', 'label', 'amplitude (V peak)', '% of fundamental', 'phase (rad)'],
    shown.map((h) => [
      String(h.order),
      h.label,
      formatNumber(h.amplitude),
      figures.fundamental > 0 ? formatNumber((100 * h.amplitude) / figures.fundamental) : '—',
      formatRadians(h.phase),
    ]),
  );
  const left = figures.spectrum.length - shown.length;
  const foot =
    left > 0
      ? `(${left} orders below 0.1 % of the fundamental left out; --all lists them, --json or --csv gives every order in full)\n`
      : '';
  return head + table + foot;
}
