export * from './Waveform.js';
export * from './assertWaveform.js';
export * from './waveformFromTransitions.js';
export * from './combineWaveforms.js';
export * from './subtractWaveforms.js';
export * from './waveformMeanSquare.js';
export * from './waveformValueAt.js';
