import {
  complexDivide as divide,
  complexMultiply as multiply,
  type Complex,
} from '../numeric/complex.js';
import { lcFilterBranches } from './lcFilterBranches.js';
import type { LcFilterOptions } from './LcFilterOptions.js';

/**
 * H(jω) = V_out/V_in of a validated {@link LcFilterOptions} at `omega` (rad/s ≥ 0), from series
 * impedance Z_s and shunt admittance Y_sh: H = 1/(1 + Z_s·Y_sh) (voltage divider, standard
 * circuit analysis). Internal: shared by the filter functions.
 */
export function lcFilterTransfer(filter: LcFilterOptions, omega: number): Complex {
  const { seriesImpedance, shuntAdmittance } = lcFilterBranches(filter, omega);
  const shunt =
    filter.loadR === undefined
      ? shuntAdmittance
      : { re: shuntAdmittance.re + 1 / filter.loadR, im: shuntAdmittance.im };
  const product = multiply(seriesImpedance, shunt);
  return divide({ re: 1, im: 0 }, { re: 1 + product.re, im: product.im });
}
