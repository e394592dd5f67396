import {
  complexAdd as add,
  complexDivide as divide,
  complexMultiply as multiply,
  complexSubtract as subtract,
  type Complex,
} from '../numeric/complex.js';
import { lcFilterBranches } from './lcFilterBranches.js';
import type { LcFilterOptions } from './LcFilterOptions.js';

/** The network between one bridge phase and its load: an optional LC filter and a series R–L load. */
export interface OutputNetwork {
  /** The LC output filter (its `loadR` is ignored: the load is `load`); null: none. */
  filter: LcFilterOptions | null;
  /** Series R–L load across the output (ohms, henries); null: open circuit. */
  load: { r: number; l: number } | null;
}

/** Phasors of one phase at one frequency (volts, amperes; the harmonics' sin convention). */
export interface OutputNetworkPhasors {
  /** Voltage at the output node (across the filter capacitor, or the bridge's without a filter). */
  output: Complex;
  /** Current out of the bridge phase, through the series inductor: what the switches carry. */
  inverterCurrent: Complex;
  /** Current into the filter's shunt branch (capacitor with its damping); zero without a filter. */
  capacitorCurrent: Complex;
  /** Current into the load (through r, l and the back-EMF). */
  loadCurrent: Complex;
}

const ZERO: Complex = { re: 0, im: 0 };

/**
 * Solves one phase of the output network at angular frequency `omega` (rad/s ≥ 0) for a bridge
 * voltage phasor and a back-EMF phasor in series with the load (the EMF opposes the load
 * current). Nodal analysis at the output node (standard circuit analysis):
 * V_o = (V_b·Y_s + E·Y_l)/(Y_s + Y_sh + Y_l), I_load = (V_o − E)·Y_l, I_cap = V_o·Y_sh and
 * I_inv = I_load + I_cap (Kirchhoff's current law). At ω = 0 the series branch is a short
 * (V_o = V_b) and every shunt branch blocks DC.
 *
 * @param network - filter and load of one phase
 * @param omega - angular frequency, rad/s
 * @param bridgeVoltage - the bridge phase voltage phasor at omega, volts
 * @param emf - the back-EMF phasor at omega, volts (zero except at the fundamental)
 */
export function outputNetworkResponse(
  network: OutputNetwork,
  omega: number,
  bridgeVoltage: Complex,
  emf: Complex = ZERO,
): OutputNetworkPhasors {
  const { filter, load } = network;
  const loadAdmittance =
    load === null ? ZERO : divide({ re: 1, im: 0 }, { re: load.r, im: omega * load.l });
  if (filter === null) {
    const loadCurrent = multiply(subtract(bridgeVoltage, emf), loadAdmittance);
    return {
      output: bridgeVoltage,
      inverterCurrent: loadCurrent,
      capacitorCurrent: ZERO,
      loadCurrent,
    };
  }
  const { seriesImpedance, shuntAdmittance } = lcFilterBranches(filter, omega);
  let output: Complex;
  if (omega === 0) {
    output = bridgeVoltage;
  } else {
    const seriesAdmittance = divide({ re: 1, im: 0 }, seriesImpedance);
    const injected = add(multiply(bridgeVoltage, seriesAdmittance), multiply(emf, loadAdmittance));
    output = divide(injected, add(add(seriesAdmittance, shuntAdmittance), loadAdmittance));
  }
  const loadCurrent = multiply(subtract(output, emf), loadAdmittance);
  const capacitorCurrent = multiply(output, shuntAdmittance);
  return {
    output,
    inverterCurrent: add(loadCurrent, capacitorCurrent),
    capacitorCurrent,
    loadCurrent,
  };
}
