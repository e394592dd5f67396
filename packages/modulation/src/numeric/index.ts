export * from './findBracketedRoot.js';
export * from './mulberry32.js';
export * from './bestRationalApproximation.js';
