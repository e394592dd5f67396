/** One problem with one input field (or with the request as a whole when `path` is ''). */
export interface ProblemItem {
  path: string;
  message: string;
}

const TITLES: Record<number, string> = {
  400: 'Bad request',
  401: 'Not signed in',
  403: 'Not allowed',
  404: 'Not found',
  405: 'Method not allowed',
  409: 'Conflict',
  413: 'Too large',
  415: 'Unsupported media type',
  429: 'Too many requests',
  500: 'Internal error',
  503: 'Service unavailable',
};

const TYPES: Record<number, string> = {
  400: 'validation-error',
  401: 'unauthenticated',
  403: 'forbidden',
  404: 'not-found',
  405: 'method-not-allowed',
  409: 'conflict',
  413: 'payload-too-large',
  415: 'unsupported-media-type',
  429: 'rate-limited',
  500: 'internal-error',
  503: 'storage-unavailable',
};

/** The URI naming a kind of problem (RFC 9457 `type`). */
export function problemType(status: number, kind?: string): string {
  return `urn:pulsewright:problem:${kind ?? TYPES[status] ?? 'error'}`;
}

export function problemTitle(status: number): string {
  return TITLES[status] ?? 'Error';
}

/**
 * The service's one error class: every failure a route or service raises is one of these, and
 * the final error handler renders it as application/problem+json.
 */
export class HttpError extends Error {
  override readonly name = 'HttpError';

  constructor(
    readonly status: number,
    readonly detail: string,
    readonly errors: ProblemItem[] = [],
    /** The problem's kind where the status alone does not say it (`job-quota`, `compute-time-limit`). */
    readonly kind?: string,
  ) {
    super(detail);
  }
}

export const badRequest = (detail: string, errors: ProblemItem[] = []): HttpError =>
  new HttpError(400, detail, errors);
export const notFound = (what: string): HttpError => new HttpError(404, `${what} was not found.`);
export const forbidden = (detail: string): HttpError => new HttpError(403, detail);
export const conflict = (detail: string, errors: ProblemItem[] = []): HttpError =>
  new HttpError(409, detail, errors);
export const unauthenticated = (detail: string): HttpError => new HttpError(401, detail);
