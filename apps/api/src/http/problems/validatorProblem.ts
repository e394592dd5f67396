import type { ProblemItem } from '../errors.js';
import { sentence, type Problem, type ProblemContext } from './problem.js';
import { validationItem } from './validationItem.js';
import { isValidatorError, type ValidatorError } from './validatorError.js';

/** `/body/x/y` → `x.y`; `/query/limit` → `limit`; anything else → `body`. */
function requestField(path: string | undefined): string {
  const parts = (path ?? '').split('/').filter(Boolean);
  if (['body', 'query', 'params', 'headers'].includes(parts[0] ?? '')) {
    return parts.slice(1).join('.') || (parts[0] as string);
  }
  return 'body';
}

/** A 5xx the validator raised: the request's fault when it was reading the request, else ours. */
function serverSideProblem(err: ValidatorError): Problem {
  const items = err.errors ?? [];
  if (items.every((item) => (item.path ?? '').startsWith('/response'))) {
    return {
      status: 500,
      detail: 'The service produced an answer that breaks its own contract; this is a bug.',
      errors: items.map((item) => ({ path: item.path ?? '', message: item.message ?? '' })),
    };
  }
  // A 500 raised while reading the request (not checking our answer): name what it reported.
  const errors = items.map((item) => ({
    path: requestField(item.path),
    message: sentence(item.message ?? err.message),
  }));
  return {
    status: 400,
    detail: `The request could not be read: ${sentence(err.message)}`,
    errors: errors.length ? errors : [{ path: 'body', message: sentence(err.message) }],
  };
}

/**
 * express-openapi-validator's errors: a request outside the contract → 400 naming each field
 * with its allowed range (in the library's words); its 401, 404, 405, 413 as they are; an answer
 * of ours outside the contract → 500.
 */
export function validatorProblem(
  err: unknown,
  { document, req }: ProblemContext,
): Problem | undefined {
  if (!isValidatorError(err)) return undefined;
  if (err.status === 400) {
    const errors = (err.errors ?? []).map((item) => validationItem(document, req, item));
    const detail =
      errors.length === 1
        ? (errors[0] as ProblemItem).message
        : `${errors.length} fields are not valid: ${errors.map((e) => e.message).join('; ')}`;
    return { status: 400, detail, errors };
  }
  if (err.status === 413) {
    return {
      status: 413,
      detail: 'The upload is larger than allowed (5 MB).',
      errors: [{ path: 'file', message: 'file must be at most 5 MB' }],
    };
  }
  if (err.status >= 500) return serverSideProblem(err);
  if (err.status === 401 && /authorization header/i.test(err.message)) {
    return {
      status: 401,
      detail: 'Sign in first: send Authorization: Bearer <session token or API key>.',
      errors: [],
    };
  }
  return { status: err.status, detail: sentence(err.message), errors: [] };
}
