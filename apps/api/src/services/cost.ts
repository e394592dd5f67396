import {
  CARRIER_METHODS,
  defaultSpectrumOrder,
  designCarrierSpan,
  designRationalRatio,
  designSpanMaxOrder,
  MAX_ANALYSIS_ORDER,
  modulationPhaseCount,
  type AnalyseDesignOptions,
  type InverterDesign,
  type Modulation,
  type MultilevelTimerTableOptions,
  type TimerTableOptions,
} from '@pulsewright/modulation';
import type { ComputeLimits } from '../config.js';
import { badRequest } from '../http/errors.js';
import { callLibrary } from './library.js';
import type { MaSweepInput, SheSweepInput } from './sweeps.js';

/**
 * The cost model: what a compute request or a job will cost, estimated from its inputs alone
 * before any work, so that what exceeds a budget is refused with a 400 naming the fields to
 * lower, and what is cheap runs on the request thread while the rest goes to the worker pool.
 *
 * Work is counted in one unit: one term of an exact Fourier sum (one switching edge at one
 * harmonic order, `harmonics` in the library), about 5 ns of one core on the 2-core build
 * machine (a three-phase report at mf 999 with a filter, 2.1·10⁸ units, took 0.98 s). Other
 * kinds of work are converted to it by factors measured on the same machine, rounded up, so an
 * estimate errs on the high side:
 *
 * - building a waveform: 100 units an edge (natural sampling finds each edge by root-finding);
 * - SHE: 4·10⁴ units × count² a point, the worst case (a point that does not converge runs
 *   Newton to its iteration limit from several starts: 0.19–0.22 ms × count² measured for
 *   staircase patterns of 8–31 angles; a converging bipolar point costs a tenth of that);
 * - timer tables: 250 units a row and channel (65 536 rows × 3 channels as JSON took 0.25 s);
 * - FFT of a capture: 16 units a sample and stage (N·log₂N): 10 for a power-of-two transform,
 *   and the whole periods at their own length (a chirp-z transform on three power-of-two
 *   transforms) took 1.6–1.7× that at 1 000 000 samples;
 * - sampled time series: 20 units a value.
 *
 * Answers are bounded the same way: each estimate carries the size of the JSON (or file) it
 * will produce, from bytes per value measured on the largest answers (about 18 bytes a number).
 */
export interface CostEstimate {
  /** What the request asks for, in the cost model's units. */
  work: number;
  /** How the work was counted, in the request's words (e.g. `4000 edges × 2001 orders`). */
  basis: string;
  /** The request fields that drive the work, the one to lower first. */
  fields: string[];
  /** Estimated size of the answer, bytes. */
  responseBytes: number;
  /** The request fields that drive the size of the answer. */
  responseFields: string[];
}

/** Units of work per edge to build a waveform (root-finding for natural sampling). */
const BUILD_PER_EDGE = 100;
/** Worst-case units per SHE point per angle² (see above). */
const SHE_PER_ANGLE_SQUARED = 4e4;
/** Units per timer-table row and channel. */
const TIMER_PER_ROW_CHANNEL = 250;
/**
 * Bytes per timer-table row and channel, by format (measured 92 with the compare-sense array, 44
 * and 17, the CSV and header of a reduced common-mode table with their sense column and array;
 * rounded up).
 */
const TIMER_BYTES_PER_ROW_CHANNEL = { json: 100, csv: 50, 'c-header': 20 } as const;
/** Bytes of one number in a JSON answer, with its key and punctuation where it is in an object. */
const BYTES_PER_NUMBER = 20;

/**
 * Bytes of a report over a span (a carrier no whole multiple of the fundamental), measured on the
 * 4000/37 three-phase report (8.38 MB at maxOrder 135): 27 bytes an edge of its voltages with its
 * level, so 13.5 a number, and 166 bytes a labelled component (order n/q, its label and kind);
 * rounded up.
 */
const SPAN_BYTES_PER_VOLTAGE_NUMBER = 15;
const SPAN_BYTES_PER_COMPONENT = 170;

/**
 * The design report's own factors (analyseDesign reads the three legs' exact spectra once, by a
 * recurrence over the orders at each edge, and every other spectrum is a combination of them),
 * fitted to its CPU time on 28 designs (three-phase and single-phase, mf 21–999, load, LC filter,
 * grid, losses, default order and 5000; the 2-core machine under a load of 8) and doubled:
 * a quarter unit a term of the legs' sums (0.13 fitted), 40 units an order of each labelled
 * spectrum and of each phase solved through the filter (20), 60 units a sample of each phase's
 * current grid (30: the exact load currents or the filter's synthesis, the DC link and losses).
 */
