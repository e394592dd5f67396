import PgBoss from 'pg-boss';
import type { JobQueueSettings } from '../config.js';
import type { JobRow, Models } from '../models/index.js';
import type { ComputePool } from './computePool.js';
import type { JobPlan } from './jobs.js';
import { claimJob, runAttempt, type JobQueue } from './jobQueue.js';
import { planForJob } from './sweepJobs.js';

/** The pg-boss queue of jobs, and the one a job goes to when the queue gives up on it. */
export const JOB_QUEUE = 'pulsewright-jobs';
export const GAVE_UP_QUEUE = 'pulsewright-jobs-gave-up';

export const GAVE_UP_MESSAGE =
  'The service process running this job stopped (or stalled past JOB_EXPIRE_SECONDS) more often than JOB_RETRY_LIMIT allows; start the job again.';

/** What a queue message carries: the id of the job's row; its kind and input are in the row. */
interface Message {
  jobId: string;
}

/**
 * The job queue of several service processes on one PostgreSQL database, through pg-boss. A
 * submitted job becomes a pg-boss message; every process with job slots polls the queue, so any
 * replica runs any job, rebuilding its plan from the stored kind and input (services/sweepJobs.ts
 * planForJob) and running it from its first chunk, with progress stored in the shared jobs table.
 * A process that dies or stalls holds its message past `expireSeconds`; pg-boss's maintenance
 * (run by any replica) then puts it back for another worker, up to `retryLimit` times, after
 * which it goes to {@link GAVE_UP_QUEUE} and the job is marked failed. A process that stops
 * cleanly hands its running jobs back the same way (the handler throws). Nothing is failed by a
 * replica's start: others may be running those jobs.
 */
export class PgBossJobQueue implements JobQueue {
  private readonly boss: PgBoss;
  private readonly running = new Set<Promise<unknown>>();
  private closing = false;

  constructor(
    databaseUrl: string,
    private readonly models: Models,
    private readonly pool: ComputePool,
    private readonly concurrency: number,
    private readonly settings: JobQueueSettings,
  ) {
    this.boss = new PgBoss({
      connectionString: databaseUrl,
      max: 4,
      maintenanceIntervalSeconds: settings.maintenanceSeconds,
    });
    // Connection trouble is reported on stderr; the queue reconnects on its own.
    this.boss.on('error', (error) => console.error('pulsewright: job queue:', error.message));
  }

  async start(): Promise<void> {
    // Replicas starting together would install pg-boss's schema and create its queues at the
    // same moment, and PostgreSQL answers one of them "deadlock detected" (seen in CI): one
    // replica at a time, behind a transaction's advisory lock as the migrations are.
    await this.models.sequelize.transaction(async (transaction) => {
      await this.models.sequelize.query('SELECT pg_advisory_xact_lock(hashtext(:key))', {
        replacements: { key: 'pulsewright:job-queue' },
        transaction,
      });
      await this.boss.start();
      await this.boss.createQueue(GAVE_UP_QUEUE);
      await this.boss.createQueue(JOB_QUEUE, { name: JOB_QUEUE, deadLetter: GAVE_UP_QUEUE });
    });
    const polling = { pollingIntervalSeconds: this.settings.pollingSeconds, batchSize: 1 };
    for (let slot = 0; slot < this.concurrency; slot++) {
      await this.boss.work<Message>(JOB_QUEUE, polling, ([message]) =>
        this.track(this.run(message!.data.jobId)),
      );
    }
    await this.boss.work<Message>(GAVE_UP_QUEUE, polling, ([message]) =>
      this.track(this.gaveUp(message!.data.jobId)),
    );
  }

  async submit(job: JobRow): Promise<void> {
    await this.boss.send(JOB_QUEUE, { jobId: job.id } satisfies Message, {
      retryLimit: this.settings.retryLimit,
      retryDelay: 1,
      expireInSeconds: this.settings.expireSeconds,
    });
  }

  /** One attempt at a job in this process; throws to hand the job back when stopping. */
  private async run(jobId: string): Promise<void> {
    const row = await this.models.Job.findByPk(jobId);
    if (!row) return; // deleted meanwhile
    const plan: JobPlan = planForJob(row.kind, row.input);
    const startedAt = await claimJob(this.models, jobId, 0);
    if (!startedAt) return; // finished meanwhile (a stalled attempt came back to it)
    const outcome = await runAttempt(
      this.models,
      { id: jobId, startedAt },
      plan,
      0,
      this.pool,
      () => this.closing,
    );
    if (outcome === 'stopping') throw new Error('This process stopped; another one takes the job.');
  }

  /** Marks a job the queue gave up on as failed, unless it finished meanwhile. */
  private async gaveUp(jobId: string): Promise<void> {
    await this.models.Job.update(
      { status: 'failed', error: GAVE_UP_MESSAGE, finishedAt: new Date() },
      { where: { id: jobId, status: ['queued', 'running'] } },
    );
  }

  private track<T>(work: Promise<T>): Promise<T> {
    this.running.add(work);
    void work.finally(() => this.running.delete(work)).catch(() => undefined);
    return work;
  }

  /** Stops polling; running jobs end with the pool and go back to the queue. */
  async close(): Promise<void> {
    this.closing = true;
    await this.boss.offWork(JOB_QUEUE);
    await this.idle();
    await this.boss.stop({ graceful: true, wait: true, timeout: 5000 });
  }

  async idle(): Promise<void> {
    while (this.running.size) await Promise.allSettled([...this.running]);
  }
}
