export * from './voltageHarmonicLimits.js';
export * from './checkVoltageHarmonicLimits.js';
export * from './gridCurrentLimits.js';
export * from './checkGridCurrentLimits.js';
export * from './generationRowReason.js';
export * from './harmonicGroups.js';
