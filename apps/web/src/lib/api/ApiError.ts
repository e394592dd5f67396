import type { Problem } from '@pulsewright/client';

/** An error answer of the API (problem+json), with the field errors for forms. */
export class ApiError extends Error {
  override readonly name = 'ApiError';
  constructor(
    readonly status: number,
    readonly problem: Problem | undefined,
  ) {
    super(problem?.detail || problem?.title || `The server answered ${status}.`);
  }

  /** The message for one field (matched on its last path segment or its full path). */
  fieldError(field: string): string | undefined {
    const errors = this.problem?.errors ?? [];
    const match = errors.find((e) => {
      const path = e.path.replace(/^\/?(body|query|params)[./]?/, '').replace(/\//g, '.');
      return path === field || path.endsWith(`.${field}`);
    });
    return match?.message;
  }
}

/** The message of any error, for error states. */
export function errorMessage(error: unknown): string {
  if (error instanceof Error) return error.message;
  return String(error);
}

/** The server's message for a form field, when the error is an API error. */
export function fieldErrorOf(error: unknown, field: string): string | undefined {
  return error instanceof ApiError ? error.fieldError(field) : undefined;
}
