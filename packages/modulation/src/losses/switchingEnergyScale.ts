import type { SemiconductorDevice } from './lossTypes.js';

/**
 * Internal: the factor that scales datasheet switching energies to a bus voltage and a
 * current magnitude, (vdc/Vref)·(|i|/Iref): linear in both (common practice; the form
 * used by Bierhoff and Fuchs, PESC 2004, from memory).
 */
export function switchingEnergyScale(
  device: SemiconductorDevice,
  vdc: number,
  current: number,
): number {
  return (vdc / device.referenceVoltage) * (Math.abs(current) / device.referenceCurrent);
}
