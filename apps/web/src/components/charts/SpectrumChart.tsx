import { scaleLinear, scaleLog } from 'd3';
import { useState, type ReactNode } from 'react';
import { spectrumCsv } from '../../lib/chartCsv';
import { formatNumber, formatPercent } from '../../lib/format';
import { Button } from '../ui/Button';
import { AxisBottom, AxisLeft, leftAxisMargin } from './axes';
import { ChartFrame } from './ChartFrame';
import { ChartLegend } from './ChartLegend';

export interface SpectrumBar {
  order: number;
  amplitude: number;
  /** Carrier-group label from the library's labelHarmonics (`mf`, `2mf+1`, …). */
  label?: string;
}

export interface SpectrumSeries {
  name: string;
  color: string;
  harmonics: readonly SpectrumBar[];
}

export interface SpectrumChartProps {
  series: readonly SpectrumSeries[];
  title?: string;
  fileName?: string;
  /** Bars at least this fraction of the largest harmonic (order ≥ 2) get their label printed. @default 0.15 */
  labelThreshold?: number;
  width?: number;
  unit?: string;
  /** Controls shown before the scale button (a choice of voltage). */
  controls?: ReactNode;
  /** Frequency of order 1, hertz: when given, the x axis can read in hertz as well as in orders. */
  fundamentalFrequency?: number | undefined;
}

/**
 * Orders drawn: every component but order 0, the mean (the fundamental, the harmonics, and the
 * fractional orders n/q of a spectrum over q periods, sub-harmonics below 1 included).
 */
export function drawnHarmonics(harmonics: readonly SpectrumBar[]): SpectrumBar[] {
  return harmonics.filter((h) => h.order > 0);
}

/** Keeps the tallest bars' labels that do not collide with one already placed (greedy, by amplitude). */
function placeLabels(
  candidates: readonly SpectrumBar[],
  xOf: (h: SpectrumBar) => number,
  minGap = 34,
): SpectrumBar[] {
  const placed: SpectrumBar[] = [];
  for (const h of [...candidates].sort((a, b) => b.amplitude - a.amplitude)) {
    if (placed.every((p) => Math.abs(xOf(p) - xOf(h)) >= minGap)) placed.push(h);
  }
  return placed;
}

