import type { Request } from 'express';

/** A validation error item as express-openapi-validator reports it. */
export interface ValidatorItem {
  path?: string;
  message?: string;
  errorCode?: string;
}

/** An express-openapi-validator error (HttpError of that package): a status and its items. */
export interface ValidatorError {
  status: number;
  message: string;
  errors?: ValidatorItem[];
}

/** Whether `err` has express-openapi-validator's error shape. */
export function isValidatorError(err: unknown): err is ValidatorError {
  return (
    typeof err === 'object' &&
    err !== null &&
    typeof (err as { status?: unknown }).status === 'number' &&
    Array.isArray((err as { errors?: unknown }).errors)
  );
}

/** A multipart upload the validator's multer/busboy step could not read (its items name the URL path). */
export function isUploadError(err: ValidatorError, req: Request): boolean {
  return (
    /^multipart\//i.test(req.headers['content-type'] ?? '') &&
    err.status !== 401 &&
    err.status !== 403 &&
    (err.errors ?? []).every((item) => item.path === req.path || !(item.path ?? '').startsWith('/'))
  );
}
