import type { ComputePool } from './computePool.js';
import type { CostEstimate } from './cost.js';
import type { JobPlan } from './jobs.js';

/** What each chunk of a chained sweep returns: its points, in grid order. */
export interface SweepPart<P> {
  points: P[];
  iterations: number;
}

/** The result of a chained sweep: every point, the fraction solved, the iterations in all. */
export interface ChainedSweepResult<P> {
  points: P[];
  solvedFraction: number;
  iterations: number;
}

/** How the pool runs one chunk: the first may wait in the queue only so long, the rest as long as it takes. */
export interface ChunkRunOptions {
  queueTimeLimitMs?: null;
  what: string;
}

/**
 * A sweep job whose chunks run in order, each started from what the chunks before ended on
 * (`carryOf` of the points so far): how the SHE sweep follows one branch and the optimal-pattern
 * sweep one family of optima across chunks run in the worker pool.
 */
export function chainedSweepPlan<P extends { converged: boolean }, C>(spec: {
  kind: string;
  cost: CostEstimate;
  chunks: number;
  /** Names the sweep in the pool's messages, e.g. `this SHE sweep`. */
  label: string;
  /** What the first chunk starts from (none: the library's own start). */
  first?: C | undefined;
  carryOf: (points: P[]) => C | undefined;
  runChunk: (
    pool: ComputePool,
    index: number,
    carry: C | undefined,
    options: ChunkRunOptions,
  ) => Promise<SweepPart<P>>;
}): JobPlan {
  const solved: P[] = [];
  let carry = spec.first;
  let iterations = 0;
  return {
    kind: spec.kind,
    cost: spec.cost,
    chunks: spec.chunks,
    async runChunk(index: number, pool: ComputePool) {
      const part = await spec.runChunk(pool, index, carry, {
        ...(index === 0 ? {} : { queueTimeLimitMs: null }),
        what: `Chunk ${index + 1} of ${spec.chunks} of ${spec.label}`,
      });
      solved.push(...part.points);
      iterations += part.iterations;
      carry = spec.carryOf(solved);
    },
    result: (): ChainedSweepResult<P> => ({
      points: solved,
      solvedFraction: solved.filter((p) => p.converged).length / Math.max(1, solved.length),
      iterations,
    }),
  };
}