const REPORT_PER_TERM = 0.25;
const REPORT_PER_ORDER = 40;
const REPORT_PER_SAMPLE = 60;
/**
 * An unfiltered span with a load or grid (spanLoadCurrents and the DC link over the span): 40
 * units a sample of each phase's grid of S = max(4096·q, 64·p) angles, rounded up to a power of
 * two as the library does (at most 2^19), and 10^6 units (5 ms) once a report for what does not
 * grow with S. CPU time measured at q = 2…64 (sine-triangle bipolar, three-phase, with and
 * without back-EMF, 50 Hz): the load part took 0.18-0.23 µs a sample and phase for S ≥ 32768, and
 * 3-14 ms in all at S = 8192 (q = 2), where 20 units a sample without the fixed part had
 * estimated a quarter to a fifth of it.
 */
const SPAN_LOAD_PER_SAMPLE = 40;
const SPAN_LOAD_FIXED = 1e6;

const sci = (value: number): string => value.toPrecision(3);

/**
 * A three-phase three-level bridge as the cost model sees three-level space vector: each leg
 * steps at most four times a switching period (a seven-state sequence moves one leg one level a
 * step), the bound multilevelEdges gives three levels.
 */
const THREE_LEVEL = { topology: 'npc', levels: 3, phaseCount: 3 } as const;

/**
 * Upper bound of the edges per period of a multilevel bridge's voltages at frequency ratio mf:
 * each of the levels − 1 carriers (bands, or cells' carriers) of a leg crosses the reference
 * at most twice a carrier cycle, 2·(levels − 1)·(mf + 1) edges a leg (exact for phase-shifted
 * carriers, an overestimate for level-shifted ones, whose comparators are built all the same).
 * A three-phase bridge's phase to star point holds its three legs' edges and a line two; a
 * single-phase full bridge's output two legs', a cascaded string's its own. `build` counts
 * every waveform the library makes: the legs' outputs, each device's gate signal and each cell
 * (about three times a leg's edges), and the phase and line voltages.
 */
function multilevelEdges(
  modulation: { topology: string; levels: number; phaseCount: number },
  mf: number,
): { phase: number; leg: number; line: number; build: number } {
  const leg = 2 * (modulation.levels - 1) * (mf + 1);
  if (modulation.phaseCount === 3) {
    return { phase: 3 * leg, leg, line: 2 * leg, build: 3 * (3 * leg + 3 * leg + 2 * leg) };
  }
  const legs = modulation.topology === 'cascaded-h-bridge' ? 1 : 2;
  return { phase: legs * leg, leg, line: 0, build: legs * 3 * leg + legs * leg };
}

/** Switching edges per period of a modulation's voltages: one phase (or leg) and one line. */
export function modulationEdges(modulation: Modulation): {
  phase: number;
  leg: number;
  line: number;
} {
  switch (modulation.method) {
    case 'sine-triangle': {
      const edges = (modulation.scheme === 'unipolar' ? 4 : 2) * (modulation.mf + 1);
      return { phase: edges, leg: edges, line: 0 };
    }
    case 'three-phase':
      return {
        phase: 6 * (modulation.mf + 1),
        leg: 2 * (modulation.mf + 1),
        line: 4 * (modulation.mf + 1),
      };
    case 'space-vector': {
      // A ratio that is not whole repeats over up to 64 fundamental periods (the library's default).
      const ratio = Number.isInteger(modulation.frequencyRatio)
        ? modulation.frequencyRatio
        : 64 * Math.ceil(modulation.frequencyRatio);
      return { phase: 6 * (ratio + 1), leg: 2 * (ratio + 1), line: 4 * (ratio + 1) };
    }
    case 'selective-harmonic-elimination':
    case 'optimal-pattern': {
      const edges = 4 * (Array.isArray(modulation.angles) ? modulation.angles.length : 0);
      return { phase: edges, leg: edges, line: 0 };
    }
    case 'multilevel-carrier': {
      const { phase, leg, line } = multilevelEdges(modulation, modulation.mf);
      return { phase, leg, line };
    }
    case 'multilevel-space-vector': {
      const { phase, leg, line } = multilevelEdges(THREE_LEVEL, modulation.frequencyRatio);
      return { phase, leg, line };
    }
  }
}

/** The request field that sets a modulation's switching frequency (its edges). */
function edgeField(modulation: Modulation, prefix: string): string {
  if (modulation.method === 'space-vector' || modulation.method === 'multilevel-space-vector')
    return `${prefix}frequencyRatio`;
  if (
    modulation.method === 'sine-triangle' ||
    modulation.method === 'three-phase' ||
    modulation.method === 'multilevel-carrier'
  )
    return `${prefix}mf`;
  return `${prefix}angles`;
}

/** Every edge of every voltage of the bridge (what modulationVoltages builds). */
function allEdges(modulation: Modulation): number {
  if (modulation.method === 'multilevel-carrier')
    return multilevelEdges(modulation, modulation.mf).build;
  if (modulation.method === 'multilevel-space-vector')
    return multilevelEdges(THREE_LEVEL, modulation.frequencyRatio).build;
  const edges = modulationEdges(modulation);
  return modulationPhaseCount(modulation) === 3
    ? 3 * (edges.phase + edges.leg + edges.line)
    : edges.phase;
}

