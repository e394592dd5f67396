import type { ThreeLevelVectorKind } from '@pulsewright/modulation';
import { line, scaleLinear } from 'd3';
import { useMemo, useState } from 'react';
import { ChartFrame } from '../../../../components/charts/ChartFrame';
import { toCsv } from '../../../../lib/download';
import {
  threeLevelDiagramSegments,
  type ThreeLevelDiagramData,
} from '../../model/threeLevelDiagram';

const KIND_COLOURS: Record<ThreeLevelVectorKind, string> = {
  zero: 'var(--color-ink)',
  small: 'var(--color-trace-carrier)',
  medium: 'var(--color-signal)',
  large: 'var(--color-trace-ref)',
};
const KINDS: ThreeLevelVectorKind[] = ['zero', 'small', 'medium', 'large'];

/**
 * The three-level space-vector diagram of a design: the 27 switching states on their 19 points
 * (by group), the triangles of the hexagon, the sampled reference's trajectory and, for the
 * switching period chosen, its sample(s) and the states the modulator applies. Data from the
 * report's `multilevel.vectorDiagram`; only the triangles' sides are found here, between its
 * points (model/threeLevelDiagram.ts).
 */
export function ThreeLevelVectorDiagram({
  data,
  fileStem,
}: {
  data: ThreeLevelDiagramData;
  fileStem: string;
}) {
  const { diagram, trajectory } = data;
  const segments = useMemo(() => threeLevelDiagramSegments(diagram), [diagram]);
  const [period, setPeriod] = useState(0);
  const periods = (trajectory[trajectory.length - 1]?.period ?? 0) + 1;
  const shown = Math.min(period, periods - 1);
  const chosen = trajectory.filter((s) => s.period === shown);
  const applied = new Set(chosen.flatMap((s) => s.states));
  const size = 460;
  const pad = 24;
  const scale = scaleLinear()
    .domain([-0.75, 0.75])
    .range([pad, size - pad]);
  const x = (alpha: number) => scale(alpha);
  const y = (beta: number) => size - scale(beta);
  const path = line<{ alpha: number; beta: number }>()
    .x((p) => x(p.alpha))
    .y((p) => y(p.beta));
  const first = trajectory[0];
  return (
    <ChartFrame
      title="Three-level vector diagram"
      fileName={`${fileStem}-vector-diagram`}
      csv={() =>
        toCsv(
          [
            'switching period',
            'angle (rad)',
            'alpha (per unit of vdc)',
            'beta (per unit of vdc)',
            'sector',
            'region',
            'states applied',
          ],
          trajectory.map((s) => [
            s.period,
            s.theta,
            s.alpha,
            s.beta,
            s.sector,
            s.region,
            s.states.join(' '),
          ]),
        )
      }
      controls={
        <label className="flex items-center gap-1 text-xs">
          Switching period
          <input
            type="range"
            min={0}
            max={periods - 1}
            value={shown}
            onChange={(e) => setPeriod(Number(e.target.value))}
            aria-label="Switching period shown"
          />
          <span className="num ml-1 w-16">
            {shown + 1} of {periods}
          </span>
        </label>
      }
      footer={
        <div className="mt-1 text-xs" data-testid="vector-period">
          {chosen.map((s, i) => (
            <p key={i}>
              Sample at θ = {s.theta.toFixed(4)} rad: sector {s.sector}, region {s.region}; states{' '}
              <span className="num">{s.states.join(' → ')}</span>
            </p>
          ))}
          <p className="mt-1 flex flex-wrap gap-3 text-ink-soft">
            {KINDS.map((kind) => (
              <span key={kind} className="flex items-center gap-1">
                <svg width={10} height={10} aria-hidden>
                  <circle cx={5} cy={5} r={4} fill={KIND_COLOURS[kind]} />
                </svg>
                {kind} vectors
              </span>
            ))}
            <span>α, β per unit of the DC link; reference dashed.</span>
          </p>
        </div>
      }
    >
      <svg
        data-chart="vector-diagram"
        viewBox={`0 0 ${size} ${size}`}
        className="mx-auto w-full max-w-[560px] text-ink"
        role="img"
        aria-label={`Three-level vector diagram: 27 states, the reference over ${periods} switching periods`}
      >
        <g stroke="currentColor" opacity={0.25} aria-hidden>
          {segments.map((s, i) => (
            <line
              key={i}
              x1={x(s.from.alpha)}
              y1={y(s.from.beta)}
              x2={x(s.to.alpha)}
              y2={y(s.to.beta)}
            />
          ))}
        </g>
        {first ? (
          <path
            d={`${path(trajectory) ?? ''}Z`}
            fill="none"
            stroke="var(--color-trace-current)"
            strokeDasharray="4 3"
            strokeWidth={1.3}
          />
        ) : null}
        {KINDS.flatMap((kind) =>
          diagram[kind].map((point) => {
            const lit = point.states.some((state) => applied.has(state));
            return (
              <g key={point.states.join('/')} data-kind={kind} data-applied={lit || undefined}>
                {lit ? (
                  <circle
                    cx={x(point.alpha)}
                    cy={y(point.beta)}
                    r={9}
                    fill="none"
                    stroke="var(--color-bad)"
                    strokeWidth={2}
                  />
                ) : null}
                <circle cx={x(point.alpha)} cy={y(point.beta)} r={4.5} fill={KIND_COLOURS[kind]} />
                <text
                  x={x(point.alpha)}
                  y={y(point.beta) - 8}
                  textAnchor="middle"
                  fontSize={kind === 'zero' ? 7 : 8}
                  fill="currentColor"
                >
                  {point.states.join('/')}
                </text>
              </g>
            );
          }),
        )}
        {chosen.map((s, i) => (
          <g key={i} data-sample={s.period}>
            <line
              x1={x(0)}
              y1={y(0)}
              x2={x(s.alpha)}
              y2={y(s.beta)}
              stroke="var(--color-bad)"
              strokeWidth={1.5}
            />
            <circle cx={x(s.alpha)} cy={y(s.beta)} r={3.5} fill="var(--color-bad)" />
          </g>
        ))}
      </svg>
    </ChartFrame>
  );
}
