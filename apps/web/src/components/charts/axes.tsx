import type { ScaleLinear, ScaleLogarithmic, ScaleBand } from 'd3';

export interface Margin {
  top: number;
  right: number;
  bottom: number;
  left: number;
}

export const DEFAULT_MARGIN: Margin = { top: 12, right: 16, bottom: 36, left: 56 };

type Continuous = ScaleLinear<number, number> | ScaleLogarithmic<number, number>;

/** Bottom axis drawn from a d3 scale's ticks. */
export function AxisBottom({
  scale,
  y,
  label,
  ticks = 8,
  format,
}: {
  scale: Continuous;
  y: number;
  label?: string;
  ticks?: number;
  format?: (v: number) => string;
}) {
  const [x0, x1] = scale.range() as [number, number];
  const tickFormat = format ?? scale.tickFormat(ticks);
  return (
    <g transform={`translate(0,${y})`} aria-hidden>
      <line x1={x0} x2={x1} stroke="currentColor" opacity={0.4} />
      {scale.ticks(ticks).map((t) => (
        <g key={t} transform={`translate(${scale(t)},0)`}>
          <line y2={5} stroke="currentColor" opacity={0.5} />
          <text y={17} textAnchor="middle" fontSize={10} fill="currentColor">
            {tickFormat(t)}
          </text>
        </g>
      ))}
      {label ? (
        <text x={(x0 + x1) / 2} y={32} textAnchor="middle" fontSize={11} fill="currentColor">
          {label}
        </text>
      ) : null}
    </g>
  );
}

/** Left axis with light grid lines across `width`. */
export function AxisLeft({
  scale,
  x,
  width,
  label,
  ticks = 5,
  format,
}: {
  scale: Continuous;
  x: number;
  width: number;
  label?: string;
  ticks?: number;
  format?: (v: number) => string;
}) {
  const [y0, y1] = scale.range() as [number, number];
  const tickFormat = format ?? scale.tickFormat(ticks);
  const values = scale.ticks(ticks);
  return (
    <g transform={`translate(${x},0)`} aria-hidden>
      <line y1={y0} y2={y1} stroke="currentColor" opacity={0.4} />
      {values.map((t, i) => (
        <g key={`${t}-${i}`} transform={`translate(0,${scale(t)})`}>
          <line x2={width} stroke="currentColor" opacity={0.08} />
          <line x2={-5} stroke="currentColor" opacity={0.5} />
          <text x={-8} dy="0.32em" textAnchor="end" fontSize={10} fill="currentColor">
            {tickFormat(t)}
          </text>
        </g>
      ))}
      {label ? (
        <text
          transform={`translate(-44,${(y0 + y1) / 2}) rotate(-90)`}
          textAnchor="middle"
          fontSize={11}
          fill="currentColor"
        >
          {label}
        </text>
      ) : null}
    </g>
  );
}

export type { ScaleBand };

/** Formats a radian angle as a fraction of π for axis ticks. */
export function formatRadians(value: number): string {
  const ratio = value / Math.PI;
  if (Math.abs(ratio) < 1e-9) return '0';
  return `${Number(ratio.toFixed(2))}π`;
}