/** POST /spectra: the voltages built, then one voltage's spectrum to maxOrder and its exact THD. */
export function spectrumCost(
  modulation: Modulation,
  maxOrder: number,
  output?: string,
  prefix = 'modulation.',
): CostEstimate {
  const edges = modulationEdges(modulation);
  const analysed =
    edges.line > 0 && (output === undefined || output === 'line-to-line')
      ? edges.line
      : output === 'leg'
        ? edges.leg
        : edges.phase;
  return {
    work: allEdges(modulation) * BUILD_PER_EDGE + analysed * (maxOrder + 1),
    basis: `${analysed} edges × ${maxOrder + 1} orders`,
    fields: ['maxOrder', edgeField(modulation, prefix)],
    responseBytes: (maxOrder + 1) * 3 * BYTES_PER_NUMBER,
    responseFields: ['maxOrder'],
  };
}

/** POST /waveforms: every named voltage of the bridge, edges and levels. */
export function waveformCost(modulation: Modulation, prefix = 'modulation.'): CostEstimate {
  const edges = allEdges(modulation);
  return {
    work: edges * BUILD_PER_EDGE,
    basis: `${edges} edges`,
    fields: [edgeField(modulation, prefix)],
    responseBytes: (edges + modulationEdges(modulation).line) * 2 * BYTES_PER_NUMBER,
    responseFields: [edgeField(modulation, prefix)],
  };
}

/**
 * Upper bound of the switching edges per period of one phase's voltage (and a line's), from the
 * design alone, and of every waveform the library builds for it (`build`).
 */
function designEdges(
  design: InverterDesign,
  ratio: number,
): { phase: number; line: number; build: number } {
  const { modulation } = design;
  if (modulation.method === 'multilevel-carrier') return multilevelEdges(modulation, ratio);
  if (modulation.method === 'multilevel-space-vector') return multilevelEdges(THREE_LEVEL, ratio);
  const edges = designVoltageEdges(design, ratio);
  return {
    ...edges,
    build: (modulationPhaseCount(modulation) === 3 ? 3 : 1) * (edges.phase + edges.line),
  };
}

function designVoltageEdges(
  design: InverterDesign,
  ratio: number,
): { phase: number; line: number } {
  const { modulation } = design;
  switch (modulation.method) {
    case 'sine-triangle':
      return { phase: (modulation.scheme === 'unipolar' ? 4 : 2) * (ratio + 1), line: 0 };
    case 'three-phase':
    case 'space-vector':
      // Each leg switches twice a carrier period; a phase-to-star voltage holds all three legs' edges.
      return { phase: 6 * (ratio + 1), line: 4 * (ratio + 1) };
    case 'selective-harmonic-elimination':
    case 'optimal-pattern':
      return {
        phase: 4 * (Array.isArray(modulation.angles) ? modulation.angles.length : 0),
        line: 0,
      };
    case 'multilevel-carrier':
      return multilevelEdges(modulation, ratio);
    case 'multilevel-space-vector':
      return multilevelEdges(THREE_LEVEL, ratio);
  }
}

/** The smallest power of two ≥ n and ≥ 4 (the library's sample grids). */
function powerOfTwoAtLeast(n: number): number {
  let size = 4;
  while (size < n) size *= 2;
  return size;
}

/**
 * The design report (POST /designs/report, /load-current, /filters/lc, /harmonic-limits/check,
 * GET /studies/{id}/report, a study's check on save and its shared report). The estimate follows
 * analyseDesign's analysis: the legs' exact spectra (a single-phase bridge's output) read once, to
 * maxOrder or, with a filter, to its analysis and current orders (10·mf + 10 at least, at most
 * MAX_ANALYSIS_ORDER), every other spectrum combined from them; each phase solved through the
 * filter order by order; each labelled spectrum of the answer; each phase's current on its grid
 * of samples; time series of `points` samples (1 + 3 per phase with a filter, one per phase with
 * a load alone). A grid is each phase's load, and its figures solve phase a once more (two more
 * labelled spectra in the answer). The factors (REPORT_PER_TERM, …) are fitted to the report's
 * measured time and doubled; a span (a carrier no whole multiple of the fundamental) keeps one
 * unit a term of each voltage's sum over its q periods. A span with a filter or grid also reads
 * the legs' spectra to q·max(maxOrder, ⌈10·p/q⌉ + 10) span orders (q times the current order
 * with a filter), solves each phase (and the grid's phase a) there, synthesises the currents on
 * 16 samples a cycle of that order (at least 4096 a period) and labels the output's and the
 * grid's spectra, at the integer report's factors.
 * @param field - where the design sits in the request (`design`, `study.design`)
 */
