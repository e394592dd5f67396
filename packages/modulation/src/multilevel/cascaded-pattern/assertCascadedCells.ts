/** Validation of the cells of a cascaded string (internal). */
import { assertNumberInRange, assertOneOf } from '../../validation/assertions.js';
import { ParameterRangeError, ParameterTypeError } from '../../validation/errors.js';
import { assertFirstQuarterAngles } from '../../she/validateShe.js';
import { CASCADED_CELL_KINDS, type CascadedCellPattern } from './CascadedCellPattern.js';

/** The most cells a cascaded string may have (17 levels of equal cells, and some room). */
export const MAX_CASCADED_CELLS = 16;

/**
 * Asserts 1..16 cells, each with a known kind, a DC source vdc > 0 volts and first-quarter
 * angles strictly ascending in (0, π/2); fields are named `cells[i].kind` and so on.
 */
export function assertCascadedCells(
  field: string,
  cells: unknown,
): asserts cells is CascadedCellPattern[] {
  if (!Array.isArray(cells)) throw new ParameterTypeError(field, 'an array of cells', cells);
  if (cells.length < 1 || cells.length > MAX_CASCADED_CELLS) {
    throw new ParameterRangeError(
      `${field}.length`,
      `1 to ${MAX_CASCADED_CELLS} cells`,
      cells.length,
    );
  }
  cells.forEach((cell: unknown, i) => {
    if (typeof cell !== 'object' || cell === null) {
      throw new ParameterTypeError(`${field}[${i}]`, 'an object { kind, vdc, angles }', cell);
    }
    const { kind, vdc, angles } = cell as Partial<Record<keyof CascadedCellPattern, unknown>>;
    assertOneOf(`${field}[${i}].kind`, kind, CASCADED_CELL_KINDS);
    assertNumberInRange(`${field}[${i}].vdc`, vdc, { min: 0, minExclusive: true });
    assertFirstQuarterAngles(`${field}[${i}].angles`, angles);
  });
}
