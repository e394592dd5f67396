import type { InverterDesign } from './InverterDesign.js';

/**
 * The highest order a design's spectra show by default: past the third carrier group so its
 * sidebands show (3·mf + 20), or for a stored pattern well past the eliminated orders
 * (2·highest + 21); at least 99 (the limit table's 50 and some), at most 5000.
 */
export function defaultSpectrumOrder(design: InverterDesign): number {
  const { modulation, carrierFrequency, fundamentalFrequency } = design;
  if (
    modulation.method === 'selective-harmonic-elimination' ||
    modulation.method === 'optimal-pattern'
  ) {
    const eliminate =
      modulation.method === 'selective-harmonic-elimination' ? (modulation.eliminate ?? []) : [];
    return Math.min(5000, Math.max(99, 2 * Math.max(0, ...eliminate) + 21));
  }
  const ratio = Math.round((carrierFrequency ?? 0) / fundamentalFrequency);
  return Math.min(5000, Math.max(99, 3 * ratio + 20));
}
