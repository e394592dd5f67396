import {
  analyseDesign,
  assertInverterDesign,
  CARRIER_METHODS,
  defaultSpectrumOrder,
  designModulation,
  MAX_ANALYSIS_ORDER,
  harmonics,
  modulationVoltages,
  spaceVectorSequence,
  thd,
  THREE_PHASE_METHODS,
  timerTable,
  timerTableToCHeader,
  timerTableToCsv,
  timerTableToJson,
  waveformThd,
  waveformWthd,
  type AnalyseDesignOptions,
  type DesignReport,
  type Harmonic,
  type InverterDesign,
  type Modulation,
  type NamedVoltage,
  type SineTriangleModulation,
  type SpaceVectorSequence,
  type SpaceVectorSequenceOptions,
  type ThreePhaseCarrierModulation,
  type TimerTableOptions,
  type Waveform,
} from '@pulsewright/modulation';
import { badRequest } from '../http/errors.js';
import { callLibrary, finiteResult } from './library.js';

/**
 * Which voltage of a three-phase bridge the spectrum and waveform routes analyse: line a−b (the
 * default, as scripts have always read it), leg a to the DC midpoint, or phase a to the star
 * point of a balanced star load. A single-phase bridge has one output, its `phase` voltage.
 */
export type VoltageOutput = 'line-to-line' | 'leg' | 'phase';

/** The methods whose modulation index a sweep can vary. */
export type CarrierModulation = SineTriangleModulation | ThreePhaseCarrierModulation;

export interface SpectrumResult {
  /** The voltage analysed, named by the library (e.g. `bridge output`, `line a−b`). */
  name: string;
  harmonics: Harmonic[];
  /** Exact over the whole waveform (waveformThd, waveformWthd). */
  thd: number;
  wthd: number;
  /** THD of orders 2..maxOrder only. */
  spectrumThd: number;
}

export interface WaveformResult {
  name: string;
  waveform: Waveform;
  traces: NamedVoltage[];
}

/** Report options the library names by themselves (the rest of its fields sit in the design). */
const OPTION_FIELDS = ['maxOrder', 'points', 'busVoltage'] as const;

/**
 * Most harmonic-sum work one report request may ask for: switching edges × orders summed (the
 * exact spectra and, with a filter, every phase to the analysis order). Every design the schema
 * allows fits (a three-phase design at mf 1000 with a filter is about 2.1·10⁸, some 1.5 s); the
 * budget stops a later widening of the bounds from making one request block the service.
 */
export const REPORT_WORK_BUDGET = 2.5e8;

/**
 * Most time-series values one report may return (points × the currents and voltages sampled):
 * 40 000 keeps the answer near 1 MB; a three-phase design with a filter and a load samples ten
 * series, so up to 4000 points a period.
 */
export const REPORT_SERIES_BUDGET = 40_000;

/** Upper bound of the switching edges per period of one phase's voltage, from the design alone. */
function edgesPerPhase(design: InverterDesign, ratio: number): { phase: number; line: number } {
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
      return { phase: 4 * (Array.isArray(modulation.angles) ? modulation.angles.length : 0), line: 0 };
  }
}

/**
 * Refuses, before any work, a report whose cost would exceed the budgets above (400 naming the
 * option to lower). The estimates follow analyseDesign's documented analysis (its analysisOrder,
 * its series); the schema has already bounded every input.
 */
