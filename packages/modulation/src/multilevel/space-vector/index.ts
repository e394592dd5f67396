export * from './threeLevelSpaceVectorTypes.js';
export * from './threeLevelSpaceVector.js';
export * from './threeLevelSpaceVectorSequence.js';
export * from './threeLevelSpaceVectorWaveforms.js';
export * from './threeLevelNeutralPointCurrent.js';
export * from './threeLevelVectorDiagram.js';
export * from './threeLevelSpaceVectorTrajectory.js';
