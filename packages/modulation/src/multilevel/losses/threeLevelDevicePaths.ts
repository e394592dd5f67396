/**
 * Internal: which positions of a three-level leg conduct and commutate, by state and current sign
 * (current i > 0 out of the leg). Positions: S1…S4 top to bottom, each a transistor with its
 * anti-parallel diode (D1…D4); D5 (midpoint → between S1 and S2) and D6 (between S3 and S4 →
 * midpoint), the NPC clamp diodes. States: +1 (top level, +vdc/2), 0 (midpoint), −1 (bottom).
 *
 * NPC (A. Nabae, I. Takahashi, H. Akagi, IEEE Trans. Ind. Appl., 1981; the paths of common
 * practice):
 * - conduction: +1: i > 0 S1, S2; i < 0 D1, D2. 0: i > 0 D5, S2; i < 0 S3, D6.
 *   −1: i > 0 D3, D4; i < 0 S3, S4.
 * - commutation between +1 and 0: i > 0 S1 with D5 (S1 turns on entering +1, D5 recovers);
 *   i < 0 S3 with D1 (S3 turns on entering 0, D1 recovers).
 * - between 0 and −1: i > 0 S2 with D4 (S2 turns on entering 0, D4 recovers); i < 0 S4 with D6
 *   (S4 turns on entering −1, D6 recovers).
 *
 * T-type (S1 to the positive rail, S4 to the negative rail, S2/S3 a common-emitter pair from the
 * midpoint to the output, S2 on the midpoint's side; M. Schweizer and J. W. Kolar, IEEE Trans.
 * Power Electronics, 2013, from memory):
 * - conduction: +1: i > 0 S1; i < 0 D1. 0: i > 0 S2, D3; i < 0 S3, D2. −1: i > 0 D4; i < 0 S4.
 * - between +1 and 0: i > 0 S1 with D3 (S1 turns on entering +1, D3 recovers); i < 0 S3 with D1
 *   (S3 turns on entering 0, D1 recovers).
 * - between 0 and −1: i > 0 S2 with D4; i < 0 S4 with D2 (S4 turns on entering −1, D2 recovers).
 *
 * Every commutation is between a transistor and a diode across half the DC link (vdc/2), in both
 * legs; the T-type outer positions block the whole link only while the opposite outer level is
 * on, which sets their voltage rating, not the commutated voltage.
 */
export type ThreeLevelPosition = 'S1' | 'S2' | 'S3' | 'S4' | 'D5' | 'D6';

/** A conducting part: the transistor or the diode of a position. */
export interface ConductingPart {
  position: ThreeLevelPosition;
  part: 'transistor' | 'diode';
}

/**
 * One commutation: the transistor that switches, the state in which it conducts, and the position
 * whose diode recovers when the transistor turns on (`S1` → D1, …; `D5`/`D6` the clamps).
 */
export interface Commutation {
  transistor: ThreeLevelPosition;
  /** The transistor turns on when the leg enters this state, off when it leaves it. */
  onIn: -1 | 0 | 1;
  diode: ThreeLevelPosition;
}

const T = (position: ThreeLevelPosition): ConductingPart => ({ position, part: 'transistor' });
const D = (position: ThreeLevelPosition): ConductingPart => ({ position, part: 'diode' });

/** Conducting parts by topology, state (+1, 0, −1 → index 0, 1, 2) and sign (i > 0, i < 0). */
export const THREE_LEVEL_CONDUCTION: Readonly<
  Record<
    'npc' | 't-type',
    readonly (readonly [readonly ConductingPart[], readonly ConductingPart[]])[]
  >
> = {
  npc: [
    [
      [T('S1'), T('S2')],
      [D('S1'), D('S2')],
    ],
    [
      [D('D5'), T('S2')],
      [T('S3'), D('D6')],
    ],
    [
      [D('S3'), D('S4')],
      [T('S3'), T('S4')],
    ],
  ],
  't-type': [
    [[T('S1')], [D('S1')]],
    [
      [T('S2'), D('S3')],
      [T('S3'), D('S2')],
    ],
    [[D('S4')], [T('S4')]],
  ],
};

/** Commutations by topology, pair (between +1 and 0 → 0, between 0 and −1 → 1) and sign. */
export const THREE_LEVEL_COMMUTATION: Readonly<
  Record<'npc' | 't-type', readonly (readonly [Commutation, Commutation])[]>
> = {
  npc: [
    [
      { transistor: 'S1', onIn: 1, diode: 'D5' },
      { transistor: 'S3', onIn: 0, diode: 'S1' },
    ],
    [
      { transistor: 'S2', onIn: 0, diode: 'S4' },
      { transistor: 'S4', onIn: -1, diode: 'D6' },
    ],
  ],
  't-type': [
    [
      { transistor: 'S1', onIn: 1, diode: 'S3' },
      { transistor: 'S3', onIn: 0, diode: 'S1' },
    ],
    [
      { transistor: 'S2', onIn: 0, diode: 'S4' },
      { transistor: 'S4', onIn: -1, diode: 'S2' },
    ],
  ],
};
