import { assertSheSweepOptions } from '@pulsewright/modulation';
import { chainedSweepPlan } from './chainedSweepPlan.js';
import { checkSweepRequest } from './checkSweepRequest.js';
import type { ComputePool } from './computePool.js';
import { maSweepCost, sheSweepCost } from './cost.js';
import type { JobPlan } from './jobs.js';
import { optimalSweepPlan } from './optimalSweepJobs.js';
import type { OptimalSweepInput } from './patternTables.js';
import {
  appendMaSweepPart,
  emptyMaSweep,
  maSweepChunkCount,
  nextSheSeed,
  sheSweepChunkCount,
  type MaSweepInput,
  type SheSweepInput,
  type SheSweepPointResult,
} from './sweeps.js';

/** A sweep of the modulation index as a job: each chunk (services/sweeps.ts maSweepChunk) in a worker. */
export function maSweepPlan(input: MaSweepInput): JobPlan {
  const total = emptyMaSweep(input);
  const chunks = maSweepChunkCount(input);
  return {
    kind: 'ma-sweep',
    cost: maSweepCost(input),
    chunks,
    async runChunk(index: number, pool: ComputePool) {
      const part = await pool.run(
        'maSweepChunk',
        { input, index },
        {
          ...(index === 0 ? {} : { queueTimeLimitMs: null }),
          what: `Chunk ${index + 1} of ${chunks} of this ma sweep`,
        },
      );
      appendMaSweepPart(total, part);
    },
    result: () => total,
  };
}

/**
 * A SHE sweep as a job: the whole request checked by the library first (a bad range end is a 400,
 * not a failed chunk), then each chunk seeded with the last solution of the ones before.
 */
export function sheSweepPlan(input: SheSweepInput): JobPlan {
  checkSweepRequest(() =>
    assertSheSweepOptions({
      kind: input.kind,
      vdc: input.vdc,
      count: input.count,
      eliminate: input.eliminate,
      fundamentals: input.fundamental,
      ...(input.initialAngles ? { angles: input.initialAngles } : {}),
      ...(input.cellVoltages ? { cellVoltages: input.cellVoltages } : {}),
    }),
  );
  return chainedSweepPlan<SheSweepPointResult, number[]>({
    kind: 'she-sweep',
    cost: sheSweepCost(input),
    chunks: sheSweepChunkCount(input),
    label: 'this SHE sweep',
    first: input.initialAngles,
    carryOf: nextSheSeed,
    runChunk: (pool, index, seed, options) =>
      pool.run('sheSweepChunk', { input, index, ...(seed ? { seed } : {}) }, options),
  });
}

/**
 * The plan of each job kind, from the input stored with the job: how a queue worker in any
 * process rebuilds a job (services/pgBossJobQueue.ts). A new kind adds its line here; the input
 * is the one its route stored, already checked by the OpenAPI validator and the first chunk.
 */
const PLANS: Record<string, (input: Record<string, unknown>) => JobPlan> = {
  'ma-sweep': (input) => maSweepPlan(input as unknown as MaSweepInput),
  'she-sweep': (input) => sheSweepPlan(input as unknown as SheSweepInput),
  'optimal-sweep': (input) => optimalSweepPlan(input as unknown as OptimalSweepInput),
};

/** The plan of a stored job; throws for a kind this version does not know. */
export function planForJob(kind: string, input: Record<string, unknown>): JobPlan {
  const plan = PLANS[kind];
  if (!plan) throw new Error(`This service does not know jobs of kind ${JSON.stringify(kind)}.`);
  return plan(input);
}
