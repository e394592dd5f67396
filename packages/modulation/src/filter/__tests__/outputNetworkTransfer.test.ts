import { describe, expect, it } from 'vitest';
import { add, div, mul, sub, type HandComplex } from '../../testing/handComplex.js';
import { outputNetworkTransfer } from '../outputNetworkTransfer.js';
import type { OutputNetwork } from '../outputNetworkResponse.js';

// An undamped LC filter (2 mH, 10 µF) into an R-L load (16 Ω, 30 mH) at 50 Hz.
const [L, C, R, LOAD_L] = [0.002, 10e-6, 16, 0.03];
const network: OutputNetwork = { filter: { l: L, c: C }, load: { r: R, l: LOAD_L } };
const omega = 2 * Math.PI * 50;

describe('outputNetworkTransfer', () => {
  it('gives each order the divider of standard circuit analysis: V_o = V·Y_s/(Y_s + Y_c + Y_load), I_inv = (V − V_o)·Y_s', () => {
    for (const n of [1, 7, 101]) {
      const w = n * omega;
      const ys = div([1, 0], [0, w * L]);
      const yc: HandComplex = [0, w * C];
      const yl = div([1, 0], [R, w * LOAD_L]);
      const output = div(ys, add(add(ys, yc), yl));
      const inverter = mul(sub([1, 0], output), ys);
      const transfer = outputNetworkTransfer(network, omega, 200);
      const scale = Math.hypot(...output);
      expect(Math.abs((transfer.output.re[n] as number) - output[0])).toBeLessThan(1e-12 * scale);
      expect(Math.abs((transfer.output.im[n] as number) - output[1])).toBeLessThan(1e-12 * scale);
      const current = Math.hypot(...inverter);
      expect(Math.abs((transfer.inverterCurrent.re[n] as number) - inverter[0])).toBeLessThan(
        1e-12 * current,
      );
      expect(Math.abs((transfer.inverterCurrent.im[n] as number) - inverter[1])).toBeLessThan(
        1e-12 * current,
      );
    }
  });

  it('keeps the currents to currentOrder and the output to maxOrder, the same numbers as the whole', () => {
    // A design report sums its currents to its current order and reads only the output above it.
    const whole = outputNetworkTransfer(network, omega, 500);
    const kept = outputNetworkTransfer(network, omega, 500, 120);
    expect(Array.from(kept.output.re)).toEqual(Array.from(whole.output.re));
    expect(Array.from(kept.output.im)).toEqual(Array.from(whole.output.im));
    for (const part of ['inverterCurrent', 'capacitorCurrent', 'loadCurrent'] as const) {
      expect(kept[part].re).toHaveLength(121);
      expect(Array.from(kept[part].re)).toEqual(Array.from(whole[part].re.subarray(0, 121)));
      expect(Array.from(kept[part].im)).toEqual(Array.from(whole[part].im.subarray(0, 121)));
    }
  });
});
