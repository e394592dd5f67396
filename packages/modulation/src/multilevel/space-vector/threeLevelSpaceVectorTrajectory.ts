import { threeLevelSchedule } from './threeLevelSchedule.js';
import type {
  ThreeLevelModulationOptions,
  ThreeLevelRegion,
  ThreeLevelSwitchingState,
} from './threeLevelSpaceVectorTypes.js';

/** One reference sample of a three-level space-vector modulator and what it selects. */
export interface ThreeLevelTrajectorySample {
  /** The switching period it belongs to, 0 … N − 1. */
  period: number;
  /** Fundamental angle of the sample, radians. */
  theta: number;
  /** The reference vector's components normalised to vdc: (m/√3)·(cos, sin)(θ − π/2). */
  alpha: number;
  beta: number;
  sector: number;
  region: ThreeLevelRegion;
  /**
   * The states applied for it, in order from the start of the period: the small vector's N-type
   * form, the other two vectors, the P-type form.
   */
  states: ThreeLevelSwitchingState[];
}

/**
 * The sampled reference trajectory of {@link threeLevelSpaceVectorWaveforms} (same options but
 * `vdc` and `topology`) and the vectors selected in each switching period, for the dashboard's
 * vector diagram (drawn over {@link threeLevelVectorDiagram}): one sample a switching period
 * with `symmetric` sampling, two with `asymmetric`.
 *
 * @throws ParameterRangeError naming `m`, `ma`, `frequencyRatio`, `sampling` or
 *   `smallVectorSplit` and the allowed range
 */
export function threeLevelSpaceVectorTrajectory(
  options: ThreeLevelModulationOptions,
): ThreeLevelTrajectorySample[] {
  const { m, periods } = threeLevelSchedule(options);
  const radius = m / Math.sqrt(3);
  return periods.flatMap(({ samples }, period) =>
    samples.map(({ theta, selection }) => ({
      period,
      theta,
      alpha: radius * Math.sin(theta),
      beta: -radius * Math.cos(theta),
      sector: selection.sector,
      region: selection.region,
      states: [
        selection.redundant.negative,
        ...selection.vectors.slice(1).flatMap((vector) => vector.states),
        selection.redundant.positive,
      ],
    })),
  );
}