export function assertReportBudget(design: InverterDesign, options: AnalyseDesignOptions, field = 'design'): void {
  const pattern = !CARRIER_METHODS.includes(design.modulation.method);
  const ratio = pattern ? 0 : Math.round((design.carrierFrequency ?? 0) / design.fundamentalFrequency);
  const maxOrder = options.maxOrder ?? defaultSpectrumOrder(design);
  const points = options.points ?? 1200;
  const phases = THREE_PHASE_METHODS.includes(design.modulation.method) ? 3 : 1;
  const edges = edgesPerPhase(design, ratio);
  const filtered = design.filter !== undefined && design.filter !== null;
  const analysisOrder = filtered ? Math.min(MAX_ANALYSIS_ORDER, Math.max(maxOrder, pattern ? 2000 : 10 * ratio + 10)) : maxOrder;
  const work = (edges.phase + edges.line) * maxOrder + (filtered ? phases * edges.phase * analysisOrder : 0);
  if (work > REPORT_WORK_BUDGET) {
    const path = filtered && analysisOrder > maxOrder ? `${field}.carrierFrequency` : 'maxOrder';
    const message =
      `${path} asks for about ${work.toPrecision(2)} edge-order sums, more than the ${REPORT_WORK_BUDGET.toPrecision(2)} one request may take; ` +
      'lower the carrier frequency or maxOrder, or run the study as a sweep job';
    throw badRequest(message, [{ path, message }]);
  }
  const series = (filtered ? 1 + 3 * phases : 0) + (!filtered && design.load ? phases : 0);
  if (series * points > REPORT_SERIES_BUDGET) {
    const most = Math.floor(REPORT_SERIES_BUDGET / series);
    const message = `points must be ≤ ${most} for this design (${series} time series of points samples each, at most ${REPORT_SERIES_BUDGET} values); got ${points}`;
    throw badRequest(message, [{ path: 'points', message }]);
  }
}

/**
 * The voltage of a modulation that spectra and waveforms analyse, with every named voltage of
 * the bridge, from the library's `modulationVoltages` (the one dispatch over methods).
 * @param prefix - where the modulation sits in the request, for the field names of errors
 */
export function modulationOutput(modulation: Modulation, output?: VoltageOutput, prefix = 'modulation.'): WaveformResult {
  const voltages = callLibrary(prefix, () => modulationVoltages(modulation));
  const traces = [...voltages.phases, ...voltages.legs, ...voltages.lines];
  if (voltages.phaseCount === 1) {
    if (output !== undefined && output !== 'phase') {
      const message = `output must be 'phase' or left out for method '${modulation.method}': a single-phase bridge has one output voltage; got ${JSON.stringify(output)}`;
      throw badRequest(message, [{ path: 'output', message }]);
    }
    const [bridge] = voltages.phases as [NamedVoltage];
    return { name: bridge.name, waveform: bridge.waveform, traces };
  }
  const chosen = (output === 'leg' ? voltages.legs : output === 'phase' ? voltages.phases : voltages.lines)[0] as NamedVoltage;
  return { name: chosen.name, waveform: chosen.waveform, traces };
}

/** Exact spectrum to maxOrder of one voltage, with THD and WTHD exact over the whole waveform. */
export function voltageSpectrum(voltage: NamedVoltage, maxOrder: number, field = 'modulation'): SpectrumResult {
  const result = callLibrary(`${field}.`, () => {
    const spectrum = harmonics(voltage.waveform, maxOrder);
    return {
      name: voltage.name,
      harmonics: spectrum,
      thd: waveformThd(voltage.waveform),
      wthd: waveformWthd(voltage.waveform),
      spectrumThd: thd(spectrum),
    };
  });
  return finiteResult(field, result);
}

export function computeSpectrum(modulation: Modulation, maxOrder: number, output?: VoltageOutput): SpectrumResult {
  return voltageSpectrum(modulationOutput(modulation, output), maxOrder);
}

/** The spectrum of a design's bridge as /spectra gives it for the design's full modulation. */
export function designSpectrum(design: InverterDesign, maxOrder: number, field = 'design'): SpectrumResult {
  const modulation = callLibrary(`${field}.`, () => designModulation(design));
  return voltageSpectrum(modulationOutput(modulation, undefined, `${field}.modulation.`), maxOrder, field);
}

/**
 * The design report (the library's analyseDesign). Errors name the field by its path in the
 * request: `design.modulation.ma`, `design.carrierFrequency`, or the option (`maxOrder`).
 */
