import type { ComputePool } from './computePool.js';
import type { JobPlan } from './jobs.js';
import {
  nextOptimalPrevious,
  optimalSweepChunkCount,
  optimalSweepCost,
  type OptimalSweepInput,
  type OptimalSweepPointResult,
  type OptimalSweepResult,
} from './patternTables.js';

/**
 * An optimal-pattern sweep as a job (issue 17), beside the SHE sweep: the same progress, quotas,
 * cost check and pool; each chunk's first point is followed from the optimum the chunk before
 * ended on (services/patternTables.ts optimalSweepChunk).
 */
export function optimalSweepPlan(input: OptimalSweepInput): JobPlan {
  const solved: OptimalSweepPointResult[] = [];
  const chunks = optimalSweepChunkCount(input);
  let previous: number[] | undefined;
  let iterations = 0;
  return {
    kind: 'optimal-sweep',
    cost: optimalSweepCost(input),
    chunks,
    async runChunk(index: number, pool: ComputePool) {
      const part = await pool.run(
        'optimalSweepChunk',
        { input, index, ...(previous ? { previous } : {}) },
        {
          ...(index === 0 ? {} : { queueTimeLimitMs: null }),
          what: `Chunk ${index + 1} of ${chunks} of this optimal-pattern sweep`,
        },
      );
      solved.push(...part.points);
      iterations += part.iterations;
      previous = nextOptimalPrevious(solved);
    },
    result: (): OptimalSweepResult => ({
      points: solved,
      solvedFraction: solved.filter((p) => p.converged).length / Math.max(1, solved.length),
      iterations,
    }),
  };
}
