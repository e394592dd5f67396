import type { Harmonic } from '../spectrum/Harmonic.js';
import { MAX_HARMONIC_ORDER } from '../spectrum/harmonics.js';
import { subharmonicSpectrum } from '../spectrum/subharmonicSpectrum.js';
import { assertNumberInRange } from '../validation/assertions.js';
import { withFieldPrefix } from '../validation/withFieldPrefix.js';
import { MAX_ASYNCHRONOUS_COST } from './asynchronousDesignSpectra.js';
import type { CarrierSpanFigures } from './DesignReport.js';
import type { RationalRatio } from './designRationalRatio.js';
import { designSpanModulation } from './designSpanModulation.js';
import type { InverterDesign } from './InverterDesign.js';
import { modulationVoltages, type NamedVoltage } from './modulationVoltages.js';

/** What {@link designSpanSpectrum} returns; a plain serialisable object. */
export interface DesignSpanSpectrum {
  /** The voltage analysed: line a−b of a three-phase bridge, else the bridge output. */
  name: string;
  /**
   * Span orders 0..q·maxOrder, index = n, each at `order` n/q of the fundamental (peak volts,
   * radians relative to sin(order·θ), θ the fundamental angle; see {@link Harmonic}); unlabelled.
   */
  harmonics: Harmonic[];
  /** THD over every component but the mean and the fundamental, sub- and inter-harmonics included, exact over the span. */
  thd: number;
  /** WTHD over the same components, each weighted by 1/order (order in fundamentals), exact over the span. */
  wthd: number;
  /** THD of the shown components only (orders above 0 to maxOrder, the fundamental left out), ratio. */
  spectrumThd: number;
  /** The ratio p/q analysed, the carrier and its error, the spacing f₁/q of the components. */
  carrierSpan: CarrierSpanFigures;
}

/**
 * The predicted spectrum of a design's bridge voltage (line a−b for a three-phase bridge, the
 * bridge output for a single-phase one) when its carrier is no whole multiple of the fundamental
 * (`designCarrierSpan`'s ratio p/q): the voltage built over the q fundamental periods after which
 * the pattern repeats and read by `subharmonicSpectrum` (components n/q of the fundamental, exact
 * from the switching angles; THD and WTHD over the whole span, Parseval). The same voltage and
 * numbers as the design report's `lineToLine` (or `bridge`) over its span, without the labels:
 * for callers that send the numbers on (GET /studies/{id}/spectrum, a capture comparison).
 * Source: Holmes and Lipo, 2003, ch. 3 (sidebands at m·p/q ± k).
 *
 * @param span - the design's ratio p/q and carrier error in hertz (`designCarrierSpan`)
 * @param options.maxOrder - highest order in fundamentals, an integer in
 *   [1, min(100000/q, 2e7/(p·q))] (q·maxOrder components, each summed over about 4p edges)
 * @throws ParameterRangeError naming `maxOrder`, or the design's field (`modulation.ma`, …)
 */
export function designSpanSpectrum(
  design: InverterDesign,
  span: RationalRatio,
  options: { maxOrder: number },
): DesignSpanSpectrum {
  const { p, q, error } = span;
  const { maxOrder } = options;
  assertNumberInRange('maxOrder', maxOrder, {
    min: 1,
    max: Math.min(Math.floor(MAX_HARMONIC_ORDER / q), Math.floor(MAX_ASYNCHRONOUS_COST / (p * q))),
    integer: true,
  });
  const ratio = p / q;
  const modulation = withFieldPrefix('modulation.', () => designSpanModulation(design, ratio));
  const voltages = withFieldPrefix('modulation.', () =>
    modulationVoltages(modulation, { fundamentalPeriods: q }),
  );
  const voltage = (voltages.lines[0] ?? voltages.phases[0]) as NamedVoltage;
  const read = subharmonicSpectrum(voltage.waveform, { fundamentalPeriods: q, maxOrder });
  let shown = 0;
  for (const c of read.components)
    if (c.spanOrder !== 0 && c.spanOrder !== q) shown += c.amplitude * c.amplitude;
  return {
    name: voltage.name,
    harmonics: read.components.map((c) => ({
      order: c.order,
      amplitude: c.amplitude,
      phase: c.phase,
    })),
    thd: read.thd,
    wthd: read.wthd,
    spectrumThd: Math.sqrt(shown) / read.fundamental,
    carrierSpan: {
      p,
      q,
      carrierFrequency: ratio * design.fundamentalFrequency,
      carrierError: error,
      baseFrequency: design.fundamentalFrequency / q,
    },
  };
}
