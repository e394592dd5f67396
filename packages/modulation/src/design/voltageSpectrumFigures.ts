import { harmonics } from '../spectrum/harmonics.js';
import { weightedDistortion } from '../spectrum/distortion.js';
import { waveformThd } from '../spectrum/waveformThd.js';
import { waveformWthd } from '../spectrum/waveformWthd.js';
import type { Harmonic } from '../spectrum/Harmonic.js';
import type { NamedVoltage } from './modulationVoltages.js';

/** What {@link voltageSpectrumFigures} returns; a plain serialisable object. */
export interface VoltageSpectrumFigures {
  /** What the voltage is measured between, e.g. `line a−b`. */
  name: string;
  /** Orders 0..maxOrder, index = order, peak volts and radians (see {@link Harmonic}); unlabelled. */
  spectrum: Harmonic[];
  /** THD over every order ≥ 2, ratio, exact from the waveform's mean square (`waveformThd`). */
  thd: number;
  /** WTHD over every order ≥ 2, ratio, exact over the whole waveform (`waveformWthd`). */
  wthd: number;
  /** THD of orders 2..maxOrder only, ratio. */
  spectrumThd: number;
}

/**
 * The spectrum figures of one piecewise-constant voltage without the carrier-group labels:
 * the exact spectrum to `maxOrder` (closed-form integral of each segment, `harmonics`), THD and
 * WTHD exact over the whole waveform, and the THD of the shown orders. For callers that send the
 * numbers on (the API's spectrum route), where a label per order would be built and thrown away;
 * {@link voltageFigures} adds the labels and the rest of the design report's figures to these.
 * @param voltage - one period of the voltage (volts), with its name
 * @param options.maxOrder - highest order of the spectrum, an integer ≥ 1
 * @throws ParameterRangeError when the fundamental is zero or maxOrder is out of range
 */
export function voltageSpectrumFigures(
  voltage: NamedVoltage,
  options: { maxOrder: number },
): VoltageSpectrumFigures {
  const { name, waveform } = voltage;
  const spectrum = harmonics(waveform, options.maxOrder);
  return {
    name,
    spectrum,
    thd: waveformThd(waveform),
    wthd: waveformWthd(waveform),
    spectrumThd: weightedDistortion(spectrum, 0),
  };
}
