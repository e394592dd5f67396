/**
 * @pulsewright/modulation: exact modulation math for inverters.
 *
 * Conventions: angles in radians over one fundamental period [0, 2π); amplitudes in peak volts;
 * ratios (THD, WTHD) as fractions. No I/O, no clocks, no mutable module state.
 */
export * from './math.js';
export * from './validation/index.js';
export * from './waveform/index.js';
export * from './spectrum/index.js';
export * from './numeric/index.js';
export * from './carrier/index.js';
export * from './three-phase/index.js';
export * from './sweep/index.js';
export * from './load/index.js';
export * from './space-vector/index.js';
export * from './filter/index.js';
export * from './she/index.js';
export * from './firmware/index.js';
export * from './programmed-pattern/index.js';
export * from './netlist/index.js';
export * from './losses/index.js';
export * from './capture/index.js';
export * from './limits/index.js';
export * from './design/index.js';
export * from './multilevel/index.js';
