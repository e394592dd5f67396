import type { InverterDesign } from '../design/InverterDesign.js';

/**
 * An invented grid-tied design for the tests: a 400 V, 50 Hz grid fed from 700 V at 10 kHz
 * (mf 200) through an LCL (L1 2 mH, C 10 µF with 2 Ω damping, l2 0.5 mH, grid 0.05 Ω and
 * 0.2 mH), a 1 kHz control bandwidth.
 */
export const GRID_TIED_DESIGN: InverterDesign = {
  vdc: 700,
  fundamentalFrequency: 50,
  carrierFrequency: 10_000,
  modulation: { method: 'three-phase', ma: 1, zeroSequence: 'third-harmonic' },
  filter: { l: 2e-3, c: 10e-6, rDamping: 2 },
  grid: { lineVoltage: 400, phase: -0.1, r: 0.05, l: 0.2e-3, l2: 0.5e-3, controlBandwidth: 1000 },
};
