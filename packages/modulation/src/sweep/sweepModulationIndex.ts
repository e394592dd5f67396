import { assertFiniteArray, assertNumberInRange } from '../validation/assertions.js';
import { harmonics, MAX_HARMONIC_ORDER } from '../spectrum/harmonics.js';
import { waveformThd } from '../spectrum/waveformThd.js';
import { waveformWthd } from '../spectrum/waveformWthd.js';
import type { Waveform } from '../waveform/Waveform.js';

/** Options of {@link sweepModulationIndex}. */
export interface ModulationIndexSweepOptions {
  /** First modulation index, > 0. @default 0.05 */
  from?: number;
  /** Last modulation index, ≥ from. @default 1.3 */
  to?: number;
  /** Number of evenly spaced points, an integer in [2, 1000]. @default 100 */
  points?: number;
  /** Highest order `orders` may name, an integer in [1, 100000] (THD and WTHD cover every order). */
  maxOrder: number;
  /** Orders whose amplitude is returned as a series (each in [0, maxOrder]). @default [] */
  orders?: number[];
  /** Called after each point with the fraction done (0..1], for a progress bar. */
  onProgress?: (fraction: number) => void;
}

/** The series of an ma sweep, one entry per point, ready to plot. */
export interface ModulationIndexSweep {
  /** The modulation indices swept. */
  ma: number[];
  /** Fundamental amplitude at each point (peak volts). */
  fundamental: number[];
  /** THD over the whole waveform, every order ≥ 2 (ratio; `waveformThd`). */
  thd: number[];
  /** WTHD over the whole waveform (ratio; `waveformWthd`). */
  wthd: number[];
  /** Amplitude series (peak volts) of each requested order. */
  harmonics: { order: number; amplitude: number[] }[];
}

/**
 * Spectrum, THD and WTHD across a range of modulation index for any method: `waveformAt(ma)`
 * builds the waveform (for example `(ma) => sineTriangle({ ...options, ma })`), and each point
 * is analysed exactly: THD and WTHD over the whole waveform, the requested orders by {@link harmonics}. The reporting follows Holmes and Lipo (2003,
 * ch. 3), who compare methods by THD and WTHD against ma.
 *
 * @throws ParameterRangeError naming `from`, `to`, `points`, `maxOrder` or `orders[i]`
 */
export function sweepModulationIndex(
  waveformAt: (ma: number) => Waveform,
  options: ModulationIndexSweepOptions,
): ModulationIndexSweep {
  const { from = 0.05, to = 1.3, points = 100, maxOrder, orders = [], onProgress } = options;
  assertNumberInRange('from', from, { min: 0, minExclusive: true });
  assertNumberInRange('to', to, { min: from });
  assertNumberInRange('points', points, { min: 2, max: 1000, integer: true });
  assertNumberInRange('maxOrder', maxOrder, { min: 1, max: MAX_HARMONIC_ORDER, integer: true });
  assertFiniteArray('orders', orders, 0, maxOrder + 1);
  orders.forEach((order, i) =>
    assertNumberInRange(`orders[${i}]`, order, { min: 0, max: maxOrder, integer: true }),
  );

  const result: ModulationIndexSweep = {
    ma: [],
    fundamental: [],
    thd: [],
    wthd: [],
    harmonics: orders.map((order) => ({ order, amplitude: [] })),
  };
  for (let k = 0; k < points; k++) {
    const ma = from + ((to - from) * k) / (points - 1);
    const waveform = waveformAt(ma);
    const spectrum = harmonics(waveform, Math.max(1, ...orders));
    result.ma.push(ma);
    result.fundamental.push(spectrum[1]?.amplitude ?? 0);
    result.thd.push(waveformThd(waveform));
    result.wthd.push(waveformWthd(waveform));
    result.harmonics.forEach((series) =>
      series.amplitude.push(spectrum[series.order]?.amplitude ?? 0),
    );
    onProgress?.((k + 1) / points);
  }
  return result;
}
