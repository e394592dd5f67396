import { HttpError } from '../errors.js';
import type { Problem } from './problem.js';

/** The service's own HttpError (routes, services, the authoriser): rendered as it was raised. */
export function httpErrorProblem(err: unknown): Problem | undefined {
  if (!(err instanceof HttpError)) return undefined;
  return {
    status: err.status,
    detail: err.detail,
    errors: err.errors,
    ...(err.kind ? { kind: err.kind } : {}),
  };
}
