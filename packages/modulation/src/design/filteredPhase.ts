import { outputNetworkResponse, type OutputNetwork } from '../filter/outputNetworkResponse.js';
import type { OutputNetworkTransfer } from '../filter/outputNetworkTransfer.js';
import { currentDistortion } from '../load/currentDistortion.js';
import type { Complex } from '../numeric/complex.js';
import { weightedDistortion } from '../spectrum/distortion.js';
import type { HarmonicPhasors } from '../spectrum/harmonicPhasors.js';
import type { Waveform } from '../waveform/Waveform.js';
import { runningIntegral } from '../waveform/runningIntegral.js';
import { hasHalfWaveSymmetry } from '../waveform/waveformSymmetry.js';
import { waveformMeanSquare } from '../waveform/waveformMeanSquare.js';
import type {
  CurrentFigures,
  DesignReport,
  PeriodSeries,
  PhaseCurrents,
  VoltageFigures,
} from './DesignReport.js';
import { networkPhasors } from './networkPhasors.js';
import { periodSeries } from './periodSeries.js';
import { synthesisSize, type PeriodSynthesiser } from './periodSynthesiser.js';
import type { SpectrumLabeller } from './spectrumLabeller.js';

/**
 * The synthesiser's buffer slot (`PeriodSynthesiser.buffers`) of each phase's sampled currents,
 * kept to the report's end, and of the output voltage's samples, read into its chart series at
 * once. No sample array reaches the report itself: its series are copies (`periodSeries`).
 */
const PHASE_SLOTS: Record<PhaseCurrents['phase'], number> = { a: 0, b: 1, c: 2 };
const OUTPUT_SLOT = 3;

/** What {@link filteredPhase} gives for one phase. */
export interface FilteredPhase {
  /**
   * The inverter current on the synthesiser's S angles 2πj/S, amperes, in the synthesiser's
   * buffers of this phase: overwritten by the next report on the same synthesiser.
   */
  inverterSamples: Float64Array;
  /** The load current on the same angles (the same buffers), amperes, or null without a load. */
  loadSamples: Float64Array | null;
  /**
   * Whether both sample arrays are half-wave symmetric exactly: the sample at 2πj/S + π the
   * negated sample at 2πj/S (read from the first half: see {@link PeriodSynthesiser.pair}).
   */
  halfWave: boolean;
  /** The output voltage's figures, for the phase asked for them (the report shows phase a's), else null. */
  output: NonNullable<DesignReport['output']> | null;
  currents: PhaseCurrents;
  /** Mean power into the load's resistance, watts (0 without a load). */
  loadPower: number;
}

/** How {@link filteredPhase} reads one phase. */
export interface FilteredPhaseContext {
  network: OutputNetwork;
  /** The network's response to a unit bridge voltage to spectrumOrder at least (`outputNetworkTransfer`). */
  transfer: OutputNetworkTransfer;
  /** Angular frequency of order 1, rad/s: the fundamental's, or a span's base ω₁/q. */
  omega: number;
  /**
   * The fundamental's order: 1, or q when the waveform spans q fundamental periods (a carrier at
   * mf = p/q; orders are then of the base f₁/q, and the back-EMF drives order q). @default 1
   */
  fundamentalOrder?: number;
  /** This phase's back-EMF phasor at the fundamental, volts (zero for none). */
  emf: Complex;
  /** Load resistance, ohms, or null without a load. */
  loadR: number | null;
  phase: PhaseCurrents['phase'];
  /** Added to each current's name (`, phase a` on a three-phase bridge). */
  suffix: string;
  /** Name of the output voltage's figures, or null when this phase gives none. */
  outputName: string | null;
  /** Order the output spectrum and its THD bound are solved to. */
  spectrumOrder: number;
  /** Order the current and output series are summed to (≤ spectrumOrder), before the tail. */
  currentOrder: number;
  points: number;
  synthesiser: PeriodSynthesiser;
  /**
   * The synthesiser of the output voltage's chart series, on a grid of its own
   * ({@link outputSeriesSize}): no figure is read from those samples, so a grid of about twice
   * the chart's points serves, not the currents'. @default synthesiser
   */
  outputSynthesiser?: PeriodSynthesiser;
  labeller: SpectrumLabeller;
  /**
   * The two other phases of a three-phase bridge, already read. Their load, filter and back-EMF
   * are this phase's and the three phase-to-star-point voltages sum to zero, so by Kirchhoff's
   * current law at the star point this phase's sampled currents are minus the sum of theirs (the
   * network is linear): read so, not synthesised (equal to rounding). @default none: synthesised
   */
  others?: readonly [FilteredPhase, FilteredPhase];
}

