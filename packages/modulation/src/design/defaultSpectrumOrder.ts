import type { InverterDesign } from './InverterDesign.js';

/**
 * The highest order a design's spectra show by default: past the third carrier group so its
 * sidebands show (3·mf + 20; 3·(levels − 1)·mf + 20 for phase-shifted multilevel carriers,
 * whose output's first group sits at (levels − 1)·mf), or for a stored pattern well past the
 * eliminated orders (2·highest + 21); at least 99 (the limit table's 50 and some), at most 5000.
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
  // Phase-shifted carriers move the output's first carrier group to (levels − 1)·mf (N flying-
  // capacitor cells, or a cascaded string's 2·cells): the third group is counted from there.
  const groupSpacing =
    modulation.method === 'multilevel-carrier' && modulation.carriers === 'phase-shifted'
      ? modulation.levels - 1
      : 1;
  return Math.min(5000, Math.max(99, 3 * groupSpacing * ratio + 20));
}
