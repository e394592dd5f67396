import type { Harmonic } from '../spectrum/Harmonic.js';
import { assertNumberInRange } from '../validation/assertions.js';

/** One harmonic group of {@link harmonicGroups}. */
export interface HarmonicGroup {
  /** The harmonic order h the group is named by, 1..maxOrder. */
  order: number;
  /** The group's amplitude √(Σ share·A²), peak amperes or volts (its rms times √2). */
  amplitude: number;
  /** The component exactly at order h, peak (0 when the spectrum holds none). */
  harmonicAmplitude: number;
  /** Its phase, radians (0 without one), for the checks that read it as a harmonic. */
  phase: number;
  /**
   * The inter- and sub-harmonic components assigned to the group: order in fundamentals, peak
   * amplitude, and the share of its square counted (1 inside the group, ½ exactly midway).
   */
  grouped: { order: number; amplitude: number; share: number }[];
}

/**
 * The rule {@link harmonicGroups} applies, in words for the report and the dashboard.
 */
export const HARMONIC_GROUP_RULE =
  'Harmonic groups after IEC 61000-4-7 (recalled from memory; confirm with the standard and the utility): ' +
  'each component between two harmonic orders is assigned to the nearest one, a component exactly midway ' +
  'counts half its square in each, and the group is the root sum of squares; the limits are then checked ' +
  'on the groups. Components below half the fundamental belong to no group (the whole-waveform total counts them).';

/**
 * Groups a spectrum whose components lie at any order (a span's sub- and inter-harmonics, at n/q
 * of the fundamental) into harmonic groups, so that limits given by whole harmonic order can be
 * checked: IEC 61000-4-7's harmonic group (recalled from memory, without its 5 Hz bins: the
 * rule applied to the components the spectrum holds) assigns every component within half an
 * order of harmonic h to that harmonic, G_h² = Σ_{|k − h| < ½} A_k² + ½·Σ_{|k − h| = ½} A_k²,
 * the group's rms being G_h/√2 (Parseval: the components are orthogonal over the span). Groups
 * 1..maxOrder; order 1 is the fundamental's group. A spectrum of whole orders gives its own
 * amplitudes, nothing grouped.
 * @param spectrum - components, order in fundamentals (≥ 0), amplitude peak
 * @param options.maxOrder - the highest group, an integer ≥ 1
 * @throws ParameterRangeError naming `maxOrder`
 */
export function harmonicGroups(
  spectrum: readonly Harmonic[],
  options: { maxOrder: number },
): HarmonicGroup[] {
  const { maxOrder } = options;
  assertNumberInRange('maxOrder', maxOrder, { min: 1, integer: true });
  const groups: HarmonicGroup[] = Array.from({ length: maxOrder }, (_, k) => ({
    order: k + 1,
    amplitude: 0,
    harmonicAmplitude: 0,
    phase: 0,
    grouped: [],
  }));
  const squares = new Float64Array(maxOrder + 1);
  const add = (h: number, component: Harmonic, share: number): void => {
    const group = groups[h - 1];
    if (group === undefined) return;
    squares[h] = (squares[h] as number) + share * component.amplitude * component.amplitude;
    if (share === 1 && component.order === h) {
      group.harmonicAmplitude = component.amplitude;
      group.phase = component.phase;
    } else group.grouped.push({ order: component.order, amplitude: component.amplitude, share });
  };
  for (const component of spectrum) {
    const { order } = component;
    const below = Math.floor(order);
    const offset = order - below;
    if (offset === 0.5) {
      add(below, component, 0.5);
      add(below + 1, component, 0.5);
    } else add(offset < 0.5 ? below : below + 1, component, 1);
  }
  for (const group of groups) group.amplitude = Math.sqrt(squares[group.order] as number);
  return groups;
}
