export * from './findBracketedRoot.js';