export function reportCost(
  design: InverterDesign,
  options: AnalyseDesignOptions,
  field = 'design',
  optionFields: readonly string[] = ['maxOrder', 'points'],
): CostEstimate & { series: number; points: number } {
  const pattern = !CARRIER_METHODS.includes(design.modulation.method);
  // A carrier that is no whole multiple of the fundamental: the report covers the span of q
  // periods of its ratio p/q (p carrier cycles, q·maxOrder components a spectrum, the currents on
  // up to 2^19 samples); the library's refusals of such a span (designSpanMaxOrder) come first.
  const span = pattern ? null : callLibrary(`${field}.`, () => designCarrierSpan(design));
  const spanBound =
    span === null ? null : callLibrary(`${field}.`, () => designSpanMaxOrder(design, span));
  const ratio = pattern
    ? 0
    : (span?.p ?? Math.round((design.carrierFrequency ?? 0) / design.fundamentalFrequency));
  const q = span?.q ?? 1;
  const maxOrder =
    options.maxOrder ?? Math.min(defaultSpectrumOrder(design), spanBound ?? Infinity);
  const points = options.points ?? 1200;
  const phases = modulationPhaseCount(design.modulation);
  const edges = designEdges(design, ratio);
  const filtered = design.filter !== undefined && design.filter !== null;
  const analysisOrder = filtered
    ? Math.min(MAX_ANALYSIS_ORDER, Math.max(maxOrder, pattern ? 2000 : 10 * ratio + 10))
    : maxOrder;
  // The legs' exact spectra (a single-phase bridge's output), read once: to maxOrder, or with a
  // filter to its analysis and current orders (analyseDesign's); every other spectrum is built
  // from them. A span reads each of its voltages over q periods (analyseDesignSpan).
  const currentOrder = Math.min(
    MAX_ANALYSIS_ORDER,
    Math.max(defaultSpectrumOrder(design), 10 * (pattern ? 200 : ratio) + 10),
  );
  const readOrder = filtered ? Math.max(analysisOrder, currentOrder) : maxOrder;
  const legTerms =
    span === null ? edges.phase * readOrder : (edges.phase + edges.line) * q * maxOrder;
  const spectra = span === null ? Math.ceil(REPORT_PER_TERM * legTerms) : legTerms;
  const grid = design.grid !== undefined && design.grid !== null;
  const spanSamples =
    span === null || filtered || !(design.load || grid)
      ? 0
      : SPAN_LOAD_FIXED +
        SPAN_LOAD_PER_SAMPLE *
          phases *
          powerOfTwoAtLeast(Math.min(2 ** 19, Math.max(4096 * span.q, 64 * span.p)));
  const spanNetwork =
    span === null || !(filtered || grid) ? 0 : spanNetworkCost(design, span, maxOrder, spanBound);
  const currents = filtered || design.load !== undefined || grid;
  // Each phase's network solved order by order to readOrder (and phase a once more for a grid),
  // and each labelled spectrum: bridge, with three phases line and common mode, with currents
  // the DC link, with a filter its output, with a grid the grid's and the inverter's currents.
  const solvedOrders =
    span === null ? ((filtered ? phases : 0) + (grid ? 1 : 0)) * (readOrder + 1) : 0;
  const labelled =
    span === null
      ? 1 + (phases === 3 ? 2 : 0) + (currents ? 1 : 0) + (filtered ? 1 : 0) + (grid ? 2 : 0)
      : 0;
  const throughFilter = REPORT_PER_ORDER * solvedOrders;
  const labels = REPORT_PER_ORDER * labelled * (maxOrder + 1);
  // Each phase's current on its grid of samples: the filter's synthesis grid (16 samples a cycle
  // of the current order) or the exact load currents' (64 a carrier cycle, at most 2^17).
  const gridSamples =
    span !== null || !currents
      ? 0
      : filtered
        ? powerOfTwoAtLeast(Math.max(4096, 16 * currentOrder))
        : powerOfTwoAtLeast(Math.min(2 ** 17, Math.max(4096, 64 * (pattern ? 64 : ratio))));
  const currentSamples = REPORT_PER_SAMPLE * phases * gridSamples;
  const series =
    (filtered ? 1 + 3 * phases : 0) + (!filtered && (design.load || grid) ? phases : 0);
  const sampled = series * points * 20;
  const build = edges.build * BUILD_PER_EDGE;
  const voltages = phases === 3 ? 9 : 1;
  // The edges of every named voltage as JSON numbers (edges and levels). A multilevel report's
  // are counted exactly (phases, legs and lines of a three-phase bridge, each once) and it also
  // holds each leg's output, leg a's cells (as many edges as one leg), the modulator's
  // levels − 1 carriers, each sampled as the reference is, and the balance figures (a value and
  // its angle per carrier period for at most levels − 1 capacitors a leg).
  const { modulation } = design;
  let voltageNumbers = 2 * voltages * (edges.phase + edges.line);
  // A span's voltages counted each by its own edges (p carrier cycles: 3 phases, 3 legs of a
  // third of a phase's edges, 3 lines, and the common mode's, as many as a phase's), since
  // they are q times longer than a period's.
  if (span !== null && phases === 3)
    voltageNumbers = 2 * (3 * edges.phase + edges.phase + 3 * edges.line + edges.phase);
  if (modulation.method === 'multilevel-carrier') {
    const { phase, leg, line } = multilevelEdges(modulation, ratio);
    const legCount = phases === 3 ? 3 : modulation.topology === 'cascaded-h-bridge' ? 1 : 2;
    voltageNumbers =
      2 * (phases === 3 ? 3 * (phase + leg + line) : phase) +
      2 * (legCount + 1) * leg +
      (modulation.levels - 1) * Math.min(20_000, Math.max(points, 8 * ratio)) +
      2 * ratio * (modulation.levels - 1) * legCount;
  }
  // A three-level space-vector report holds its vector diagram: the 19 points (about 64 numbers'
  // worth) and a trajectory sample a switching period, two with asymmetric sampling (about 150
  // bytes each, 8 numbers' worth, measured).
  if (modulation.method === 'multilevel-space-vector')
    voltageNumbers += 64 + 8 * ratio * (modulation.sampling === 'asymmetric' ? 2 : 1);
  // The fields to lower, the largest share of the work first (the carrier sets the edges of every
  // sum, but is named first only where it also sets the filter's analysis order); options the
  // route does not take are left out.
  const fromCarrier = (readOrder > maxOrder ? spectra + throughFilter : 0) + currentSamples;
  const shares: [string, number][] = [
    [`${field}.carrierFrequency`, pattern ? 0 : build + fromCarrier + spanSamples + spanNetwork],
    [`${field}.modulation.levels`, modulation.method === 'multilevel-carrier' ? build : 0],
    ['maxOrder', spectra + throughFilter + labels + currentSamples - fromCarrier],
    ['points', sampled],
  ];
  const fields = shares
    .filter(
      ([name, share]) => share > 0 && (name.startsWith(`${field}.`) || optionFields.includes(name)),
    )
    .sort((a, b) => b[1] - a[1])
    .map(([name]) => name);
  return {
    work:
      spectra +
      throughFilter +
      labels +
      currentSamples +
      build +
      sampled +
      spanSamples +
      spanNetwork,
    basis:
      span === null
        ? `${edges.phase} edges × ${readOrder + 1} orders of the legs' spectra + ${labelled} labelled spectra × ${maxOrder + 1} orders${filtered ? ` + ${phases} phases × ${readOrder + 1} orders and ${gridSamples} samples through the filter` : ''}${grid ? ` + ${readOrder + 1} orders for the grid` : ''}${!filtered && gridSamples ? ` + ${phases} × ${gridSamples} current samples` : ''}${series ? ` + ${series} series × ${points} points` : ''}`
        : `${edges.phase + edges.line} edges × ${q * maxOrder} orders over ${span.q} fundamental periods (${span.p}/${span.q})${spanNetwork ? ` + ${sci(spanNetwork)} units through the ${filtered ? 'filter' : 'grid'} over the span` : ''}${series ? ` + ${series} series × ${points} points` : ''}`,
    fields: fields.length ? fields : [field],
    // Labelled spectra (about five numbers an order and voltage), time series, and the edges of each voltage.
    responseBytes:
      span === null
        ? BYTES_PER_NUMBER *
          (5 * (maxOrder + 1) * ((filtered ? 3 : 2) + (grid ? 2 : 0)) +
            series * points +
            voltageNumbers)
        : // A span's four labelled spectra (bridge, line, common mode, DC link), the filter's
          // output and the grid's two currents, and its voltages.
          SPAN_BYTES_PER_COMPONENT *
            (q * maxOrder + 1) *
            (4 + (filtered ? 1 : 0) + (grid ? 2 : 0)) +
          SPAN_BYTES_PER_VOLTAGE_NUMBER * voltageNumbers +
          BYTES_PER_NUMBER * series * points,
    // A span's size is set by its carrier cycles p as much as by the orders. Where the caller
    // can lower no option (a study's trial analysis), the design's carrier is named: it sets the
    // voltages' edges and the default order (a stored pattern's size is its modulation's).
    responseFields: responseFieldsOf(span !== null, pattern, field, optionFields),
    series,
    points,
  };
}

