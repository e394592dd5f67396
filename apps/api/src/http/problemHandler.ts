import type { ErrorRequestHandler, Request } from 'express';
import type { OpenApiDocument, JsonSchema } from '../openapi.js';
import { describeAllowed, describeValue, schemaAt } from './describeSchema.js';
import { HttpError, problemTitle, problemType, type ProblemItem } from './errors.js';

/** A validation error item as express-openapi-validator reports it. */
interface ValidatorItem {
  path?: string;
  message?: string;
  errorCode?: string;
}

interface ValidatorError {
  status: number;
  message: string;
  errors?: ValidatorItem[];
}

function isValidatorError(err: unknown): err is ValidatorError {
  return (
    typeof err === 'object' &&
    err !== null &&
    typeof (err as { status?: unknown }).status === 'number' &&
    Array.isArray((err as { errors?: unknown }).errors)
  );
}

/** The library's ParameterRangeError / ParameterTypeError, recognised by shape. */
function isParameterError(err: unknown): err is Error & { field: string } {
  return (
    err instanceof Error &&
    (err.name === 'ParameterRangeError' || err.name === 'ParameterTypeError') &&
    typeof (err as { field?: unknown }).field === 'string'
  );
}

/**
 * The one final error handler: renders every error as application/problem+json
 * `{ type, title, status, detail, errors: [{ path, message }] }`.
 */
export function problemHandler(document: OpenApiDocument, logErrors: boolean): ErrorRequestHandler {
  return (err: unknown, req, res, next) => {
    if (res.headersSent) {
      next(err);
      return;
    }
    const problem = toProblem(document, err, req);
    if (problem.status >= 500 && logErrors) {
      console.error(`pulsewright: ${req.method} ${req.originalUrl} failed:`, err);
    }
    if (problem.status === 401) res.setHeader('WWW-Authenticate', 'Bearer realm="pulsewright"');
    // send (not json): the body never goes through response validation hooks, whose failure
    // would come back here.
    res
      .status(problem.status)
      .type('application/problem+json')
      .send(
        JSON.stringify({
          type: problemType(problem.status),
          title: problemTitle(problem.status),
          status: problem.status,
          detail: problem.detail,
          errors: problem.errors,
        }),
      );
  };
}

interface Problem {
  status: number;
  detail: string;
  errors: ProblemItem[];
}

function toProblem(document: OpenApiDocument, err: unknown, req: Request): Problem {
  if (err instanceof HttpError) return { status: err.status, detail: err.detail, errors: err.errors };
  if (isParameterError(err)) {
    return { status: 400, detail: err.message, errors: [{ path: err.field, message: err.message }] };
  }
  const bodyParser = err as { type?: string; status?: number };
  if (bodyParser?.type === 'entity.parse.failed') {
    return { status: 400, detail: 'The request body is not valid JSON.', errors: [{ path: 'body', message: 'The request body is not valid JSON.' }] };
  }
  if (bodyParser?.type === 'entity.too.large') {
    return { status: 413, detail: 'The request body is larger than 1 MB.', errors: [] };
  }
  if (isValidatorError(err)) {
    if (err.status === 400) {
      const errors = (err.errors ?? []).map((item) => validationItem(document, req, item));
      const detail = errors.length === 1 ? (errors[0] as ProblemItem).message : `${errors.length} fields are not valid: ${errors.map((e) => e.message).join('; ')}`;
      return { status: 400, detail, errors };
    }
    if (err.status === 413) {
      return { status: 413, detail: 'The upload is larger than allowed (5 MB).', errors: [{ path: 'file', message: 'file must be at most 5 MB' }] };
    }
    if (err.status >= 500) {
      return {
        status: 500,
        detail: 'The service produced an answer that breaks its own contract; this is a bug.',
        errors: (err.errors ?? []).map((item) => ({ path: item.path ?? '', message: item.message ?? '' })),
      };
    }
    if (err.status === 401 && /authorization header/i.test(err.message)) {
      return { status: 401, detail: 'Sign in first: send Authorization: Bearer <session token or API key>.', errors: [] };
    }
    return { status: err.status, detail: sentence(err.message), errors: [] };
  }
  if (err instanceof Error && err.name === 'SequelizeUniqueConstraintError') {
    return { status: 409, detail: 'That conflicts with data saved meanwhile; reload and try again.', errors: [] };
  }
  return { status: 500, detail: 'Something went wrong inside the service; it has been logged.', errors: [] };
}

