import { assertNumberInRange } from '../validation/assertions.js';
import type { AngleTable, AngleTableMidpointErrors } from './angleTableTypes.js';
import {
  angleTableFixedPoint,
  type AngleTableFixedPoint,
  type AngleTableFixedPointOptions,
} from './angleTableFixedPoint.js';

/** Options of {@link angleTableToJson}. */
export interface AngleTableJsonOptions {
  midpointErrors?: AngleTableMidpointErrors;
  fixedPoint?: AngleTableFixedPointOptions;
  /** Spaces of indentation; 0 writes one line. @default 2 */
  indent?: number;
}

/** What {@link angleTableToJson} writes. */
export interface AngleTableDocument {
  table: AngleTable;
  midpointErrors: AngleTableMidpointErrors | null;
  fixedPoint: AngleTableFixedPoint | null;
}

/**
 * An {@link angleTable} as JSON text: `{ table, midpointErrors, fixedPoint }` (the last two
 * null unless given), angles in radians as the library holds them. Lossless: `JSON.parse` gives
 * back an equal object (the table holds no NaN; missing values are null).
 */
export function angleTableToJson(table: AngleTable, options: AngleTableJsonOptions = {}): string {
  const { midpointErrors, fixedPoint, indent = 2 } = options;
  assertNumberInRange('indent', indent, { min: 0, max: 10, integer: true });
  const document: AngleTableDocument = {
    table,
    midpointErrors: midpointErrors ?? null,
    fixedPoint: fixedPoint === undefined ? null : angleTableFixedPoint(table, fixedPoint),
  };
  return JSON.stringify(document, null, indent);
}
