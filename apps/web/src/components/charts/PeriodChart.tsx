import { line, scaleLinear } from 'd3';
import type { ReactNode } from 'react';
import { periodTracesCsv } from '../../lib/chartCsv';
import { angleAxis, AxisBottom, AxisLeft } from './axes';
import { ChartFrame } from './ChartFrame';
import { ChartLegend } from './ChartLegend';

/** One quantity over one fundamental period: values at the angles (radians). */
export interface PeriodTrace {
  name: string;
  color: string;
  angles: readonly number[];
  values: readonly number[];
  dashed?: boolean;
}

export interface PeriodChartProps {
  title: string;
  fileName: string;
  traces: readonly PeriodTrace[];
  /** Axis label, e.g. `amperes`. */
  unit: string;
  footer?: ReactNode;
  controls?: ReactNode;
  /** q, the fundamental periods the traces span on [0, 2π] (a report's carrierSpan). @default 1 */
  fundamentalPeriods?: number;
  width?: number;
}

/** Currents or voltages over one period on a shared angle axis (0 to 2π), one line each. */
export function PeriodChart({
  title,
  fileName,
  traces,
  unit,
  footer,
  controls,
  fundamentalPeriods = 1,
  width = 760,
}: PeriodChartProps) {
  const spanned = fundamentalPeriods > 1;
  const height = 240;
  const margin = { top: 12, right: 14, bottom: 36, left: 56 };
  const x = scaleLinear()
    .domain([0, 2 * Math.PI])
    .range([margin.left, width - margin.right]);
  const extent = Math.max(1e-9, ...traces.flatMap((t) => t.values.map(Math.abs)));
  const y = scaleLinear()
    .domain([-extent * 1.08, extent * 1.08])
    .range([height - margin.bottom, margin.top])
    .nice();
  return (
    <ChartFrame
      title={title}
      fileName={fileName}
      controls={controls}
      csv={() => periodTracesCsv(traces, unit)}
      footer={
        <>
          {traces.length > 1 ? <ChartLegend series={traces} swatch="line" /> : null}
          {footer}
        </>
      }
    >
      <svg
        data-chart="period"
        viewBox={`0 0 ${width} ${height}`}
        className="w-full text-ink"
        role="img"
        aria-label={`${title}: ${traces.map((t) => t.name).join(', ')} over ${spanned ? `${fundamentalPeriods} fundamental periods` : 'one period'}`}
      >
        <AxisLeft
          scale={y}
          x={margin.left}
          width={width - margin.left - margin.right}
          label={unit}
          ticks={5}
        />
        {traces.map((t) => (
          <path
            key={t.name}
            data-trace={t.name}
            d={
              line<number>()
                .x((_, i) => x(t.angles[i] ?? 0))
                .y((d) => y(d))(t.values as number[]) ?? ''
            }
            fill="none"
            stroke={t.color}
            strokeWidth={1.4}
            strokeDasharray={t.dashed ? '5 4' : undefined}
          />
        ))}
        <AxisBottom
          scale={x}
          y={height - margin.bottom}
          label={spanned ? `span angle θ/${fundamentalPeriods} (rad)` : 'angle θ (rad)'}
          tickValues={angleAxis(0, 2 * Math.PI).ticks}
          format={angleAxis(0, 2 * Math.PI).format}
        />
      </svg>
    </ChartFrame>
  );
}
