import { scaleLinear } from 'd3';
import { ChartFrame } from '../../../components/charts/ChartFrame';
import { toCsv } from '../../../lib/download';

const STATES = ['100', '110', '010', '011', '001', '101'];

/**
 * The hexagon of the six active vectors (vertices at radius 2/3 of vdc in the αβ plane,
 * drawn normalised to 1), the inscribed circle m = 1, and the reference vector.
 */
export function HexagonChart({ m, theta, sector }: { m: number; theta: number; sector: number }) {
  const size = 360;
  const s = scaleLinear().domain([-1.45, 1.45]).range([0, size]);
  const y = scaleLinear().domain([-1.45, 1.45]).range([size, 0]);
  const vertex = (k: number) => [Math.cos((k * Math.PI) / 3), Math.sin((k * Math.PI) / 3)] as const;
  const hexagon = STATES.map((_, k) => vertex(k))
    .map(([a, b]) => `${s(a)},${y(b)}`)
    .join(' ');
  // m = 1 is the inscribed circle, radius cos(π/6) of the vertex radius (hexagon geometry).
  const inscribed = Math.cos(Math.PI / 6);
  const radius = m * inscribed;
  const tip = [radius * Math.cos(theta), radius * Math.sin(theta)] as const;
  const a = vertex(sector - 1);
  const b = vertex(sector);
  return (
    <ChartFrame
      title="Hexagon and reference"
      fileName="space-vector-hexagon"
      csv={() => toCsv(['m', 'theta (rad)', 'sector'], [[m, theta, sector]])}
    >
      <svg
        data-chart="hexagon"
        viewBox={`0 0 ${size} ${size}`}
        className="mx-auto w-full max-w-md text-ink"
        role="img"
        aria-label={`Reference vector m ${m.toFixed(3)} in sector ${sector}`}
      >
        <polygon
          points={`${s(0)},${y(0)} ${s(a[0])},${y(a[1])} ${s(b[0])},${y(b[1])}`}
          fill="var(--color-signal-soft)"
        />
        <polygon points={hexagon} fill="none" stroke="currentColor" strokeWidth={1.5} />
        <circle
          cx={s(0)}
          cy={y(0)}
          r={s(inscribed) - s(0)}
          fill="none"
          stroke="var(--color-trace-carrier)"
          strokeDasharray="4 3"
        />
        {STATES.map((state, k) => {
          const [vx, vy] = vertex(k);
          return (
            <g key={state}>
              <line
                x1={s(0)}
                y1={y(0)}
                x2={s(vx)}
                y2={y(vy)}
                stroke="currentColor"
                opacity={0.25}
              />
              <circle cx={s(vx)} cy={y(vy)} r={3} fill="currentColor" />
              <text
                x={s(vx * 1.2)}
                y={y(vy * 1.2)}
                fontSize={11}
                textAnchor="middle"
                dy="0.35em"
                fill="currentColor"
              >
                V{k + 1} {state}
              </text>
            </g>
          );
        })}
        <text x={s(0)} y={y(0) + 16} fontSize={10} textAnchor="middle" fill="currentColor">
          000 / 111
        </text>
        <line
          x1={s(0)}
          y1={y(0)}
          x2={s(tip[0])}
          y2={y(tip[1])}
          stroke="var(--color-trace-ref)"
          strokeWidth={3}
          markerEnd="url(#arrow)"
        />
        <defs>
          <marker
            id="arrow"
            viewBox="0 0 10 10"
            refX="8"
            refY="5"
            markerWidth="6"
            markerHeight="6"
            orient="auto-start-reverse"
          >
            <path d="M 0 0 L 10 5 L 0 10 z" fill="var(--color-trace-ref)" />
          </marker>
        </defs>
      </svg>
    </ChartFrame>
  );
}
