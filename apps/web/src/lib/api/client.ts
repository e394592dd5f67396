import { createPulsewrightClient, type operations, type Problem } from '@pulsewright/client';
import { session } from '../session';
import { ApiError } from './ApiError';

// The one door of the dashboard to the service: the generated typed client (openapi-fetch over
// the types openapi-typescript makes from apps/api/openapi.yaml), so every path, body and answer
// is checked by the compiler and no answer is parsed by hand.

/** The typed client of the API, same origin, with the session token on every request. */
export const api = createPulsewrightClient({
  // An absolute origin: Request() needs one outside a browser page (tests).
  baseUrl: globalThis.location?.origin ?? '',
  token: () => session.getToken(),
  // openapi-fetch keeps a reference to fetch; look it up per call so tests can replace it.
  fetch: (input, init) => globalThis.fetch(input, init),
});

/** The JSON body an operation of the API takes, by its operationId in apps/api/openapi.yaml. */
export type BodyOf<Id extends keyof operations> = operations[Id] extends {
  requestBody?: { content: { 'application/json': infer Body } };
}
  ? Body
  : never;

/** The query parameters an operation of the API takes, by its operationId. */
export type QueryOf<Id extends keyof operations> = NonNullable<
  operations[Id]['parameters']['query']
>;

/** Turns an openapi-fetch answer into its data or throws {@link ApiError}. */
export function unwrap<T>(result: { data?: T; error?: unknown; response: Response }): T {
  if (result.error !== undefined || !result.response.ok) throw failure(result);
  return result.data as T;
}

/** For 204 answers: throws {@link ApiError} on an error, returns nothing. */
export function unwrapEmpty(result: { error?: unknown; response: Response }): void {
  if (!result.response.ok) throw failure(result);
}

/** The error of a failed answer; a 401 also ends the session (the token is no longer valid). */
function failure({ error, response }: { error?: unknown; response: Response }): ApiError {
  if (response.status === 401) session.setToken(null);
  return new ApiError(response.status, error as Problem | undefined);
}