/**
 * Internal (part of analyseDesign): one phase through the loaded filter, per harmonic to the
 * analysis order: the bridge voltage's phasors (exact, to spectrumOrder at least) times the
 * network's response to each order (`outputNetworkTransfer`), the fundamental solved with the
 * back-EMF (`networkPhasors`). Its currents are sampled on the synthesiser's grid of S
 * angles 2πj/S: the load and inverter currents in one transform, the capacitor current as
 * their difference (Kirchhoff's current law holds phasor by phasor, so it holds sample by
 * sample to rounding), and the output voltage for the phase that reports it. Peaks and ripple
 * peak-to-peak are the extremes of those samples: at S ≥ 16·N, with N the analysis order, each
 * harmonic is sampled at least 16 times a cycle, so a sinusoid's peak is read within
 * 1 − cos(π/16) ≈ 1.9 % of its own amplitude at worst (the switching tail is exact at the
 * samples and piecewise linear between them).
 *
 * The output's THD beyond spectrumOrder is bounded by Parseval: the bridge's remaining mean
 * square (exact) times the largest filter gain found above the order (|H| sampled at
 * (N+1)·2^k, k = 0..10, and assumed not to rise between: true past the resonance).
 * @param waveform - this phase's bridge voltage, one period, volts
 * @param bridge - its phasors, orders 0..spectrumOrder at least
 */
