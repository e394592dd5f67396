import { harmonicPhasors, type HarmonicPhasors } from '../spectrum/harmonicPhasors.js';
import { mirroredPhasors } from '../spectrum/mirroredPhasors.js';
import { waveformMirror } from '../waveform/waveformSymmetry.js';
import type { ModulationVoltages, NamedVoltage } from './modulationVoltages.js';

/** The spectra of a design's voltages, each read once (see {@link designVoltagePhasors}). */
export interface DesignVoltagePhasors {
  /**
   * Phase k's voltage (a, b, c = 0, 1, 2; a single-phase bridge's output is phase 0), orders
   * 0..highestOrder (an integer ≤ maxOrder; a caller reading fewer orders of a three-phase bridge's
   * phase, as the report's phases b and c, spares combining the rest). @default maxOrder
   */
  phase(index: number, highestOrder?: number): HarmonicPhasors;
  /** Line k's voltage, leg k − leg k+1 (three-phase only). */
  line(index: number): HarmonicPhasors;
  /** The common-mode voltage (v_a + v_b + v_c)/3 of the legs (three-phase only). */
  commonMode(): HarmonicPhasors;
}

/**
 * The exact spectra (orders 0..maxOrder) of the voltages a design report shows, each computed
 * once. A three-phase bridge's phase, line and common-mode voltages are fixed linear
 * combinations of its three leg voltages (phase to star point (2·v_k − v_k+1 − v_k+2)/3, line
 * v_k − v_k+1, common mode (v_a + v_b + v_c)/3: standard circuit analysis, as
 * `modulationVoltages` builds their waveforms), and the Fourier series is linear, so their
 * phasors are the same combinations of the legs' three spectra: equal to reading each waveform
 * on its own to rounding, for the cost of three legs (each leg has a third of a phase
 * voltage's edges). A single-phase bridge's output is read as it is. Internal: part of
 * analyseDesign.
 * @param voltages - the design's voltages
 * @param maxOrder - highest order, an integer in [0, 100000]
 */
export function designVoltagePhasors(
  voltages: ModulationVoltages,
  maxOrder: number,
): DesignVoltagePhasors {
  const size = maxOrder + 1;
  const legs =
    voltages.phaseCount === 3 && voltages.legs.length === 3 ? legPhasors(voltages, maxOrder) : null;
  const leg = (k: number): HarmonicPhasors => {
    if (legs === null) throw new RangeError('a three-phase bridge has legs; this one has none');
    return legs[((k % 3) + 3) % 3] as HarmonicPhasors;
  };
  const cache = new Map<string, HarmonicPhasors>();
  const once = (key: string, read: () => HarmonicPhasors): HarmonicPhasors => {
    const known = cache.get(key);
    if (known !== undefined) return known;
    const phasors = read();
    cache.set(key, phasors);
    return phasors;
  };
  /**
   * Three legs from `first` combined order by order as `combination` names (weights as the
   * waveforms'), orders 0..count − 1.
   */
  const combine = (
    first: number,
    combination: 'phase' | 'line' | 'common mode',
    count = size,
  ): HarmonicPhasors => {
    const [a, b, c] = [leg(first), leg(first + 1), leg(first + 2)];
    const re = new Float64Array(count);
    const im = new Float64Array(count);
    const parts = [
      [a.re, b.re, c.re, re],
      [a.im, b.im, c.im, im],
    ] as const;
    for (const [own, next, last, into] of parts) {
      if (combination === 'phase')
        for (let n = 0; n < count; n++)
          into[n] = (2 * (own[n] as number) - (next[n] as number) - (last[n] as number)) / 3;
      else if (combination === 'line')
        for (let n = 0; n < count; n++) into[n] = (own[n] as number) - (next[n] as number);
      else
        for (let n = 0; n < count; n++)
          into[n] = ((own[n] as number) + (next[n] as number) + (last[n] as number)) / 3;
    }
    return { re, im };
  };
  return {
    phase: (index, highestOrder = maxOrder) => {
      if (highestOrder > maxOrder)
        throw new RangeError(`order ${highestOrder} is above the ${maxOrder} read`);
      return once(`phase ${index} to ${highestOrder}`, () =>
        legs === null
          ? harmonicPhasors((voltages.phases[index] as NamedVoltage).waveform, highestOrder)
          : combine(index, 'phase', highestOrder + 1),
      );
    },
    line: (index) => once(`line ${index}`, () => combine(index, 'line')),
    commonMode: () => once('common mode', () => combine(0, 'common mode')),
  };
}

/**
 * The exact phasors of each leg, orders 0..maxOrder. A leg that is an earlier leg read backwards
 * (`waveformMirror`: leg c is leg b mirrored about π/2 under carrier modulation with any zero
 * sequence, see there) is read from that leg's phasors (`mirroredPhasors`), not summed again.
 */
function legPhasors(voltages: ModulationVoltages, maxOrder: number): HarmonicPhasors[] {
  const read: HarmonicPhasors[] = [];
  voltages.legs.forEach(({ waveform }, k) => {
    for (let j = 0; j < k; j++) {
      const mirror = waveformMirror((voltages.legs[j] as NamedVoltage).waveform, waveform);
      if (mirror !== null) {
        read.push(mirroredPhasors(read[j] as HarmonicPhasors, mirror.axis));
        return;
      }
    }
    read.push(harmonicPhasors(waveform, maxOrder));
  });
  return read;
}
