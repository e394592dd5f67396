import { MAX_HARMONIC_ORDER } from '../spectrum/harmonics.js';
import { ParameterRangeError } from '../validation/errors.js';
import { MAX_ASYNCHRONOUS_COST } from './asynchronousDesignSpectra.js';
import type { RationalRatio } from './designRationalRatio.js';
import type { InverterDesign } from './InverterDesign.js';

/** The fewest orders a report's spectra hold (the harmonic limit table's 50). */
const MIN_REPORT_ORDER = 50;

/**
 * The highest spectrum order (in fundamentals) the design report of a design at a non-integer
 * ratio p/q (`designCarrierSpan`) may ask for, checked before any work: its span's spectra hold
 * q·maxOrder components, each summed over about 4p edges, so p·q·maxOrder is kept to
 * MAX_ASYNCHRONOUS_COST (as `asynchronousDesignSpectra`), q·maxOrder to what `harmonics` sums,
 * and maxOrder to 5000: min(5000, 100000/q, 2e7/(p·q)). The API's cost model asks it too, so a
 * span is refused with the same words before the report starts.
 * @throws ParameterRangeError naming `carrierFrequency` when that bound is below 50 (the span
 *   costs too much for the limit table's orders), or when the design has a filter or a grid
 *   (solved per harmonic of one period, not over a span)
 */
export function designSpanMaxOrder(design: InverterDesign, span: RationalRatio): number {
  const { p, q } = span;
  const frequency = design.fundamentalFrequency;
  const attached = design.grid ? 'grid' : design.filter ? 'filter' : null;
  if (attached !== null)
    throw new ParameterRangeError(
      'carrierFrequency',
      `a whole multiple of fundamentalFrequency ${frequency} Hz for a design with a ${attached} (a non-integer ratio is analysed without a filter or grid)`,
      design.carrierFrequency,
    );
  const bound = Math.min(
    5000,
    Math.floor(MAX_HARMONIC_ORDER / q),
    Math.floor(MAX_ASYNCHRONOUS_COST / (p * q)),
  );
  if (bound < MIN_REPORT_ORDER)
    throw new ParameterRangeError(
      'carrierFrequency',
      `a carrier whose ratio to fundamentalFrequency ${frequency} Hz is a fraction p/q with p·q ≤ ${MAX_ASYNCHRONOUS_COST / MIN_REPORT_ORDER} (its nearest with q ≤ 64 is ${p}/${q}: the ${q}-period span's spectra to order ${MIN_REPORT_ORDER} cost too much)`,
      design.carrierFrequency,
    );
  return bound;
}
