import type { Comparator, ComparatorSum } from './multilevelDoubleFourier.js';

/**
 * A multilevel leg written as comparators, from the definitions of the carrier arrangements
 * (G. Carrara, S. Gardella, M. Marchesoni, R. Salutari, G. Sciutto, IEEE Trans. Power
 * Electronics, 1992; B. P. McGrath and D. G. Holmes, IEEE Trans. Industrial Electronics, 2002;
 * Holmes and Lipo, 2003, ch. 11), written here without the library:
 * - level-shifted: `bands` carriers stacked in equal bands over ±1; band k (0 lowest) spans
 *   [lo, lo + 2/bands], lo = −1 + 2k/bands, so its carrier lo + (c + 1)/bands meets r where the
 *   unit triangle c meets bands·(r − lo) − 1; PD all in phase, POD the bands below zero in
 *   opposition, APOD alternate bands in opposition with the one just above zero in phase; a
 *   carrier in opposition is the triangle delayed by half a carrier period (π);
 * - phase-shifted flying capacitor: `cells` comparators of the whole reference with carriers
 *   delayed by k·2π/cells;
 * - phase-shifted cascaded: per cell a unipolar H-bridge (+r and −r against one carrier),
 *   carriers delayed by k·π/cells.
 */
export type Arrangement = 'pd' | 'pod' | 'apod';

/** The reference of one phase and the angles where it has a kink. */
export interface PhaseReference {
  value: (y: number) => number;
  kinks: readonly number[];
}

/**
 * Phase p (0, 1, 2 for a, b, c) of a sine reference ma·sin(y − p·2π/3) with a zero sequence:
 * third harmonic +ma/6·sin 3y (Houldsworth and Grant, 1984) or min-max −(max + min)/2 of the
 * three sines (Holmes and Lipo, 2003, ch. 5); min-max has kinks every π/6 at most.
 */
export function phaseReference(
  ma: number,
  phase: number,
  zeroSequence: 'none' | 'third-harmonic' | 'min-max' = 'none',
): PhaseReference {
  const sine = (y: number, k: number): number => ma * Math.sin(y - (k * 2 * Math.PI) / 3);
  const zero = (y: number): number => {
    if (zeroSequence === 'none') return 0;
    if (zeroSequence === 'third-harmonic') return (ma / 6) * Math.sin(3 * y);
    const s = [sine(y, 0), sine(y, 1), sine(y, 2)];
    return -(Math.max(...s) + Math.min(...s)) / 2;
  };
  return {
    value: (y) => sine(y, phase) + zero(y),
    kinks:
      zeroSequence === 'min-max' ? Array.from({ length: 12 }, (_, k) => (k * Math.PI) / 6) : [],
  };
}

/** −reference, for a full bridge's second leg or an H-bridge's right leg. */
export function negated(reference: PhaseReference): PhaseReference {
  return { value: (y) => -reference.value(y), kinks: reference.kinks };
}

/** A level-shifted leg of `bands` bands from `bottom` volts, each band adding `step` volts. */
export function levelShiftedLeg(
  reference: PhaseReference,
  arrangement: Arrangement,
  bands: number,
  bottom: number,
  step: number,
  carrierPhase = 0,
): ComparatorSum {
  const comparators: Comparator[] = [];
  for (let k = 0; k < bands; k++) {
    const lo = -1 + (2 * k) / bands;
    // Index of the band counted from zero: 0 just above, −1 just below.
    const fromZero = k - bands / 2;
    const opposed =
      arrangement === 'pd' ? false : arrangement === 'pod' ? fromZero < 0 : fromZero % 2 !== 0;
    comparators.push({
      reference: (y) => bands * (reference.value(y) - lo) - 1,
      kinks: reference.kinks,
      delay: carrierPhase + (opposed ? Math.PI : 0),
      weight: step,
    });
  }
  return { offset: bottom, comparators };
}

/** A phase-shifted flying-capacitor leg of `cells` cells over a DC link `vdc`. */
export function flyingCapacitorLeg(
  reference: PhaseReference,
  cells: number,
  vdc: number,
  carrierPhase = 0,
): ComparatorSum {
  return {
    offset: -vdc / 2,
    comparators: Array.from({ length: cells }, (_, k) => ({
      reference: reference.value,
      kinks: reference.kinks,
      delay: carrierPhase + (k * 2 * Math.PI) / cells,
      weight: vdc / cells,
    })),
  };
}

/** A phase-shifted cascaded string of `cells` unipolar H-bridges, each on `vdc`. */
export function cascadedPhaseShiftedString(
  reference: PhaseReference,
  cells: number,
  vdc: number,
  carrierPhase = 0,
): ComparatorSum {
  const comparators: Comparator[] = [];
  for (let k = 0; k < cells; k++) {
    const delay = carrierPhase + (k * Math.PI) / cells;
    comparators.push({ reference: reference.value, kinks: reference.kinks, delay, weight: vdc });
    comparators.push({
      reference: (y) => -reference.value(y),
      kinks: reference.kinks,
      delay,
      weight: -vdc,
    });
  }
  return { offset: 0, comparators };
}

/** a − b of two comparator sums (a line-to-line voltage, or a full bridge's output). */
export function difference(a: ComparatorSum, b: ComparatorSum): ComparatorSum {
  return {
    offset: a.offset - b.offset,
    comparators: [...a.comparators, ...b.comparators.map((c) => ({ ...c, weight: -c.weight }))],
  };
}
