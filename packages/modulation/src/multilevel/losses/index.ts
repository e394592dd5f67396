export * from './threeLevelLosses.js';
