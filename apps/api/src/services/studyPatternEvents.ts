import type { InverterDesign } from '@pulsewright/modulation';
import { badRequest } from '../http/errors.js';
import type { PatternEventsRequest } from './patternTables.js';

/** POST /api/v1/pattern-compare-events as sent: an inline `pattern` or a saved study's id. */
export type PatternEventsBody = Omit<PatternEventsRequest, 'pattern'> & {
  pattern?: PatternEventsRequest['pattern'];
  studyId?: string;
};

/**
 * The compare-events request with its pattern: the inline `pattern`, or the first-quarter
 * angles, kind and DC source of the saved SHE or optimal-pattern study `studyId`, read by
 * `readStudy` (the study service's team-scoped read, so a study the caller cannot see is 404).
 * Exactly one of the two; a study of another method is a 400 naming `studyId`.
 */
export async function patternEventsRequest(
  body: PatternEventsBody,
  readStudy: (id: string) => Promise<{ design: InverterDesign }>,
): Promise<PatternEventsRequest> {
  const { studyId, pattern, ...options } = body;
  if (studyId !== undefined && pattern !== undefined) {
    const message = 'studyId must be left out when pattern is given (one or the other)';
    throw badRequest(message, [{ path: 'studyId', message }]);
  }
  if (studyId === undefined) {
    if (pattern === undefined) {
      const message = 'pattern must be given, or studyId of a saved SHE or optimal-pattern study';
      throw badRequest(message, [{ path: 'pattern', message }]);
    }
    return { ...options, pattern };
  }
  const { design } = await readStudy(studyId);
  const modulation = design.modulation;
  if (
    modulation.method !== 'selective-harmonic-elimination' &&
    modulation.method !== 'optimal-pattern'
  ) {
    const message = `studyId must be a study of a programmed pattern (selective-harmonic-elimination or optimal-pattern); that study's method is ${modulation.method}`;
    throw badRequest(message, [{ path: 'studyId', message }]);
  }
  return {
    ...options,
    pattern: { kind: modulation.kind, vdc: design.vdc, angles: modulation.angles },
  };
}