export function designReport(design: InverterDesign, options: AnalyseDesignOptions = {}, field = 'design'): DesignReport {
  // The design's own checks first (cheap), so the budget estimate reads a valid design.
  callLibrary(`${field}.`, () => assertInverterDesign(design));
  assertReportBudget(design, options, field);
  const report = callLibrary(`${field}.`, () => analyseDesign(design, options), OPTION_FIELDS);
  return finiteResult(field, report);
}

/**
 * Refuses (400 naming `design.<field>` in the library's words) a design the library will not
 * analyse, so a study is never stored with one: the schema bounds each field, assertInverterDesign
 * and a trial analysis check what a schema cannot (a whole frequency ratio, ascending angles,
 * exactly one of m and ma, a filter or load so extreme its figures leave double precision).
 */
export function assertDesign(design: InverterDesign, field = 'design'): void {
  designReport(design, { maxOrder: 50, points: 64 }, field);
}

/** A function from ma to the analysed waveform, for sweeps of the carrier methods. */
export function waveformAtMa(modulation: CarrierModulation): (ma: number) => Waveform {
  return (ma) => modulationOutput({ ...modulation, ma }).waveform;
}

/** The part of a design's report that the load-current route returns (currents of each phase). */
export interface LoadCurrentResult {
  phaseCount: 1 | 3;
  voltage: string;
  currents: DesignReport['currents'];
  loadPower: number;
}

export function computeLoadCurrent(design: InverterDesign, points?: number): LoadCurrentResult {
  if (!design.load) {
    const message = 'design.load is required: the currents are those of the design\'s load (r, l and an optional emf)';
    throw badRequest(message, [{ path: 'design.load', message }]);
  }
  const report = designReport(design, points === undefined ? {} : { points });
  return { phaseCount: report.phaseCount, voltage: report.bridge.name, currents: report.currents, loadPower: report.loadPower ?? 0 };
}

/** The part of a design's report that the filter route returns. */
export interface FilterResult {
  filter: NonNullable<DesignReport['filter']>;
  bridge: DesignReport['bridge'];
  output: NonNullable<DesignReport['output']>;
}

export function computeFilter(design: InverterDesign, options: Pick<AnalyseDesignOptions, 'maxOrder' | 'points'>): FilterResult {
  if (!design.filter) {
    const message = 'design.filter is required: give the LC filter (l, c and optional damping) to analyse';
    throw badRequest(message, [{ path: 'design.filter', message }]);
  }
  const report = designReport(design, options);
  return { filter: report.filter as FilterResult['filter'], bridge: report.bridge, output: report.output as FilterResult['output'] };
}

/** The harmonic-limit check of a design's report (at the filter's output where there is one). */
export function checkDesignLimits(design: InverterDesign, busVoltage?: number): DesignReport['limitCheck'] {
  return designReport(design, busVoltage === undefined ? {} : { busVoltage }).limitCheck;
}

export function computeSpaceVector(m: number, theta: number, options: SpaceVectorSequenceOptions): SpaceVectorSequence {
  return callLibrary('', () => spaceVectorSequence({ m, theta }, options));
}

export type TimerFormat = 'json' | 'csv' | 'c-header';

export interface TimerDownload {
  body: string;
  contentType: string;
  fileName: string;
}

/** A timer table rendered by the library in the format asked for, ready to download. */
export function computeTimerTable(options: TimerTableOptions, format: TimerFormat, prefix = 'pwm_table'): TimerDownload {
  return callLibrary('', () => {
    const table = timerTable(options);
    if (format === 'csv') return { body: timerTableToCsv(table), contentType: 'text/csv; charset=utf-8', fileName: `${prefix}.csv` };
    if (format === 'c-header') {
      return { body: timerTableToCHeader(table, { prefix }), contentType: 'text/x-c; charset=utf-8', fileName: `${prefix}.h` };
    }
    return { body: timerTableToJson(table), contentType: 'application/json; charset=utf-8', fileName: `${prefix}.json` };
  });
}
