export * from './triangleCarrier.js';
export * from './ReferenceSignal.js';
export * from './CarrierSampling.js';
export * from './compareWithCarrier.js';
export * from './assertCarrierOptions.js';
export * from './sineReference.js';
export * from './sineTriangle.js';
export * from './CarrierSpan.js';
