import { lcFilterBranches } from './lcFilterBranches.js';
import type { OutputNetwork } from './outputNetworkResponse.js';

/**
 * The phasors `outputNetworkResponse` solves, as numbers written into `into` from `at`: output
 * voltage, inverter, capacitor and load current, each as re then im (8 numbers). The same nodal
 * analysis and the same floating-point operations in the same order as `outputNetworkResponse`
 * (which reads its result from here), with no object per complex number: a report solves the
 * network at every order of its spectrum. Internal.
 * @param phasors - the bridge voltage's real and imaginary parts, then the back-EMF's, volts
 */
export function solveOutputNetwork(
  network: OutputNetwork,
  omega: number,
  phasors: readonly [number, number, number, number],
  into: Float64Array,
  at: number,
): void {
  // Read by index: destructuring the tuple would run the array iterator at every call.
  const vRe = phasors[0];
  const vIm = phasors[1];
  const eRe = phasors[2];
  const eIm = phasors[3];
  const { filter, load } = network;
  // Y_l = 1/(r + jωl), as complexDivide divides 1 + j0 by it.
  let ylRe = 0;
  let ylIm = 0;
  if (load !== null) {
    const lr = load.r;
    const li = omega * load.l;
    const scale = lr * lr + li * li;
    ylRe = (1 * lr + 0 * li) / scale;
    ylIm = (0 * lr - 1 * li) / scale;
  }
  if (filter === null) {
    // No filter: the load takes the bridge voltage; no shunt branch.
    const dRe = vRe - eRe;
    const dIm = vIm - eIm;
    const loadRe = dRe * ylRe - dIm * ylIm;
    const loadIm = dRe * ylIm + dIm * ylRe;
    into.set([vRe, vIm, loadRe, loadIm, 0, 0, loadRe, loadIm], at);
    return;
  }
  const { seriesImpedance: z, shuntAdmittance: sh } = lcFilterBranches(filter, omega);
  const shRe = sh.re;
  const shIm = sh.im;
  let oRe = vRe;
  let oIm = vIm;
  // At ω = 0 the series branch is a short: the output is the bridge's.
  if (omega !== 0) {
    const zScale = z.re * z.re + z.im * z.im;
    const ysRe = (1 * z.re + 0 * z.im) / zScale;
    const ysIm = (0 * z.re - 1 * z.im) / zScale;
    // (V·Y_s + E·Y_l)/(Y_s + Y_sh + Y_l)
    const injectedRe = vRe * ysRe - vIm * ysIm + (eRe * ylRe - eIm * ylIm);
    const injectedIm = vRe * ysIm + vIm * ysRe + (eRe * ylIm + eIm * ylRe);
    const totalRe = ysRe + shRe + ylRe;
    const totalIm = ysIm + shIm + ylIm;
    const scale = totalRe * totalRe + totalIm * totalIm;
    oRe = (injectedRe * totalRe + injectedIm * totalIm) / scale;
    oIm = (injectedIm * totalRe - injectedRe * totalIm) / scale;
  }
  // I_load = (V_o − E)·Y_l, I_cap = V_o·Y_sh, I_inv = I_load + I_cap.
  const dRe = oRe - eRe;
  const dIm = oIm - eIm;
  const loadRe = dRe * ylRe - dIm * ylIm;
  const loadIm = dRe * ylIm + dIm * ylRe;
  const capRe = oRe * shRe - oIm * shIm;
  const capIm = oRe * shIm + oIm * shRe;
  into[at] = oRe;
  into[at + 1] = oIm;
  into[at + 2] = loadRe + capRe;
  into[at + 3] = loadIm + capIm;
  into[at + 4] = capRe;
  into[at + 5] = capIm;
  into[at + 6] = loadRe;
  into[at + 7] = loadIm;
}
