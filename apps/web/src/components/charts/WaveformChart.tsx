import {
  line,
  curveStepAfter,
  scaleLinear,
  select,
  zoom,
  zoomIdentity,
  type ZoomBehavior,
  type ZoomTransform,
} from 'd3';
import { useEffect, useId, useMemo, useRef, useState, type ReactNode } from 'react';
import { waveformChartCsv } from '../../lib/chartCsv';
import { angleAxis, AxisBottom, AxisLeft, formatRadians } from './axes';
import { ChartFrame } from './ChartFrame';
import { ZoomButtons } from './ZoomButtons';

export interface StepWaveform {
  edges: readonly number[];
  levels: readonly number[];
}

export interface WaveformChartProps {
  title?: string;
  fileName?: string;
  /**
   * Reference and carrier sampled over [0, 2π], per unit of the carrier peak; a multilevel
   * modulator's several carriers in `carriers` (per unit of the reference's full range).
   */
  modulator?:
    | {
        angles: readonly number[];
        reference: readonly number[];
        carrier: readonly number[] | null;
        carriers?: readonly (readonly number[])[] | undefined;
      }
    | undefined;
  /** The switched output (volts). */
  output: StepWaveform;
  outputName: string;
  /** A smooth voltage drawn over the output on the same axes (a filter's output), volts. */
  overlay?: { name: string; angles: readonly number[]; values: readonly number[] } | undefined;
  /** Controls shown before the zoom buttons (a choice of voltage). */
  controls?: ReactNode;
  /**
   * q, the fundamental periods the output spans on [0, 2π] (a report's carrierSpan: span angle
   * θ/q). The modulator, one fundamental period, is then drawn over the first 2π/q. @default 1
   */
  fundamentalPeriods?: number;
  width?: number;
}

const TAU = 2 * Math.PI;

/** The points of a piecewise-constant period for a step line, from 0 to 2π. */
export function stepPoints({ edges, levels }: StepWaveform): [number, number][] {
  if (edges.length === 0) return [];
  const last = levels[levels.length - 1] ?? 0;
  const points: [number, number][] = [[0, last]];
  edges.forEach((edge, i) => points.push([edge, levels[i] ?? 0]));
  points.push([TAU, points[points.length - 1]?.[1] ?? 0]);
  return points;
}

