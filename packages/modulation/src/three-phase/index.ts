export * from './ZeroSequence.js';
export * from './zeroSequenceOffset.js';
export * from './threePhaseReference.js';
export * from './threePhase.js';
export * from './invertsCarrier.js';
export * from './reducedCommonModeRange.js';
