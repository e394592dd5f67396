export * from './errors.js';
export * from './assertions.js';
export * from './withFieldPrefix.js';