export function filteredPhase(
  waveform: Waveform,
  bridge: HarmonicPhasors,
  context: FilteredPhaseContext,
): FilteredPhase {
  const { network, transfer, omega, emf, loadR, phase, suffix, outputName } = context;
  const { spectrumOrder, currentOrder, points, synthesiser, labeller } = context;
  const f = context.fundamentalOrder ?? 1;
  // The currents are summed to the current order (the output spectrum to spectrumOrder).
  const held = Math.min(spectrumOrder, currentOrder) + 1;
  // The currents are solved to the orders summed, the output (of the phase that reports it) to
  // spectrumOrder: no product is formed that nothing reads.
  const solved = networkPhasors(bridge, transfer, {
    count: held,
    outputCount: outputName === null ? 0 : spectrumOrder + 1,
    network,
    omega,
    emf,
    fundamentalOrder: f,
  });

  const { size } = synthesiser;
  const figures = (
    name: string,
    phasors: HarmonicPhasors,
    tailMeanSquare: number,
    extremes: SampleExtremes,
    series: PeriodSeries,
  ): CurrentFigures => {
    const { re, im } = phasors;
    let meanSquare = tailMeanSquare + (re[0] as number) * (re[0] as number);
    for (let n = 1; n < held; n++) {
      const a = re[n] as number;
      const b = im[n] as number;
      meanSquare += (a * a + b * b) / 2;
    }
    const firstRe = held > f ? (re[f] as number) : 0;
    const firstIm = held > f ? (im[f] as number) : 0;
    const fundamentalCurrent = Math.hypot(firstRe, firstIm);
    return {
      name: `${name}${suffix}`,
      rms: Math.sqrt(meanSquare),
      peak: extremes.peak,
      fundamental: fundamentalCurrent,
      fundamentalPhase: Math.atan2(firstIm, firstRe),
      rippleRms: Math.sqrt(Math.max(0, meanSquare - (fundamentalCurrent * fundamentalCurrent) / 2)),
      ...currentDistortion(Math.sqrt(meanSquare), fundamentalCurrent),
      ripplePeakToPeak: extremes.rippleHigh - extremes.rippleLow,
      series,
    };
  };

  // The switch current above N (the tail) is linear in the bridge's running integral: its
  // harmonic part joins the inverter phasors, its exact part is added to the samples.
  const tail = switchingTail(waveform, bridge, solved.inverterCurrent, {
    count: held,
    filter: network.filter,
    omega,
    size,
  });
  const { others } = context;
  // The phase's samples live in the synthesiser's buffers of its slot (reused by the next report).
  const slot = PHASE_SLOTS[phase];
  const [inverterInto, loadInto] = synthesiser.buffers(slot);
  const [inverterSamples, loadSamples, synthesisedHalfWave] =
    others === undefined
      ? synthesiser.pair(
          tail === null ? solved.inverterCurrent : tail.added,
          loadR === null ? null : solved.loadCurrent,
          held,
          slot,
        )
      : [
          negatedSum(others[0].inverterSamples, others[1].inverterSamples, inverterInto),
          loadR === null
            ? null
            : negatedSum(others[0].loadSamples, others[1].loadSamples, loadInto),
          others[0].halfWave && others[1].halfWave,
        ];
  // The tail added to half-wave symmetric samples keeps them so when the bridge voltage is: its
  // running integral less its mean is then half-wave symmetric too.
  const halfWave =
    synthesisedHalfWave && (tail === null || others !== undefined || hasHalfWaveSymmetry(waveform));
  const extremes = currentExtremes(inverterSamples, loadSamples, {
    // The others' samples hold their tails already.
    tail: tail === null || others !== undefined ? null : tail.samples(halfWave ? size / 2 : size),
    sine: synthesiser.sine,
    inverter: solved.inverterCurrent,
    capacitor: solved.capacitorCurrent,
    load: solved.loadCurrent,
    held,
    fundamentalOrder: f,
    halfWave,
  });
  const tailMeanSquare = tail?.meanSquare ?? 0;
  const loadCurrent =
    loadSamples === null
      ? null
      : figures(
          'load current',
          solved.loadCurrent,
          0,
          extremes.load,
          periodSeries(loadSamples, points),
        );
  return {
    inverterSamples,
    loadSamples,
    halfWave,
    output:
      outputName === null
        ? null
        : {
            ...outputFigures(outputName, solved.output, {
              labeller,
              fundamentalOrder: f,
              thdUpperBound: outputThdUpperBound(waveform, bridge, solved.output, context),
            }),
            series: periodSeries(
              (context.outputSynthesiser ?? synthesiser).pair(
                solved.output,
                null,
                held,
                OUTPUT_SLOT,
              )[0],
              points,
            ),
          },
    currents: {
      phase,
      inverter: figures(
        'inverter (switch) current',
        solved.inverterCurrent,
        tailMeanSquare,
        extremes.inverter,
        periodSeries(inverterSamples, points),
      ),
      capacitor: figures(
        'capacitor current',
        solved.capacitorCurrent,
        tailMeanSquare,
        extremes.capacitor,
        periodSeries(inverterSamples, points, loadSamples),
      ),
      load: loadCurrent,
    },
    loadPower:
      loadR === null || loadCurrent === null ? 0 : loadR * loadCurrent.rms * loadCurrent.rms,
  };
}

/**
 * The grid of the output voltage's chart series (`FilteredPhaseContext.outputSynthesiser`): the
 * smallest power of two that holds its orders to `highestOrder` without aliasing and at least
 * 2·points samples (so the series gets between `points` and 2·points of them), and never more
 * than the currents' grid.
 */
export function outputSeriesSize(
  highestOrder: number,
  points: number,
  currentGrid: number,
): number {
  return Math.min(currentGrid, synthesisSize(highestOrder, 2 * points));
}

/**
 * Figures of the output voltage, a sum over its spectrum (its THD bound found by the caller):
 * THD over every order but the mean and the fundamental f, WTHD weighting order n by (f/n)².
 */
