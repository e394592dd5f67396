import type { MessagePort } from 'node:worker_threads';
import { HttpError, type ProblemItem } from '../http/errors.js';
import { asBadRequest } from '../services/library.js';
import { COMPUTE_TASKS, type ComputeTaskName } from './computeTasks.js';

/** What the pool sends a worker: the task's name and arguments, and a port to say it started. */
export interface WorkerTask {
  name: ComputeTaskName;
  args: unknown;
  started?: MessagePort;
}

/**
 * What a worker answers: the value, or the problem a request must answer with (an HttpError does
 * not survive structured clone with its status and items, so it crosses as plain data).
 */
export type WorkerAnswer =
  | { ok: true; value: unknown }
  | { ok: false; status: number; detail: string; errors: ProblemItem[] };

/**
 * The compute pool's worker (the export piscina calls by name): says it started (the pool's time limit
 * counts from here, not from the queue), runs the named task, and returns its answer. Errors that
 * are the caller's (a 400 naming a field, from the services or the library) come back as answers;
 * anything else is thrown and becomes a 500 in the request thread.
 */
export function runComputeTask(task: WorkerTask): WorkerAnswer {
  task.started?.postMessage('started');
  task.started?.close();
  const run = COMPUTE_TASKS[task.name] as (args: unknown) => unknown;
  try {
    return { ok: true, value: run(task.args) };
  } catch (error) {
    const problem = asBadRequest('', error);
    if (problem instanceof HttpError)
      return { ok: false, status: problem.status, detail: problem.detail, errors: problem.errors };
    throw problem;
  }
}
