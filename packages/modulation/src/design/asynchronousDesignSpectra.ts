import { subharmonicSpectrum, type SubharmonicSpectrum } from '../spectrum/subharmonicSpectrum.js';
import { assertNumberInRange } from '../validation/assertions.js';
import { ParameterRangeError } from '../validation/errors.js';
import { withFieldPrefix } from '../validation/withFieldPrefix.js';
import { assertInverterDesign } from './assertInverterDesign.js';
import { ASYNCHRONOUS_METHODS } from './designCarrierSpan.js';
import { designRationalRatio } from './designRationalRatio.js';
import type { InverterDesign } from './InverterDesign.js';
import type { ModulationMethod } from './Modulation.js';
import { designSpanModulation } from './designSpanModulation.js';
import { modulationVoltages } from './modulationVoltages.js';

/**
 * Most products p·q·maxOrder (carrier cycles in the span times span orders) one call may cost:
 * about 4p edges a leg, each summed into q·maxOrder orders (a few hundred milliseconds here).
 */
export const MAX_ASYNCHRONOUS_COST = 20_000_000;

/** A voltage of the design over its span, with its spectrum on the base frequency f₁/q. */
export interface AsynchronousVoltage {
  /** What it is measured between (`bridge output`, `phase a to star point`, `line a−b`, …). */
  name: string;
  spectrum: SubharmonicSpectrum;
}

/** The spectra of a carrier design at its frequency ratio p/q, exact over q fundamental periods. */
export interface AsynchronousDesignSpectra {
  /** Carrier cycles in the span. */
  p: number;
  /** Fundamental periods in the span; the spectra's base frequency is fundamentalFrequency/q. */
  q: number;
  /** p/q, the ratio analysed. */
  frequencyRatio: number;
  /** p/q·fundamentalFrequency, hertz: the carrier analysed. */
  carrierFrequency: number;
  /** The carrier analysed minus the one asked for, hertz (0 to rounding for an exact p/q). */
  carrierError: number;
  /** Hertz, fundamentalFrequency/q: the spacing of the spectra's components. */
  baseFrequency: number;
  /** Phase a's voltage (bridge output, or phase a to star point), then leg a and line a−b (three-phase). */
  voltages: AsynchronousVoltage[];
}

/** Options of {@link asynchronousDesignSpectra}. */
export interface AsynchronousDesignOptions {
  /** Highest order in fundamentals, an integer ≥ 1 with p·q·maxOrder ≤ 2e7. @default min(50, that bound) */
  maxOrder?: number;
}

/**
 * A carrier design (sine-triangle, three-phase carrier or space vector) whose carrier need not
 * be a whole multiple of the fundamental: the ratio is taken as the nearest p/q with q ≤ 64
 * (`designRationalRatio`, its error in hertz stated), the voltages are built exactly over the q
 * fundamental periods after which the pattern repeats, and each is read by
 * `subharmonicSpectrum` (orders n/q, labelled as fractions; THD and WTHD over the whole span, the
 * sub-harmonics included). With q = 1 the figures are those of `analyseDesign`'s voltages.
 * Sources: Holmes and Lipo, 2003, ch. 3 (sidebands at m·p/q ± n); continued fractions for p/q.
 *
 * @throws ParameterRangeError / ParameterTypeError naming the field by its path in the design
 *   (`carrierFrequency`, `modulation.method` for a stored pattern, `modulation.ma`, …) or `maxOrder`
 */
export function asynchronousDesignSpectra(
  design: InverterDesign,
  options: AsynchronousDesignOptions = {},
): AsynchronousDesignSpectra {
  const method = (design.modulation as { method?: unknown } | undefined)?.method;
  if (!ASYNCHRONOUS_METHODS.includes(method as ModulationMethod)) {
    throw new ParameterRangeError(
      'modulation.method',
      `one of ${ASYNCHRONOUS_METHODS.map((m) => `'${m}'`).join(', ')} (a two-level method with a carrier)`,
      method,
    );
  }
  const { fundamentalFrequency } = design;
  const { p, q, error } = designRationalRatio(design);
  // Every other field is checked by the design's own rules, on a stand-in whose carrier is the
  // nearest whole multiple of f₁ (the carrier itself was checked just above).
  const standIn = {
    ...design,
    carrierFrequency: Math.max(1, Math.round(p / q)) * fundamentalFrequency,
  };
  assertInverterDesign(standIn);
  const bound = Math.floor(MAX_ASYNCHRONOUS_COST / (p * q));
  const { maxOrder = Math.min(50, bound) } = options;
  assertNumberInRange('maxOrder', maxOrder, { min: 1, max: bound, integer: true });
  const ratio = p / q;
  const modulation = designSpanModulation(standIn, ratio);
  const voltages = withFieldPrefix('modulation.', () =>
    modulationVoltages(modulation, { fundamentalPeriods: q }),
  );
  const shown = [voltages.phases[0], voltages.legs[0], voltages.lines[0]].filter(
    (v) => v !== undefined,
  );
  return {
    p,
    q,
    frequencyRatio: ratio,
    carrierFrequency: ratio * fundamentalFrequency,
    carrierError: error,
    baseFrequency: fundamentalFrequency / q,
    voltages: shown.map(({ name, waveform }) => ({
      name,
      spectrum: subharmonicSpectrum(waveform, { fundamentalPeriods: q, maxOrder }),
    })),
  };
}
