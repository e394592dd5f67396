export * from './spaceVectorTypes.js';
export * from './spaceVectorLimits.js';
export * from './spaceVector.js';
export * from './spaceVectorSequence.js';
export * from './overmodulationSetting.js';
export * from './overmodulatedReference.js';
export * from './spaceVectorIndices.js';
// Listed, not `export *`: spaceVectorLegs is internal (the design report's).
export {
  MAX_SPACE_VECTOR_PERIODS,
  SPACE_VECTOR_SAMPLINGS,
  spaceVectorWaveforms,
  type SpaceVectorSampling,
  type SpaceVectorWaveformOptions,
  type SpaceVectorWaveforms,
} from './spaceVectorWaveforms.js';
export * from './overmodulationGainCurve.js';