/** Harmonic amplitudes as bars, linear or logarithmic, carrier groups labelled, value on hover. */
export function SpectrumChart({
  series,
  title = 'Spectrum',
  fileName = 'spectrum',
  labelThreshold = 0.15,
  width = 760,
  unit = 'V',
  controls,
  fundamentalFrequency,
}: SpectrumChartProps) {
  const [scaleKind, setScaleKind] = useState<'linear' | 'log'>('linear');
  const [axisKind, setAxisKind] = useState<'order' | 'frequency'>('order');
  const inHertz =
    axisKind === 'frequency' &&
    fundamentalFrequency !== undefined &&
    Number.isFinite(fundamentalFrequency) &&
    fundamentalFrequency > 0;
  const [hover, setHover] = useState<number | null>(null);
  const height = 280;
  const all = series.map((s) => drawnHarmonics(s.harmonics));
  const maxOrder = Math.max(1, ...all.flat().map((h) => h.order));
  const peak = Math.max(1e-12, ...all.flat().map((h) => h.amplitude));
  const floor = peak * 1e-5;
  const yRange = [height - 40, 22];
  const y =
    scaleKind === 'linear'
      ? scaleLinear()
          .domain([0, peak * 1.08])
          .range(yRange)
          .nice()
      : scaleLog()
          .domain([floor, peak * 1.5])
          .range(yRange)
          .clamp(true);
  const yFormat = scaleKind === 'log' ? (v: number) => formatNumber(v, 2) : y.tickFormat(5);
  const margin = {
    top: 22,
    right: 14,
    bottom: 40,
    left: leftAxisMargin(y.ticks(5).map(yFormat), 60),
  };
  const x = scaleLinear()
    .domain([0.5, maxOrder + 0.5])
    .range([margin.left, width - margin.right]);
  // The same positions read in hertz: order n sits at n·f₁.
  const f1 = inHertz ? fundamentalFrequency : 1;
  const hertz = scaleLinear()
    .domain([0.5 * f1, (maxOrder + 0.5) * f1])
    .range(x.range());
  const kilohertz = inHertz && (maxOrder + 0.5) * f1 >= 10_000;
  const step = (width - margin.left - margin.right) / maxOrder;
  const barWidth = Math.max(0.6, (step * 0.82) / series.length);
  const base = height - margin.bottom;
  const first = all[0] ?? [];
  const fundamental = first.find((h) => h.order === 1)?.amplitude ?? 0;
  const largestHarmonic = Math.max(0, ...first.filter((h) => h.order >= 2).map((h) => h.amplitude));
  const labelled = placeLabels(
    first.filter(
      (h) =>
        h.label !== undefined &&
        h.order >= 2 &&
        h.amplitude >= labelThreshold * largestHarmonic &&
        largestHarmonic > 0,
    ),
    (h) => x(h.order),
  );
  const hovered =
    hover === null
      ? null
      : series.map((s, i) => ({
          name: s.name,
          color: s.color,
          bar: all[i]?.find((h) => h.order === hover),
        }));
  const hoverWidth = series.length > 1 ? 300 : 200;
  const significant = first.filter((h) => h.amplitude > peak * 1e-3).map((h) => h.order);

  const moveHover = (direction: 1 | -1) => {
    if (!significant.length) return;
    const index = hover === null ? -1 : significant.indexOf(hover);
    const next = significant[Math.min(significant.length - 1, Math.max(0, index + direction))];
    setHover(next ?? null);
  };

  return (
    <ChartFrame
      title={title}
      fileName={fileName}
      csv={() => spectrumCsv(series, unit)}
      controls={
        <>
          {controls}
          {fundamentalFrequency !== undefined ? (
            <Button
              variant="ghost"
              aria-pressed={inHertz}
              onClick={() => setAxisKind(inHertz ? 'order' : 'frequency')}
            >
              {inHertz ? 'Axis in orders' : 'Axis in Hz'}
            </Button>
          ) : null}
          <Button
            variant="ghost"
            aria-pressed={scaleKind === 'log'}
            onClick={() => setScaleKind(scaleKind === 'linear' ? 'log' : 'linear')}
          >
            {scaleKind === 'linear' ? 'Log scale' : 'Linear scale'}
          </Button>
        </>
      }
      footer={series.length > 1 ? <ChartLegend series={series} swatch="square" /> : null}
    >
      <svg
        data-chart="spectrum"
        data-scale={scaleKind}
        data-axis={inHertz ? 'frequency' : 'order'}
        viewBox={`0 0 ${width} ${height}`}
        className="w-full text-ink"
        role="img"
        tabIndex={0}
        aria-label={`${title}: ${first.length} harmonic orders, ${scaleKind} scale. Use the arrow keys to read values.`}
        onKeyDown={(event) => {
          if (event.key === 'ArrowRight') moveHover(1);
          else if (event.key === 'ArrowLeft') moveHover(-1);
          else if (event.key === 'Escape') setHover(null);
          else return;
          event.preventDefault();
        }}
        onMouseLeave={() => setHover(null)}
      >
        <AxisLeft
          scale={y}
          x={margin.left}
          width={width - margin.left - margin.right}
          label={`amplitude (${unit} peak)`}
          ticks={5}
          format={yFormat}
        />
        {series.map((s, i) => (
          <g key={s.name} fill={s.color} data-series={s.name}>
            {(all[i] ?? []).map((h) => {
              const top = y(Math.max(h.amplitude, scaleKind === 'log' ? floor : 0));
              return (
                <rect
                  key={h.order}
                  data-order={h.order}
                  data-bar=""
                  x={x(h.order) - step * 0.41 + i * barWidth}
                  width={barWidth}
                  y={top}
                  height={Math.max(0, base - top)}
                  opacity={hover === null || hover === h.order ? 1 : 0.55}
                  onMouseEnter={() => setHover(h.order)}
                />
              );
            })}
          </g>
        ))}
        <g fontSize={9} fill="currentColor" textAnchor="middle" data-labels="">
          {labelled.map((h) => (
            <text
              key={h.order}
              data-label-order={h.order}
              x={x(h.order)}
              y={y(Math.max(h.amplitude, floor)) - 4}
            >
              {h.label}
            </text>
          ))}
        </g>
        {inHertz ? (
          <AxisBottom
            scale={hertz}
            y={base}
            label={kilohertz ? 'frequency (kHz)' : 'frequency (Hz)'}
            ticks={10}
            format={(v) => formatNumber(kilohertz ? v / 1000 : v, 6)}
          />
        ) : (
          <AxisBottom
            scale={x}
            y={base}
            label="harmonic order"
            ticks={10}
            format={(v) => String(v)}
          />
        )}
        {hovered && hover !== null ? (
          <g
            transform={`translate(${Math.min(x(hover) + 8, width - hoverWidth - 10)},${margin.top})`}
            pointerEvents="none"
          >
            <rect
              width={hoverWidth}
              height={18 + hovered.length * 14}
              rx={4}
              fill="var(--color-panel)"
              stroke="var(--color-rule)"
            />
            <text x={8} y={13} fontSize={10} fontWeight={600} fill="currentColor">
              order {hover}
              {inHertz ? `, ${formatNumber(hover * f1, 6)} Hz` : ''}
              {first.find((h) => h.order === hover)?.label
                ? ` (${first.find((h) => h.order === hover)?.label})`
                : ''}
            </text>
            {hovered.map((entry, i) => (
              <text key={entry.name} x={8} y={27 + i * 14} fontSize={10} fill={entry.color}>
                {series.length > 1 ? `${entry.name}: ` : ''}
                {entry.bar
                  ? `${formatNumber(entry.bar.amplitude)} ${unit}${fundamental > 0 && i === 0 ? ` · ${formatPercent(entry.bar.amplitude / fundamental)} of order 1` : ''}${i > 0 && entry.bar.label !== undefined && entry.bar.label !== first.find((h) => h.order === hover)?.label ? ` (${entry.bar.label})` : ''}`
                  : '—'}
              </text>
            ))}
          </g>
        ) : null}
      </svg>
      <p className="sr-only" aria-live="polite">
        {hover !== null && hovered?.[0]?.bar
          ? `Order ${hover}: ${formatNumber(hovered[0].bar.amplitude)} ${unit}`
          : ''}
      </p>
    </ChartFrame>
  );
}
