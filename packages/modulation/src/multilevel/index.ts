export * from './MultilevelTypes.js';
export * from './carrier/assertMultilevelCarrierOptions.js';
export * from './carrier/multilevelCarrier.js';
export * from './balance/index.js';
export * from './cascaded-pattern/CascadedCellPattern.js';
export * from './cascaded-pattern/cascadedPatternWaveform.js';
export * from './cascaded-pattern/solveCascadedPattern.js';
export * from './space-vector/index.js';
