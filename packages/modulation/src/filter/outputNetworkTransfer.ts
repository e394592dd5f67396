import type { HarmonicPhasors } from '../spectrum/harmonicPhasors.js';
import type { OutputNetwork } from './outputNetworkResponse.js';
import { solveOutputNetwork } from './solveOutputNetwork.js';

/**
 * What one volt of bridge voltage (phasor 1 + j0, no back-EMF) gives at each order of the
 * fundamental: the {@link outputNetworkResponse} phasors per order, index = order.
 */
export interface OutputNetworkTransfer {
  output: HarmonicPhasors;
  inverterCurrent: HarmonicPhasors;
  capacitorCurrent: HarmonicPhasors;
  loadCurrent: HarmonicPhasors;
}

/**
 * The network's response to a unit bridge voltage at the orders 0..maxOrder of the fundamental
 * angular frequency `omega` (rad/s), solved order by order as `outputNetworkResponse` solves it
 * (`solveOutputNetwork`). The network is
 * linear, so a bridge voltage V_n gives V_n times these (superposition; a back-EMF, present at
 * the fundamental only, is added by solving that order with it). A balanced three-phase
 * bridge's phases share one network, so a report solves it once for all of them. Internal:
 * part of analyseDesign.
 * @param currentOrder - the highest order whose currents are kept (a report sums its currents to
 *   an order of its own and reads only the output voltage above it), ≤ maxOrder @default maxOrder
 */
export function outputNetworkTransfer(
  network: OutputNetwork,
  omega: number,
  maxOrder: number,
  currentOrder: number = maxOrder,
): OutputNetworkTransfer {
  const size = maxOrder + 1;
  const currents = Math.min(size, currentOrder + 1);
  const phasors = (count: number): HarmonicPhasors => ({
    re: new Float64Array(count),
    im: new Float64Array(count),
  });
  const transfer: OutputNetworkTransfer = {
    output: phasors(size),
    inverterCurrent: phasors(currents),
    capacitorCurrent: phasors(currents),
    loadCurrent: phasors(currents),
  };
  const solved = new Float64Array(8);
  const unit = [1, 0, 0, 0] as const;
  for (let n = 0; n < size; n++) {
    solveOutputNetwork(network, omega * n, unit, solved, 0);
    transfer.output.re[n] = solved[0] as number;
    transfer.output.im[n] = solved[1] as number;
    if (n >= currents) continue;
    transfer.inverterCurrent.re[n] = solved[2] as number;
    transfer.inverterCurrent.im[n] = solved[3] as number;
    transfer.capacitorCurrent.re[n] = solved[4] as number;
    transfer.capacitorCurrent.im[n] = solved[5] as number;
    transfer.loadCurrent.re[n] = solved[6] as number;
    transfer.loadCurrent.im[n] = solved[7] as number;
  }
  return transfer;
}
