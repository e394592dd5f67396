import { Panel } from '../../../components/ui/Panel';
import { formatNumber, formatPercent } from '../../../lib/format';
import type { CaptureComparison } from '../../../lib/api';

/** What a capture was compared over: the service's warnings, the orders, both fundamentals and the ratio's noise floor. */
export function ComparisonNotes({ comparison }: { comparison: CaptureComparison }) {
  return (
    <Panel title="What was compared">
      {comparison.warnings.length ? (
        <ul role="alert" className="mb-2 flex flex-col gap-1 text-sm text-bad">
          {comparison.warnings.map((warning) => (
            <li key={warning}>{warning}</li>
          ))}
        </ul>
      ) : null}
      <p className="text-sm">
        Orders 1 to {comparison.maxOrder} (the study&apos;s third carrier group and its sidebands
        unless asked otherwise) · capture fundamental{' '}
        {formatNumber(comparison.fundamentalFrequency)} Hz, study{' '}
        {formatNumber(comparison.studyFundamentalFrequency)} Hz · capture THD{' '}
        {formatPercent(comparison.measuredThd)} over the orders compared.
      </p>
      <p className="mt-1 text-sm text-ink-soft">
        Measured / predicted is given only where the prediction is above the noise floor,{' '}
        {formatPercent(comparison.ratioFloor)} of the predicted fundamental (
        {formatNumber(comparison.noiseFloor)} V): below it the ratio of two small numbers says
        nothing about the prediction.
      </p>
    </Panel>
  );
}
