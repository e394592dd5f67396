import type { Harmonic } from '../spectrum/Harmonic.js';
import type { HarmonicPhasors } from '../spectrum/harmonicPhasors.js';
import { carrierGroupLabel } from '../spectrum/carrierGroupLabel.js';
import type { CarrierGroupLabel } from '../spectrum/carrierGroupOf.js';
import type { LabelledHarmonic } from '../spectrum/labelHarmonics.js';
import { meanHarmonic } from '../spectrum/meanHarmonic.js';
import { assertNumberInRange } from '../validation/assertions.js';

/** Labels a design report's spectra (see {@link spectrumLabeller}). */
export interface SpectrumLabeller {
  /** The first maxOrder + 1 entries of a spectrum, labelled as `labelHarmonics` labels them. */
  harmonics: (spectrum: readonly Harmonic[]) => LabelledHarmonic[];
  /**
   * Orders 0..maxOrder of a spectrum's phasors, labelled: amplitude |X_n| and phase arg X_n as
   * `harmonicsOfPhasors` gives them, without building those first.
   */
  phasors: (phasors: HarmonicPhasors) => LabelledHarmonic[];
}

/**
 * The labeller of a design report's spectra, orders 0..maxOrder, by carrier group m and sideband
 * n (order = m·ratio + n; Holmes and Lipo, 2003, ch. 3), the same labels as `labelHarmonics`.
 * A report labels up to a dozen spectra of the same orders, so each order's group, sideband and
 * label text are worked out once here and shared by them all. Internal: part of analyseDesign.
 * @param maxOrder - highest order labelled, an integer ≥ 0
 * @param ratio - the ratio the orders are grouped by (`spectrumLabelRatio`), > 0
 */
export function spectrumLabeller(maxOrder: number, ratio: number): SpectrumLabeller {
  assertNumberInRange('mf', ratio, { min: 0, minExclusive: true });
  const count = maxOrder + 1;
  // Plain arrays, not Float64Arrays: whole numbers read from them stay small integers in the
  // labelled objects instead of a boxed double each.
  const groups = new Array<number>(count);
  const sidebands = new Array<number>(count);
  const labels = new Array<string>(count);
  const split = (order: number): Omit<CarrierGroupLabel, 'order'> => {
    const carrierGroup = Math.round(order / ratio);
    const sideband = order - carrierGroup * ratio;
    return { carrierGroup, sideband, label: carrierGroupLabel(order, carrierGroup, sideband) };
  };
  for (let order = 0; order < count; order++) {
    const { carrierGroup, sideband, label } = split(order);
    groups[order] = carrierGroup;
    sidebands[order] = sideband;
    labels[order] = label;
  }
  const labelled = (order: number, amplitude: number, phase: number): LabelledHarmonic => {
    // An order off the shared table (none of the report's spectra has one) is labelled alone.
    if (!(Number.isInteger(order) && order >= 0 && order < count))
      return { order, amplitude, phase, ...split(order) };
    return new LabelledEntry(
      order,
      amplitude,
      phase,
      groups[order] as number,
      sidebands[order] as number,
      labels[order] as string,
    );
  };
  // The exactly-zero orders' entries, by the signs of the zero parts (atan2 gives ±0 or ±π from
  // them: the same phase as a new entry's), built once and shared by every spectrum labelled
  // here. A report's voltages are mostly half-wave symmetric, so about half of the orders of its
  // bridge, line, common-mode and filter-output spectra are exactly zero (the legs' even-order
  // sums are never added to, and the network's response to a zero phasor is zero): with the
  // plans' labeller, a report's answer holds 10000 fewer new objects at 5000 orders. The
  // entries are read, never changed (readonly), like the label strings they share already. A
  // sign pair's table is built when its first zero comes (a report meets one or two of the four).
  const zeros: (LabelledEntry | undefined)[][] = [];
  const zeroEntry = (order: number, a: number, b: number): LabelledHarmonic => {
    const key = (1 / a < 0 ? 1 : 0) + (1 / b < 0 ? 2 : 0);
    const signs = (zeros[key] ??= new Array<LabelledEntry | undefined>(count));
    let entry = signs[order];
    if (entry === undefined) {
      entry = new LabelledEntry(
        order,
        0,
        Math.atan2(a, b),
        groups[order] as number,
        sidebands[order] as number,
        labels[order] as string,
      );
      signs[order] = entry;
    }
    return entry;
  };
  return {
    harmonics: (spectrum) => {
      const length = Math.min(spectrum.length, count);
      const result = new Array<LabelledHarmonic>(length);
      for (let k = 0; k < length; k++) {
        const { order, amplitude, phase } = spectrum[k] as Harmonic;
        result[k] = labelled(order, amplitude, phase);
      }
      return result;
    },
    phasors: ({ re, im }) => {
      const length = Math.min(re.length, count);
      const result = new Array<LabelledHarmonic>(length);
      const mean = meanHarmonic(re[0] as number);
      if (length > 0) result[0] = labelled(0, mean.amplitude, mean.phase);
      for (let n = 1; n < length; n++) {
        const a = im[n] as number;
        const b = re[n] as number;
        result[n] =
          a === 0 && b === 0
            ? zeroEntry(n, a, b)
            : labelled(n, Math.sqrt(a * a + b * b), Math.atan2(a, b));
      }
      return result;
    },
  };
}

/**
 * One labelled order of a report's spectrum: the fields of a `LabelledHarmonic`, set in the
 * order an object literal would hold them (the same JSON, the same keys). Built by a
 * constructor, not a literal, for the garbage collector's sake: V8 tracks a literal's allocation
 * site and, seeing a report's thousands of labelled orders outlive a young-generation collection,
 * allocates them straight in the old generation, whose collections then follow. Measured (300
 * full reports with plans at mf 101 to 5000, three processes each): 40 minor and 20 major
 * collections with the literal against 100 minor and 1 major with the constructor, 0.85–1.08 →
 * 0.34–0.54 ms of collection a report.
 */
class LabelledEntry implements LabelledHarmonic {
  constructor(
    readonly order: number,
    readonly amplitude: number,
    readonly phase: number,
    readonly carrierGroup: number,
    readonly sideband: number,
    readonly label: string,
  ) {}
}
