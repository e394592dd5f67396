import { assertNumberInRange, assertOneOf } from '../validation/assertions.js';
import { assertSemiconductorDevice } from './assertSemiconductorDevice.js';
import { LOSS_ZERO_SEQUENCES, type LossOperatingPoint } from './lossTypes.js';

/** Internal: validates a device and an operating point; returns the options with defaults. */
export function assertLossInputs(
  device: unknown,
  options: LossOperatingPoint,
): Required<LossOperatingPoint> {
  assertSemiconductorDevice(device);
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
