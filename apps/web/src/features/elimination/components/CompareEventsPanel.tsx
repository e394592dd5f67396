import { useState } from 'react';
import { Button } from '../../../components/ui/Button';
import { NumberField } from '../../../components/ui/Field';
import { Panel } from '../../../components/ui/Panel';
import { errorMessage, fieldErrorOf, usePatternCompareEvents } from '../../../lib/api';
import { formatNumber, formatPercent } from '../../../lib/format';
import type { SolvedPattern } from '../model/eliminationForm';

/**
 * The picked pattern at one operating point (POST /api/v1/pattern-compare-events): every
 * device's on and off ticks over one period for a timer clock, fundamental frequency and dead
 * time, and what rounding to ticks and the dead time do to the fundamental and the eliminated
 * orders, as the service computes them.
 */
export function CompareEventsPanel({
  pattern,
  angles,
}: {
  pattern: SolvedPattern;
  angles: number[];
}) {
  const [form, setForm] = useState({ fundamentalFrequency: 50, timerClock: 72e6, deadTime: 1e-6 });
  const events = usePatternCompareEvents();
  const set = (key: keyof typeof form) => (value: number) =>
    setForm((f) => ({ ...f, [key]: value }));
  const error = (field: string) => fieldErrorOf(events.error, field);
  const result = events.data;
  return (
    <Panel title="Compare events at one operating point">
      <div className="grid gap-3 sm:grid-cols-3">
        <NumberField
          label="Fundamental frequency"
          unit="Hz"
          value={form.fundamentalFrequency}
          onChange={set('fundamentalFrequency')}
          error={error('fundamentalFrequency')}
        />
        <NumberField
          label="Timer clock"
          unit="MHz"
          scale={1e-6}
          value={form.timerClock}
          onChange={set('timerClock')}
          error={error('timerClock')}
        />
        <NumberField
          label="Dead time"
          unit="µs"
          scale={1e6}
          value={form.deadTime}
          onChange={set('deadTime')}
          error={error('deadTime')}
        />
      </div>
      <div className="mt-3">
        <Button
          variant="secondary"
          busy={events.isPending}
          onClick={() =>
            events.mutate({
              pattern: { kind: pattern.kind, vdc: pattern.vdc, angles },
              ...form,
              orders: pattern.orders,
            })
          }
        >
          Compute the events
        </Button>
      </div>
      {events.isError ? (
        <p role="alert" className="mt-2 text-sm text-bad">
          {errorMessage(events.error)}
        </p>
      ) : null}
      {result ? (
        <div className="mt-3 flex flex-col gap-2 text-sm">
          <p data-testid="dead-time-effect">
            {result.ticksPerPeriod} ticks a period, dead time {result.deadTimeTicks} ticks.
            Fundamental {formatNumber(result.ideal.fundamental)} V exact,{' '}
            {formatNumber(result.quantised.fundamental)} V on ticks,{' '}
            {formatNumber(result.realised.fundamental)} V with the dead time (current in phase):{' '}
            {formatNumber(result.deadTimeFundamentalChange)} V.
            {result.realised.orders.length > 0
              ? ` Eliminated orders with the dead time: ${result.realised.orders.map((o) => `${o.order}: ${formatPercent(o.relative, 3)}`).join(', ')} of the fundamental.`
              : ''}
          </p>
          {result.warnings.map((w) => (
            <p key={w} className="text-bad">
              {w}
            </p>
          ))}
          <div className="max-h-60 overflow-auto">
            <table className="num w-full text-xs" aria-label="Compare events">
              <thead>
                <tr className="text-left text-ink-soft">
                  <th className="pr-3">device</th>
                  <th>on / off at tick</th>
                </tr>
              </thead>
              <tbody>
                {result.devices.map((d) => (
                  <tr key={d.device}>
                    <td className="pr-3 whitespace-nowrap">{d.device}</td>
                    <td>{d.events.map((e) => `${e.state} ${e.tick}`).join(', ')}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </div>
      ) : null}
    </Panel>
  );
}
