import { ParameterTypeError } from '../validation/errors.js';
import { assertNumberInRange, assertOneOf } from '../validation/assertions.js';
import { LOSS_DEVICE_BOUNDS } from './lossDeviceBounds.js';
import type { SemiconductorDevice } from './lossTypes.js';

/**
 * Internal: asserts a loss-model device (its kind and each datasheet value within
 * {@link LOSS_DEVICE_BOUNDS}); errors name the field as `device.vce0`, … (the caller adds any
 * prefix of its own with withFieldPrefix).
 * @throws ParameterTypeError / ParameterRangeError naming the field and its allowed range
 */
export function assertSemiconductorDevice(device: unknown): asserts device is SemiconductorDevice {
  if (typeof device !== 'object' || device === null) {
    throw new ParameterTypeError('device', "an object { kind: 'igbt' | 'mosfet', ... }", device);
  }
  const d = device as Record<string, unknown>;
  assertOneOf('device.kind', d.kind, ['igbt', 'mosfet'] as const);
  const values = d.kind === 'igbt' ? (['vce0', 'rce', 'vf0', 'rf'] as const) : (['rdsOn'] as const);
  for (const field of [
    ...values,
    'eon',
    'eoff',
    'err',
    'referenceVoltage',
    'referenceCurrent',
  ] as const) {
    assertNumberInRange(`device.${field}`, d[field], LOSS_DEVICE_BOUNDS[field]);
  }
}
