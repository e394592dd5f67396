export * from './LcFilterOptions.js';
export * from './assertLcFilter.js';
export * from './lcFilter.js';
export * from './lcFilterResponse.js';
export * from './filteredSpectrum.js';
export * from './sizeFilterInductance.js';
export * from './filterInductanceForTarget.js';
export * from './outputNetworkResponse.js';