function outputFigures(
  name: string,
  phasors: HarmonicPhasors,
  context: { labeller: SpectrumLabeller; thdUpperBound: number; fundamentalOrder: number },
): VoltageFigures {
  const { re, im } = phasors;
  const f = context.fundamentalOrder;
  const mean = re[0] as number;
  let meanSquare = mean * mean;
  let harmonicSquares = 0;
  let weightedSquares = 0;
  for (let n = 1; n < re.length; n++) {
    const a = re[n] as number;
    const b = im[n] as number;
    const square = b * b + a * a;
    meanSquare += square / 2;
    if (n === f) continue;
    harmonicSquares += square;
    weightedSquares += (square * f * f) / (n * n);
  }
  const first = Math.sqrt((im[f] as number) ** 2 + (re[f] as number) ** 2);
  const spectrum = context.labeller.phasors(phasors);
  return {
    name,
    fundamental: first,
    fundamentalPhase: Math.atan2(im[f] as number, re[f] as number),
    rms: Math.sqrt(meanSquare),
    thd: Math.sqrt(harmonicSquares) / first,
    thdUpperBound: context.thdUpperBound,
    wthd: Math.sqrt(weightedSquares) / first,
    exact: false,
    spectrum,
    spectrumThd: weightedDistortion(spectrum, 0),
  };
}

/**
 * An upper bound of the output's THD over every order: the solved orders' sum, plus the
 * bridge's mean square above them (exact, Parseval) times the largest gain found above.
 */
function outputThdUpperBound(
  waveform: Waveform,
  bridge: HarmonicPhasors,
  output: HarmonicPhasors,
  context: Pick<FilteredPhaseContext, 'network' | 'omega' | 'spectrumOrder' | 'fundamentalOrder'>,
): number {
  const { network, omega, spectrumOrder } = context;
  const f = context.fundamentalOrder ?? 1;
  let bridgeSum = (bridge.re[0] as number) * (bridge.re[0] as number);
  for (let n = 1; n <= spectrumOrder; n++) {
    const a = bridge.re[n] as number;
    const b = bridge.im[n] as number;
    bridgeSum += (a * a + b * b) / 2;
  }
  const bridgeTail = Math.max(0, waveformMeanSquare(waveform) - bridgeSum);
  let tailGain = 0;
  for (let k = 0, order = spectrumOrder + 1; k <= 10; k++, order *= 2) {
    const response = outputNetworkResponse(network, omega * order, { re: 1, im: 0 });
    tailGain = Math.max(tailGain, Math.hypot(response.output.re, response.output.im));
  }
  let harmonicSum = 0;
  for (let n = 1; n <= spectrumOrder; n++) {
    if (n === f) continue;
    const a = output.re[n] as number;
    const b = output.im[n] as number;
    harmonicSum += (a * a + b * b) / 2;
  }
  const fundamental = Math.hypot(output.re[f] as number, output.im[f] as number);
  return Math.sqrt(2 * (harmonicSum + tailGain * tailGain * bridgeTail)) / fundamental;
}

/**
 * The inverter current above the summed order N, where the series inductor alone sets it
 * (|Z_s| ≫ the shunt branch there, so nearly all of it flows into the capacitor):
 * i_tail = (Φ − Φ_N)/(ω·L), with Φ the bridge voltage's running integral (exact, piecewise
 * linear) and Φ_N its harmonics to N (v = L·di/dt, standard circuit analysis). Its mean square
 * is (Var Φ − Σ_{n≤N} (V_n/n)²/2)/(ωL)² by Parseval. Returned as the inverter phasors to N with
 * those of −Φ_N/(ωL) added (`added`), Φ on the first `upTo` of the S angles 2πj/S with mean Φ
 * and ωL (read when asked for: the tail there is (Φ − mean Φ)/(ωL)), and that mean square.
 * Null for damping across the inductor, whose series branch is not inductive at high frequency,
 * and when N is not ten times past the LC resonance (the sum to N is used as it is there).
 * @param inverter - the inverter current's phasors to N at least
 * @param context.count - N + 1, the orders summed
 */
