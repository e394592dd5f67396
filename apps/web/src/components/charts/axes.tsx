import { scaleLinear, type ScaleBand, type ScaleLinear, type ScaleLogarithmic } from 'd3';

type Continuous = ScaleLinear<number, number> | ScaleLogarithmic<number, number>;

/** Bottom axis drawn from a d3 scale's ticks. */
export function AxisBottom({
  scale,
  y,
  label,
  ticks = 8,
  tickValues,
  format,
}: {
  scale: Continuous;
  y: number;
  label?: string;
  ticks?: number;
  /** Where to put the ticks (in the scale's domain) instead of the scale's own round numbers. */
  tickValues?: readonly number[];
  format?: (v: number) => string;
}) {
  const [x0, x1] = scale.range() as [number, number];
  const tickFormat = format ?? scale.tickFormat(ticks);
  return (
    <g transform={`translate(0,${y})`} aria-hidden>
      <line x1={x0} x2={x1} stroke="currentColor" opacity={0.4} />
      {(tickValues ?? scale.ticks(ticks)).map((t) => (
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
  // A log axis ticks every 1–9 of each decade; only the decades (and 2 and 5 over a short span)
  // get a label, or the texts pile on top of each other.
  const labelled = isLogScale(scale) ? logLabelled(values) : () => true;
  // The label sits clear of the widest tick text (issue 10: "3000 %" ran into the label).
  const labelX = -leftAxisLabelOffset(values.filter(labelled).map((t) => tickFormat(t)));
  return (
    <g transform={`translate(${x},0)`} aria-hidden>
      <line y1={y0} y2={y1} stroke="currentColor" opacity={0.4} />
      {values.map((t, i) => (
        <g key={`${t}-${i}`} transform={`translate(0,${scale(t)})`}>
          <line x2={width} stroke="currentColor" opacity={0.08} />
          <line x2={-5} stroke="currentColor" opacity={0.5} />
          {labelled(t) ? (
            <text x={-8} dy="0.32em" textAnchor="end" fontSize={10} fill="currentColor">
              {tickFormat(t)}
            </text>
          ) : null}
        </g>
      ))}
      {label ? (
        <text
          transform={`translate(${labelX},${(y0 + y1) / 2}) rotate(-90)`}
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

function isLogScale(scale: Continuous): scale is ScaleLogarithmic<number, number> {
  return typeof (scale as Partial<ScaleLogarithmic<number, number>>).base === 'function';
}

/**
 * Which ticks of a log axis carry a label: the powers of ten, and 2 and 5 of each decade when the
 * axis spans two decades or less (so a short axis still has three or more labels).
 */
export function logLabelled(ticks: readonly number[]): (tick: number) => boolean {
  const decades = new Set(ticks.filter((t) => t > 0).map((t) => Math.floor(Math.log10(t) + 1e-9)));
  const mantissas = decades.size <= 3 ? [1, 2, 5] : [1];
  return (tick) => {
    if (!(tick > 0)) return false;
    const mantissa = tick / 10 ** Math.floor(Math.log10(tick) + 1e-9);
    return mantissas.some((m) => Math.abs(mantissa - m) < 1e-6);
  };
}

/** Width of one character of tick text at font size 10, px (a generous mean for digits and signs). */
const TICK_CHARACTER_WIDTH = 6.2;

/**
 * How far left of a left axis its rotated label goes (px) so that it clears the widest tick text:
 * tick mark 8 px, the text, a 10 px gap, half the label's 11 px line. A chart's left margin must
 * be at least this plus a few px; {@link leftAxisMargin} gives it.
 */
export function leftAxisLabelOffset(tickTexts: readonly string[]): number {
  const widest = Math.max(0, ...tickTexts.map((text) => text.length));
  return Math.max(44, 8 + widest * TICK_CHARACTER_WIDTH + 10 + 6);
}

/** A left margin wide enough for the axis's tick texts and its label. */
export function leftAxisMargin(tickTexts: readonly string[], least = 56): number {
  return Math.max(least, Math.ceil(leftAxisLabelOffset(tickTexts) + 8));
}

/** Denominators of the fractions of π that read cleanly on an angle axis. */
const PI_DENOMINATORS = [1, 2, 3, 4, 6, 12] as const;

/** Tick steps of an angle axis, largest first: π, π/2, π/4, π/6, π/12. */
const ANGLE_STEPS = [1, 2, 4, 6, 12].map((k) => Math.PI / k);

/** The ticks of an angle axis and how to write them. */
export interface AngleAxis {
  /** Tick angles, radians. */
  ticks: number[];
  format: (radians: number) => string;
}

/** An angle in radians written in degrees with up to two decimals (12.5°, −30°). */
export function formatDegrees(value: number): string {
  const degrees = Number(((value * 180) / Math.PI).toFixed(2));
  return `${degrees < 0 ? '−' : ''}${Math.abs(degrees)}°`;
}

/**
 * The ticks of an angle axis showing [lo, hi] radians: multiples of π, π/2, π/4, π/6 or π/12,
 * the coarsest giving at least four intervals, written as fractions of π (0, π/2, π, 3π/2, 2π).
 * A window narrower than four steps of π/12 (60°) gets round numbers of degrees, written in
 * degrees, so one axis never mixes the two.
 */
export function angleAxis(lo: number, hi: number): AngleAxis {
  const span = hi - lo;
  const step = ANGLE_STEPS.find((candidate) => span / candidate >= 4);
  if (step === undefined) {
    const toDegrees = 180 / Math.PI;
    // Rounded to 1e-9° so a window ending at 30° (29.999999999999996 in binary) keeps its 30° tick.
    const degrees = (angle: number) => Number((angle * toDegrees).toFixed(9));
    const ticks = scaleLinear()
      .domain([degrees(lo), degrees(hi)])
      .ticks(6)
      .map((d) => d / toDegrees);
    return { ticks, format: formatDegrees };
  }
  const first = Math.ceil(lo / step - 1e-9);
  const last = Math.floor(hi / step + 1e-9);
  const ticks: number[] = [];
  for (let k = first; k <= last; k++) ticks.push(k * step);
  return { ticks, format: formatRadians };
}

/**
 * An angle in radians as a clean fraction of π (0, π/2, 3π/4, −π/6, 2π) when it is a multiple of
 * π/12, otherwise in degrees with up to two decimals (12.5°).
 */
export function formatRadians(value: number): string {
  const ratio = value / Math.PI;
  if (Math.abs(ratio) < 1e-9) return '0';
  for (const denominator of PI_DENOMINATORS) {
    const numerator = Math.round(ratio * denominator);
    if (Math.abs(ratio * denominator - numerator) > 1e-6) continue;
    const sign = numerator < 0 ? '−' : '';
    const size = Math.abs(numerator);
    const top = size === 1 ? 'π' : `${size}π`;
    return denominator === 1 ? `${sign}${top}` : `${sign}${top}/${denominator}`;
  }
  return formatDegrees(value);
}
