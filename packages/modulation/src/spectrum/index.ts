export * from './Harmonic.js';
export * from './harmonics.js';
export * from './thd.js';
export * from './wthd.js';
