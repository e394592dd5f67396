import { lcFilter } from '../filter/lcFilter.js';
import { outputNetworkResponse, type OutputNetwork } from '../filter/outputNetworkResponse.js';
import { TAU } from '../math.js';
import { complexAbs } from '../numeric/complex.js';
import { withFieldPrefix } from '../validation/withFieldPrefix.js';
import type { DesignReport } from './DesignReport.js';
import type { InverterDesign } from './InverterDesign.js';

/**
 * A design report's filter figures: the LC filter's characteristics (`lcFilter`) and the loaded
 * network's voltage gain |V_out/V_bridge| at the fundamental and at the carrier (frequencyRatio
 * times the fundamental, a whole mf or a span's p/q; null for a stored pattern).
 * Internal: part of analyseDesign and analyseDesignSpan.
 * @param frequency - the fundamental, hertz
 */
export function filterFigures(
  filter: NonNullable<InverterDesign['filter']>,
  network: OutputNetwork,
  frequency: number,
  frequencyRatio: number | null,
): NonNullable<DesignReport['filter']> {
  const gainAt = (order: number): number =>
    complexAbs(outputNetworkResponse(network, TAU * frequency * order, { re: 1, im: 0 }).output);
  return {
    characteristics: withFieldPrefix('filter.', () => lcFilter(filter)),
    gainAtFundamental: gainAt(1),
    gainAtCarrier: frequencyRatio === null ? null : gainAt(frequencyRatio),
  };
}
