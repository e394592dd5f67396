export * from './Harmonic.js';
export * from './harmonics.js';
export * from './thd.js';
export * from './wthd.js';
export * from './labelHarmonics.js';
export * from './carrierGroupOf.js';
