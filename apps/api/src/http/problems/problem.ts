import type { Request } from 'express';
import type { OpenApiDocument } from '../../openapi.js';
import type { ProblemItem } from '../errors.js';

/** What the final handler renders as application/problem+json (RFC 9457). */
export interface Problem {
  status: number;
  detail: string;
  errors: ProblemItem[];
  /** The problem's kind where the status alone does not say it (`job-quota`, …). */
  kind?: string;
}

/** What a translator may read besides the error: the contract and the request that failed. */
export interface ProblemContext {
  document: OpenApiDocument;
  req: Request;
}

/**
 * Turns the errors of one source (the validator, the library, storage, …) into a Problem, or
 * returns undefined when the error is not one of that source's.
 */
export type ProblemTranslator = (err: unknown, context: ProblemContext) => Problem | undefined;

/** `text` as a sentence: first letter upper case, a full stop at the end. */
export function sentence(text: string): string {
  const trimmed = text.trim();
  if (!trimmed) return 'Request refused.';
  return trimmed[0]?.toUpperCase() + trimmed.slice(1) + (/[.!?]$/.test(trimmed) ? '' : '.');
}
