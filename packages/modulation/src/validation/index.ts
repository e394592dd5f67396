export * from './errors.js';
export * from './assertions.js';
