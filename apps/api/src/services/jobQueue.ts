import { Op } from 'sequelize';
import type { JobAttributes, JobRow, Models } from '../models/index.js';
import { HttpError } from '../http/errors.js';
import type { ComputePool } from './computePool.js';
import type { JobPlan } from './jobs.js';

/**
 * Where a stored job waits and which process runs it. JobService checks the budget and the
 * quotas, stores the job as `queued` and runs its first chunk (so bad input is a 400 and no job);
 * the queue runs the rest. Two implementations: {@link InProcessJobQueue} (SQLite: this process,
 * a job left running by a stop is failed at the next start) and {@link PgBossJobQueue}
 * (PostgreSQL: any replica's workers take any job; the queue retries or fails a job whose replica
 * died).
 */
export interface JobQueue {
  /** Deals with jobs a previous run left queued or running; called once at start. */
  start(): Promise<void>;
  /** Hands over a stored `queued` job whose first chunk `plan` has run. */
  submit(job: JobRow, plan: JobPlan): Promise<void>;
  /** Stops taking jobs and ends those running here (the pool is closed by the caller). */
  close(): Promise<void>;
  /** Resolves when this process runs no job (tests). */
  idle(): Promise<void>;
}

/** Why an attempt ended: all chunks done, stopped by a closing process, or taken over. */
export type AttemptOutcome = 'done' | 'stopping' | 'superseded';

/**
 * One attempt at a job: runs chunks `first`… of `plan` in the pool, storing `progress` after
 * each and the result at the end. Every write is conditional on the row still being this
 * attempt's (`status` running with this `startedAt`), so an attempt the queue gave up on (its
 * process stalled past the expiry and the job was retried elsewhere) cannot overwrite the
 * retry's figures; it stops at its next write. An error from a chunk fails the job (the same
 * input would fail again), except while the process is stopping: then the caller decides.
 */
export async function runAttempt(
  models: Models,
  job: { id: string; startedAt: Date },
  plan: JobPlan,
  first: number,
  pool: ComputePool,
  stopping: () => boolean,
): Promise<AttemptOutcome> {
  const mine = { id: job.id, status: 'running' as const, startedAt: job.startedAt };
  const write = async (values: Partial<JobAttributes>): Promise<boolean> => {
    const [count] = await models.Job.update(values, { where: mine });
    return count === 1;
  };
  try {
    for (let index = first; index < plan.chunks; index++) {
      if (stopping()) return 'stopping';
      await plan.runChunk(index, pool);
      if (index < plan.chunks - 1 && !(await write({ progress: (index + 1) / plan.chunks })))
        return 'superseded';
    }
    const stored = await write({
      status: 'succeeded',
      progress: 1,
      result: plan.result(),
      finishedAt: new Date(),
    });
    return stored ? 'done' : 'superseded';
  } catch (error) {
    if (stopping()) return 'stopping';
    await write({ status: 'failed', error: messageOf(error), finishedAt: new Date() }).catch(
      () => undefined,
    );
    return 'done';
  }
}

/**
 * Marks a queued job (or one a dead attempt left running) as running for a new attempt that
 * starts at `progress` (0 to 1); returns the attempt's start time, or null when the job has
 * finished meanwhile.
 */
export async function claimJob(models: Models, id: string, progress: number): Promise<Date | null> {
  const startedAt = new Date();
  const [count] = await models.Job.update(
    { status: 'running', startedAt, progress },
    { where: { id, status: { [Op.in]: ['queued', 'running'] } } },
  );
  return count === 1 ? startedAt : null;
}

/** The message a failed job records. */
export function messageOf(error: unknown): string {
  if (error instanceof HttpError) return error.detail;
  return error instanceof Error ? error.message : String(error);
}
