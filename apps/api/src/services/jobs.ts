import { setImmediate as yieldToEventLoop } from 'node:timers/promises';
import { Op } from 'sequelize';
import type { JobRow, Models } from '../models/index.js';
import { notFound } from '../http/errors.js';
import type { AuditLog } from './audit.js';
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
 * Work split into chunks of bounded cost. The first chunk runs inside the request, so input
 * the library rejects gives a 400 and no job; the rest run in the background, one chunk per
 * turn of the event loop, so requests keep being answered while a sweep runs.
 */
export interface ChunkedWork {
  chunks: number;
  runChunk(index: number): void;
  result(): unknown;
}

export const INTERRUPTED_MESSAGE = 'The service stopped while this job was running; start it again.';

/** In-process jobs with progress stored in the jobs table. */
export class JobService {
  private readonly running = new Set<Promise<void>>();
  private closing = false;

  constructor(
    private readonly models: Models,
    private readonly audit: AuditLog,
  ) {}

  /** Marks jobs that a crash or stop left queued or running as failed (run at start-up). */
  async failInterrupted(): Promise<number> {
    const [count] = await this.models.Job.update(
      { status: 'failed', error: INTERRUPTED_MESSAGE, finishedAt: new Date() },
      { where: { status: { [Op.in]: ['queued', 'running'] } } },
    );
    return count;
  }

  async start(principal: Principal, kind: string, input: Record<string, unknown>, work: ChunkedWork): Promise<JobDto> {
    work.runChunk(0);
    const done = work.chunks <= 1;
    const now = new Date();
    const job = await this.models.Job.create({
      teamId: principal.teamId,
      userId: principal.user.id,
      kind,
      status: done ? 'succeeded' : 'running',
      progress: done ? 1 : 1 / work.chunks,
      input,
      result: done ? work.result() : null,
      startedAt: now,
      finishedAt: done ? now : null,
    });
    await this.audit.record(principal, 'job.start', 'job', job.id, { kind });
    if (!done) {
      const task = this.runRest(job, work).finally(() => this.running.delete(task));
      this.running.add(task);
    }
    return toDto(job);
  }

  private async runRest(job: JobRow, work: ChunkedWork): Promise<void> {
    try {
      for (let index = 1; index < work.chunks; index++) {
        await yieldToEventLoop();
        if (this.closing) return; // left 'running'; the next start marks it failed
        work.runChunk(index);
        if (index < work.chunks - 1) await job.update({ progress: (index + 1) / work.chunks });
      }
      await job.update({ status: 'succeeded', progress: 1, result: work.result(), finishedAt: new Date() });
    } catch (error) {
      if (this.closing) return;
      await job.update({
        status: 'failed',
        error: error instanceof Error ? error.message : String(error),
        finishedAt: new Date(),
      });
    }
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

  /** Waits for background work to stop at its next chunk boundary. */
  async close(): Promise<void> {
    this.closing = true;
    await Promise.allSettled([...this.running]);
  }

  /** Resolves when every background job has finished (tests). */
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
