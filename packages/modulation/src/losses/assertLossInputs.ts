import { ParameterTypeError } from '../validation/errors.js';
import { assertNumberInRange, assertOneOf } from '../validation/assertions.js';
import { LOSS_ZERO_SEQUENCES, type LossOperatingPoint } from './lossTypes.js';

/**
 * Upper bounds of a device's datasheet values (volts, ohms, joules, amperes), far past any real
 * part so that no device is refused, yet low enough that every loss stays a finite number:
 * on-state thresholds of about 1 V, resistances of milliohms, switching energies of millijoules
 * up to some 10 J a pulse for the largest press-pack modules (common practice, from memory);
 * the reference point within the operating point's own bounds (vdc ≤ 100 kV, current ≤ 1 MA).
 */
const DEVICE_BOUNDS: Readonly<Record<string, number>> = {
  vce0: 1e3,
  vf0: 1e3,
  rce: 1e3,
  rf: 1e3,
  rdsOn: 1e3,
  eon: 1e3,
  eoff: 1e3,
  err: 1e3,
  referenceVoltage: 1e5,
  referenceCurrent: 1e6,
};

/**
 * Least reference voltage and current (volts, amperes): datasheets state their switching energies
 * at hundreds of volts and amperes; a reference near zero would scale the energies past any finite
 * number.
 */
const REFERENCE_MINIMUM = 1e-3;

/** Internal: validates a device and an operating point; returns the options with defaults. */
export function assertLossInputs(
  device: unknown,
  options: LossOperatingPoint,
): Required<LossOperatingPoint> {
  if (typeof device !== 'object' || device === null) {
    throw new ParameterTypeError('device', "an object { kind: 'igbt' | 'mosfet', ... }", device);
  }
  const d = device as Record<string, unknown>;
  assertOneOf('device.kind', d.kind, ['igbt', 'mosfet'] as const);
  const values = d.kind === 'igbt' ? ['vce0', 'rce', 'vf0', 'rf'] : ['rdsOn'];
  for (const field of [...values, 'eon', 'eoff', 'err']) {
    assertNumberInRange(`device.${field}`, d[field], { min: 0, max: DEVICE_BOUNDS[field] });
  }
  for (const field of ['referenceVoltage', 'referenceCurrent']) {
    assertNumberInRange(`device.${field}`, d[field], {
      min: REFERENCE_MINIMUM,
      max: DEVICE_BOUNDS[field],
    });
  }
  const {
    vdc,
    ma,
    peakCurrent,
    currentAngle = 0,
    switchingFrequency,
    topology = 'three-phase',
    zeroSequence = 'none',
  } = options;
  assertNumberInRange('vdc', vdc, { min: 0, minExclusive: true });
  assertNumberInRange('ma', ma, { min: 0, max: 4 });
  assertNumberInRange('peakCurrent', peakCurrent, { min: 0 });
  assertNumberInRange('currentAngle', currentAngle, { min: -Math.PI, max: Math.PI });
  assertNumberInRange('switchingFrequency', switchingFrequency, {
    min: 0,
    minExclusive: true,
    max: 1e8,
  });
  assertOneOf('topology', topology, ['h-bridge', 'three-phase'] as const);
  assertOneOf('zeroSequence', zeroSequence, LOSS_ZERO_SEQUENCES);
  return {
    vdc,
    ma,
    peakCurrent,
    currentAngle,
    switchingFrequency,
    topology,
    zeroSequence,
  };
}
