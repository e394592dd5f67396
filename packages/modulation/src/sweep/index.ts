export * from './sweepModulationIndex.js';
