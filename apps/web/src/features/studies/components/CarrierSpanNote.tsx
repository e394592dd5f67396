import type { StudyReport } from '../../../lib/api';
import { formatNumber } from '../../../lib/format';

/**
 * What a report of a carrier that is no whole multiple of the fundamental states (its
 * `carrierSpan`): the ratio p/q, the carrier analysed and its distance from the one entered, and
 * the span of q fundamental periods every figure and chart covers. Nothing for a whole ratio.
 */
export function CarrierSpanNote({ report }: { report: StudyReport }) {
  const span = report.carrierSpan;
  if (!span) return null;
  return (
    <p
      role="note"
      className="rounded-md border border-rule bg-panel px-3 py-2 text-sm"
      data-testid="carrier-span"
    >
      Frequency ratio mf = {span.p}/{span.q} ≈ {formatNumber(span.p / span.q, 6)}: the carrier
      analysed is {formatNumber(span.carrierFrequency, 9)} Hz ({formatNumber(span.carrierError, 3)}{' '}
      Hz from the one entered), and the pattern repeats after {span.q} fundamental period
      {span.q === 1 ? '' : 's'} ({span.p} carrier cycles). Every figure is exact over that span; the
      spectra step by {formatNumber(span.baseFrequency, 6)} Hz, with the sub- and inter-harmonics a
      fixed carrier makes (THD counts them), and the charts over time show the whole span across
      their 0–360°.
    </p>
  );
}
