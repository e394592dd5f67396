import { scaleBand, scaleLinear } from 'd3';
import { useState } from 'react';
import { toCsv } from '../../lib/download';
import { formatNumber } from '../../lib/format';
import { AxisBottom } from './axes';
import { ChartFrame } from './ChartFrame';
import { ChartLegend } from './ChartLegend';

/** One bar: its name and the value of each part, in the chart's unit. */
export interface StackedBar {
  name: string;
  values: readonly number[];
}

/** One part of every bar (drawn in this colour, stacked in the order given). */
export interface StackedBarPart {
  name: string;
  color: string;
}

/**
 * Horizontal bars, each the stack of its parts (for example the conduction and switching loss of
 * each device), on a linear axis from 0; the value on hover; the data drawn as CSV (one row a
 * bar, one column a part and the total, the unit in the header).
 */
export function StackedBarChart({
  title,
  fileName,
  bars,
  parts,
  unit,
  width = 760,
}: {
  title: string;
  fileName: string;
  bars: readonly StackedBar[];
  parts: readonly StackedBarPart[];
  unit: string;
  width?: number;
}) {
  const [hover, setHover] = useState<number | null>(null);
  const barHeight = 18;
  const margin = { top: 8, right: 24, bottom: 40, left: 150 };
  const height = margin.top + margin.bottom + bars.length * (barHeight + 6);
  const totals = bars.map((b) => b.values.reduce((s, v) => s + v, 0));
  const x = scaleLinear()
    .domain([0, Math.max(1e-12, ...totals)])
    .nice()
    .range([margin.left, width - margin.right]);
  const y = scaleBand<number>()
    .domain(bars.map((_, i) => i))
    .range([margin.top, height - margin.bottom])
    .padding(0.25);
  const csv = () =>
    toCsv(
      ['bar', ...parts.map((p) => `${p.name} (${unit})`), `total (${unit})`],
      bars.map((b, i) => [b.name, ...parts.map((_, k) => b.values[k] ?? 0), totals[i] ?? 0]),
    );
  const hovered = hover === null ? null : bars[hover];
  return (
    <ChartFrame
      title={title}
      fileName={fileName}
      csv={csv}
      footer={
        <div className="flex flex-wrap items-center justify-between gap-2 text-xs">
          <ChartLegend series={parts} swatch="square" />
          <span className="num text-ink-soft" aria-live="polite">
            {hovered
              ? `${hovered.name}: ${parts
                  .map((p, k) => `${p.name} ${formatNumber(hovered.values[k] ?? 0)} ${unit}`)
                  .join(', ')}`
              : ''}
          </span>
        </div>
      }
    >
      <svg
        data-chart
        viewBox={`0 0 ${width} ${height}`}
        className="w-full text-ink"
        role="img"
        aria-label={title}
      >
        <AxisBottom scale={x} y={height - margin.bottom} label={unit} ticks={6} />
        {bars.map((bar, i) => {
          let start = 0;
          const top = y(i) ?? 0;
          return (
            <g
              key={bar.name}
              data-bar={bar.name}
              onMouseEnter={() => setHover(i)}
              onMouseLeave={() => setHover(null)}
            >
              <text
                x={margin.left - 6}
                y={top + y.bandwidth() / 2}
                dy="0.32em"
                textAnchor="end"
                fontSize={10}
                fill="currentColor"
              >
                {bar.name}
              </text>
              {parts.map((part, k) => {
                const value = bar.values[k] ?? 0;
                const x0 = x(start);
                start += value;
                return (
                  <rect
                    key={part.name}
                    data-part={part.name}
                    x={x0}
                    y={top}
                    width={Math.max(0, x(start) - x0)}
                    height={y.bandwidth()}
                    fill={part.color}
                  >
                    <title>{`${bar.name}, ${part.name}: ${formatNumber(value)} ${unit}`}</title>
                  </rect>
                );
              })}
            </g>
          );
        })}
      </svg>
    </ChartFrame>
  );
}
