export * from './FftWindowName.js';
export * from './fftWindow.js';
export * from './fftSpectrum.js';
export * from './compareCapture.js';
