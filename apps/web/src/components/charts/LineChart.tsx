import type { ReactNode } from 'react';
import { line, scaleLinear, scaleLog } from 'd3';
import { lineSeriesCsv } from '../../lib/chartCsv';
import { formatNumber } from '../../lib/format';
import { AxisBottom, AxisLeft, leftAxisMargin } from './axes';
import { ChartFrame } from './ChartFrame';
import { ChartLegend } from './ChartLegend';

export interface LineSeries {
  name: string;
  color: string;
  x: readonly number[];
  y: readonly number[];
  dashed?: boolean;
}

export interface LineChartProps {
  title: string;
  fileName: string;
  series: readonly LineSeries[];
  xLabel: string;
  yLabel: string;
  width?: number;
  height?: number;
  /** Points become buttons; called with the series index and point index. */
  onPick?: (seriesIndex: number, pointIndex: number) => void;
  picked?: { series: number; point: number } | null;
  yFormat?: (v: number) => string;
  /** A logarithmic y axis (values ≤ 0 are not drawn) or the linear one. @default 'linear' */
  yScale?: 'linear' | 'log';
  /** The y range shown, [low, high] in the series' unit; the lines are clipped to it. @default the data's */
  yDomain?: readonly [number, number] | undefined;
  /** Controls shown in the card's heading (a scale choice), screen only. */
  controls?: ReactNode;
}

/** Several y(x) series on shared linear axes (sweeps against ma, solution branches). */
export function LineChart({
  title,
  fileName,
  series,
  xLabel,
  yLabel,
  width = 760,
  height = 280,
  onPick,
  picked,
  yFormat,
  yScale = 'linear',
  yDomain,
  controls,
}: LineChartProps) {
  const top = 14;
  const bottom = 40;
  const right = 14;
  const xs = series.flatMap((s) => s.x as number[]);
  const ys = series.flatMap((s) => (s.y as number[]).filter(Number.isFinite));
  const positive = ys.filter((v) => v > 0);
  const yRange = [height - bottom, top];
  const y =
    yScale === 'log'
      ? scaleLog()
          .domain(
            yDomain && yDomain[0] > 0
              ? [yDomain[0], yDomain[1]]
              : [Math.min(...positive, 1), Math.max(...positive, 1e-12)],
          )
          .range(yRange)
          .nice()
      : scaleLinear()
          .domain(
            yDomain
              ? [yDomain[0], yDomain[1]]
              : [Math.min(0, ...ys), Math.max(1e-12, ...ys) * 1.05],
          )
          .range(yRange)
          .nice();
  const yTickFormat = yFormat ?? y.tickFormat(5);
  const margin = { top, right, bottom, left: leftAxisMargin(y.ticks(5).map(yTickFormat), 60) };
  const x = scaleLinear()
    .domain([Math.min(...xs, 0), Math.max(...xs, 1)])
    .range([margin.left, width - margin.right])
    .nice();
  const [low, high] = y.domain() as [number, number];
  // Outside the shown range (or ≤ 0 on a log axis) a point is left out, so a line stops at the edge.
  const shown = (d: number) =>
    Number.isFinite(d) && d >= low && d <= high && (yScale === 'linear' || d > 0);
  const path = line<number>().defined(shown);
  return (
    <ChartFrame
      title={title}
      fileName={fileName}
      controls={controls}
      footer={<ChartLegend series={series} swatch="line" />}
      csv={() => lineSeriesCsv(series, xLabel, yLabel)}
    >
      <svg
        data-chart="line"
        data-scale={yScale}
        viewBox={`0 0 ${width} ${height}`}
        className="w-full text-ink"
        role="img"
        aria-label={`${title}: ${series.map((s) => s.name).join(', ')} against ${xLabel}`}
      >
        <AxisLeft
          scale={y}
          x={margin.left}
          width={width - margin.left - margin.right}
          label={yLabel}
          format={yTickFormat}
        />
        {series.map((s, si) => (
          <g key={s.name}>
            <path
              d={path.x((_, i) => x(s.x[i] ?? 0)).y((d) => y(d))(s.y as number[]) ?? ''}
              fill="none"
              stroke={s.color}
              strokeWidth={1.8}
              strokeDasharray={s.dashed ? '5 4' : undefined}
            />
            {onPick
              ? s.y.map((value, pi) =>
                  shown(value) ? (
                    <circle
                      key={pi}
                      cx={x(s.x[pi] ?? 0)}
                      cy={y(value)}
                      r={picked?.series === si && picked.point === pi ? 6 : 3}
                      fill={
                        picked?.series === si && picked.point === pi
                          ? 'var(--color-signal)'
                          : s.color
                      }
                      tabIndex={0}
                      role="button"
                      aria-label={`${s.name}: ${xLabel} ${formatNumber(s.x[pi] ?? 0)}, ${formatNumber(value)}`}
                      className="cursor-pointer"
                      onClick={() => onPick(si, pi)}
                      onKeyDown={(event) => {
                        if (event.key === 'Enter' || event.key === ' ') {
                          event.preventDefault();
                          onPick(si, pi);
                        }
                      }}
                    />
                  ) : null,
                )
              : null}
          </g>
        ))}
        <AxisBottom scale={x} y={height - margin.bottom} label={xLabel} />
      </svg>
    </ChartFrame>
  );
}
