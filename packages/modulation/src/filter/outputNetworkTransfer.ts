import type { HarmonicPhasors } from '../spectrum/harmonicPhasors.js';
import { outputNetworkResponse, type OutputNetwork } from './outputNetworkResponse.js';

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
 * angular frequency `omega` (rad/s), by `outputNetworkResponse` order by order. The network is
 * linear, so a bridge voltage V_n gives V_n times these (superposition; a back-EMF, present at
 * the fundamental only, is added by solving that order with it). A balanced three-phase
 * bridge's phases share one network, so a report solves it once for all of them. Internal:
 * part of analyseDesign.
 */
export function outputNetworkTransfer(
  network: OutputNetwork,
  omega: number,
  maxOrder: number,
): OutputNetworkTransfer {
  const size = maxOrder + 1;
  const phasors = (): HarmonicPhasors => ({
    re: new Float64Array(size),
    im: new Float64Array(size),
  });
  const transfer: OutputNetworkTransfer = {
    output: phasors(),
    inverterCurrent: phasors(),
    capacitorCurrent: phasors(),
    loadCurrent: phasors(),
  };
  const unit = { re: 1, im: 0 };
  const parts = ['output', 'inverterCurrent', 'capacitorCurrent', 'loadCurrent'] as const;
  for (let n = 0; n < size; n++) {
    const response = outputNetworkResponse(network, omega * n, unit);
    for (const part of parts) {
      transfer[part].re[n] = response[part].re;
      transfer[part].im[n] = response[part].im;
    }
  }
  return transfer;
}