/** Reference and carrier above, the switched output below, over a zoomable, pannable angle window. */
export function WaveformChart({
  title = 'Modulator and output',
  fileName = 'waveform',
  modulator,
  output,
  outputName,
  overlay,
  controls,
  fundamentalPeriods = 1,
  width = 760,
}: WaveformChartProps) {
  const spanned = fundamentalPeriods > 1;
  // Over a span the modulator's period is the first 2π/q of the axis (and of the CSV's angles).
  const shownModulator = useMemo(
    () =>
      modulator && spanned
        ? { ...modulator, angles: modulator.angles.map((a) => a / fundamentalPeriods) }
        : modulator,
    [modulator, spanned, fundamentalPeriods],
  );
  const svgRef = useRef<SVGSVGElement>(null);
  const zoomRef = useRef<ZoomBehavior<SVGSVGElement, unknown> | null>(null);
  const [transform, setTransform] = useState<ZoomTransform>(zoomIdentity);
  const margin = { top: 10, right: 14, bottom: 36, left: 56 };
  const topHeight = modulator ? 150 : 0;
  const gap = modulator ? 18 : 0;
  const bottomHeight = 150;
  const height = margin.top + topHeight + gap + bottomHeight + margin.bottom;
  const innerWidth = width - margin.left - margin.right;

  const baseX = useMemo(
    () =>
      scaleLinear()
        .domain([0, TAU])
        .range([margin.left, margin.left + innerWidth]),
    [innerWidth, margin.left],
  );
  const x = useMemo(() => transform.rescaleX(baseX), [transform, baseX]);

  useEffect(() => {
    const svg = svgRef.current;
    if (!svg) return;
    const behaviour = zoom<SVGSVGElement, unknown>()
      .scaleExtent([1, 200])
      .translateExtent([
        [margin.left, 0],
        [margin.left + innerWidth, height],
      ])
      .extent([
        [margin.left, 0],
        [margin.left + innerWidth, height],
      ])
      .on('zoom', (event: { transform: ZoomTransform }) => setTransform(event.transform));
    zoomRef.current = behaviour;
    select(svg).call(behaviour);
    return () => {
      select(svg).on('.zoom', null);
    };
  }, [innerWidth, height, margin.left]);

  const stepBy = (factor: number) => {
    const svg = svgRef.current;
    if (svg && zoomRef.current) select(svg).call(zoomRef.current.scaleBy, factor);
  };
  const panBy = (fraction: number) => {
    const svg = svgRef.current;
    if (svg && zoomRef.current)
      select(svg).call(zoomRef.current.translateBy, (-fraction * innerWidth) / transform.k, 0);
  };

  const topY = scaleLinear()
    .domain([-1.6, 1.6])
    .range([margin.top + topHeight, margin.top]);
  const levels = output.levels.length ? output.levels : [0];
  const peak = Math.max(1e-9, ...levels.map(Math.abs), ...(overlay?.values ?? []).map(Math.abs));
  const bottomTop = margin.top + topHeight + gap;
  const bottomY = scaleLinear()
    .domain([-peak * 1.15, peak * 1.15])
    .range([bottomTop + bottomHeight, bottomTop])
    .nice();

  const [lo, hi] = x.domain() as [number, number];
  const visible = (angles: readonly number[], values: readonly number[]) => {
    const points: [number, number][] = [];
    angles.forEach((angle, i) => {
      if (angle >= lo - 0.05 && angle <= hi + 0.05) points.push([angle, values[i] ?? 0]);
    });
    return points;
  };
  const topLineOf = (scale: (v: number) => number) =>
    line<[number, number]>()
      .x((d) => x(d[0]))
      .y((d) => scale(d[1]));
  const topLine = topLineOf(topY);
  const stepLine = line<[number, number]>()
    .x((d) => x(d[0]))
    .y((d) => bottomY(d[1]))
    .curve(curveStepAfter);
  const clipId = `clip-${useId().replace(/:/g, '')}`;

  return (
    <ChartFrame
      title={title}
      fileName={fileName}
      csv={() => waveformChartCsv({ output, outputName, overlay, modulator: shownModulator })}
      controls={
        <>
          {controls}
          <ZoomButtons
            onZoom={stepBy}
            onPan={panBy}
            onReset={() => {
              const svg = svgRef.current;
              if (svg && zoomRef.current) select(svg).call(zoomRef.current.transform, zoomIdentity);
            }}
          />
        </>
      }
      footer={
        <p className="no-print mt-1 text-xs text-ink-soft">
          Scroll or pinch to zoom, drag to pan; window {formatRadians(lo)} to {formatRadians(hi)} of
          {spanned
            ? ` the span of ${fundamentalPeriods} fundamental periods (0 to 2π is all ${fundamentalPeriods}; span angle θ/${fundamentalPeriods})${modulator ? `, the modulator drawn over the first period, 0 to ${formatRadians(TAU / fundamentalPeriods)}` : ''}.`
            : ' the fundamental period.'}
        </p>
      }
    >
      <svg
        ref={svgRef}
        data-chart="waveform"
        viewBox={`0 0 ${width} ${height}`}
        className="w-full cursor-grab touch-none select-none text-ink"
        role="img"
        aria-label={`${title}: ${outputName}, ${output.edges.length} switching edges per ${spanned ? `span of ${fundamentalPeriods} periods` : 'period'}`}
      >
        <defs>
          <clipPath id={clipId}>
            <rect x={margin.left} y={0} width={innerWidth} height={height} />
          </clipPath>
        </defs>
        {shownModulator ? (
          <>
            <AxisLeft scale={topY} x={margin.left} width={innerWidth} label="per unit" ticks={4} />
            <g clipPath={`url(#${clipId})`} fill="none" strokeWidth={1.4}>
              {shownModulator.carrier ? (
                <path
                  d={topLine(visible(shownModulator.angles, shownModulator.carrier)) ?? ''}
                  stroke="var(--color-trace-carrier)"
                  strokeWidth={1}
                />
              ) : null}
              {(shownModulator.carriers ?? []).map((carrier, i) => (
                <path
                  key={i}
                  data-carrier={i}
                  d={topLine(visible(shownModulator.angles, carrier)) ?? ''}
                  stroke="var(--color-trace-carrier)"
                  strokeWidth={1}
                  opacity={0.8}
                />
              ))}
              <path
                data-trace="reference"
                d={topLine(visible(shownModulator.angles, shownModulator.reference)) ?? ''}
                stroke="var(--color-trace-ref)"
                strokeWidth={2}
              />
            </g>
            <g fontSize={10} transform={`translate(${margin.left + 8},${margin.top + 10})`}>
              <rect width={10} height={3} y={-4} fill="var(--color-trace-ref)" />
              <text x={14} fill="currentColor">
                reference
              </text>
              {shownModulator.carrier || shownModulator.carriers?.length ? (
                <>
                  <rect x={80} width={10} height={3} y={-4} fill="var(--color-trace-carrier)" />
                  <text x={94} fill="currentColor">
                    {shownModulator.carriers?.length ? 'carriers' : 'carrier'}
                  </text>
                </>
              ) : null}
              {spanned ? (
                <text x={150} fill="currentColor">
                  first of {fundamentalPeriods} fundamental periods
                </text>
              ) : null}
            </g>
          </>
        ) : null}
        <AxisLeft scale={bottomY} x={margin.left} width={innerWidth} label="volts" ticks={4} />
        <g clipPath={`url(#${clipId})`}>
          <path
            d={stepLine(stepPoints(output)) ?? ''}
            fill="none"
            stroke="var(--color-trace-out)"
            strokeWidth={1.3}
          />
          {overlay ? (
            <path
              data-trace={overlay.name}
              d={topLineOf(bottomY)(visible(overlay.angles, overlay.values)) ?? ''}
              fill="none"
              stroke="var(--color-signal)"
              strokeWidth={2}
            />
          ) : null}
        </g>
        <text x={margin.left + 8} y={bottomTop + 12} fontSize={10} fill="currentColor">
          {outputName}
          {overlay ? <tspan fill="var(--color-signal)"> · {overlay.name}</tspan> : null}
        </text>
        <AxisBottom
          scale={x}
          y={bottomTop + bottomHeight}
          label={spanned ? `span angle θ/${fundamentalPeriods} (rad)` : 'angle θ (rad)'}
          tickValues={angleAxis(lo, hi).ticks}
          format={angleAxis(lo, hi).format}
        />
      </svg>
    </ChartFrame>
  );
}