/**
 * The fields that set a design report's size, in the order to lower them: a span's carrier, then
 * the options the caller can lower (`optionFields` of maxOrder and points), and when there are
 * none, the design's carrier (or a stored pattern's modulation), so a refusal always names one.
 */
function responseFieldsOf(
  isSpan: boolean,
  pattern: boolean,
  field: string,
  optionFields: readonly string[],
): string[] {
  const options = ['maxOrder', 'points'].filter((name) => optionFields.includes(name));
  if (isSpan) return [`${field}.carrierFrequency`, ...options];
  if (options.length) return options;
  return [pattern ? `${field}.modulation` : `${field}.carrierFrequency`];
}

/**
 * The work a span with a filter or grid adds (analyseDesignSpan): the legs' spectra to the span
 * orders the network is solved to, q·max(maxOrder, ⌈10·p/q⌉ + 10) with a filter (each at least
 * the span's current order) and q·maxOrder with a grid alone, a quarter unit a term; each phase
 * and the grid's phase a solved there and the output's and grid's spectra labelled, 40 units an
 * order; with a filter the currents synthesised on max(4096·q, 16 × the span's current order)
 * samples a phase, 60 units a sample (the integer report's factors, REPORT_PER_*).
 */
function spanNetworkCost(
  design: InverterDesign,
  span: { p: number; q: number },
  maxOrder: number,
  spanBound: number | null,
): number {
  const { p, q } = span;
  const filtered = design.filter !== undefined && design.filter !== null;
  const grid = design.grid !== undefined && design.grid !== null;
  const phases = modulationPhaseCount(design.modulation);
  const analysisOrder = filtered ? Math.max(maxOrder, Math.ceil((10 * p) / q) + 10) : maxOrder;
  const currentOrder = filtered
    ? Math.max(Math.min(defaultSpectrumOrder(design), spanBound ?? Infinity), analysisOrder)
    : maxOrder;
  const spanOrders = q * currentOrder;
  const edges = designEdges(design, p);
  const terms = REPORT_PER_TERM * edges.phase * spanOrders;
  const solved = ((filtered ? phases : 0) + (grid ? 1 : 0)) * (spanOrders + 1);
  const labelled = ((filtered ? 1 : 0) + (grid ? 2 : 0)) * (q * maxOrder + 1);
  const samples = filtered ? phases * powerOfTwoAtLeast(Math.max(4096 * q, 16 * spanOrders)) : 0;
  return Math.ceil(terms + REPORT_PER_ORDER * (solved + labelled) + REPORT_PER_SAMPLE * samples);
}

