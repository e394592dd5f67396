import { currentDistortion } from '../load/currentDistortion.js';
import { rlCurrentAt } from '../load/rlCurrentAt.js';
import type { RlLoadOptions } from '../load/RlLoad.js';
import { rlSteadyState } from '../load/rlSteadyState.js';
import { TAU } from '../math.js';
import { complexAbs, complexDivide, complexSubtract, phasorOf } from '../numeric/complex.js';
import { harmonics } from '../spectrum/harmonics.js';
import type { Harmonic } from '../spectrum/Harmonic.js';
import { withFieldPrefix } from '../validation/withFieldPrefix.js';
import type { Waveform } from '../waveform/Waveform.js';
import type { CurrentFigures, PhaseCurrents } from './DesignReport.js';

/** One unfiltered phase as {@link exactLoadCurrents} takes it. */
export interface UnfilteredPhase {
  /** The phase's voltage across its load, one period, volts. */
  waveform: Waveform;
  load: RlLoadOptions;
  phase: PhaseCurrents['phase'];
  /** Added to each current's name (`, phase a` on a three-phase bridge). */
  suffix: string;
}

/** What {@link exactLoadCurrents} gives for one phase. */
export interface ExactLoadCurrents {
  currents: PhaseCurrents;
  /** Mean power into the load's resistance, watts. */
  power: number;
  /** The current on the grid's angles 2πj/S, amperes (the DC link's and the losses' samples). */
  inverterSamples: Float64Array;
}

/**
 * Internal (part of analyseDesign): the exact load current of each unfiltered phase, which is
 * also its switch current: RMS, peaks and power from the piecewise-exponential steady state
 * (`rlSteadyState`); the fundamental V₁ − E over R + jωL (circuit analysis); the ripple
 * i − i₁'s peak-to-peak from the current (`rlCurrentAt`) at every switching edge, where the
 * ripple's extremes sit, and on a grid of S angles 2πj/S (its sines read once for all phases).
 * @param context.gridSize - S, samples a period of the grid
 * @param context.points - samples a period of the charted series
 */
export function exactLoadCurrents(
  phases: readonly UnfilteredPhase[],
  context: { gridSize: number; points: number },
): ExactLoadCurrents[] {
  const { gridSize, points } = context;
  const gridAngles = new Array<number>(gridSize);
  const sine = new Float64Array(gridSize);
  const cosine = new Float64Array(gridSize);
  for (let k = 0; k < gridSize; k++) {
    const theta = (TAU * k) / gridSize;
    gridAngles[k] = theta;
    sine[k] = Math.sin(theta);
    cosine[k] = Math.cos(theta);
  }
  const seriesAngles = new Array<number>(points);
  for (let k = 0; k < points; k++) seriesAngles[k] = (TAU * k) / points;
  return phases.map(({ waveform, load, phase, suffix }) => {
    const steady = withFieldPrefix('load.', () => rlSteadyState(waveform, load));
    const voltage = harmonics(waveform, 1)[1] as Harmonic;
    const emf = load.emf ? phasorOf(load.emf.amplitude, load.emf.phase) : { re: 0, im: 0 };
    const impedance = { re: load.r, im: TAU * load.frequency * load.l };
    const first = complexDivide(
      complexSubtract(phasorOf(voltage.amplitude, voltage.phase), emf),
      impedance,
    );
    const fundamental = complexAbs(first);
    const { edges } = waveform;
    const atEdges = rlCurrentAt(waveform, edges, load);
    const onGrid = rlCurrentAt(waveform, gridAngles, load);
    let low = Infinity;
    let high = -Infinity;
    const extend = (ripple: number): void => {
      if (ripple < low) low = ripple;
      if (ripple > high) high = ripple;
    };
    for (let k = 0; k < edges.length; k++) {
      const theta = edges[k] as number;
      extend((atEdges[k] as number) - (first.re * Math.sin(theta) + first.im * Math.cos(theta)));
    }
    for (let k = 0; k < gridSize; k++)
      extend(
        (onGrid[k] as number) - (first.re * (sine[k] as number) + first.im * (cosine[k] as number)),
      );
    const figures: CurrentFigures = {
      name: `load current${suffix}`,
      rms: steady.rmsCurrent,
      peak: Math.max(Math.abs(steady.peakCurrent), Math.abs(steady.minCurrent)),
      fundamental,
      fundamentalPhase: Math.atan2(first.im, first.re),
      rippleRms: Math.sqrt(Math.max(0, steady.rmsCurrent ** 2 - (fundamental * fundamental) / 2)),
      ...currentDistortion(steady.rmsCurrent, fundamental),
      ripplePeakToPeak: high - low,
      series: { angles: seriesAngles.slice(), values: rlCurrentAt(waveform, seriesAngles, load) },
    };
    return {
      currents: {
        phase,
        inverter: { ...figures, name: `inverter (switch) current${suffix}` },
        capacitor: null,
        load: figures,
      },
      power: steady.power,
      inverterSamples: Float64Array.from(onGrid),
    };
  });
}
