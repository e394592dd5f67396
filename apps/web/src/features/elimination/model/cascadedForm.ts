import type { CascadedSolveRequest } from '../../../lib/api';
import { ordersOf } from './eliminationForm';

/** The cascaded-string panel's form, in the units it shows (ma, volts). */
export interface CascadedForm {
  /** Identical H-bridge cells in the string. */
  cells: number;
  /** Each cell's DC source, volts. */
  vdc: number;
  /** First-quarter angles of each cell's unipolar pattern. */
  count: number;
  /** Odd orders to null in the string's output, as typed. */
  eliminate: string;
  /** The string's fundamental over cells·vdc (4/π is the square wave of every cell). */
  ma: number;
}

export const DEFAULT_CASCADED_FORM: CascadedForm = {
  cells: 3,
  vdc: 100,
  count: 2,
  eliminate: '5, 7, 11, 13, 17',
  ma: 0.4,
};

/** The solve request for the service: the fundamental in peak volts, ma·cells·vdc. */
export function cascadedSolveRequestOf(form: CascadedForm): CascadedSolveRequest {
  return {
    cells: form.cells,
    vdc: form.vdc,
    count: form.count,
    eliminate: ordersOf(form),
    fundamental: form.ma * form.cells * form.vdc,
  };
}
