export * from './ZeroSequence.js';
export * from './zeroSequenceOffset.js';
export * from './threePhaseReference.js';
// Listed, not `export *`: threePhaseLegs is internal (the design report's).
export { threePhase, type ThreePhaseOptions, type ThreePhaseWaveforms } from './threePhase.js';
export * from './invertsCarrier.js';
export * from './reducedCommonModeRange.js';
