import { scaleBand, scaleLinear } from 'd3';
import type { SpaceVectorSequence } from '@pulsewright/modulation';
import { ChartFrame } from '../../../components/charts/ChartFrame';
import { sequenceCsv } from '../../../lib/chartCsv';

/** The states of one switching period as segments, and each leg's gate signal beneath. */
export function SequenceChart({ sequence }: { sequence: SpaceVectorSequence }) {
  const width = 720;
  const height = 200;
  const left = 60;
  const x = scaleLinear()
    .domain([0, 1])
    .range([left, width - 12]);
  const legs = ['a', 'b', 'c'] as const;
  const rows = scaleBand<string>()
    .domain(['state', ...legs])
    .range([10, height - 24])
    .padding(0.25);
  const segments = sequence.states.reduce<{ state: string; from: number; to: number }[]>(
    (list, state, i) => {
      const from = list[list.length - 1]?.to ?? 0;
      return [...list, { state, from, to: from + (sequence.durations[i] ?? 0) }];
    },
    [],
  );
  return (
    <ChartFrame
      title="Switching sequence over one period"
      fileName="space-vector-sequence"
      csv={() => sequenceCsv(segments)}
    >
      <svg
        data-chart="sequence"
        viewBox={`0 0 ${width} ${height}`}
        className="w-full text-ink"
        role="img"
        aria-label={`Sequence ${sequence.states.join(' ')}`}
      >
        <text
          x={4}
          y={(rows('state') ?? 0) + rows.bandwidth() / 2}
          dy="0.35em"
          fontSize={11}
          fill="currentColor"
        >
          state
        </text>
        {segments.map((seg, i) => (
          <g key={i}>
            <rect
              x={x(seg.from)}
              width={Math.max(0, x(seg.to) - x(seg.from))}
              y={rows('state')}
              height={rows.bandwidth()}
              fill={
                seg.state === '000' || seg.state === '111'
                  ? 'var(--color-rule)'
                  : 'var(--color-signal-soft)'
              }
              stroke="var(--color-panel)"
            />
            {x(seg.to) - x(seg.from) > 26 ? (
              <text
                x={(x(seg.from) + x(seg.to)) / 2}
                y={(rows('state') ?? 0) + rows.bandwidth() / 2}
                dy="0.35em"
                fontSize={10}
                textAnchor="middle"
                fill="currentColor"
              >
                {seg.state}
              </text>
            ) : null}
          </g>
        ))}
        {legs.map((leg, li) => (
          <g key={leg}>
            <text
              x={4}
              y={(rows(leg) ?? 0) + rows.bandwidth() / 2}
              dy="0.35em"
              fontSize={11}
              fill="currentColor"
            >
              leg {leg}
            </text>
            {segments.map((seg, i) => {
              const high = seg.state[li] === '1';
              const top = rows(leg) ?? 0;
              return (
                <rect
                  key={i}
                  x={x(seg.from)}
                  width={Math.max(0, x(seg.to) - x(seg.from))}
                  y={high ? top : top + rows.bandwidth() * 0.75}
                  height={high ? rows.bandwidth() : rows.bandwidth() * 0.25}
                  fill={high ? 'var(--color-trace-carrier)' : 'var(--color-rule)'}
                />
              );
            })}
          </g>
        ))}
        {[0, 0.25, 0.5, 0.75, 1].map((t) => (
          <text
            key={t}
            x={x(t)}
            y={height - 8}
            fontSize={10}
            textAnchor="middle"
            fill="currentColor"
          >
            {t}·Ts
          </text>
        ))}
      </svg>
    </ChartFrame>
  );
}
