import { assertOptimalPulseSweepOptions } from '@pulsewright/modulation';
import { chainedSweepPlan } from './chainedSweepPlan.js';
import { checkSweepRequest } from './checkSweepRequest.js';
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
 * cost check and pool; the whole request checked by the library first (a bad range end is a 400,
 * not a failed chunk); each chunk's first point is followed from the optimum the chunk before
 * ended on (services/patternTables.ts optimalSweepChunk).
 */
export function optimalSweepPlan(input: OptimalSweepInput): JobPlan {
  checkSweepRequest(() =>
    assertOptimalPulseSweepOptions({
      kind: input.kind,
      vdc: input.vdc,
      count: input.count,
      objective: input.objective ?? 'wthd',
      maxOrder: input.maxOrder ?? 99,
      fundamentals: input.fundamental,
      ...(input.initialAngles ? { angles: input.initialAngles } : {}),
    }),
  );
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
