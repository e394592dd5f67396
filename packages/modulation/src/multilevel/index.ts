export * from './MultilevelTypes.js';
export * from './carrier/assertMultilevelCarrierOptions.js';
export * from './carrier/multilevelCarrier.js';
