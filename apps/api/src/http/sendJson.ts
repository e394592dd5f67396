import express, { type Request, type Response } from 'express';

/** Express's own `res.json`, as every response has it until something wraps it. */
const plainJson = express.response.json;

/**
 * Answers `body` as JSON with the response's status (200 unless set), exactly as Express's
 * `res.json` would (`JSON.stringify` with no replacer or spacing, as this app configures none;
 * `Content-Type: application/json; charset=utf-8`; `Content-Length`), but writes the string
 * itself: `res.json` goes through `res.send`, which copies a body of 1 kB or more into a Buffer
 * before writing it (about 25 µs for a spectrum's 60 kB, and the garbage of it) and runs its
 * freshness and HEAD checks. Node's `end` measures the string and sets `Content-Length` itself.
 *
 * When something has wrapped `res.json` (express-openapi-validator's response validation, on in
 * development and in the test suites) or the request is a HEAD (no body, Express's length), the
 * answer goes through `res.json` as before, so the validator still checks every answer there.
 */
export function sendJson(req: Pick<Request, 'method'>, res: Response, body: unknown): void {
  if (res.json !== plainJson || req.method === 'HEAD') {
    res.json(body);
    return;
  }
  const text = JSON.stringify(body);
  res.setHeader('Content-Type', 'application/json; charset=utf-8');
  res.end(text);
}

/**
 * Answers JSON text made elsewhere (a worker's serialised result) as {@link sendJson} would
 * answer the value: when the response is validated (development, tests) or the request is a
 * HEAD, `value()` gives the object to `res.json`; otherwise the text is written as it is.
 */
export async function sendJsonText(
  req: Pick<Request, 'method'>,
  res: Response,
  text: () => Promise<string>,
  value: () => Promise<unknown>,
): Promise<void> {
  if (res.json !== plainJson || req.method === 'HEAD') {
    res.json(await value());
    return;
  }
  const body = await text();
  res.setHeader('Content-Type', 'application/json; charset=utf-8');
  res.end(body);
}
