import { clamp } from '../math.js';
import { levelShiftedBandDelay } from '../multilevel/carrier/levelShiftedBandDelay.js';
import { threePhaseReference, type PhaseIndex } from '../three-phase/threePhaseReference.js';
import type { MultilevelTimerTableInputs } from './multilevelTimerTableInputs.js';

/** One carrier of the modulator, and so one up-down counter. */
export interface PlannedCounter {
  name: string;
  /** Delay behind the in-phase carrier, carrier radians. */
  delay: number;
}

/** One complementary pair: which carrier it compares with and the duty of its main switch. */
export interface PlannedPair {
  main: string;
  complement: string;
  counter: number;
  description: string;
  /** Duty of the main switch for a held reference r (units of the leg's half range), in [0, 1]. */
  duty: (r: number) => number;
}

/** One leg (or cascaded string): its reference and its pairs. */
export interface PlannedLeg {
  name: string;
  /** The leg's reference at θ (rad), normalised so that ±1 spans the leg's output range. */
  reference: (theta: number) => number;
  pairs: PlannedPair[];
}

/**
 * Internal to multilevelTimerTable: the carriers (counters) and, per leg, the complementary pairs
 * each carrier drives, as `multilevelCarrier` compares them (Holmes and Lipo, 2003, ch. 11;
 * B. P. McGrath and D. G. Holmes, IEEE Trans. Ind. Electron., 2002):
 * - level-shifted (PD, POD, APOD): levels − 1 carriers, `carrier 1` the bottom band; band b
 *   spans [−1 + 2b/(levels − 1), −1 + 2(b + 1)/(levels − 1)] and the pair it drives is on (main
 *   switch) while the reference is above the band's carrier: duty = the reference's place in the
 *   band, clamped to [0, 1];
 * - phase-shifted: one full-range carrier per cell, duty (1 + r)/2 (cascaded right legs compare
 *   −r).
 *
 * Complementary pairs (Holmes and Lipo, 2003, ch. 11; common practice): NPC S1/S3 (upper band)
 * and S2/S4 (lower band); T-type the same S1/S3 and S2/S4 (the usual gating of a T-type leg, as
 * `multilevelCarrier` gates it: each middle switch stays on while the outer switch of its own
 * side is on, which blocks nothing, so one compare value drives each pair);
 * flying capacitor each cell's upper and lower switch; cascaded each half-bridge's upper and lower
 * switch (a level-shifted cell's right leg: main switch the lower one, on while the reference is
 * above the k-th band below zero, as `multilevelCarrier` assigns the bands, cell 1 innermost).
 */
export function multilevelTimerPlan(inputs: MultilevelTimerTableInputs): {
  counters: PlannedCounter[];
  legs: PlannedLeg[];
} {
  const { modulation } = inputs;
  const { topology, levels, carriers, phaseCount, ma } = modulation;
  const zeroSequence = modulation.zeroSequence ?? 'none';
  const string = topology === 'cascaded-h-bridge';
  const legReferences: { name: string; reference: (theta: number) => number }[] =
    phaseCount === 3
      ? ([0, 1, 2] as const).map((k: PhaseIndex) => {
          const signal = threePhaseReference(k, { ma, zeroSequence });
          return { name: `${string ? 'string' : 'leg'} ${'abc'[k]}`, reference: signal.value };
        })
      : string
        ? [{ name: 'string a', reference: (theta) => ma * Math.sin(theta) }]
        : [
            { name: 'leg a', reference: (theta) => ma * Math.sin(theta) },
            { name: 'leg b', reference: (theta) => -ma * Math.sin(theta) },
          ];
  const bands = levels - 1;
  if (carriers === 'phase-shifted') {
    const cells = string ? bands / 2 : bands;
    const counters = Array.from({ length: cells }, (_, k) => ({
      name: `cell ${k + 1}`,
      // Flying capacitor: 2π/(levels − 1) apart; cascaded (unipolar cells): π/cells apart, so
      // the phase voltage's first carrier group sits at 2·cells·mf (McGrath and Holmes, 2002).
      delay: string ? (k * Math.PI) / cells : (k * 2 * Math.PI) / cells,
    }));
    const full = (r: number): number => clamp((1 + r) / 2, 0, 1);
    const pairsOf = (): PlannedPair[] =>
      counters.flatMap((_, k): PlannedPair[] =>
        string
          ? [
              halfBridge(`cell ${k + 1} left`, k, 'the reference', full),
              halfBridge(`cell ${k + 1} right`, k, 'the negated reference', (r) => full(-r)),
            ]
          : [halfBridge(`cell ${k + 1}`, k, 'the reference', full)],
      );
    return { counters, legs: legReferences.map((leg) => ({ ...leg, pairs: pairsOf() })) };
  }
  const counters = Array.from({ length: bands }, (_, b) => ({
    name: `carrier ${b + 1}`,
    delay: levelShiftedBandDelay(carriers, b, bands),
  }));
  const inBand =
    (b: number) =>
    (r: number): number =>
      clamp(((r + 1) * bands) / 2 - b, 0, 1);
  const describe = (b: number): string =>
    `band ${b + 1} of ${bands}, reference ${fmt(-1 + (2 * b) / bands)} to ${fmt(-1 + (2 * (b + 1)) / bands)}`;
  const pairsOf = (): PlannedPair[] => {
    if (topology === 'npc' || topology === 't-type') {
      return [
        { main: 'S1', complement: 'S3', counter: 1, description: describe(1), duty: inBand(1) },
        { main: 'S2', complement: 'S4', counter: 0, description: describe(0), duty: inBand(0) },
      ];
    }
    if (topology === 'flying-capacitor') {
      return counters.map((_, b) => halfBridge(`cell ${b + 1}`, b, describe(b), inBand(b)));
    }
    // Level-shifted cascaded: cell k's left leg takes the k-th band above zero, its right leg
    // the k-th band below zero (its lower switch on while the reference is above that carrier).
    const cells = bands / 2;
    return Array.from({ length: cells }, (_, k): PlannedPair[] => {
      const above = cells + k;
      const below = cells - 1 - k;
      return [
        halfBridge(`cell ${k + 1} left`, above, describe(above), inBand(above)),
        {
          main: `cell ${k + 1} right lower`,
          complement: `cell ${k + 1} right upper`,
          counter: below,
          description: describe(below),
          duty: inBand(below),
        },
      ];
    }).flat();
  };
  return { counters, legs: legReferences.map((leg) => ({ ...leg, pairs: pairsOf() })) };
}

function halfBridge(
  name: string,
  counter: number,
  description: string,
  duty: (r: number) => number,
): PlannedPair {
  return { main: `${name} upper`, complement: `${name} lower`, counter, description, duty };
}

function fmt(value: number): string {
  return String(Number(value.toPrecision(6)));
}
