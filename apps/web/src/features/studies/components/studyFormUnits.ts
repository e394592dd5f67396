import type { FieldUnit } from '../../../lib/fieldRange';

/** Degrees per radian: the form holds angles in radians and shows them in degrees. */
export const RADIANS_TO_DEGREES = 180 / Math.PI;

/** Angles are held in radians and shown in degrees. */
export const DEGREES: FieldUnit = { scale: RADIANS_TO_DEGREES, unit: '°' };
