import { MAX_HARMONIC_ORDER } from '../spectrum/harmonics.js';
import { ParameterRangeError } from '../validation/errors.js';
import { MAX_ASYNCHRONOUS_COST } from './asynchronousDesignSpectra.js';
import type { RationalRatio } from './designRationalRatio.js';
import type { InverterDesign } from './InverterDesign.js';
import { spanFilterOrder } from './spanFilterOrder.js';

/** The fewest orders a report's spectra hold (the harmonic limit table's 50). */
const MIN_REPORT_ORDER = 50;
/**
 * Most span components a filtered span solves and sums per phase (q·order), as the one-period
 * report's MAX_ANALYSIS_ORDER: the currents' synthesis grid then stays within 2^19 samples.
 */
const MAX_FILTERED_SPAN_ORDERS = 20_000;

/**
 * The highest spectrum order (in fundamentals) the design report of a design at a non-integer
 * ratio p/q (`designCarrierSpan`) may ask for, checked before any work: its span's spectra hold
 * q·maxOrder components, each summed over about 4p edges, so p·q·maxOrder is kept to
 * MAX_ASYNCHRONOUS_COST (as `asynchronousDesignSpectra`), q·maxOrder to what `harmonics` sums,
 * and maxOrder to 5000: min(5000, 100000/q, 2e7/(p·q)). With a filter its network is solved to
 * the span order q·max(maxOrder, ⌈10·p/q⌉ + 10) (`spanFilterOrder`, the one-period report's
 * 10·mf + 10) and its currents summed there, so that order may reach min(20000/q, 2e7/(p·q)) and
 * must, and maxOrder is bounded by min(5000, that) (a grid without a filter is bounded as no
 * filter). The API's cost model
 * asks it too, so a span is refused with the same words before the report starts.
 * @throws ParameterRangeError naming `carrierFrequency` when that bound is below 50 (the span
 *   costs too much for the limit table's orders), or with a filter below ⌈10·p/q⌉ + 10
 */
export function designSpanMaxOrder(design: InverterDesign, span: RationalRatio): number {
  const { p, q } = span;
  const frequency = design.fundamentalFrequency;
  const filtered = design.filter !== undefined && design.filter !== null;
  // The most orders (in fundamentals) the span's sums may reach.
  const analysisBound = Math.min(
    Math.floor((filtered ? MAX_FILTERED_SPAN_ORDERS : MAX_HARMONIC_ORDER) / q),
    Math.floor(MAX_ASYNCHRONOUS_COST / (p * q)),
  );
  const bound = Math.min(5000, analysisBound);
  const required = spanFilterOrder(span);
  if (filtered && analysisBound < Math.max(MIN_REPORT_ORDER, required))
    throw new ParameterRangeError(
      'carrierFrequency',
      `a whole multiple of fundamentalFrequency ${frequency} Hz, or for a design with a filter a ratio p/q whose span solves the filter to order ⌈10·p/q⌉ + 10 within q·order ≤ ${MAX_FILTERED_SPAN_ORDERS} and p·q·order ≤ ${MAX_ASYNCHRONOUS_COST} (its nearest with q ≤ 64 is ${p}/${q}: order ${required} over ${q} periods costs too much)`,
      design.carrierFrequency,
    );
  if (bound < MIN_REPORT_ORDER)
    throw new ParameterRangeError(
      'carrierFrequency',
      `a carrier whose ratio to fundamentalFrequency ${frequency} Hz is a fraction p/q with p·q ≤ ${MAX_ASYNCHRONOUS_COST / MIN_REPORT_ORDER} (its nearest with q ≤ 64 is ${p}/${q}: the ${q}-period span's spectra to order ${MIN_REPORT_ORDER} cost too much)`,
      design.carrierFrequency,
    );
  return bound;
}
