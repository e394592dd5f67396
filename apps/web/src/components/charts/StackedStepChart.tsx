import { curveStepAfter, line, scaleLinear } from 'd3';
import { useId, useState } from 'react';
import { formatNumber } from '../../lib/format';
import { toCsv } from '../../lib/download';
import { angleAxis, AxisBottom, formatRadians } from './axes';
import { ChartFrame } from './ChartFrame';
import { ZoomButtons } from './ZoomButtons';
import { stepPoints, type StepWaveform } from './WaveformChart';

/** One row of a {@link StackedStepChart}: a piecewise-constant period and the levels it takes. */
export interface StepRow {
  name: string;
  waveform: StepWaveform;
  /** The values drawn as grid lines and labelled on the row's axis, ascending. */
  levels: readonly number[];
  /** The unit of the row's values ('V', or '' for a 0/1 state). */
  unit: string;
  /** Drawn as a main trace (a leg's output) or a secondary one (a cell). @default 'main' */
  tone?: 'main' | 'secondary';
}

const TAU = 2 * Math.PI;
/** Pixels a level gets on a row's axis, and the least and most height of a row. */
const LEVEL_SPACING = 16;
const ROW_HEIGHT = { min: 56, max: 220 } as const;
const ROW_GAP = 10;
/** The band above each row that holds its name, pixels. */
const LABEL_BAND = 14;

/** The CSV of the rows: each edge's angle and the value held from it, one row per edge. */
export function stepRowsCsv(rows: readonly StepRow[]): string {
  return toCsv(
    ['signal', 'angle (rad)', 'value from this edge', 'unit'],
    rows.flatMap((row) =>
      row.waveform.edges.map((edge, i) => [
        row.name,
        edge,
        row.waveform.levels[i] ?? '',
        row.unit || 'state',
      ]),
    ),
  );
}

/**
 * Piecewise-constant periods stacked one above the other on a shared angle axis, each on its own
 * vertical scale with its levels as labelled grid lines (a multilevel leg's output and its cells,
 * level by level). The buttons zoom and pan the shared window; the CSV holds every edge.
 */
export function StackedStepChart({
  title,
  fileName,
  rows,
  width = 760,
}: {
  title: string;
  fileName: string;
  rows: readonly StepRow[];
  width?: number;
}) {
  const [window, setWindow] = useState<[number, number]>([0, TAU]);
  const margin = { top: 8, right: 14, bottom: 36, left: 64 };
  const innerWidth = width - margin.left - margin.right;
  const heights = rows.map((row) =>
    Math.min(ROW_HEIGHT.max, Math.max(ROW_HEIGHT.min, row.levels.length * LEVEL_SPACING)),
  );
  const tops = heights.map(
    (_, i) =>
      heights.slice(0, i).reduce((sum, h) => sum + LABEL_BAND + h + ROW_GAP, margin.top) +
      LABEL_BAND,
  );
  const plotBottom = (tops[tops.length - 1] ?? margin.top) + (heights[heights.length - 1] ?? 0);
  const height = plotBottom + margin.bottom;
  const [lo, hi] = window;
  const x = scaleLinear()
    .domain([lo, hi])
    .range([margin.left, margin.left + innerWidth]);
  const clipId = `clip-${useId().replace(/:/g, '')}`;
  const axis = angleAxis(lo, hi);

  const zoomBy = (factor: number) => {
    const centre = (lo + hi) / 2;
    const half = Math.min(TAU / 2, Math.max(1e-4, (hi - lo) / 2 / factor));
    setWindow(clamp(centre - half, centre + half));
  };
  const panBy = (fraction: number) => {
    const shift = fraction * (hi - lo);
    setWindow(clamp(lo + shift, hi + shift));
  };

  return (
    <ChartFrame
      title={title}
      fileName={fileName}
      csv={() => stepRowsCsv(rows)}
      controls={<ZoomButtons onZoom={zoomBy} onPan={panBy} onReset={() => setWindow([0, TAU])} />}
      footer={
        <p className="no-print mt-1 text-xs text-ink-soft">
          Window {formatRadians(lo)} to {formatRadians(hi)} of the fundamental period.
        </p>
      }
    >
      <svg
        data-chart="stacked-steps"
        viewBox={`0 0 ${width} ${height}`}
        className="w-full select-none text-ink"
        role="img"
        aria-label={`${title}: ${rows.map((r) => r.name).join(', ')}`}
      >
        <defs>
          <clipPath id={clipId}>
            <rect x={margin.left} y={0} width={innerWidth} height={height} />
          </clipPath>
        </defs>
        {rows.map((row, i) => {
          const top = tops[i] ?? 0;
          const rowHeight = heights[i] ?? ROW_HEIGHT.min;
          const low = row.levels[0] ?? 0;
          const high = row.levels[row.levels.length - 1] ?? 1;
          const pad = (high - low || 1) * 0.08;
          const y = scaleLinear()
            .domain([low - pad, high + pad])
            .range([top + rowHeight, top]);
          // Label every level while they stay 12 px apart, else every second, third, …
          const every = Math.max(1, Math.ceil(12 / (rowHeight / Math.max(1, row.levels.length))));
          const path = line<[number, number]>()
            .x((d) => x(d[0]))
            .y((d) => y(d[1]))
            .curve(curveStepAfter);
          return (
            <g key={row.name} data-row={row.name}>
              <g aria-hidden>
                <line
                  x1={margin.left}
                  x2={margin.left}
                  y1={top}
                  y2={top + rowHeight}
                  stroke="currentColor"
                  opacity={0.4}
                />
                {row.levels.map((level, k) => (
                  <g key={level} transform={`translate(${margin.left},${y(level)})`}>
                    <line x2={innerWidth} stroke="currentColor" opacity={0.14} />
                    {k % every === 0 || k === row.levels.length - 1 ? (
                      <text x={-6} dy="0.32em" textAnchor="end" fontSize={9} fill="currentColor">
                        {formatNumber(level, 4)}
                      </text>
                    ) : null}
                  </g>
                ))}
              </g>
              <path
                clipPath={`url(#${clipId})`}
                d={path(stepPoints(row.waveform)) ?? ''}
                fill="none"
                stroke={
                  row.tone === 'secondary' ? 'var(--color-trace-carrier)' : 'var(--color-trace-out)'
                }
                strokeWidth={1.2}
              />
              <text x={margin.left + 4} y={top - 4} fontSize={10} fill="currentColor">
                {row.name}
                {row.unit ? ` (${row.unit})` : ''}
              </text>
            </g>
          );
        })}
        <AxisBottom
          scale={x}
          y={plotBottom + 4}
          label="angle θ (rad)"
          tickValues={axis.ticks}
          format={axis.format}
        />
      </svg>
    </ChartFrame>
  );
}

/** A window kept inside one period [0, 2π]. */
function clamp(lo: number, hi: number): [number, number] {
  const span = Math.min(TAU, hi - lo);
  const start = Math.min(Math.max(0, lo), TAU - span);
  return [start, start + span];
}
