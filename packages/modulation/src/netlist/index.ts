export * from './netlistTypes.js';
export * from './spiceNetlistSources.js';
export * from './timerTableToSpiceNetlist.js';
