export * from './MultilevelPhaseCurrents.js';
export * from './neutralPointCurrentFigures.js';
export * from './flyingCapacitorCharge.js';
export * from './deviceSwitchingFrequencies.js';
export * from './cascadedCellPower.js';
