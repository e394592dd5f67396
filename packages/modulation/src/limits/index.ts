export * from './voltageHarmonicLimits.js';
export * from './checkVoltageHarmonicLimits.js';
