import type { Complex } from '../numeric/complex.js';
import type { LcFilterOptions } from './LcFilterOptions.js';
import { solveOutputNetwork } from './solveOutputNetwork.js';

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
  const solved = new Float64Array(8);
  solveOutputNetwork(
    network,
    omega,
    [bridgeVoltage.re, bridgeVoltage.im, emf.re, emf.im],
    solved,
    0,
  );
  const phasor = (k: number): Complex => ({ re: solved[k] as number, im: solved[k + 1] as number });
  return {
    output: phasor(0),
    inverterCurrent: phasor(2),
    capacitorCurrent: phasor(4),
    loadCurrent: phasor(6),
  };
}
