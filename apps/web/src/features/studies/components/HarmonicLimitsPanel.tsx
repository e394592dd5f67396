import { useState } from 'react';
import { Button } from '../../../components/ui/Button';
import { TextField } from '../../../components/ui/Field';
import { Panel } from '../../../components/ui/Panel';
import { errorMessage, fieldErrorOf } from '../../../lib/api';
import { formatPercent } from '../../../lib/format';
import { useCheckHarmonicLimits, type HarmonicLimitRequest } from '../api/studies';

/** Checks the draft's voltage spectrum against the service's harmonic-limit table. */
export function HarmonicLimitsPanel({ modulation }: { modulation: Record<string, unknown> }) {
  const [busVoltage, setBusVoltage] = useState(230);
  const check = useCheckHarmonicLimits();
  const result = check.data;
  return (
    <Panel title="Harmonic limits">
      <div className="flex flex-wrap items-end gap-3">
        <TextField label="Bus voltage at the point of coupling" unit="V rms" type="number" value={busVoltage} onChange={(e) => setBusVoltage(Number(e.target.value))} error={fieldErrorOf(check.error, 'busVoltage')} />
        <Button variant="secondary" busy={check.isPending} onClick={() => check.mutate({ modulation: modulation as HarmonicLimitRequest['modulation'], busVoltage })}>
          Check the spectrum
        </Button>
      </div>
      {check.isError && !fieldErrorOf(check.error, 'busVoltage') ? <p role="alert" className="mt-2 text-sm text-bad">{errorMessage(check.error)}</p> : null}
      {result ? (
        <div className="mt-3 text-sm" data-testid="limit-result">
          <p className={`font-semibold ${result.pass ? 'text-good' : 'text-bad'}`}>{result.pass ? 'Within the limits' : `${result.violations.length} limit(s) exceeded`}</p>
          <p>
            THD to order {result.limits.maxOrder} {formatPercent(result.thd)} against {formatPercent(result.limits.thd, 0)}; worst single order {result.worstIndividual.order} at {formatPercent(result.worstIndividual.ratio)} against {formatPercent(result.limits.individual, 0)} ({result.limits.busRange}).
          </p>
          <p className="mt-1 text-xs text-ink-soft">
            {result.standard.name} {result.standard.edition}, {result.standard.table}
            {result.standard.recalledFromMemory ? ' (recalled from memory: confirm with the standard and the local utility)' : ''}. {result.caution}
          </p>
        </div>
      ) : null}
    </Panel>
  );
}
