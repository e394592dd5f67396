import { sentence, type Problem } from './problem.js';

/** The fields of body-parser's errors (http-errors with a `type` such as `charset.unsupported`). */
interface BodyParserError {
  type: string;
  status: number;
  message: string;
  charset?: string;
  encoding?: string;
}

function isBodyParserError(err: unknown): err is BodyParserError {
  const e = err as { type?: unknown; status?: unknown; errors?: unknown } | null;
  return (
    err instanceof Error &&
    typeof e?.type === 'string' &&
    typeof e.status === 'number' &&
    e.status >= 400 &&
    e.status < 500 &&
    // express-openapi-validator's errors carry `errors`; they have their own translator.
    !Array.isArray(e.errors)
  );
}

/** express.json's errors: a body that is not JSON, too large, in a charset or encoding it cannot read. */
export function bodyParserProblem(err: unknown): Problem | undefined {
  if (!isBodyParserError(err)) return undefined;
  if (err.type === 'entity.parse.failed') {
    const detail = 'The request body is not valid JSON.';
    return { status: 400, detail, errors: [{ path: 'body', message: detail }] };
  }
  if (err.type === 'entity.too.large') {
    return { status: 413, detail: 'The request body is larger than 1 MB.', errors: [] };
  }
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
