import type { RequestHandler } from 'express';
import { badRequest } from './errors.js';

/**
 * Refuses a request whose path is not valid percent-encoding (`/%`, `/%E0%A4%A`) with 400
 * problem+json naming `path`. Without it the router's own decoding throws a URIError deep in
 * route matching, which reached the final handler as a 500 and a logged stack trace.
 */
export const refuseMalformedPath: RequestHandler = (req, _res, next) => {
  try {
    decodeURIComponent(req.path);
  } catch {
    next(
      badRequest(
        'The request path is not valid percent-encoding: each % must be followed by two hexadecimal digits of UTF-8.',
        [{ path: 'path', message: 'path holds a malformed percent-escape' }],
      ),
    );
    return;
  }
  next();
};