/**
 * GET /studies/{id}/spectrum and a capture comparison's prediction: the design's bridge voltage.
 * A carrier that is no whole multiple of the fundamental (designCarrierSpan's p/q) builds the
 * voltage over p carrier cycles and sums q·maxOrder + 1 span components.
 */
export function designSpectrumCost(
  design: InverterDesign,
  maxOrder: number,
  field = 'design',
): CostEstimate {
  const pattern = !CARRIER_METHODS.includes(design.modulation.method);
  const span = pattern ? null : callLibrary(`${field}.`, () => designCarrierSpan(design));
  const ratio = pattern
    ? 0
    : (span?.p ?? Math.round((design.carrierFrequency ?? 0) / design.fundamentalFrequency));
  const orders = (span?.q ?? 1) * maxOrder + 1;
  const edges = designEdges(design, ratio);
  const analysed = edges.line || edges.phase;
  return {
    work:
      Math.max(edges.build, 3 * (edges.phase + edges.line)) * BUILD_PER_EDGE + analysed * orders,
    basis: `${analysed} edges × ${orders} orders${span === null ? '' : ` over ${span.q} fundamental periods (${span.p}/${span.q})`}`,
    fields: pattern ? ['maxOrder'] : ['maxOrder', `${field}.carrierFrequency`],
    responseBytes: orders * 3 * BYTES_PER_NUMBER,
    responseFields: span === null ? ['maxOrder'] : ['maxOrder', `${field}.carrierFrequency`],
  };
}

/**
 * POST /designs/asynchronous-spectra: the carrier's ratio as the nearest p/q (the library's
 * designRationalRatio, so a bad carrier is refused here, before any work), every voltage built
 * over the q-period span (p carrier cycles), and phase a, leg a and line a−b (one voltage for a
 * single-phase bridge) summed to q·maxOrder span orders; five numbers an order in the answer.
 */
export function asynchronousSpectraCost(design: InverterDesign, maxOrder: number): CostEstimate {
  if (!CARRIER_METHODS.includes(design.modulation.method)) {
    const message = `design.modulation.method must be one of ${CARRIER_METHODS.map((m) => `'${m}'`).join(', ')} (a method with a carrier); got '${design.modulation.method}'`;
    throw badRequest(message, [{ path: 'design.modulation.method', message }]);
  }
  const { p, q } = callLibrary('design.', () => designRationalRatio(design));
  const edges = designEdges(design, p);
  const phases = modulationPhaseCount(design.modulation);
  // Leg a switches a third as often as phase a to the star point (2 against 6 edges a carrier cycle).
  const analysed = phases === 3 ? edges.phase + edges.phase / 3 + edges.line : edges.phase;
  const orders = q * maxOrder + 1;
  const voltages = phases === 3 ? 3 : 1;
  return {
    work: phases * analysed * BUILD_PER_EDGE + analysed * orders,
    basis: `${analysed} edges × ${orders} orders over ${q} fundamental periods`,
    fields: ['maxOrder', 'design.carrierFrequency'],
    responseBytes: voltages * orders * 5 * BYTES_PER_NUMBER,
    responseFields: ['maxOrder'],
  };
}

export type TimerFormat = 'json' | 'csv' | 'c-header';

/**
 * POST /timer-tables: rows (tableLength, by default one per compare update: carrier ÷
 * fundamental, twice that with asymmetric sampling) × channels (legs), and the file's size.
 */
