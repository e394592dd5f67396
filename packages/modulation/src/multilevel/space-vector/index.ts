export * from './threeLevelSpaceVectorTypes.js';
export * from './threeLevelSpaceVector.js';
export * from './threeLevelSpaceVectorSequence.js';
export * from './threeLevelSpaceVectorWaveforms.js';
