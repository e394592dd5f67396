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
    if (problem.status === 503) res.setHeader('Retry-After', '30');
    if (problem.status === 429 && !res.getHeader('Retry-After')) res.setHeader('Retry-After', '10');
    // send (not json): the body never goes through response validation hooks, whose failure
    // would come back here.
    res
      .status(problem.status)
      .type('application/problem+json')
      .send(
        JSON.stringify({
          type: problemType(problem.status, problem.kind),
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
  kind?: string;
}

function toProblem(document: OpenApiDocument, err: unknown, req: Request): Problem {
  if (err instanceof HttpError)
    return {
      status: err.status,
      detail: err.detail,
      errors: err.errors,
      ...(err.kind ? { kind: err.kind } : {}),
    };
  if (isParameterError(err)) {
    return {
      status: 400,
      detail: err.message,
      errors: [{ path: err.field, message: err.message }],
    };
  }
  const bodyParser = err as {
    type?: string;
    status?: number;
    charset?: string;
    encoding?: string;
    message?: string;
  };
  if (bodyParser?.type === 'entity.parse.failed') {
    return {
      status: 400,
      detail: 'The request body is not valid JSON.',
      errors: [{ path: 'body', message: 'The request body is not valid JSON.' }],
    };
  }
  if (bodyParser?.type === 'entity.too.large') {
    return { status: 413, detail: 'The request body is larger than 1 MB.', errors: [] };
  }
  if (isBodyParserError(err)) return bodyParserProblem(err);
  const storage = storageProblem(err);
  if (storage) return storage;
  if (isValidatorError(err) && isUploadError(err, req)) return uploadProblem(err);
  if (isValidatorError(err)) {
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
    if (
      err.status >= 500 &&
      !(err.errors ?? []).every((item) => (item.path ?? '').startsWith('/response'))
    ) {
      // A 500 the validator raised while reading the request (not checking our answer) is the
      // request's fault: name what it reported.
      const errors = (err.errors ?? []).map((item) => ({
        path: requestField(item.path),
        message: sentence(item.message ?? err.message),
      }));
      return {
        status: 400,
        detail: `The request could not be read: ${sentence(err.message)}`,
        errors: errors.length ? errors : [{ path: 'body', message: sentence(err.message) }],
      };
    }
    if (err.status >= 500) {
      return {
        status: 500,
        detail: 'The service produced an answer that breaks its own contract; this is a bug.',
        errors: (err.errors ?? []).map((item) => ({
          path: item.path ?? '',
          message: item.message ?? '',
        })),
      };
    }
    if (err.status === 401 && /authorization header/i.test(err.message)) {
      return {
        status: 401,
        detail: 'Sign in first: send Authorization: Bearer <session token or API key>.',
        errors: [],
      };
    }
    return { status: err.status, detail: sentence(err.message), errors: [] };
  }
  if (err instanceof Error && err.name === 'SequelizeUniqueConstraintError') {
    return {
      status: 409,
      detail: 'That conflicts with data saved meanwhile; reload and try again.',
      errors: [],
    };
  }
  return {
    status: 500,
    detail: 'Something went wrong inside the service; it has been logged.',
    errors: [],
  };
}

/** body-parser's own errors (http-errors with a `type` such as `charset.unsupported`). */
function isBodyParserError(
  err: unknown,
): err is { type: string; status: number; message: string; charset?: string; encoding?: string } {
  const e = err as { type?: unknown; status?: unknown } | null;
  return (
    err instanceof Error &&
    typeof e?.type === 'string' &&
    typeof e.status === 'number' &&
    e.status >= 400 &&
    e.status < 500 &&
    !isValidatorError(err)
  );
}

function bodyParserProblem(err: {
  type: string;
  status: number;
  message: string;
  charset?: string;
  encoding?: string;
}): Problem {
  if (err.type === 'charset.unsupported') {
    const detail = `The request body's charset ${JSON.stringify(err.charset ?? '')} is not supported; send JSON as UTF-8 (Content-Type: application/json or application/json; charset=utf-8).`;
    return { status: 415, detail, errors: [{ path: 'body', message: detail }] };
  }
  if (err.type === 'encoding.unsupported') {
    const detail = `The request body's Content-Encoding ${JSON.stringify(err.encoding ?? '')} is not supported; send it unencoded (identity) or as gzip, deflate or br.`;
    return { status: 415, detail, errors: [{ path: 'body', message: detail }] };
  }
  const detail = `The request body could not be read: ${sentence(err.message)}`;
  return { status: err.status, detail, errors: [{ path: 'body', message: detail }] };
}

/** A multipart upload the validator's multer/busboy step could not read (its items name the URL path). */
function isUploadError(err: ValidatorError, req: Request): boolean {
  return (
    /^multipart\//i.test(req.headers['content-type'] ?? '') &&
    err.status !== 401 &&
    err.status !== 403 &&
    (err.errors ?? []).every((item) => item.path === req.path || !(item.path ?? '').startsWith('/'))
  );
}

function uploadProblem(err: ValidatorError): Problem {
  const reason = sentence(err.message);
  const status = err.status === 413 ? 413 : 400;
  if (status === 413) {
    return {
      status,
      detail: 'The upload is larger than allowed (5 MB, one file).',
      errors: [{ path: 'file', message: 'file must be one file of at most 5 MB' }],
    };
  }
  const fieldProblem = /field/i.test(err.message) && !/unexpected field/i.test(err.message);
  const path = fieldProblem ? 'body' : 'file';
  const detail =
    path === 'file'
      ? `The upload could not be read (${reason.replace(/\.$/, '')}); send one CSV as the multipart field "file" with a plain file name.`
      : `The upload's form fields could not be read: ${reason}`;
  return { status, detail, errors: [{ path, message: detail }] };
}

/** `/body/x/y` → `x.y`; `/query/limit` → `limit`; anything else → `body`. */
function requestField(path: string | undefined): string {
  const parts = (path ?? '').split('/').filter(Boolean);
  if (
    parts[0] === 'body' ||
    parts[0] === 'query' ||
    parts[0] === 'params' ||
    parts[0] === 'headers'
  ) {
    return parts.slice(1).join('.') || parts[0];
  }
  return 'body';
}

/** SQLite / PostgreSQL error codes meaning the storage cannot take the write. */
const STORAGE_PROBLEMS: Record<string, string> = {
  SQLITE_READONLY:
    'The database is read-only; nothing was saved. Give the service write access to its database file and folder, then try again.',
  SQLITE_CANTOPEN:
    'The database file cannot be opened for writing; nothing was saved. Check that the file and its folder exist and the service may write them, then try again.',
  SQLITE_IOERR:
    'The database storage failed to read or write (I/O error); nothing was saved. Check the disk that holds the database, then try again.',
  SQLITE_FULL:
    'The database disk is full; nothing was saved. Free space on the storage that holds the database, then try again.',
  SQLITE_BUSY: 'The database is busy with other writes; nothing was saved. Try again in a moment.',
  SQLITE_LOCKED:
    'The database is busy with other writes; nothing was saved. Try again in a moment.',
  // PostgreSQL SQLSTATEs: read_only_sql_transaction, disk_full, insufficient_resources.
  '25006': 'The database is read-only; nothing was saved. Try again once it accepts writes.',
  '53100':
    'The database disk is full; nothing was saved. Free space on the database server, then try again.',
  '53000': 'The database has run out of resources; nothing was saved. Try again in a moment.',
};

/** The driver's error code of a Sequelize error (its `parent` / `original`, or the error itself). */
function driverCode(err: unknown): string | undefined {
  const seen = new Set<unknown>();
  let current: unknown = err;
  while (current && typeof current === 'object' && !seen.has(current)) {
    seen.add(current);
    const e = current as {
      code?: unknown;
      message?: unknown;
      parent?: unknown;
      original?: unknown;
      cause?: unknown;
    };
    if (typeof e.code === 'string' && e.code in STORAGE_PROBLEMS) return e.code;
    const named =
      typeof e.message === 'string' ? /\b(SQLITE_[A-Z]+)\b/.exec(e.message)?.[1] : undefined;
    if (named && named in STORAGE_PROBLEMS) return named;
    current = e.parent ?? e.original ?? e.cause;
  }
  return undefined;
}

/** Storage that cannot take a write → 503 (RFC 9110 §15.6.4: the service is temporarily unable). */
function storageProblem(err: unknown): Problem | undefined {
  if (!(err instanceof Error) || !err.name.startsWith('Sequelize')) return undefined;
  const code = driverCode(err);
  if (!code) return undefined;
  const detail = STORAGE_PROBLEMS[code] as string;
  return { status: 503, detail, errors: [] };
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
    const tag =
      (union?.discriminator as { propertyName?: string } | undefined)?.propertyName ?? 'method';
    const mapping = Object.keys(
      ((union?.discriminator as { mapping?: object } | undefined)?.mapping ?? {}) as object,
    );
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
    const content = (
      operation.requestBody as { content?: Record<string, { schema?: JsonSchema }> } | undefined
    )?.content;
    const root = content?.['application/json']?.schema ?? content?.['multipart/form-data']?.schema;
    let value: unknown = req.body;
    for (const segment of segments)
      value = (value as Record<string, unknown> | undefined)?.[segment];
    return { schema: schemaAt(document, root, segments, req.body, { keepChoices }), value };
  }
  const name = segments[0];
  const where = location === 'params' ? 'path' : location;
  const pathItem = document.paths[openApiRouteOf(req) ?? ''] ?? {};
  const parameters = [
    ...((pathItem.parameters as JsonSchema[] | undefined) ?? []),
    ...((operation.parameters as JsonSchema[] | undefined) ?? []),
  ].map((p) => (p.$ref ? (resolveParameter(document, p) ?? p) : p));
  const parameter = parameters.find((p) => p.name === name && p.in === where);
  const source =
    location === 'params' ? req.params : location === 'query' ? req.query : req.headers;
  return {
    schema: schemaAt(document, parameter?.schema as JsonSchema | undefined, [], undefined),
    value: (source as Record<string, unknown>)[name ?? ''],
  };
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