function sentence(text: string): string {
  const trimmed = text.trim();
  if (!trimmed) return 'Request refused.';
  return trimmed[0]?.toUpperCase() + trimmed.slice(1) + (/[.!?]$/.test(trimmed) ? '' : '.');
}

/** Turns `/body/modulation/ma` + "must be <= 4" into `modulation.ma must be a number > 0 and ≤ 4; got 5`. */
function validationItem(document: OpenApiDocument, req: Request, item: ValidatorItem): ProblemItem {
  const parts = (item.path ?? '').split('/').filter(Boolean);
  const location = parts[0] ?? '';
  const segments = parts.slice(1);
  const code = (item.errorCode ?? '').replace('.openapi.validation', '');
  if (code === 'discriminator') {
    const union = locate(document, req, location, segments, true).schema;
    const tag = (union?.discriminator as { propertyName?: string } | undefined)?.propertyName ?? 'method';
    const mapping = Object.keys(((union?.discriminator as { mapping?: object } | undefined)?.mapping ?? {}) as object);
    const field = [...segments, tag].join('.');
    const given = locate(document, req, location, [...segments, tag]).value;
    const message = `${field} must be one of ${mapping.map((v) => JSON.stringify(v)).join(', ') || 'the documented values'}; got ${describeValue(given)}`;
    return { path: field, message };
  }
  const field = segments.join('.') || location;
  const { schema, value } = locate(document, req, location, segments);
  const allowed = describeAllowed(document, schema);
  let message: string;
  if (code === 'required') {
    message = allowed ? `${field} is required; it must be ${allowed}` : `${field} is required`;
  } else if (code === 'additionalProperties') {
    const parent = locate(document, req, location, segments.slice(0, -1)).schema;
    const known = Object.keys((parent?.properties as object | undefined) ?? {});
    message = `${field} is not a known field${known.length ? `; allowed fields are ${known.join(', ')}` : ''}`;
  } else if (allowed) {
    message = `${field} must be ${allowed}; got ${describeValue(value)}`;
  } else {
    message = `${field} ${item.message ?? 'is not valid'}`;
  }
  return { path: field, message };
}

function locate(
  document: OpenApiDocument,
  req: Request,
  location: string,
  segments: readonly string[],
  keepChoices = false,
): { schema: JsonSchema | undefined; value: unknown } {
  const operation = operationOf(document, req);
  if (!operation) return { schema: undefined, value: undefined };
  if (location === 'body') {
    const content = (operation.requestBody as { content?: Record<string, { schema?: JsonSchema }> } | undefined)?.content;
    const root = content?.['application/json']?.schema ?? content?.['multipart/form-data']?.schema;
    let value: unknown = req.body;
    for (const segment of segments) value = (value as Record<string, unknown> | undefined)?.[segment];
    return { schema: schemaAt(document, root, segments, req.body, { keepChoices }), value };
  }
  const name = segments[0];
  const where = location === 'params' ? 'path' : location;
  const pathItem = document.paths[openApiRouteOf(req) ?? ''] ?? {};
  const parameters = [
    ...(((pathItem.parameters as JsonSchema[] | undefined) ?? [])),
    ...(((operation.parameters as JsonSchema[] | undefined) ?? [])),
  ].map((p) => (p.$ref ? (resolveParameter(document, p) ?? p) : p));
  const parameter = parameters.find((p) => p.name === name && p.in === where);
  const source = location === 'params' ? req.params : location === 'query' ? req.query : req.headers;
  return { schema: schemaAt(document, parameter?.schema as JsonSchema | undefined, [], undefined), value: (source as Record<string, unknown>)[name ?? ''] };
}

function resolveParameter(document: OpenApiDocument, ref: JsonSchema): JsonSchema | undefined {
  const pointer = String(ref.$ref).replace(/^#\//, '').split('/');
  let target: unknown = document;
  for (const part of pointer) target = (target as Record<string, unknown> | undefined)?.[part];
  return target as JsonSchema | undefined;
}

function openApiRouteOf(req: Request): string | undefined {
  return (req as Request & { openapi?: { openApiRoute?: string } }).openapi?.openApiRoute;
}

function operationOf(document: OpenApiDocument, req: Request): Record<string, unknown> | undefined {
  const route = openApiRouteOf(req);
  if (!route) return undefined;
  return document.paths[route]?.[req.method.toLowerCase()] as Record<string, unknown> | undefined;
}
