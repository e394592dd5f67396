export * from './spaceVectorTypes.js';
export * from './spaceVectorLimits.js';
export * from './spaceVector.js';
export * from './spaceVectorSequence.js';
export * from './overmodulationSetting.js';
export * from './overmodulatedReference.js';
export * from './spaceVectorWaveforms.js';
export * from './overmodulationGainCurve.js';
