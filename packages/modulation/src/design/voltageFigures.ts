import { MAX_HARMONIC_ORDER } from '../spectrum/harmonicPhasors.js';
import { harmonics } from '../spectrum/harmonics.js';
import { assertNumberInRange } from '../validation/assertions.js';
import { labelHarmonics } from '../spectrum/labelHarmonics.js';
import type { VoltageFigures } from './DesignReport.js';
import { labelledVoltageFigures } from './labelledVoltageFigures.js';
import type { NamedVoltage } from './modulationVoltages.js';
import { spectrumLabelRatio } from './spectrumLabelRatio.js';

/** Options of {@link voltageFigures}. */
export interface VoltageFiguresOptions {
  /** Highest order of the returned spectrum, an integer ≥ 1. */
  maxOrder: number;
  /** Frequency ratio the spectrum is labelled by (carrier group, sideband); null labels by order. @default null */
  frequencyRatio?: number | null;
}

/**
 * The figures of one piecewise-constant voltage as the design report gives them: fundamental,
 * RMS, THD and WTHD exact over the whole waveform (`waveformThd`, `waveformWthd`), the spectrum
 * to `maxOrder` labelled by carrier group, and the THD of only the shown orders: the design
 * report's bridge and line-to-line figures (which the report reads from the spectra it shares
 * between its voltages, `labelledVoltageFigures`).
 * @throws ParameterRangeError when the fundamental is zero or maxOrder is out of range
 */
export function voltageFigures(
  voltage: NamedVoltage,
  options: VoltageFiguresOptions,
): VoltageFigures {
  const { maxOrder, frequencyRatio = null } = options;
  assertNumberInRange('maxOrder', maxOrder, { min: 1, max: MAX_HARMONIC_ORDER, integer: true });
  const spectrum = harmonics(voltage.waveform, maxOrder);
  return labelledVoltageFigures(
    voltage,
    labelHarmonics(spectrum, spectrumLabelRatio(maxOrder, frequencyRatio)),
  );
}
