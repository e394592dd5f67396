import { outputNetworkResponse, type OutputNetwork } from '../filter/outputNetworkResponse.js';
import type { OutputNetworkTransfer } from '../filter/outputNetworkTransfer.js';
import type { Complex } from '../numeric/complex.js';
import type { HarmonicPhasors } from '../spectrum/harmonicPhasors.js';

/**
 * One phase's output voltage and currents at the orders 0..count − 1 of the fundamental: the
 * network's response to a unit bridge voltage (`outputNetworkTransfer`) times the bridge
 * voltage's phasor at each order (the network is linear: superposition), and the fundamental
 * solved with the back-EMF (`outputNetworkResponse`), which drives that order only. Internal:
 * the filtered phases and the grid figures of analyseDesign. Over a span of q fundamental
 * periods (a carrier at mf = p/q) the orders are of the span's base f₁/q and the fundamental,
 * with the back-EMF, is order q (`fundamentalOrder`).
 * @param bridge - the phase's bridge voltage phasors, orders 0..max(count, outputCount) − 1 at
 *   least, volts
 * @param transfer - the unit responses, orders 0..max(count, outputCount) − 1 at least
 * @param context.omega - angular frequency of order 1, rad/s (the fundamental's over one period)
 * @param context.emf - the back-EMF phasor at the fundamental, volts
 * @param context.fundamentalOrder - the order of the fundamental (q over a span) @default 1
 * @param context.outputCount - the output voltage's orders, 0..outputCount − 1 (a caller that
 *   reports a phase's output spectrum further than its currents, or none, spares the products
 *   it would not read) @default count
 */
export function networkPhasors(
  bridge: HarmonicPhasors,
  transfer: OutputNetworkTransfer,
  context: {
    count: number;
    network: OutputNetwork;
    omega: number;
    emf: Complex;
    fundamentalOrder?: number;
    outputCount?: number;
  },
): OutputNetworkTransfer {
  const { count, network, omega, emf, fundamentalOrder: first = 1 } = context;
  const { outputCount = count } = context;
  const scaled = (unit: HarmonicPhasors, orders: number): HarmonicPhasors => {
    // The result is built before the loop, not after it: V8 may compile this loop on the fly
    // (on-stack replacement) before the code after it ever ran, and code there without type
    // feedback then deoptimised it on every later call (measured: 12 times a report, in about
    // half of the processes).
    const product = { re: new Float64Array(orders), im: new Float64Array(orders) };
    const { re, im } = product;
    for (let n = 0; n < orders; n++) {
      const vr = bridge.re[n] as number;
      const vi = bridge.im[n] as number;
      const ur = unit.re[n] as number;
      const ui = unit.im[n] as number;
      re[n] = ur * vr - ui * vi;
      im[n] = ur * vi + ui * vr;
    }
    return product;
  };
  const solved: OutputNetworkTransfer = {
    output: scaled(transfer.output, outputCount),
    inverterCurrent: scaled(transfer.inverterCurrent, count),
    capacitorCurrent: scaled(transfer.capacitorCurrent, count),
    loadCurrent: scaled(transfer.loadCurrent, count),
  };
  if (Math.max(count, outputCount) > first) {
    const voltage = { re: bridge.re[first] as number, im: bridge.im[first] as number };
    const fundamental = outputNetworkResponse(network, omega * first, voltage, emf);
    for (const part of ['output', 'inverterCurrent', 'capacitorCurrent', 'loadCurrent'] as const) {
      if (solved[part].re.length <= first) continue;
      solved[part].re[first] = fundamental[part].re;
      solved[part].im[first] = fundamental[part].im;
    }
  }
  return solved;
}