function switchingTail(
  waveform: Waveform,
  bridge: HarmonicPhasors,
  inverter: HarmonicPhasors,
  context: { count: number; filter: OutputNetwork['filter']; omega: number; size: number },
): {
  added: HarmonicPhasors;
  samples: (upTo: number) => TailSamples;
  meanSquare: number;
} | null {
  const { count, filter, omega, size } = context;
  if (filter === null || filter.dampingPlacement === 'parallel-with-inductor') return null;
  // Only valid well past the resonance, where the shunt branch shorts the load out.
  const resonanceOrder = 1 / (Math.sqrt(filter.l * filter.c) * omega);
  if (count - 1 < 10 * resonanceOrder) return null;
  const integral = runningIntegral(waveform);
  const reactance = omega * filter.l;
  const re = new Float64Array(count);
  const im = new Float64Array(count);
  let heldVariance = 0;
  for (let n = 1; n < count; n++) {
    // ∫ A·sin(nθ + φ) dθ = (A/n)·sin(nθ + φ − π/2): phasor (V_n/n)·e^{−jπ/2}, negated and over ωL.
    const vr = (bridge.re[n] as number) / n;
    const vi = (bridge.im[n] as number) / n;
    re[n] = (inverter.re[n] as number) - vi / reactance;
    im[n] = (inverter.im[n] as number) + vr / reactance;
    heldVariance += (vr * vr + vi * vi) / 2;
  }
  re[0] = inverter.re[0] as number;
  im[0] = inverter.im[0] as number;
  return {
    added: { re, im },
    samples: (upTo) => ({ flux: integral.at(size, upTo), mean: integral.mean, reactance }),
    meanSquare: Math.max(0, integral.variance - heldVariance) / (reactance * reactance),
  };
}

/**
 * The switching tail on the grid: (flux[j] − mean)/reactance at sample j, amperes, worked out
 * where it is added (one pass over the samples, not two).
 */
interface TailSamples {
  /**
   * The bridge voltage's running integral Φ at the S angles (the first half of them when the
   * samples are half-wave symmetric), volt-radians.
   */
  flux: Float64Array;
  /** Mean Φ over the period. */
  mean: number;
  /** ω·L of the filter's inductor, ohms. */
  reactance: number;
}

/** Peak |i| and the lowest and highest ripple i − i₁ of one current on the grid, amperes. */
interface SampleExtremes {
  peak: number;
  rippleLow: number;
  rippleHigh: number;
}

/**
 * The extremes of a filtered phase's three currents over the synthesiser's S angles 2πj/S, in
 * one pass: the inverter current (its switching tail added into `inverter` in place, when there
 * is one), the load current, and the capacitor current as their difference (Kirchhoff's current
 * law; the inverter current itself without a load). Each current's ripple is i − i₁ with i₁ its
 * fundamental X₁ = re₁ + j·im₁ at order f (1, or q over a span): i₁(θ) = re₁·sin fθ + im₁·cos fθ,
 * the sine table read every f-th entry and the cosine a quarter period on. No fundamental (f or
 * fewer orders held) leaves i as its ripple. Half-wave symmetric samples are read over the first
 * half period: i(θ + π) = −i(θ) and i₁(θ + π) = −i₁(θ) (f is odd, or i₁ is zero, when every even
 * order is), so the second half's peak is the first's and its ripple extremes are the first's
 * negated, to rounding.
 * @param inverter - the inverter current's synthesised samples, amperes (the tail is added here)
 * @param load - the load current's samples, amperes, or null without a load
 */
function currentExtremes(
  inverter: Float64Array,
  load: Float64Array | null,
  context: {
    tail: TailSamples | null;
    sine: Float64Array;
    inverter: HarmonicPhasors;
    capacitor: HarmonicPhasors;
    load: HarmonicPhasors;
    held: number;
    fundamentalOrder: number;
    /** Whether the samples, their tail added, are half-wave symmetric. */
    halfWave: boolean;
  },
): { inverter: SampleExtremes; capacitor: SampleExtremes; load: SampleExtremes } {
  const { held, fundamentalOrder: f } = context;
  const first = (phasors: HarmonicPhasors, part: 're' | 'im'): number =>
    held > f ? (phasors[part][f] as number) : 0;
  const span = context.halfWave ? inverter.length / 2 : inverter.length;
  const found = extremesPass(inverter, load, context.tail, context.sine, f, span, [
    first(context.inverter, 're'),
    first(context.inverter, 'im'),
    first(context.capacitor, 're'),
    first(context.capacitor, 'im'),
    first(context.load, 're'),
    first(context.load, 'im'),
  ]);
  if (span < inverter.length && context.tail !== null) {
    // The tail was added to the first half only: the second half is its negation.
    for (let j = 0; j < span; j++) inverter[j + span] = -(inverter[j] as number);
  }
  const read = (at: number): SampleExtremes => {
    const low = found[at + 1] as number;
    const high = found[at + 2] as number;
    return span < inverter.length
      ? {
          peak: found[at] as number,
          rippleLow: Math.min(low, -high),
          rippleHigh: Math.max(high, -low),
        }
      : { peak: found[at] as number, rippleLow: low, rippleHigh: high };
  };
  return { inverter: read(0), capacitor: read(3), load: read(6) };
}

