import type { IgbtDevice } from './lossTypes.js';

/**
 * An invented IGBT with its diode (datasheet-like values, not from any real part): the starting
 * values of the dashboard's loss form and the device of the examples, tests and benchmarks.
 * Volts, ohms, joules at 600 V and 100 A.
 */
export const EXAMPLE_IGBT: Readonly<IgbtDevice> = {
  kind: 'igbt',
  vce0: 0.9,
  rce: 0.012,
  vf0: 1.05,
  rf: 0.009,
  eon: 2.1e-3,
  eoff: 2.6e-3,
  err: 1.3e-3,
  referenceVoltage: 600,
  referenceCurrent: 100,
};
