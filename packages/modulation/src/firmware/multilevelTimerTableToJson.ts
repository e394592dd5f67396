import { assertNumberInRange } from '../validation/assertions.js';
import type { MultilevelTimerTable } from './multilevelTimerTableTypes.js';

/** Options of {@link multilevelTimerTableToJson}. */
export interface MultilevelTimerTableJsonOptions {
  /** Spaces of indentation; 0 writes one line. @default 2 */
  indent?: number;
}

/**
 * The whole {@link MultilevelTimerTable} as JSON text (parameters with their units, conventions,
 * period, dead-time ticks, counters with their offsets, per leg and pair the duty and compare
 * arrays, warnings). Lossless: `JSON.parse` gives back an equal object.
 */
export function multilevelTimerTableToJson(
  table: MultilevelTimerTable,
  options: MultilevelTimerTableJsonOptions = {},
): string {
  const { indent = 2 } = options;
  assertNumberInRange('indent', indent, { min: 0, max: 10, integer: true });
  return JSON.stringify(table, null, indent);
}
