import { ASYNCHRONOUS_METHODS } from './designCarrierSpan.js';
import type { InverterDesign } from './InverterDesign.js';

/**
 * The highest order a design's spectra show by default: past the third carrier group so its
 * sidebands show (3·mf + 20; 3·(levels − 1)·mf + 20 for phase-shifted multilevel carriers,
 * whose output's first group sits at (levels − 1)·mf), or for a stored pattern well past the
 * eliminated orders (2·highest + 21); at least 99 (the limit table's 50 and some), at most 5000.
 * A sine-triangle, three-phase or space-vector carrier that is no whole multiple of the
 * fundamental: ⌈mf⌉ + 10, at least 50 (its spectra hold q components an order).
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
  const exact = (carrierFrequency ?? 0) / fundamentalFrequency;
  // A ratio that is not whole (a span of q periods, q·maxOrder components a spectrum): the first
  // carrier group and its main sidebands, ⌈mf⌉ + 10, at least 50 (analyseDesignSpan bounds it
  // further by designSpanMaxOrder).
  if (
    ASYNCHRONOUS_METHODS.includes(modulation.method) &&
    Math.abs(exact - Math.round(exact)) > 1e-9 * exact
  )
    return Math.min(5000, Math.max(50, Math.ceil(exact) + 10));
  const ratio = Math.round(exact);
  // Phase-shifted carriers move the output's first carrier group to (levels − 1)·mf (N flying-
  // capacitor cells, or a cascaded string's 2·cells): the third group is counted from there.
  const groupSpacing =
    modulation.method === 'multilevel-carrier' && modulation.carriers === 'phase-shifted'
      ? modulation.levels - 1
      : 1;
  return Math.min(5000, Math.max(99, 3 * groupSpacing * ratio + 20));
}
