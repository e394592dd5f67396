export * from './SheKind.js';
export * from './sheWaveform.js';
export * from './solveShe.js';
export type { SheSolverSettings } from './sheOptions.js';
export * from './sheSweep.js';
export * from './assertSheSweepOptions.js';
export * from './optimalPulsePattern.js';
export * from './optimalPulseSweep.js';
export * from './assertOptimalPulseSweepOptions.js';
