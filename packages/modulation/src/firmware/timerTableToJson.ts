import { assertNumberInRange } from '../validation/assertions.js';
import type { TimerTable } from './timerTableTypes.js';

/** Options of {@link timerTableToJson}. */
export interface TimerTableJsonOptions {
  /** Spaces of indentation; 0 writes one line. @default 2 */
  indent?: number;
}

/**
 * The whole {@link TimerTable} as JSON text (parameters with their units, conventions,
 * period, dead-time counts, per-channel duty and compare arrays, warnings). Lossless:
 * `JSON.parse` gives back an equal object.
 */
export function timerTableToJson(table: TimerTable, options: TimerTableJsonOptions = {}): string {
  const { indent = 2 } = options;
  assertNumberInRange('indent', indent, { min: 0, max: 10, integer: true });
  return JSON.stringify(table, null, indent);
}
