import type { Request } from 'express';
import { badRequest } from './errors.js';

const DECIMAL_INTEGER = /^[0-9]{1,15}$/;

/**
 * The integer query parameter `name` of `req`, or `fallback` when it is absent. The validator
 * has checked the bounds, but its type coercion takes `0x10` for 16 and `1e999` for Infinity
 * (and writes the coerced value into `req.query`), so the text as sent in the URL is read
 * here: only plain decimal digits are accepted, anything else is a 400 naming the parameter,
 * never a silent default.
 */
export function intQuery(
  req: Pick<Request, 'originalUrl'>,
  name: string,
  fallback: number,
): number {
  return optionalIntQuery(req, name, fallback) ?? fallback;
}

/**
 * The query parameter `name` as sent in the URL (not as the validator coerced it), as a number
 * when it is given once and `accepts` its text; undefined when absent; else a 400 naming it and
 * saying it `must be` `allowed`.
 */
function queryNumber(
  req: Pick<Request, 'originalUrl'>,
  name: string,
  accepts: (text: string) => boolean,
  allowed: string,
): number | undefined {
  const search = req.originalUrl.includes('?')
    ? req.originalUrl.slice(req.originalUrl.indexOf('?') + 1)
    : '';
  const values = new URLSearchParams(search).getAll(name);
  if (values.length === 0) return undefined;
  const text = values[0] as string;
  if (values.length === 1 && accepts(text)) return Number(text);
  const given = values.length === 1 ? JSON.stringify(text.slice(0, 40)) : `${values.length} values`;
  const message = `${name} must be ${allowed}; got ${given}`;
  throw badRequest(message, [{ path: name, message }]);
}

/** As {@link intQuery}, but undefined when the parameter is absent (`example` shows in the error). */
export function optionalIntQuery(
  req: Pick<Request, 'originalUrl'>,
  name: string,
  example: number,
): number | undefined {
  return queryNumber(
    req,
    name,
    (text) => DECIMAL_INTEGER.test(text),
    `one whole number written in decimal digits, e.g. ${example}`,
  );
}

const DECIMAL_NUMBER = /^(?:[0-9]{1,30}(?:\.[0-9]{0,30})?|\.[0-9]{1,30})(?:[eE][+-]?[0-9]{1,3})?$/;

/**
 * The number query parameter `name` of `req`, or undefined when it is absent. As for
 * {@link intQuery}, the text as sent is read (the validator coerces `0x10` to 16): decimal
 * notation with an optional exponent only, finite, else a 400 naming the parameter.
 */
export function numberQuery(req: Pick<Request, 'originalUrl'>, name: string): number | undefined {
  return queryNumber(
    req,
    name,
    (text) => DECIMAL_NUMBER.test(text) && Number.isFinite(Number(text)),
    'one finite number in decimal notation, e.g. 400',
  );
}
