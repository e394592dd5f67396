export * from './RlLoad.js';
export * from './assertRlLoad.js';
export * from './rlSteadyState.js';
export * from './rlCurrentAt.js';
export * from './rlCurrentSeries.js';
export * from './harmonicLoadCurrent.js';
export * from './MotorFigures.js';
