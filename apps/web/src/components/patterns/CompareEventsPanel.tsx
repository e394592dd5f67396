import { useState, type ReactNode } from 'react';
import { Button } from '../ui/Button';
import { NumberField } from '../ui/Field';
import { Panel } from '../ui/Panel';
import { errorMessage, fieldErrorOf, usePatternCompareEvents } from '../../lib/api';
import { formatNumber, formatPercent } from '../../lib/format';

/** Which pattern: its angles inline, or a saved SHE or optimal-pattern study's, by id. */
export type CompareEventsSource =
  | { pattern: { kind: 'bipolar' | 'staircase'; vdc: number; angles: number[] } }
  | { studyId: string };

export interface CompareEventsPanelProps {
  /** The pattern to time; null while none is chosen (the button is disabled). */
  source: CompareEventsSource | null;
  /** Odd orders to report (the eliminated ones). */
  orders: number[];
  /** Shown above the timer fields (the controller-tables page's study picker). */
  picker?: ReactNode;
}

/**
 * A programmed pattern at one operating point (POST /api/v1/pattern-compare-events): every
 * device's on and off ticks over one period for a timer clock, fundamental frequency and dead
 * time, and what rounding to ticks and the dead time do to the fundamental and the eliminated
 * orders, as the service computes them. Shared by the harmonic-elimination page (the picked
 * point's angles) and the controller-tables page (a saved pattern study).
 */
export function CompareEventsPanel({ source, orders, picker }: CompareEventsPanelProps) {
  const [form, setForm] = useState({ fundamentalFrequency: 50, timerClock: 72e6, deadTime: 1e-6 });
  const events = usePatternCompareEvents();
  const set = (key: keyof typeof form) => (value: number) =>
    setForm((f) => ({ ...f, [key]: value }));
  const error = (field: string) => fieldErrorOf(events.error, field);
  const result = events.data;
  return (
    <Panel title="Compare events at one operating point">
      {picker}
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
          disabled={source === null}
          onClick={() => {
            if (source !== null) events.mutate({ ...source, ...form, orders });
          }}
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
              ? ` Eliminated orders with the dead time: ${result.realised.orders.map((o) => `${o.order}: ${o.relative === null ? '— (no fundamental)' : formatPercent(o.relative, 3)}`).join(', ')} of the fundamental.`
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
