import type { IncomingMessage } from 'node:http';
import type { NextFunction, Request, RequestHandler, Response, Router } from 'express';
import type { OpenApiDocument } from '../openapi.js';
import type { CachedMetadataStep } from './cacheOpenApiMetadata.js';

/**
 * express-openapi-validator 5's steps, by function name, that act on a JSON request to a
 * documented path without parameters, in the order the validator lists them (`installMiddleware`
 * in `openapi.validator.js`): the route lookup (kept by cacheOpenApiMetadata), the security
 * handler (authentication and the role), the request check (query, headers and body against the
 * document, defaults filled in) and, when on, the response check.
 */
const STEPS = new Set([
  'metadataMiddleware',
  'securityMiddleware',
  'requestMiddleware',
  'responseMiddleware',
]);

/**
 * The validator's steps the fast path leaves out, and why that changes nothing for the requests
 * it takes: `pathParamsMiddleware` installs `app.param` handlers on the first request of the
 * process and then only calls `next` (the fast path is taken only after the first request to its
 * path went through the whole chain), and `multipartMiddleware` acts only on
 * `multipart/form-data` bodies (the fast path takes only `application/json`).
 */
const SKIPPED = new Set(['pathParamsMiddleware', 'multipartMiddleware']);

/** The two spellings of a JSON body's type the fast path takes; any other goes the whole way. */
const JSON_TYPES = new Set(['application/json', 'application/json; charset=utf-8']);

/** What the fast path needs of the app: the parts it would otherwise reach one layer at a time. */
export interface ComputeFastPathOptions {
  /** helmet's headers (securityHeaders), the app's first step for every answer. */
  headers: RequestHandler;
  /** express-openapi-validator's steps as the app mounts them (after cacheOpenApiMetadata). */
  validator: readonly RequestHandler[];
  /** The router whose POST routes the fast path takes (computeRoutes), called as the app would. */
  router: Router;
  /** The OpenAPI document: only its POST operations with a JSON body and no path parameters. */
  document: OpenApiDocument;
  /** The largest body accepted, bytes (express.json's `limit`). */
  bodyLimit: number;
}

/**
 * The paths the fast path takes: those `router` has a POST route for that the document gives a
 * POST operation with an `application/json` body and no path parameters.
 */
function fastPaths(router: Router, document: OpenApiDocument): Set<string> {
  const paths = new Set<string>();
  for (const layer of router.stack) {
    const route = layer.route;
    if (!route || !route.stack.some((handler) => handler.method === 'post')) continue;
    const body = (document.paths[route.path]?.post as { requestBody?: { content?: object } })
      ?.requestBody?.content;
    if (body && 'application/json' in body && !route.path.includes('{')) paths.add(route.path);
  }
  return paths;
}

/** Whether the request's headers are those of a plain JSON body of `1..limit` bytes. */
function plainJsonLength(req: IncomingMessage, limit: number): number | undefined {
  const headers = req.headers;
  const type = headers['content-type'];
  if (type === undefined || !JSON_TYPES.has(type.toLowerCase())) return undefined;
  if (headers['transfer-encoding'] !== undefined) return undefined;
  const encoding = headers['content-encoding'];
  if (encoding !== undefined && encoding.toLowerCase() !== 'identity') return undefined;
  const text = headers['content-length'];
  if (text === undefined || !/^[0-9]{1,9}$/.test(text)) return undefined;
  const length = Number(text);
  return length > 0 && length <= limit ? length : undefined;
}

/**
 * express.json's error for a body that is not JSON, as body-parser raises it (`type`
 * `entity.parse.failed`, status 400), so the one problem handler answers it in the same words.
 */
function parseFailure(message: string): Error {
  return Object.assign(new SyntaxError(message), {
    type: 'entity.parse.failed',
    status: 400,
    statusCode: 400,
    expose: true,
  });
}

/** body-parser's error for a request whose body stopped coming (the client went away). */
function abortedBody(): Error {
  return Object.assign(new Error('request aborted'), {
    type: 'request.aborted',
    status: 400,
    statusCode: 400,
    expose: true,
  });
}

/** JSON's white space (RFC 8259): space, tab, line feed, carriage return. */
const JSON_WHITE_SPACE = new Set([0x20, 0x09, 0x0a, 0x0d]);

