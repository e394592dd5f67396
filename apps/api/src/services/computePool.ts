import { MessageChannel } from 'node:worker_threads';
import { Piscina } from 'piscina';
import type { ComputeLimits } from '../config.js';
import { HttpError } from '../http/errors.js';
import type { ComputeTaskName, TaskArgs, TaskResult } from '../workers/computeTasks.js';
import type { WorkerAnswer, WorkerTask } from '../workers/computeWorker.js';

/**
 * The worker file: the compiled worker beside the built service, or, when the service runs from
 * its TypeScript source (tests), a small ES module that loads the source through tsx.
 */
function workerFile(): string {
  const fromSource = import.meta.url.endsWith('.ts');
  return new URL(
    fromSource ? '../workers/computeWorker.dev.mjs' : '../workers/computeWorker.js',
    import.meta.url,
  ).href;
}

/**
 * Each worker's young generation, MB (Node's `resourceLimits.maxYoungGenerationSizeMb`, passed by
 * piscina to each Worker it makes): 96, two 32 MB semi-spaces, against V8's default of 48 (16 MB
 * semi-spaces). A design report at mf 101 with a filter and spectra to 5000 makes tens of MB of
 * short-lived arrays; with the default a worker scavenged 2.1–2.5 times a report, with 96 MB
 * 1.4–1.7 times, for a third less garbage-collection time (measured in worker threads of one
 * process, four alternating rounds of 40 reports each; 192 and 384 MB gave no fewer). V8's flags
 * are the process's: `npm start` runs the service with `--max-semi-space-size=64`
 * (scripts/start.mjs), which the workers take as well and which wins over this limit (measured:
 * the same new space and scavenges with and without it there); this setting gives the workers the
 * larger young generation wherever the service is started without that flag (tests, `node
 * dist/index.js`).
 */
const WORKER_YOUNG_GENERATION_MB = 96;

export interface RunOptions {
  /**
   * Longest wait for a free worker before the task starts, ms; `null` waits as long as it takes
   * (job chunks, which queue behind each other by design). @default the pool's queueTimeLimitMs
   */
  queueTimeLimitMs?: number | null;
  /** What the work was, for the error messages (e.g. `This design report`). */
  what?: string;
}

/** Why a task was stopped, for the caller (a job records the message). */
export class ComputeStopped extends HttpError {}

/**
 * A pool of worker threads (piscina) for compute that would hold the request thread: sized to
 * the machine's cores, each worker with a heap limit (a task that needs more ends that worker,
 * not the service), and a time limit per task counted from the moment a worker takes it up. A
 * task past its limit is ended by terminating its worker (piscina replaces it) and answered with
 * a 503 naming the limit; one that waits too long for a worker is answered 503 with Retry-After.
 * Created on first use, so an app that computes nothing heavy starts no threads.
 */
export class ComputePool {
  private pool: Piscina | undefined;
  private closed = false;

  constructor(private readonly limits: ComputeLimits) {}

  /** Tasks waiting for a worker and running, for tests and diagnostics. */
  get pending(): number {
    return this.pool ? this.pool.queueSize + this.pool.threads.length - this.pool.idleThreads : 0;
  }

  private piscina(): Piscina {
    if (this.closed)
      throw new HttpError(503, 'The service is shutting down; try again in a moment.');
    this.pool ??= new Piscina({
      filename: workerFile(),
      name: 'runComputeTask',
      minThreads: 1,
      maxThreads: this.limits.threads,
      idleTimeout: 60_000,
      resourceLimits: {
        maxOldGenerationSizeMb: this.limits.workerHeapMb,
        maxYoungGenerationSizeMb: WORKER_YOUNG_GENERATION_MB,
      },
      // Workers yield the CPU to the request thread (and to SQLite's threads): on a machine whose
      // cores are all computing, health checks and sign-ins still get a core at once. Needs
      // piscina's optional @napi-rs/nice; without it the workers run at normal priority.
      niceIncrement: this.limits.workerNice,
    });
    return this.pool;
  }

  /** Runs a named task of workers/computeTasks.ts in the pool and returns its result. */
  async run<N extends ComputeTaskName>(
    name: N,
    args: TaskArgs<N>,
    options: RunOptions = {},
  ): Promise<TaskResult<N>> {
    const pool = this.piscina();
    const what = options.what ?? 'This computation';
    const queueLimit =
      options.queueTimeLimitMs === undefined
        ? this.limits.queueTimeLimitMs
        : options.queueTimeLimitMs;
    const runLimit = this.limits.taskTimeLimitMs;
    const abort = new AbortController();
    const channel = new MessageChannel();
    let started = false;
    let stop: 'queue' | 'time' | undefined;
    let timer =
      queueLimit === null
        ? undefined
        : setTimeout(() => ((stop = 'queue'), abort.abort()), queueLimit);
    channel.port1.once('message', () => {
      started = true;
      clearTimeout(timer);
      timer = setTimeout(() => ((stop = 'time'), abort.abort()), runLimit);
    });
    const task: WorkerTask = { name, args, started: channel.port2 };
    try {
      const answer = (await pool.run(task, {
        transferList: [channel.port2],
        signal: abort.signal,
      })) as WorkerAnswer;
      if (!answer.ok) throw new HttpError(answer.status, answer.detail, answer.errors);
      return answer.value as TaskResult<N>;
    } catch (error) {
      if (error instanceof HttpError) throw error;
      if (stop === 'time' || (abort.signal.aborted && started)) {
        throw new ComputeStopped(
          503,
          `${what} was stopped after ${runLimit / 1000} s, the time limit of one task (COMPUTE_TIME_LIMIT_MS); lower the sizes it asks for.`,
          [],
          'compute-time-limit',
        );
      }
      if (stop === 'queue') {
        throw new ComputeStopped(
          503,
          `Every compute worker stayed busy for ${queueLimit! / 1000} s (COMPUTE_QUEUE_LIMIT_MS); ${what.toLowerCase()} was not started. Try again in a moment.`,
          [],
          'compute-busy',
        );
      }
      const code = (error as { code?: unknown }).code;
      if (code === 'ERR_WORKER_OUT_OF_MEMORY') {
        throw new ComputeStopped(
          503,
          `${what} needed more than the ${this.limits.workerHeapMb} MB a compute worker may use (COMPUTE_WORKER_HEAP_MB) and was stopped; lower the sizes it asks for.`,
          [],
          'compute-memory',
        );
      }
      if (this.closed)
        throw new ComputeStopped(503, 'The service is shutting down; try again in a moment.');
      throw error;
    } finally {
      clearTimeout(timer);
      channel.port1.close();
    }
  }

  /** Ends every task (running ones by terminating their workers) and the threads. */
  async close(): Promise<void> {
    this.closed = true;
    const pool = this.pool;
    this.pool = undefined;
    await pool?.destroy();
  }
}
