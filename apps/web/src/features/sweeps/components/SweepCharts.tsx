import { useState } from 'react';
import { LineChart } from '../../../components/charts/LineChart';
import { NumberField } from '../../../components/ui/Field';
import { rangeError } from '../../../lib/fieldRange';
import { formatPercent } from '../../../lib/format';
import type { MaSweepResult } from '../../../lib/api';

const selectClass = 'rounded border border-rule bg-panel px-1.5 py-0.5 text-xs';

/** How the THD axis reads: linear from 0, logarithmic, or a range the user picks (percent). */
type DistortionAxis = 'linear' | 'log' | 'range';

/** Bounds of the picked THD range's top, percent: above 0, at most 10,000 %. */
const RANGE_TOP_BOUNDS = { min: 0, minExclusive: true, max: 10_000 };

/** The axis of a distortion ratio in percent, with as many decimals as small values need. */
const percentTick = (ratio: number) =>
  formatPercent(ratio, ratio !== 0 && Math.abs(ratio) < 0.01 ? 2 : 0);

/**
 * The charts of an ma sweep: THD and WTHD on a linear or logarithmic axis or a picked range (so
 * overmodulation's large values do not flatten the useful range), and the amplitude of any
 * tracked harmonic against ma beside the fundamental. Titles and the volts axis name the voltage
 * the service analysed (`bridge output`, `line a−b`); a sweep stored before it was named says so.
 */
export function SweepCharts({ result }: { result: MaSweepResult }) {
  const [axis, setAxis] = useState<DistortionAxis>('log');
  const [rangeTop, setRangeTop] = useState(100);
  const tracked = result.harmonics ?? [];
  const [order, setOrder] = useState<number | null>(tracked[0]?.order ?? null);
  const rangeMessage = rangeError('THD axis top', rangeTop, RANGE_TOP_BOUNDS, { unit: '%' });
  const picked = tracked.find((h) => h.order === order) ?? tracked[0];
  const voltage = result.voltage || 'voltage not recorded';
  return (
    <>
      <LineChart
        title={`THD and WTHD against ma, ${voltage}`}
        fileName="ma-sweep-distortion"
        xLabel="modulation index ma"
        yLabel={axis === 'log' ? 'ratio (log scale)' : 'ratio'}
        yFormat={percentTick}
        yScale={axis === 'log' ? 'log' : 'linear'}
        yDomain={axis === 'range' && !rangeMessage ? [0, rangeTop / 100] : undefined}
        controls={
          <select
            aria-label="THD axis"
            className={selectClass}
            value={axis}
            onChange={(e) => setAxis(e.target.value as DistortionAxis)}
          >
            <option value="log">Log axis</option>
            <option value="linear">Linear axis</option>
            <option value="range">Range I pick</option>
          </select>
        }
        series={[
          {
            name: 'THD, exact over the whole waveform',
            color: 'var(--color-ink)',
            x: result.ma,
            y: result.thd,
          },
          {
            name: 'WTHD, exact over the whole waveform',
            color: 'var(--color-signal)',
            x: result.ma,
            y: result.wthd,
          },
        ]}
      />
      {axis === 'range' ? (
        <div className="no-print max-w-xs">
          <NumberField
            label="THD axis up to"
            unit="%"
            value={rangeTop}
            onChange={setRangeTop}
            error={rangeMessage}
            hint="lines above it are clipped at the top"
          />
        </div>
      ) : null}
      <LineChart
        title={
          picked
            ? `Fundamental and order ${picked.order} against ma, ${voltage}`
            : `Fundamental against ma, ${voltage}`
        }
        fileName="ma-sweep-harmonics"
        xLabel="modulation index ma"
        yLabel={`volts peak, ${voltage}`}
        controls={
          tracked.length ? (
            <select
              aria-label="Harmonic shown"
              className={selectClass}
              value={picked?.order}
              onChange={(e) => setOrder(Number(e.target.value))}
            >
              {tracked.map((h) => (
                <option key={h.order} value={h.order}>
                  order {h.order}
                </option>
              ))}
            </select>
          ) : null
        }
        series={[
          {
            name: 'fundamental',
            color: 'var(--color-trace-ref)',
            x: result.ma,
            y: result.fundamental,
          },
          ...(picked
            ? [
                {
                  name: `order ${picked.order}`,
                  color: 'var(--color-signal)',
                  x: result.ma,
                  y: picked.amplitude,
                  dashed: true,
                },
              ]
            : []),
        ]}
      />
    </>
  );
}
