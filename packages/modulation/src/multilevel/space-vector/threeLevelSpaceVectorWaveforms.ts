import { EDGE_EPSILON, TAU } from '../../math.js';
import { assertNumberInRange, assertOneOf } from '../../validation/assertions.js';
import { ParameterTypeError } from '../../validation/errors.js';
import { combineWaveforms } from '../../waveform/combineWaveforms.js';
import type { Waveform } from '../../waveform/Waveform.js';
import {
  waveformFromTransitions,
  type Transition,
} from '../../waveform/waveformFromTransitions.js';
import type { MultilevelLeg, MultilevelSwitch, MultilevelWaveforms } from '../MultilevelTypes.js';
import { threeLevelSchedule } from './threeLevelSchedule.js';
import type { ThreeLevelModulationOptions } from './threeLevelSpaceVectorTypes.js';

/** The three-level legs the space-vector modulator drives. */
export type ThreeLevelSpaceVectorTopology = 'npc' | 't-type';

/** The topologies, in the order the API and the dashboard list them. */
export const THREE_LEVEL_SPACE_VECTOR_TOPOLOGIES: readonly ThreeLevelSpaceVectorTopology[] = [
  'npc',
  't-type',
];

/** Options of {@link threeLevelSpaceVectorWaveforms}. Give exactly one of `m` and `ma`. */
export interface ThreeLevelSpaceVectorWaveformOptions extends ThreeLevelModulationOptions {
  /** The whole DC link, volts, > 0; each leg takes −vdc/2, 0 or +vdc/2 to the DC midpoint. */
  vdc: number;
  /** @default 'npc' */
  topology?: ThreeLevelSpaceVectorTopology;
}

const LEG_NAMES = ['leg a', 'leg b', 'leg c'] as const;

/**
 * Three-phase three-level space-vector PWM, regular sampled, as exact waveforms of each leg and
 * each switch over one fundamental period (edges from the dwell times; no time sampling).
 *
 * Reference: phase a (m·vdc/√3)·sin θ, b and c lagging by 2π/3 and 4π/3, so its space vector is
 * at θ − π/2 (as for the two-level {@link spaceVectorWaveforms}). Switching period k spans
 * [k, k + 1)·2π/N with N = frequencyRatio, a whole number. `symmetric` sampling takes the
 * reference at the period's start for the whole symmetric sequence of
 * {@link threeLevelSpaceVectorSequence}; `asymmetric` takes a second sample at the middle for
 * the second half (S. R. Bowes, Proc. IEE, 1975, regular sampling). Every (half) period's
 * volt-seconds equal the sampled reference's (nearest-three-vector dwell times; Celanovic and
 * Boroyevich, IEEE Trans. Power Electron., 2000). With `smallVectorSplit` 0.5 the legs equal
 * level-shifted PD carrier PWM, regular sampled at the carrier peaks, with the zero sequence of
 * B. P. McGrath, D. G. Holmes and T. A. Lipo, IEEE Trans. Power Electron., 2003. Regular
 * sampling delays the fundamental by half a switching period, π/N.
 *
 * Switches, top to bottom, as {@link multilevelCarrier} names them: `npc` S1 on at +vdc/2, S2 at
 * +vdc/2 and 0, S3 at 0 and −vdc/2, S4 at −vdc/2 (A. Nabae, I. Takahashi, H. Akagi, 1981);
 * `t-type` the same gates (S2/S3 the bidirectional pair to the midpoint, both on at 0; S2 stays on
 * at +vdc/2 and S3 at −vdc/2, blocking nothing, so S1/S3 and S2/S4 commutate as pairs: M.
 * Schweizer and J. W. Kolar, IEEE Trans. Power Electron., 2013, from memory). No dead time.
 *
 * @returns three legs (`leg a`, `leg b`, `leg c`), `phaseCount` 3, `levels` 3
 * @throws ParameterRangeError naming `m`, `ma`, `vdc`, `frequencyRatio`, `sampling`,
 *   `smallVectorSplit` or `topology` and the allowed range
 */
export function threeLevelSpaceVectorWaveforms(
  options: ThreeLevelSpaceVectorWaveformOptions,
): MultilevelWaveforms {
  if (typeof options !== 'object' || options === null) {
    throw new ParameterTypeError('options', 'an object', options);
  }
  const { vdc, topology = 'npc' } = options;
  assertNumberInRange('vdc', vdc, { min: 0, minExclusive: true });
  assertOneOf('topology', topology, THREE_LEVEL_SPACE_VECTOR_TOPOLOGIES);
  const { periods } = threeLevelSchedule(options);
  const transitions: Transition[][] = [[], [], []];
  const width = TAU / periods.length;
  periods.forEach(({ states, durations }, k) => {
    let elapsed = 0;
    states.forEach((state, i) => {
      const duration = durations[i] as number;
      // A segment too short to be an edge is left out rather than pushed: pushed, rounding
      // could place it a hair after the next segment's transition, where it would win.
      if (duration * width >= EDGE_EPSILON) {
        for (let leg = 0; leg < 3; leg++) {
          const letter = state[leg];
          const level = letter === 'P' ? vdc / 2 : letter === 'N' ? -vdc / 2 : 0;
          (transitions[leg] as Transition[]).push({ angle: (k + elapsed) * width, level });
        }
      }
      elapsed += duration;
    });
  });
  const legs = transitions.map((legTransitions, leg): MultilevelLeg => {
    const output = waveformFromTransitions(legTransitions);
    return {
      name: LEG_NAMES[leg] as string,
      output,
      switches: legSwitches(output),
      cells: [],
    };
  });
  return { phaseCount: 3, levels: 3, legs };
}

/** Gate signals (1 on, 0 off) of a three-level leg's four switches from its output voltage. */
function legSwitches(output: Waveform): MultilevelSwitch[] {
  const gate = (on: (level: number) => boolean): Waveform =>
    combineWaveforms([output], ([level = 0]) => (on(level) ? 1 : 0));
  return [
    { name: 'S1', on: gate((level) => level > 0) },
    { name: 'S2', on: gate((level) => level >= 0) },
    { name: 'S3', on: gate((level) => level <= 0) },
    { name: 'S4', on: gate((level) => level < 0) },
  ];
}
