import { assertNumberInRange } from '../validation/assertions.js';
import { harmonics } from '../spectrum/harmonics.js';
import { SIX_STEP_M } from './spaceVectorLimits.js';
import type { OvermodulationMode } from './spaceVectorTypes.js';
import { spaceVectorWaveforms, type SpaceVectorWaveformOptions } from './spaceVectorWaveforms.js';

/** Options of {@link overmodulationGainCurve}: the waveform options without m/ma, plus the sweep. */
export interface OvermodulationGainCurveOptions extends Omit<
  SpaceVectorWaveformOptions,
  'm' | 'ma'
> {
  /** First commanded m of the sweep, in [0, 2√3/π). @default 0 */
  mStart?: number;
  /** Number of commanded values, evenly spaced from mStart to six-step 2√3/π inclusive. @default 45 */
  points?: number;
}

/** Series for a gain-curve chart, one entry per commanded value. */
export interface OvermodulationGainCurve {
  /** Commanded modulation index m = √3·|V1*|/vdc. */
  m: number[];
  /** Commanded phase fundamental, peak volts: m·vdc/√3. */
  commandedFundamental: number[];
  /**
   * Output phase fundamental, peak volts: the exact fundamental of the star-load phase voltage
   * `an` of the generated waveform (harmonic order `fundamentalOrder`).
   */
  outputFundamental: number[];
  /** Output over commanded (1 where commanded is 0). */
  gain: number[];
  /** Overmodulation mode of each point. */
  mode: OvermodulationMode[];
  /** Six-step phase fundamental (2/π)·vdc, where the curve should end. */
  sixStepFundamental: number;
  /** Harmonic order of the fundamental in the generated waveforms (q of frequencyRatio = p/q). */
  fundamentalOrder: number;
}

/**
 * The fundamental gain curve of space-vector modulation through overmodulation to six-step:
 * for commanded m from `mStart` to 2√3/π, the phase fundamental the generated waveform really
 * has (exact harmonics of {@link spaceVectorWaveforms}, no sampling) against the commanded one.
 *
 * With `overmodulation: 'two-mode'` (Holtz, Lotzkat, Khambadkone, IEEE Trans. Power Electron.,
 * 1993) the curve follows the commanded line up to six-step, where it reaches (2/π)·vdc (the
 * Fourier fundamental of the ±vdc/2 square leg voltage) exactly when the switching periods per
 * fundamental are a multiple of 6 (the six-step edges then fall on the sampling grid); at other
 * ratios the last point is the six-step pattern quantised to the grid. At a finite frequency
 * ratio regular sampling makes the output differ a little from the commanded value everywhere
 * (the per-period samples lag); the curve shows by how much. `'hexagon-limit'` falls short of the
 * commanded value beyond m = 1 (it gives the mode-I fundamental of radius m) and never reaches
 * six-step.
 *
 * @param options - as {@link spaceVectorWaveforms} without m/ma, plus `mStart` and `points`
 * @throws ParameterRangeError naming the field
 */
export function overmodulationGainCurve({
  mStart = 0,
  points = 45,
  ...waveformOptions
}: OvermodulationGainCurveOptions): OvermodulationGainCurve {
  assertNumberInRange('mStart', mStart, { min: 0, max: SIX_STEP_M, maxExclusive: true });
  assertNumberInRange('points', points, { min: 2, max: 1000, integer: true });
  const { vdc } = waveformOptions;
  assertNumberInRange('vdc', vdc, { min: 0, minExclusive: true });
  const curve: OvermodulationGainCurve = {
    m: [],
    commandedFundamental: [],
    outputFundamental: [],
    gain: [],
    mode: [],
    sixStepFundamental: (2 / Math.PI) * vdc,
    fundamentalOrder: 1,
  };
  for (let i = 0; i < points; i++) {
    const m = i === points - 1 ? SIX_STEP_M : mStart + ((SIX_STEP_M - mStart) * i) / (points - 1);
    const result = spaceVectorWaveforms({ ...waveformOptions, m });
    const order = result.fundamentalOrder;
    const output = (harmonics(result.an, order)[order] as { amplitude: number }).amplitude;
    const commanded = (m * vdc) / Math.sqrt(3);
    curve.m.push(m);
    curve.commandedFundamental.push(commanded);
    curve.outputFundamental.push(output);
    curve.gain.push(commanded > 0 ? output / commanded : 1);
    curve.mode.push(result.mode);
    curve.fundamentalOrder = order;
  }
  return curve;
}
