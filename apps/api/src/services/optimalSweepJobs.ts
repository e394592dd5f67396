import { chainedSweepPlan } from './chainedSweepPlan.js';
import type { JobPlan } from './jobs.js';
import {
  nextOptimalPrevious,
  optimalSweepChunkCount,
  optimalSweepCost,
  type OptimalSweepInput,
  type OptimalSweepPointResult,
} from './patternTables.js';

/**
 * An optimal-pattern sweep as a job (issue 17), beside the SHE sweep: the same progress, quotas,
 * cost check and pool; each chunk's first point is followed from the optimum the chunk before
 * ended on (services/patternTables.ts optimalSweepChunk).
 */
export function optimalSweepPlan(input: OptimalSweepInput): JobPlan {
  return chainedSweepPlan<OptimalSweepPointResult, number[]>({
    kind: 'optimal-sweep',
    cost: optimalSweepCost(input),
    chunks: optimalSweepChunkCount(input),
    label: 'this optimal-pattern sweep',
    carryOf: nextOptimalPrevious,
    runChunk: (pool, index, previous, options) =>
      pool.run('optimalSweepChunk', { input, index, ...(previous ? { previous } : {}) }, options),
  });
}
