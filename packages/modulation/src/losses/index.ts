export * from './lossTypes.js';
export * from './semiconductorLosses.js';
export * from './legLossesFromSamples.js';
export * from './semiconductorLossesByIntegration.js';
export * from './rippleInductance.js';
export * from './switchingFrequencyTradeoff.js';
export * from './lossesByPowerFactor.js';
export * from './exampleIgbt.js';
