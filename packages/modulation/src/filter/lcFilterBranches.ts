import { complexDivide as divide, type Complex } from '../numeric/complex.js';
import type { LcFilterOptions } from './LcFilterOptions.js';

/** The two branches of an LC output filter at one angular frequency. */
export interface LcFilterBranches {
  /** Series impedance from the bridge to the output node, ohms (complex). */
  seriesImpedance: Complex;
  /** Shunt admittance at the output node (capacitor with its damping), siemens (complex). */
  shuntAdmittance: Complex;
}

/**
 * Series impedance and shunt admittance of a validated {@link LcFilterOptions} at `omega`
 * (rad/s ≥ 0), each damping placement as its doc describes, without `loadR` (standard circuit
 * analysis). Internal: shared by the filter transfer and the loaded filter network.
 */
export function lcFilterBranches(filter: LcFilterOptions, omega: number): LcFilterBranches {
  const { l, c, rDamping = 0, dampingPlacement = 'series-with-capacitor', cDamping = 0 } = filter;
  if (dampingPlacement === 'series-with-capacitor') {
    return {
      seriesImpedance: { re: 0, im: omega * l },
      shuntAdmittance: divide({ re: 0, im: omega * c }, { re: 1, im: omega * rDamping * c }),
    };
  }
  if (dampingPlacement === 'parallel-rc') {
    const branch = divide(
      { re: 0, im: omega * cDamping },
      { re: 1, im: omega * rDamping * cDamping },
    );
    return {
      seriesImpedance: { re: 0, im: omega * l },
      shuntAdmittance: { re: branch.re, im: branch.im + omega * c },
    };
  }
  return {
    seriesImpedance: divide({ re: 0, im: omega * l * rDamping }, { re: rDamping, im: omega * l }),
    shuntAdmittance: { re: 0, im: omega * c },
  };
}
