import type { NextFunction, Request, RequestHandler, Response } from 'express';

/** What express-openapi-validator's metadata step puts on a request it matched to an operation. */
interface OpenApiMetadata {
  expressRoute: string;
  openApiRoute: string;
  pathParams: Record<string, string>;
  [more: string]: unknown;
}

type WithMetadata = Request & { openapi?: OpenApiMetadata };

/** The name express-openapi-validator 5 gives its metadata step in the list it returns. */
const METADATA_STEP = 'metadataMiddleware';

/**
 * The validator's metadata step, remembered per method and path for the document's paths without
 * parameters. express-openapi-validator 5.6 (`middlewares/openapi.metadata.js`, `lookupRoute`)
 * walks every documented path on every request, building an object and asking Express for two
 * settings per path until one matches: about 3 % of the service's CPU under a load of
 * `POST /api/v1/spectra` (docs/robustness.md, throughput). What it finds depends only on the
 * method, the path and the app's fixed routing settings, so the first answer for a request whose
 * path is exactly a documented path without parameters (`/api/v1/spectra`) is kept, and later
 * requests get a fresh copy of it with empty path parameters, as the step would set them, without
 * the walk. Paths with parameters, paths the step ignores or refuses (404, 405), and paths that
 * only match a documented one (another case, a trailing slash) always go through the step, so
 * the cache holds at most one entry per documented operation and cannot grow with requests.
 * Authentication and validation run on every request after it, unchanged.
 * @param steps - the list `OpenApiValidator.middleware` returns; the metadata step is found by
 *   its function name, and its absence (another version of the validator) stops the start.
 */
export function cacheOpenApiMetadata<T extends RequestHandler>(steps: T[]): T[] {
  const index = steps.findIndex((step) => step.name === METADATA_STEP);
  if (index < 0)
    throw new Error(
      `express-openapi-validator's ${METADATA_STEP} was not found; check cacheOpenApiMetadata against this version`,
    );
  const step = steps[index]!;
  const known = new Map<string, Map<string, OpenApiMetadata>>();
  const remember = (req: WithMetadata, method: string, path: string): void => {
    const found = req.openapi;
    if (!found || found.expressRoute !== path || Object.keys(found.pathParams).length > 0) return;
    let byPath = known.get(method);
    if (!byPath) known.set(method, (byPath = new Map<string, OpenApiMetadata>()));
    byPath.set(path, { ...found });
  };
  const cached = function metadataMiddleware(req: Request, res: Response, next: NextFunction) {
    const url = req.originalUrl;
    const query = url.indexOf('?');
    const path = query < 0 ? url : url.slice(0, query);
    const hit = known.get(req.method)?.get(path);
    if (hit) {
      const pathParams: Record<string, string> = {};
      (req as WithMetadata).openapi = { ...hit, pathParams };
      req.params = pathParams;
      next();
      return;
    }
    const method = req.method;
    void step(req, res, (error?: unknown) => {
      if (error === undefined) remember(req as WithMetadata, method, path);
      next(error);
    });
  };
  return steps.map((other, i) => (i === index ? (cached as unknown as T) : other));
}
