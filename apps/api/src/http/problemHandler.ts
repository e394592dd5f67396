import type { ErrorRequestHandler } from 'express';
import type { OpenApiDocument } from '../openapi.js';
import { problemTitle, problemType } from './errors.js';
import { bodyParserProblem } from './problems/bodyParserProblem.js';
import { httpErrorProblem } from './problems/httpErrorProblem.js';
import { libraryProblem } from './problems/libraryProblem.js';
import type { Problem, ProblemContext, ProblemTranslator } from './problems/problem.js';
import { storageProblem } from './problems/storageProblem.js';
import { uploadProblem } from './problems/uploadProblem.js';
import { validatorProblem } from './problems/validatorProblem.js';

/**
 * One translator per error source, asked in this order; the first that knows the error answers.
 * Upload comes before the validator because multer's errors reach us as validator errors.
 */
const TRANSLATORS: readonly ProblemTranslator[] = [
  httpErrorProblem,
  libraryProblem,
  bodyParserProblem,
  storageProblem,
  uploadProblem,
  validatorProblem,
];

/** Anything no translator knows (a bare RangeError or TypeError, V8's own errors): our bug. */
const INTERNAL: Problem = {
  status: 500,
  detail: 'Something went wrong inside the service; it has been logged.',
  errors: [],
};

function toProblem(err: unknown, context: ProblemContext): Problem {
  for (const translate of TRANSLATORS) {
    const problem = translate(err, context);
    if (problem) return problem;
  }
  return INTERNAL;
}

/**
 * The one final error handler: renders every error as application/problem+json
 * `{ type, title, status, detail, errors: [{ path, message }] }`. Only the library's parameter
 * errors and requests outside the contract are the client's (400); a 5xx is logged here, once,
 * with its cause, when `logErrors` is on.
 */
export function problemHandler(document: OpenApiDocument, logErrors: boolean): ErrorRequestHandler {
  return (err: unknown, req, res, next) => {
    if (res.headersSent) {
      next(err);
      return;
    }
    const problem = toProblem(err, { document, req });
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
