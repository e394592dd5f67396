import type { Harmonic } from '../spectrum/Harmonic.js';
import { harmonics } from '../spectrum/harmonics.js';
import type { Waveform } from '../waveform/Waveform.js';
import { waveformMeanSquare } from '../waveform/waveformMeanSquare.js';
import type { CommonModeFigures } from './DesignReport.js';

/**
 * The figures of a common-mode voltage (v_a + v_b + v_c)/3 of three leg (or cascaded string)
 * voltages (`starVoltages`), exact: its levels, RMS, steps (edges) per period and per carrier
 * period, and spectrum (standard circuit analysis; A. M. Hava and E. Ün, IEEE Trans. Power
 * Electronics, 2009, for why the steps matter), with the range of a reduced common-mode method
 * passed through.
 * Internal: part of analyseDesign.
 */
export function commonModeFigures(
  waveform: Waveform,
  context: {
    maxOrder: number;
    frequencyRatio: number | null;
    label: (s: readonly Harmonic[]) => CommonModeFigures['spectrum'];
    /** The labelled spectrum to maxOrder when the caller has it (the report reads it from its legs'); else read here. */
    spectrum?: CommonModeFigures['spectrum'];
    reducedRange: CommonModeFigures['reducedRange'];
    /** What it is measured between (the DC midpoint of a bridge on one DC link). */
    name: string;
  },
): CommonModeFigures {
  const { maxOrder, frequencyRatio, label, reducedRange, name } = context;
  // Levels are sums of ±vdc/2 thirds: round away the last bits so equal levels compare equal,
  // each distinct level once (a few levels recur at every one of hundreds of edges).
  const distinct = [...new Set(waveform.levels)];
  const levels = [...new Set(distinct.map((level) => Number(level.toPrecision(12))))].sort(
    (x, y) => x - y,
  );
  const steps = waveform.edges.length;
  return {
    name,
    waveform,
    levels,
    rms: Math.sqrt(waveformMeanSquare(waveform)),
    stepsPerPeriod: steps,
    stepsPerCarrierPeriod: frequencyRatio === null ? null : steps / frequencyRatio,
    spectrum: context.spectrum ?? label(harmonics(waveform, maxOrder)),
    reducedRange,
  };
}