/**
 * The pass of {@link currentExtremes} over samples 0..span − 1: the inverter's, capacitor's and
 * load's peak, lowest and highest ripple at indices 0–2, 3–5 and 6–8 (the load's 0, ∞, −∞
 * without a load).
 *
 * Each extreme is kept in a local and written to the array built before the loop when it
 * changes, and the loop is the last thing here: V8 may compile this loop on the fly (on-stack
 * replacement) during its first call, and code after the loop that had not yet run (the result
 * built from the locals) then deoptimised that compiled loop again at later calls. The writes
 * run from the first sample on (every extreme changes there), so they have type feedback before
 * the loop is compiled. The same comparisons in the same order as before.
 * @param fundamentals - re₁, im₁ of the inverter, capacitor and load currents, amperes
 */
function extremesPass(
  inverter: Float64Array,
  load: Float64Array | null,
  tail: TailSamples | null,
  sine: Float64Array,
  f: number,
  span: number,
  fundamentals: readonly [number, number, number, number, number, number],
): Float64Array {
  const [iRe, iIm, cRe, cIm, lRe, lIm] = fundamentals;
  const flux = tail?.flux ?? null;
  const fluxMean = tail?.mean ?? 0;
  const reactance = tail?.reactance ?? 1;
  const size = inverter.length;
  const quarter = size / 4;
  const found = new Float64Array([
    0,
    Infinity,
    -Infinity,
    0,
    Infinity,
    -Infinity,
    0,
    Infinity,
    -Infinity,
  ]);
  let iPeak = 0;
  let iLow = Infinity;
  let iHigh = -Infinity;
  let cPeak = 0;
  let cLow = Infinity;
  let cHigh = -Infinity;
  let lPeak = 0;
  let lLow = Infinity;
  let lHigh = -Infinity;
  // sin(2πfj/S) at index fj mod S; cos(2πfj/S) = sin(2π(fj + S/4)/S).
  for (
    let j = 0, h = 0, k = quarter;
    j < span;
    j++, h = h + f >= size ? h + f - size : h + f, k = k + f >= size ? k + f - size : k + f
  ) {
    const s = sine[h] as number;
    const c = sine[k] as number;
    let i = inverter[j] as number;
    if (flux !== null) {
      i = i + ((flux[j] as number) - fluxMean) / reactance;
      inverter[j] = i;
    }
    let ripple = i - (iRe * s + iIm * c);
    if (Math.abs(i) > iPeak) found[0] = iPeak = Math.abs(i);
    if (ripple < iLow) found[1] = iLow = ripple;
    if (ripple > iHigh) found[2] = iHigh = ripple;
    let capacitor = i;
    if (load !== null) {
      const l = load[j] as number;
      capacitor = i - l;
      ripple = l - (lRe * s + lIm * c);
      if (Math.abs(l) > lPeak) found[6] = lPeak = Math.abs(l);
      if (ripple < lLow) found[7] = lLow = ripple;
      if (ripple > lHigh) found[8] = lHigh = ripple;
    }
    ripple = capacitor - (cRe * s + cIm * c);
    if (Math.abs(capacitor) > cPeak) found[3] = cPeak = Math.abs(capacitor);
    if (ripple < cLow) found[4] = cLow = ripple;
    if (ripple > cHigh) found[5] = cHigh = ripple;
  }
  return found;
}

/**
 * −(a + b) sample by sample, written into `into` (null when either is null).
 * @param into - S samples, overwritten
 */
function negatedSum(a: Float64Array, b: Float64Array, into: Float64Array): Float64Array;
function negatedSum(
  a: Float64Array | null,
  b: Float64Array | null,
  into: Float64Array,
): Float64Array | null;
function negatedSum(
  a: Float64Array | null,
  b: Float64Array | null,
  into: Float64Array,
): Float64Array | null {
  if (a === null || b === null) return null;
  for (let j = 0; j < a.length; j++) into[j] = -((a[j] as number) + (b[j] as number));
  return into;
}
