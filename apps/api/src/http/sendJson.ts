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
  endJson(res, JSON.stringify(body));
}

/**
 * Answers JSON made elsewhere, as UTF-8 bytes (a worker's serialised and encoded result), as
 * {@link sendJson} would answer the value: when the response is validated (development, tests)
 * or the request is a HEAD, `value()` gives the object to `res.json`; otherwise the bytes are
 * written as they are.
 */
export async function sendJsonBytes(
  req: Pick<Request, 'method'>,
  res: Response,
  bytes: () => Promise<Uint8Array>,
  value: () => Promise<unknown>,
): Promise<void> {
  if (res.json !== plainJson || req.method === 'HEAD') {
    res.json(await value());
    return;
  }
  endJson(res, await bytes());
}

/**
 * Ends the response with JSON, as UTF-8 bytes or as text; Node sets `Content-Length` from either
 * when no header has gone yet. Text goes with its encoding named `'utf-8'` rather than left to
 * Node's default `'utf8'`: the same bytes on the wire (one encoding, two names; Node measures the
 * `Content-Length` in UTF-8 either way), but Node's `OutgoingMessage#_send` joins the header
 * block and a first body chunk given as a string in its default encoding into one string, which
 * is flattened on the JavaScript heap before the socket write (a copy of the whole answer, 60 kB
 * for a spectrum at maxOrder 1050, and its garbage); under any other encoding name the header
 * goes as its own chunk of the same `writev`. Sampled allocations of `POST /api/v1/spectra`:
 * about 100 kB an answer less; instructions an answer (valgrind): about 1 % fewer
 * (docs/robustness.md, throughput, fifth pass).
 */
function endJson(res: Response, body: string | Uint8Array): void {
  res.setHeader('Content-Type', 'application/json; charset=utf-8');
  if (typeof body === 'string') res.end(body, 'utf-8');
  else res.end(body);
}
