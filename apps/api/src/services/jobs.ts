import { Op, Transaction } from 'sequelize';
import type { ComputeLimits } from '../config.js';
import type { JobRow, Models } from '../models/index.js';
import { HttpError, notFound } from '../http/errors.js';
import type { AuditLog } from './audit.js';
import type { ComputePool } from './computePool.js';
import { messageOf, type JobQueue } from './jobQueue.js';
import { assertWithinBudget, type CostEstimate } from './cost.js';
import { iso, isoOrNull } from './dto.js';
import type { Principal } from './principal.js';

export interface JobDto {
  id: string;
  kind: string;
  status: JobRow['status'];
  progress: number;
  result: unknown;
  error: string | null;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
}

/**
 * A job's work as the compute pool runs it: chunks of bounded cost, each one task in a worker,
 * run in order and folded into the result on the request thread (services/sweepJobs.ts).
 */
export interface JobPlan {
  kind: string;
  /** The estimate the job budget is checked against (services/cost.ts). */
  cost: CostEstimate;
  chunks: number;
  /** Runs chunk `index` in the pool and folds its part into the result. */
  runChunk(index: number, pool: ComputePool): Promise<void>;
  result(): unknown;
}

export { INTERRUPTED_MESSAGE } from './inProcessJobQueue.js';

/**
 * Jobs with progress stored in the jobs table, their work in the compute pool. A job is checked
 * against the job budget, then against the quotas of queued and running jobs per user and per
 * team (429), and stored as `queued`; its first chunk runs before the answer, so input the
 * library rejects gives a 400 and no job. The rest is handed to the job queue (services/
 * jobQueue.ts): in this process on SQLite, through pg-boss on PostgreSQL so any replica runs it.
 */
export class JobService {
  constructor(
    private readonly models: Models,
    private readonly audit: AuditLog,
    private readonly pool: ComputePool,
    private readonly limits: ComputeLimits,
    private readonly queue: JobQueue,
  ) {}

  /** Starts the queue: on SQLite, marks jobs a crash or stop left queued or running as failed. */
  async startQueue(): Promise<void> {
    await this.queue.start();
  }

  async start(
    principal: Principal,
    input: Record<string, unknown>,
    plan: JobPlan,
  ): Promise<JobDto> {
    assertWithinBudget(plan.cost, 'job', this.limits);
    const job = await this.reserve(principal, plan.kind, input);
    try {
      await plan.runChunk(0, this.pool);
    } catch (error) {
      if (error instanceof HttpError && error.status === 400) {
        await job.destroy();
        throw error;
      }
      await this.fail(job, error);
      throw error;
    }
    await this.audit.record(principal, 'job.start', 'job', job.id, { kind: plan.kind });
    if (plan.chunks <= 1) {
      const now = new Date();
      await job.update({
        status: 'succeeded',
        progress: 1,
        result: plan.result(),
        startedAt: now,
        finishedAt: now,
      });
      return toDto(job);
    }
    await job.update({ progress: 1 / plan.chunks });
    try {
      await this.queue.submit(job, plan);
    } catch (error) {
      await this.fail(job, error);
      throw error;
    }
    await job.reload(); // the queue may have started it
    return toDto(job);
  }

  /**
   * Counts the caller's and the team's queued and running jobs and stores the new one as queued,
   * in one write transaction, so concurrent starts cannot both slip under a quota: SQLite's
   * writers take turns; on PostgreSQL a transaction-scoped advisory lock on the team does the
   * same across replicas.
   */
  private async reserve(
    principal: Principal,
    kind: string,
    input: Record<string, unknown>,
  ): Promise<JobRow> {
    const active = { status: { [Op.in]: ['queued', 'running'] } };
    const { sequelize } = this.models;
    return sequelize.transaction({ type: Transaction.TYPES.IMMEDIATE }, async (transaction) => {
      if (sequelize.getDialect() === 'postgres') {
        await sequelize.query('SELECT pg_advisory_xact_lock(hashtext(:key))', {
          replacements: { key: `jobs:${principal.teamId}` },
          transaction,
        });
      }
      const mine = await this.models.Job.count({
        where: { ...active, userId: principal.user.id },
        transaction,
      });
      if (mine >= this.limits.userJobQuota) {
        throw new HttpError(
          429,
          `You have ${mine} jobs queued or running, the most one user may have (JOB_QUOTA_USER is ${this.limits.userJobQuota}); wait for one to finish (GET /api/v1/jobs) and start this one again.`,
          [],
          'job-quota',
        );
      }
      const team = await this.models.Job.count({
        where: { ...active, teamId: principal.teamId },
        transaction,
      });
      if (team >= this.limits.teamJobQuota) {
        throw new HttpError(
          429,
          `Your team has ${team} jobs queued or running, the most one team may have (JOB_QUOTA_TEAM is ${this.limits.teamJobQuota}); wait for one to finish (GET /api/v1/jobs) and start this one again.`,
          [],
          'job-quota',
        );
      }
      return this.models.Job.create(
        {
          teamId: principal.teamId,
          userId: principal.user.id,
          kind,
          status: 'queued',
          progress: 0,
          input,
        },
        { transaction },
      );
    });
  }

  private async fail(job: JobRow, error: unknown): Promise<void> {
    const message = messageOf(error);
    await job
      .update({ status: 'failed', error: message, finishedAt: new Date() })
      .catch(() => undefined);
  }

  async get(teamId: string, id: string): Promise<JobDto> {
    const job = await this.models.Job.findOne({ where: { id, teamId } });
    if (!job) throw notFound('That job');
    return toDto(job);
  }

  async list(teamId: string, limit: number, offset: number): Promise<JobDto[]> {
    const jobs = await this.models.Job.findAll({
      where: { teamId },
      attributes: { exclude: ['result', 'input'] },
      order: [['createdAt', 'DESC']],
      limit,
      offset,
    });
    return jobs.map((job) => ({ ...toDto(job), result: null }));
  }

  /**
   * Stops: no waiting job starts, running chunks are ended with the pool (their workers
   * terminated); what happens to their jobs is the queue's (services/jobQueue.ts).
   */
  async close(): Promise<void> {
    await Promise.all([this.queue.close(), this.pool.close()]);
    await this.queue.idle();
  }

  /** Resolves when this process runs no job (tests). */
  async idle(): Promise<void> {
    await this.queue.idle();
  }
}

function toDto(job: JobRow): JobDto {
  return {
    id: job.id,
    kind: job.kind,
    status: job.status,
    progress: job.progress,
    result: job.result ?? null,
    error: job.error ?? null,
    createdAt: iso(job.createdAt),
    startedAt: isoOrNull(job.startedAt),
    finishedAt: isoOrNull(job.finishedAt),
  };
}
