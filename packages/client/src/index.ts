import createClient, { type Client, type Middleware } from 'openapi-fetch';
import type { components, paths } from './schema.js';

export type { components, operations, paths } from './schema.js';

/** Shorthand for a schema of the API document, e.g. `Schema<'Study'>`. */
export type Schema<Name extends keyof components['schemas']> = components['schemas'][Name];

/** The problem+json body every error of the API has. */
export type Problem = components['schemas']['Problem'];

export interface PulsewrightClientOptions {
  /** Origin of the service, e.g. `http://localhost:3000`; '' for the page's own origin. */
  baseUrl: string;
  /** A session token or an API key; a function is asked before every request. */
  token?: string | (() => string | undefined | null);
  /** fetch to use (tests, Node without a global fetch). @default globalThis.fetch */
  fetch?: typeof globalThis.fetch;
}

export type PulsewrightClient = Client<paths>;

/**
 * A typed client of the Pulsewright API, built on openapi-fetch: paths, bodies and answers are
 * checked against the types generated from apps/api/openapi.yaml at build time, so a breaking
 * change of the document breaks the build of every caller.
 *
 * @example
 * const api = createPulsewrightClient({ baseUrl: 'http://localhost:3000', token });
 * const { data, error } = await api.POST('/api/v1/spectra', { body: { modulation, maxOrder: 50 } });
 */
export function createPulsewrightClient({
  baseUrl,
  token,
  fetch,
}: PulsewrightClientOptions): PulsewrightClient {
  const client = createClient<paths>({ baseUrl, ...(fetch ? { fetch } : {}) });
  const auth: Middleware = {
    onRequest({ request }) {
      const value = typeof token === 'function' ? token() : token;
      if (value) request.headers.set('Authorization', `Bearer ${value}`);
      return request;
    },
  };
  client.use(auth);
  return client;
}
