import { createPulsewrightClient, type Problem } from '@pulsewright/client';
import { session } from './session';

/** The typed client of the API, same origin, with the session token on every request. */
export const api = createPulsewrightClient({
  // An absolute origin: Request() needs one outside a browser page (tests).
  baseUrl: globalThis.location?.origin ?? '',
  token: () => session.getToken(),
  // openapi-fetch keeps a reference to fetch; look it up per call so tests can replace it.
  fetch: (input, init) => globalThis.fetch(input, init),
});

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

/** Turns an openapi-fetch answer into its data or throws {@link ApiError}. */
export function unwrap<T>(result: { data?: T; error?: unknown; response: Response }): T {
  if (result.error !== undefined || !result.response.ok) {
    if (result.response.status === 401) session.setToken(null);
    throw new ApiError(result.response.status, result.error as Problem | undefined);
  }
  return result.data as T;
}

/** For 204 answers: throws on error, returns nothing. */
export function unwrapEmpty(result: { error?: unknown; response: Response }): void {
  if (!result.response.ok) {
    if (result.response.status === 401) session.setToken(null);
    throw new ApiError(result.response.status, result.error as Problem | undefined);
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