export function timerTableCost(options: TimerTableOptions, format: TimerFormat): CostEstimate {
  const ratio = options.carrierFrequency / options.fundamentalFrequency;
  const updates = Math.round(ratio) * (options.sampling === 'regular-asymmetric' ? 2 : 1);
  const rows =
    options.tableLength ?? (Number.isFinite(updates) ? Math.max(1, updates) : Number.MAX_VALUE);
  const channels = options.modulation.method === 'three-phase' ? 3 : 2;
  const sizeFields =
    options.tableLength === undefined
      ? ['tableLength', 'carrierFrequency', 'fundamentalFrequency']
      : ['tableLength'];
  return {
    work: rows * channels * TIMER_PER_ROW_CHANNEL,
    basis: `${rows} rows × ${channels} channels${options.tableLength === undefined ? ' (the default table length, one row per compare update)' : ''}`,
    fields: sizeFields,
    responseBytes: rows * channels * TIMER_BYTES_PER_ROW_CHANNEL[format],
    responseFields: sizeFields,
  };
}

/**
 * Units per compare value of a multilevel timer table (an entry of one complementary pair),
 * written: 150–400 ns measured for 240 000 values of a 17-level cascaded three-phase table, the
 * CSV the slowest (its angles), so 400 units.
 */
const MULTILEVEL_TIMER_PER_VALUE = 400;
/**
 * Bytes per compare value by format: measured 90, 37 and 14 on a table of 16 counters and 48
 * pairs; rounded up for the tables with a counter per pair (a level-shifted single-phase cascaded
 * string), whose per-counter angles add about 20 bytes (JSON 30) a value.
 */
const MULTILEVEL_TIMER_BYTES_PER_VALUE = { json: 130, csv: 60, 'c-header': 20 } as const;

/**
 * POST /multilevel-timer-tables: rows (tableLength, by default one per compare update: carrier ÷
 * fundamental, twice that with asymmetric sampling) × complementary pairs (levels − 1 per leg;
 * two legs for a single-phase full bridge, one string for a single-phase cascaded bridge, three
 * for three-phase), and the file's size.
 */
export function multilevelTimerTableCost(
  options: MultilevelTimerTableOptions,
  format: TimerFormat,
): CostEstimate {
  const { modulation } = options;
  const ratio = options.carrierFrequency / options.fundamentalFrequency;
  const updates = Math.round(ratio) * (modulation.sampling === 'regular-asymmetric' ? 2 : 1);
  const rows =
    options.tableLength ?? (Number.isFinite(updates) ? Math.max(1, updates) : Number.MAX_VALUE);
  const legs =
    modulation.phaseCount === 3 ? 3 : modulation.topology === 'cascaded-h-bridge' ? 1 : 2;
  const pairs = legs * (modulation.levels - 1);
  const sizeFields =
    options.tableLength === undefined
      ? ['tableLength', 'carrierFrequency', 'fundamentalFrequency']
      : ['tableLength'];
  return {
    work: rows * pairs * MULTILEVEL_TIMER_PER_VALUE,
    basis: `${rows} rows × ${pairs} complementary pairs${options.tableLength === undefined ? ' (the default table length, one row per compare update)' : ''}`,
    fields: [...sizeFields, 'modulation.levels'],
    responseBytes: rows * pairs * MULTILEVEL_TIMER_BYTES_PER_VALUE[format],
    responseFields: [...sizeFields, 'modulation.levels'],
  };
}

/** Bytes of one (time, value) point of a netlist (measured 24.2–25.0 with its comments; rounded up). */
const NETLIST_BYTES_PER_POINT = 26;
/** Units per netlist point (building and writing it, as a time-series value). */
const NETLIST_PER_POINT = 20;

/**
 * POST /netlists: the timer table, then two points (a ramp's start and end) per edge of each
 * source, plus its first and last. Each source (two gates and one leg voltage per leg, three
 * legs or two) switches twice per carrier period: 4 points per carrier period and source over
 * `periods` periods (default 1); measured 4.00–4.03 with the first and last points.
 */
export function netlistCost(request: {
  timerTable: TimerTableOptions;
  periods?: number;
}): CostEstimate {
  const options = request.timerTable;
  const table = timerTableCost(options, 'json');
  const ratio = Math.round(options.carrierFrequency / options.fundamentalFrequency);
  const signals = 3 * (options.modulation.method === 'three-phase' ? 3 : 2);
  const periods = request.periods ?? 1;
  const points = signals * (4 * Math.max(1, ratio) * periods + 2);
  const fields = ['periods', 'timerTable.carrierFrequency'];
  return {
    work: table.work + points * NETLIST_PER_POINT,
    basis: `${table.basis}, then about ${points} points (${signals} sources × ${periods} periods)`,
    fields: [
      ...fields,
      ...table.fields.map((f) => `timerTable.${f}`).filter((f) => !fields.includes(f)),
    ],
    responseBytes: points * NETLIST_BYTES_PER_POINT,
    responseFields: fields,
  };
}