/**
 * The body as express.json reads a UTF-8 JSON body: a leading byte-order mark dropped (iconv-lite,
 * which body-parser decodes with, drops it), strict (the first character that is not white space
 * must be `{` or `[`), `JSON.parse` with no reviver.
 */
function parseJson(bytes: Buffer): unknown {
  let text = bytes.toString('utf8');
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  if (text.length === 0) return {}; // body-parser's own special case of an empty body
  let start = 0;
  while (JSON_WHITE_SPACE.has(text.charCodeAt(start))) start += 1;
  const first = text[start];
  if (first !== '{' && first !== '[') throw parseFailure('the body must be a JSON object or array');
  try {
    return JSON.parse(text) as unknown;
  } catch (error) {
    throw parseFailure((error as Error).message);
  }
}

/** Reads `length` bytes of body and gives them parsed, or the error express.json would raise. */
function readJson(
  req: IncomingMessage,
  length: number,
  done: (error: unknown, body?: unknown) => void,
): void {
  const chunks: Buffer[] = [];
  let settled = false;
  req.on('data', (chunk: Buffer) => chunks.push(chunk));
  req.once('error', () => {
    if (settled) return;
    settled = true;
    done(abortedBody());
  });
  req.once('end', () => {
    if (settled) return;
    settled = true;
    let body: unknown;
    try {
      body = parseJson(chunks.length === 1 ? chunks[0]! : Buffer.concat(chunks, length));
    } catch (error) {
      done(error);
      return;
    }
    done(undefined, body);
  });
}

/**
 * The compute routes' own way through the app, for the requests that take most of its load:
 * `POST` of a plain JSON body to a compute path as documented. Such a request would pass, one
 * Express layer at a time, helmet's headers, the malformed-path check, express.json, the
 * validator's six steps (each a promise hop) and the routers before the compute router; this
 * middleware, mounted first, runs the same steps that act on it, in the same order, directly:
 * helmet's headers; the body read and parsed as express.json would (the same limit, the same
 * errors); the validator's own route lookup, security handler (authentication, role, revocation),
 * request check and, when on, response check; then the compute router. Errors go to `next`, so
 * the one problem handler answers them as before.
 *
 * Any other request, and any request this middleware is not sure about, takes the whole chain:
 * another method or path (a query string, a trailing slash, another case), a path the validator's
 * route lookup has not yet seen (so the first request to each path takes the whole chain, which
 * also lets the validator install its parameter handlers), a body that is not plain JSON
 * (another type or charset, a Content-Encoding, chunked, empty or over the limit: express.json
 * and the validator answer those). The start fails when the validator has a step this does not
 * know, so a new version cannot be half-followed silently.
 */
export function computeFastPath(options: ComputeFastPathOptions): RequestHandler {
  const { headers, router, bodyLimit } = options;
  const steps = options.validator.filter((step) => STEPS.has(step.name));
  const unknown = options.validator.filter(
    (step) => !STEPS.has(step.name) && !SKIPPED.has(step.name),
  );
  const lookup = steps[0] as (RequestHandler & Partial<CachedMetadataStep>) | undefined;
  if (unknown.length > 0 || lookup?.name !== 'metadataMiddleware' || !lookup.knows)
    throw new Error(
      `computeFastPath does not know the validator's steps ${options.validator.map((step) => step.name || '(anonymous)').join(', ')}; check it against this version of express-openapi-validator`,
    );
  const knows = lookup.knows.bind(lookup);
  const paths = fastPaths(router, options.document);
  const ignore = (): void => {};

  return function computeFastPath(req: Request, res: Response, next: NextFunction): void {
    if (req.method !== 'POST' || !paths.has(req.url) || !knows('POST', req.url)) {
      next();
      return;
    }
    const length = plainJsonLength(req, bodyLimit);
    if (length === undefined) {
      next();
      return;
    }
    headers(req, res, ignore);
    readJson(req, length, (error, body) => {
      if (error !== undefined) {
        next(error);
        return;
      }
      req.body = body;
      const step = (index: number): void => {
        if (index === steps.length) {
          router(req, res, next);
          return;
        }
        void steps[index]!(req, res, (failure?: unknown) => {
          if (failure !== undefined) next(failure);
          else step(index + 1);
        });
      };
      step(0);
    });
  };
}
