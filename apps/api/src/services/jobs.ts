import { Op, Transaction } from 'sequelize';
import type { ComputeLimits } from '../config.js';
import type { JobRow, Models } from '../models/index.js';
import { HttpError, notFound } from '../http/errors.js';
import type { AuditLog } from './audit.js';
import type { ComputePool } from './computePool.js';
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

export const INTERRUPTED_MESSAGE =
  'The service stopped while this job was running; start it again.';

interface Entry {
  job: JobRow;
  plan: JobPlan;
}

/**
 * Jobs with progress stored in the jobs table, their work in the compute pool. A job is checked
 * against the job budget, then against the quotas of queued and running jobs per user and per
 * team (429), and stored as `queued`; its first chunk runs before the answer, so input the
 * library rejects gives a 400 and no job. The rest waits for one of `jobConcurrency` slots, so a
 * slot is left for requests, and runs chunk by chunk with `progress` stored after each.
 */
export class JobService {
  private readonly waiting: Entry[] = [];
  private readonly running = new Set<Promise<void>>();
  private closing = false;

  constructor(
    private readonly models: Models,
    private readonly audit: AuditLog,
    private readonly pool: ComputePool,
    private readonly limits: ComputeLimits,
  ) {}

  /** Marks jobs that a crash or stop left queued or running as failed (run at start-up). */
  async failInterrupted(): Promise<number> {
    const [count] = await this.models.Job.update(
      { status: 'failed', error: INTERRUPTED_MESSAGE, finishedAt: new Date() },
      { where: { status: { [Op.in]: ['queued', 'running'] } } },
    );
    return count;
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
    this.waiting.push({ job, plan });
    await this.pump();
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

  /** Starts waiting jobs while a slot is free; resolves once their rows say `running`. */
  private async pump(): Promise<void> {
    const begun: Promise<unknown>[] = [];
    while (!this.closing && this.running.size < this.limits.jobConcurrency && this.waiting.length) {
      const entry = this.waiting.shift() as Entry;
      const marked = entry.job.update({ status: 'running', startedAt: new Date() });
      const task: Promise<void> = marked
        .then(() => this.runRest(entry))
        .catch(() => undefined)
        .finally(() => {
          this.running.delete(task);
          void this.pump();
        });
      this.running.add(task);
      begun.push(marked.catch(() => undefined));
    }
    await Promise.all(begun);
  }

  private async runRest({ job, plan }: Entry): Promise<void> {
    try {
      for (let index = 1; index < plan.chunks; index++) {
        if (this.closing) return; // left 'running'; the next start marks it failed
        await plan.runChunk(index, this.pool);
        if (index < plan.chunks - 1) await job.update({ progress: (index + 1) / plan.chunks });
      }
      await job.update({
        status: 'succeeded',
        progress: 1,
        result: plan.result(),
        finishedAt: new Date(),
      });
    } catch (error) {
      if (this.closing) return;
      await this.fail(job, error);
    }
  }

  private async fail(job: JobRow, error: unknown): Promise<void> {
    const message =
      error instanceof HttpError
        ? error.detail
        : error instanceof Error
          ? error.message
          : String(error);
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
   * terminated), and jobs left queued or running are marked failed at the next start.
   */
  async close(): Promise<void> {
    this.closing = true;
    this.waiting.length = 0;
    await this.pool.close();
    await Promise.allSettled([...this.running]);
  }

  /** Resolves when every running job has finished, and those that started after them (tests). */
  async idle(): Promise<void> {
    while (this.running.size) await Promise.allSettled([...this.running]);
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