/** POST /captures/{id}/spectrum: an FFT of the capture's samples, harmonics to maxOrder. */
export function captureSpectrumCost(samples: number, maxOrder: number): CostEstimate {
  const stages = Math.max(1, Math.ceil(Math.log2(Math.max(2, samples))));
  return {
    work: 16 * samples * stages,
    basis: `the capture's ${samples} samples × ${stages} FFT stages`,
    fields: ['id'],
    responseBytes: (maxOrder + 1) * 5 * BYTES_PER_NUMBER,
    responseFields: ['maxOrder'],
  };
}

/**
 * POST /captures: checking and parsing the uploaded CSV, 20 units a byte (a 4.3 MB file of
 * 160 000 rows took 0.43 s). Its size is bounded by the upload limit (5 MB), not by a budget.
 */
export function captureUploadCost(bytes: number): CostEstimate {
  return {
    work: 20 * bytes,
    basis: `${bytes} bytes of CSV`,
    fields: ['file'],
    responseBytes: 1000,
    responseFields: [],
  };
}

/** POST /space-vector: one reference's dwell times and sequence. */
export function spaceVectorCost(): CostEstimate {
  return {
    work: 1000,
    basis: 'one reference vector',
    fields: [],
    responseBytes: 2000,
    responseFields: [],
  };
}

/** An ma sweep job: at each point the waveform built and its spectrum to maxOrder. */
export function maSweepCost(input: MaSweepInput): CostEstimate {
  const { points } = input.ma;
  const edges = modulationEdges(input.modulation);
  const analysed = edges.line || edges.phase;
  const perPoint = allEdges(input.modulation) * BUILD_PER_EDGE + analysed * (input.maxOrder + 1);
  return {
    work: points * perPoint,
    basis: `${points} points × ${analysed} edges × ${input.maxOrder + 1} orders`,
    fields: ['ma.points', 'maxOrder', edgeField(input.modulation, 'modulation.')],
    responseBytes: points * (6 + (input.orders?.length ?? 0)) * BYTES_PER_NUMBER,
    responseFields: ['ma.points'],
  };
}

/** A SHE sweep job: a Newton solve of `count` angles at each point, costed at its worst. */
export function sheSweepCost(input: SheSweepInput): CostEstimate {
  const { points } = input.fundamental;
  return {
    work: points * input.count * input.count * SHE_PER_ANGLE_SQUARED,
    basis: `${points} points × ${input.count} angles squared, a Newton solve that does not converge at worst`,
    fields: ['fundamental.points', 'count'],
    responseBytes: points * (input.count + 3) * BYTES_PER_NUMBER,
    responseFields: ['fundamental.points', 'count'],
  };
}

/** Which budget an estimate is held to. */
export type CostKind = 'request' | 'job';

/**
 * Refuses, before any work, what exceeds the budget of its kind (400 naming the fields and the
 * limit, in the words of the setting that raises it), and an answer larger than the response
 * budget. Returns the estimate so a caller can decide where the work runs.
 */
export function assertWithinBudget(
  cost: CostEstimate,
  kind: CostKind,
  limits: ComputeLimits,
): CostEstimate {
  const budget = kind === 'job' ? limits.jobWorkBudget : limits.requestWorkBudget;
  if (cost.work > budget) {
    const names = cost.fields.length ? cost.fields.join(' and ') : 'this request';
    const setting = kind === 'job' ? 'JOB_WORK_BUDGET' : 'COMPUTE_WORK_BUDGET';
    const advice =
      kind === 'job'
        ? 'lower them or split the sweep'
        : 'lower them, or run the work as a sweep job';
    const message = `${names} ask for about ${sci(cost.work)} units of work (${cost.basis}), more than the ${sci(budget)} one ${kind} may take (${setting}); ${advice}`;
    throw badRequest(
      message,
      (cost.fields.length ? cost.fields : ['']).map((path) => ({ path, message })),
    );
  }
  if (cost.responseBytes > limits.responseBytesBudget) {
    const names = cost.responseFields.join(' and ');
    const message = `${names} would make an answer of about ${(cost.responseBytes / 1e6).toFixed(1)} MB, more than the ${(limits.responseBytesBudget / 1e6).toFixed(1)} MB one answer may hold (RESPONSE_BYTES_BUDGET); lower them`;
    throw badRequest(
      message,
      cost.responseFields.map((path) => ({ path, message })),
    );
  }
  return cost;
}

/**
 * The report's own bound on its time series: at most REPORT_SERIES_BUDGET values (points ×
 * series), named by `points` with the most this design allows.
 */
export const REPORT_SERIES_BUDGET = 40_000;

export function assertReportSeries(cost: { series: number; points: number }): void {
  if (cost.series * cost.points > REPORT_SERIES_BUDGET) {
    const most = Math.floor(REPORT_SERIES_BUDGET / cost.series);
    const message = `points must be ≤ ${most} for this design (${cost.series} time series of points samples each, at most ${REPORT_SERIES_BUDGET} values); got ${cost.points}`;
    throw badRequest(message, [{ path: 'points', message }]);
  }
}
