import { outputNetworkResponse, type OutputNetwork } from '../filter/outputNetworkResponse.js';
import type { OutputNetworkTransfer } from '../filter/outputNetworkTransfer.js';
import type { Complex } from '../numeric/complex.js';
import type { HarmonicPhasors } from '../spectrum/harmonicPhasors.js';

/**
 * One phase's output voltage and currents at the orders 0..count − 1 of the fundamental: the
 * network's response to a unit bridge voltage (`outputNetworkTransfer`) times the bridge
 * voltage's phasor at each order (the network is linear: superposition), and the fundamental
 * solved with the back-EMF (`outputNetworkResponse`), which drives that order only. Internal:
 * the filtered phases and the grid figures of analyseDesign.
 * @param bridge - the phase's bridge voltage phasors, orders 0..count − 1 at least, volts
 * @param transfer - the unit responses, orders 0..count − 1 at least
 * @param context.omega - fundamental angular frequency, rad/s
 * @param context.emf - the back-EMF phasor at the fundamental, volts
 */
export function networkPhasors(
  bridge: HarmonicPhasors,
  transfer: OutputNetworkTransfer,
  context: { count: number; network: OutputNetwork; omega: number; emf: Complex },
): OutputNetworkTransfer {
  const { count, network, omega, emf } = context;
  const scaled = (unit: HarmonicPhasors): HarmonicPhasors => {
    const re = new Float64Array(count);
    const im = new Float64Array(count);
    for (let n = 0; n < count; n++) {
      const vr = bridge.re[n] as number;
      const vi = bridge.im[n] as number;
      const ur = unit.re[n] as number;
      const ui = unit.im[n] as number;
      re[n] = ur * vr - ui * vi;
      im[n] = ur * vi + ui * vr;
    }
    return { re, im };
  };
  const solved: OutputNetworkTransfer = {
    output: scaled(transfer.output),
    inverterCurrent: scaled(transfer.inverterCurrent),
    capacitorCurrent: scaled(transfer.capacitorCurrent),
    loadCurrent: scaled(transfer.loadCurrent),
  };
  if (count > 1) {
    const voltage = { re: bridge.re[1] as number, im: bridge.im[1] as number };
    const fundamental = outputNetworkResponse(network, omega, voltage, emf);
    for (const part of ['output', 'inverterCurrent', 'capacitorCurrent', 'loadCurrent'] as const) {
      solved[part].re[1] = fundamental[part].re;
      solved[part].im[1] = fundamental[part].im;
    }
  }
  return solved;
}
