import { line, scaleLinear } from 'd3';
import { formatNumber } from '../../lib/format';
import { AxisBottom, AxisLeft, formatRadians } from './axes';
import { ChartFrame } from './ChartFrame';

export interface LoadCurrentChartProps {
  angles: readonly number[];
  current: readonly number[];
  /** Peak-to-peak current over the period (amperes) and the load voltage's name, for the caption. */
  peakToPeak: number;
  rms: number;
  voltageName: string;
  width?: number;
}

/** Steady-state load current over one period, with its switching ripple visible on the curve. */
export function LoadCurrentChart({ angles, current, peakToPeak, rms, voltageName, width = 760 }: LoadCurrentChartProps) {
  const height = 220;
  const margin = { top: 12, right: 14, bottom: 36, left: 56 };
  const x = scaleLinear().domain([0, 2 * Math.PI]).range([margin.left, width - margin.right]);
  const extent = Math.max(1e-9, ...current.map(Math.abs));
  const y = scaleLinear().domain([-extent * 1.1, extent * 1.1]).range([height - margin.bottom, margin.top]).nice();
  const path = line<number>().x((_, i) => x(angles[i] ?? 0)).y((d) => y(d))(current as number[]) ?? '';
  const rmsLines = [rms * Math.SQRT2, -rms * Math.SQRT2];
  return (
    <ChartFrame title="Load current" fileName="load-current" footer={<p className="mt-1 text-xs text-ink-soft">Driven by the {voltageName}; dashed lines at ±√2·I rms. Peak-to-peak {formatNumber(peakToPeak)} A.</p>}>
      <svg data-chart="load-current" viewBox={`0 0 ${width} ${height}`} className="w-full text-ink" role="img" aria-label={`Load current, RMS ${formatNumber(rms)} amperes`}>
        <AxisLeft scale={y} x={margin.left} width={width - margin.left - margin.right} label="amperes" ticks={5} />
        {rmsLines.map((value) => (
          <line key={value} x1={margin.left} x2={width - margin.right} y1={y(value)} y2={y(value)} stroke="var(--color-trace-current)" strokeDasharray="4 4" opacity={0.5} />
        ))}
        <path d={path} fill="none" stroke="var(--color-trace-current)" strokeWidth={1.4} />
        <AxisBottom scale={x} y={height - margin.bottom} label="angle θ (rad)" format={formatRadians} />
      </svg>
    </ChartFrame>
  );
}
