import type { NumberBounds } from '../validation/assertions.js';

/**
 * Bounds of a loss-model device's datasheet values, by field name (volts for vce0/vf0/
 * referenceVoltage, ohms for rce/rf/rdsOn, joules for eon/eoff/err, amperes for
 * referenceCurrent). The upper bounds lie far past any real part so that no device is refused,
 * yet low enough that every loss stays a finite number: on-state thresholds of about 1 V,
 * resistances of milliohms, switching energies of millijoules up to some 10 J a pulse for the
 * largest press-pack modules (common practice, from memory); the reference point within the
 * operating point's own bounds (vdc ≤ 100 kV, current ≤ 1 MA). The reference point's least value
 * (1 mV, 1 mA) keeps the linear energy scaling finite: datasheets state their switching energies
 * at hundreds of volts and amperes. The OpenAPI schema SemiconductorDevice restates these.
 */
export const LOSS_DEVICE_BOUNDS: Readonly<
  Record<
    | 'vce0'
    | 'rce'
    | 'vf0'
    | 'rf'
    | 'rdsOn'
    | 'eon'
    | 'eoff'
    | 'err'
    | 'referenceVoltage'
    | 'referenceCurrent',
    Readonly<NumberBounds>
  >
> = {
  vce0: { min: 0, max: 1e3 },
  rce: { min: 0, max: 1e3 },
  vf0: { min: 0, max: 1e3 },
  rf: { min: 0, max: 1e3 },
  rdsOn: { min: 0, max: 1e3 },
  eon: { min: 0, max: 1e3 },
  eoff: { min: 0, max: 1e3 },
  err: { min: 0, max: 1e3 },
  referenceVoltage: { min: 1e-3, max: 1e5 },
  referenceCurrent: { min: 1e-3, max: 1e6 },
};
