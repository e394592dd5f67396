import type FFT from 'fft.js';
import type { Harmonic } from '../spectrum/Harmonic.js';
import type { HarmonicPhasors } from '../spectrum/harmonicPhasors.js';
import { harmonicsOfPhasors } from '../spectrum/harmonicsOfPhasors.js';
import type { Waveform } from '../waveform/Waveform.js';
import { firstGridSampleFrom } from '../waveform/firstGridSampleFrom.js';
import { hasAntisymmetricHalves, hasHalfWaveSymmetryAbout } from '../waveform/waveformSymmetry.js';
import type { DcLinkFigures } from './DesignReport.js';
import { periodSeries } from './periodSeries.js';
import { sampledPhasors } from './sampledPhasors.js';

/**
 * The DC-link current from each leg's switching function and its inverter current, sampled on
 * the currents' grid (the same S angles 2πj/S for every phase): i_dc = Σ s_k·i_k. For a
 * three-phase bridge s_k = ½ + v_k/vdc with v_k the leg voltage (±vdc/2), and Σ i_k = 0 for a
 * star-connected load and filter, so i_dc = Σ (v_k/vdc)·i_k; for a single-phase bridge
 * i_dc = (v_bridge/vdc)·i (standard circuit analysis; J. W. Kolar and S. D. Round, 2006).
 * At a sample that falls exactly on an edge the level that starts there is used.
 *
 * When every switching waveform and every current is half-wave symmetric (v(θ + π) = −v(θ), as
 * the legs of carrier PWM at odd mf are, and the samples exactly so), each product s_k·i_k
 * repeats every half period: i_dc has even orders only (the ripple at 2, 4, … times the output
 * frequency, Kolar and Round, 2006). The first half period is then sampled, its mean, RMS and
 * transform are the whole period's, and the odd orders are exactly zero.
 * Internal: part of analyseDesign.
 */
export function dcLinkFigures(
  switching: readonly Waveform[],
  inverterSamples: readonly Float64Array[],
  context: {
    vdc: number;
    phaseCount: 1 | 3;
    maxOrder: number;
    points: number;
    label: (s: readonly Harmonic[]) => DcLinkFigures['spectrum'];
    /** Labels the spectrum's phasors directly (the report's labeller); else they go through `label`. */
    labelPhasors?: (p: HarmonicPhasors) => DcLinkFigures['spectrum'];
    /** The transform of a size (the grid's, or half of it), to reuse for the spectrum. */
    transform?: (size: number) => FFT;
    /**
     * Whether each current's samples are exactly half-wave antisymmetric
     * (`hasAntisymmetricHalves`), when the caller has read it for its other uses. @default read here
     */
    antisymmetricCurrents?: readonly boolean[];
  },
): DcLinkFigures {
  const { vdc, phaseCount, maxOrder, points, label, transform } = context;
  const size = inverterSamples[0]?.length ?? 0;
  const antisymmetric =
    context.antisymmetricCurrents ?? inverterSamples.map(hasAntisymmetricHalves);
  const repeats = halfPeriodic(switching, antisymmetric) ? 2 : 1;
  // The samples of one repeat (the whole period, or its first half).
  const span = size / repeats;
  const current = new Float64Array(size);
  for (let k = 0; k < switching.length; k++) {
    const { edges, levels } = switching[k] as Waveform;
    const phaseCurrent = inverterSamples[k] as Float64Array;
    // One walk along the segments (the grid is in order): before the first edge the period's
    // last level; each segment's samples from the first at or after its edge.
    let start = 0;
    for (let segment = -1; segment < edges.length; segment++) {
      const end =
        segment + 1 < edges.length
          ? Math.min(span, firstGridSampleFrom(edges[segment + 1] as number, size))
          : span;
      const share = (levels[segment < 0 ? levels.length - 1 : segment] as number) / vdc;
      for (let j = start; j < end; j++)
        current[j] = (current[j] as number) + share * (phaseCurrent[j] as number);
      start = Math.max(start, end);
    }
  }
  let sum = 0;
  let sumOfSquares = 0;
  for (let j = 0; j < span; j++) {
    const value = current[j] as number;
    sum += value;
    sumOfSquares += value * value;
  }
  const mean = sum / span;
  const rms = Math.sqrt(sumOfSquares / span);
  const repeat = span === size ? current : current.subarray(0, span);
  const phasors = sampledPhasors(repeat, maxOrder, transform?.(span), repeats);
  // The chart's series reads the whole period.
  if (span < size) current.copyWithin(span, 0, span);
  const labelled = context.labelPhasors
    ? context.labelPhasors(phasors)
    : label(harmonicsOfPhasors(phasors));
  return {
    mean,
    rms,
    rippleRms: Math.sqrt(Math.max(0, rms * rms - mean * mean)),
    secondHarmonic: phaseCount === 1 ? (labelled[2]?.amplitude ?? 0) : null,
    spectrum: labelled,
    series: periodSeries(current, points),
    samplesPerPeriod: size,
  };
}

/**
 * Whether each switching waveform is half-wave symmetric about zero (edges half a period apart
 * to `SYMMETRY_TOLERANCE`, levels negated) and each current's samples are antisymmetric (its
 * sample at 2πj/S + π exactly minus its sample at 2πj/S): then every product s_k·i_k repeats
 * each half period.
 */
function halfPeriodic(
  switching: readonly Waveform[],
  antisymmetricCurrents: readonly boolean[],
): boolean {
  return (
    switching.length > 0 &&
    switching.length === antisymmetricCurrents.length &&
    switching.every((waveform) => hasHalfWaveSymmetryAbout(waveform, 0)) &&
    antisymmetricCurrents.every(Boolean)
  );
}
