import { DESIGN_BOUNDS, MAX_DESIGN_FREQUENCY_RATIO } from '@pulsewright/modulation';
import { METHOD_OPTIONS, type Option } from '../../../lib/modulationOptions';

/** The carrier methods a sweep takes. */
export type SweepMethod = 'sine-triangle' | 'three-phase';

/** The methods a sweep of the service takes (carrier PWM), from the library's list. */
export const SWEEP_METHOD_OPTIONS = METHOD_OPTIONS.filter(
  (o): o is Option<SweepMethod> => o.value === 'sine-triangle' || o.value === 'three-phase',
);

/** The modulation index's bounds, the library's own. */
export const MA_BOUNDS = DESIGN_BOUNDS['modulation.ma'];
/** The frequency ratio: a whole number up to the library's largest. */
export const RATIO_BOUNDS = { min: 1, max: MAX_DESIGN_FREQUENCY_RATIO, integer: true };
/** Points and highest order: the API document's MaSweepRequest (Range.points, maxOrder). */
export const POINTS_BOUNDS = { min: 2, max: 400, integer: true };
export const MAX_ORDER_BOUNDS = { min: 1, max: 2000, integer: true };
/** At most this many tracked orders (the API document's MaSweepRequest.orders). */
export const MAX_TRACKED_ORDERS = 20;
