import { Op } from 'sequelize';
import type { JobRow, Models } from '../models/index.js';
import type { ComputePool } from './computePool.js';
import type { JobPlan } from './jobs.js';
import { claimJob, runAttempt, type JobQueue } from './jobQueue.js';

export const INTERRUPTED_MESSAGE =
  'The service stopped while this job was running; start it again.';

interface Entry {
  job: JobRow;
  plan: JobPlan;
}

/**
 * The job queue of one process (SQLite): jobs wait in memory for one of `concurrency` slots (so
 * a slot of the pool is left for requests) and run chunk by chunk. A stop leaves its jobs queued
 * or running in the table; the next start marks them failed, since no other process could be
 * running them.
 */
export class InProcessJobQueue implements JobQueue {
  private readonly waiting: Entry[] = [];
  private readonly running = new Set<Promise<void>>();
  private closing = false;

  constructor(
    private readonly models: Models,
    private readonly pool: ComputePool,
    private readonly concurrency: number,
  ) {}

  async start(): Promise<void> {
    await this.models.Job.update(
      { status: 'failed', error: INTERRUPTED_MESSAGE, finishedAt: new Date() },
      { where: { status: { [Op.in]: ['queued', 'running'] } } },
    );
  }

  /** Queues the job; resolves once it is running or waiting for a slot. */
  async submit(job: JobRow, plan: JobPlan): Promise<void> {
    this.waiting.push({ job, plan });
    await this.pump();
  }

  /** Starts waiting jobs while a slot is free; resolves once their rows say `running`. */
  private async pump(): Promise<void> {
    const begun: Promise<unknown>[] = [];
    while (!this.closing && this.running.size < this.concurrency && this.waiting.length) {
      const { job, plan } = this.waiting.shift() as Entry;
      const claimed = claimJob(this.models, job.id, 1 / plan.chunks);
      const task: Promise<void> = claimed
        .then(async (startedAt) => {
          if (!startedAt) return;
          await runAttempt(this.models, { id: job.id, startedAt }, plan, 1, this.pool, () => {
            return this.closing; // left 'running'; the next start marks it failed
          });
        })
        .catch(() => undefined)
        .finally(() => {
          this.running.delete(task);
          void this.pump();
        });
      this.running.add(task);
      begun.push(claimed.catch(() => undefined));
    }
    await Promise.all(begun);
  }

  async close(): Promise<void> {
    this.closing = true;
    this.waiting.length = 0;
  }

  async idle(): Promise<void> {
    while (this.running.size) await Promise.allSettled([...this.running]);
  }
}
