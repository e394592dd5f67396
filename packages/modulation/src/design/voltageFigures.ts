import { labelHarmonics } from '../spectrum/labelHarmonics.js';
import { waveformMeanSquare } from '../waveform/waveformMeanSquare.js';
import type { Harmonic } from '../spectrum/Harmonic.js';
import type { VoltageFigures } from './DesignReport.js';
import type { NamedVoltage } from './modulationVoltages.js';
import { spectrumLabelRatio } from './spectrumLabelRatio.js';
import { voltageSpectrumFigures } from './voltageSpectrumFigures.js';

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
 * to `maxOrder` labelled by carrier group, and the THD of only the shown orders. The report's
 * bridge and line-to-line figures and the API's spectrum route both come from here.
 * @throws ParameterRangeError when the fundamental is zero or maxOrder is out of range
 */
export function voltageFigures(
  voltage: NamedVoltage,
  options: VoltageFiguresOptions,
): VoltageFigures {
  const { maxOrder, frequencyRatio = null } = options;
  const { name, spectrum, thd, wthd, spectrumThd } = voltageSpectrumFigures(voltage, { maxOrder });
  const fundamental = spectrum[1] as Harmonic;
  return {
    name,
    fundamental: fundamental.amplitude,
    fundamentalPhase: fundamental.phase,
    rms: Math.sqrt(waveformMeanSquare(voltage.waveform)),
    thd,
    thdUpperBound: thd,
    wthd,
    exact: true,
    spectrum: labelHarmonics(spectrum, spectrumLabelRatio(maxOrder, frequencyRatio)),
    spectrumThd,
  };
}
