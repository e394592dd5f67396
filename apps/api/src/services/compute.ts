import {
  analyseDesign,
  assertInverterDesign,
  asynchronousDesignSpectra,
  designCarrierSpan,
  designModulation,
  designSpanSpectrum,
  fftSpectrum,
  modulationVoltages,
  multilevelTimerTable,
  multilevelTimerTableToCHeader,
  multilevelTimerTableToCsv,
  multilevelTimerTableToJson,
  spaceVectorSequence,
  timerTableToCHeader,
  timerTableToCsv,
  timerTableToJson,
  type AnalyseDesignOptions,
  type AsynchronousDesignSpectra,
  type CarrierSpanFigures,
  type DesignReport,
  type FftWindowName,
  type Harmonic,
  type InverterDesign,
  type Modulation,
  type MultilevelTimerTableOptions,
  type NamedVoltage,
  type SineTriangleModulation,
  type SpaceVectorSequence,
  type SpaceVectorSequenceOptions,
  type ThreePhaseCarrierModulation,
  type Waveform,
  voltageSpectrumFigures,
} from '@pulsewright/modulation';
import { badRequest } from '../http/errors.js';
import type { TimerFormat } from './cost.js';
import { callLibrary, finiteResult, finiteSpectrum } from './library.js';
import { requestedTimerTable, type TimerTableRequest } from './requestedTimerTable.js';

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
  /** A carrier that is no whole multiple of the fundamental: the span (harmonics at orders n/q). */
  carrierSpan?: CarrierSpanFigures;
}

export interface WaveformResult {
  name: string;
  waveform: Waveform;
  traces: NamedVoltage[];
}

/** Report options the library names by themselves (the rest of its fields sit in the design). */
const OPTION_FIELDS = ['maxOrder', 'points', 'busVoltage'] as const;

/**
 * The voltage of a modulation that spectra and waveforms analyse, with every named voltage of
 * the bridge, from the library's `modulationVoltages` (the one dispatch over methods).
 * @param prefix - where the modulation sits in the request, for the field names of errors
 */
export function modulationOutput(
  modulation: Modulation,
  output?: VoltageOutput,
  prefix = 'modulation.',
): WaveformResult {
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
  const chosen = (
    output === 'leg' ? voltages.legs : output === 'phase' ? voltages.phases : voltages.lines
  )[0] as NamedVoltage;
  return { name: chosen.name, waveform: chosen.waveform, traces };
}

/**
 * Exact spectrum to maxOrder of one voltage, with THD and WTHD exact over the whole waveform: the
 * library's `voltageSpectrumFigures`, the numbers the design report gives, in the route's shape.
 */
export function voltageSpectrum(
  voltage: NamedVoltage,
  maxOrder: number,
  field = 'modulation',
): SpectrumResult {
  // Unlabelled: the answer carries order, amplitude and phase only, so no label is built per order.
  const result = callLibrary(`${field}.`, () => {
    const { name, spectrum, thd, wthd, spectrumThd } = voltageSpectrumFigures(voltage, {
      maxOrder,
    });
    return { name, harmonics: spectrum, thd, wthd, spectrumThd };
  });
  return finiteSpectrum(field, result);
}

export function computeSpectrum(
  modulation: Modulation,
  maxOrder: number,
  output?: VoltageOutput,
): SpectrumResult {
  return voltageSpectrum(modulationOutput(modulation, output), maxOrder);
}

/** The spectrum of a design's bridge as /spectra gives it for the design's full modulation. */
export function designSpectrum(
  design: InverterDesign,
  maxOrder: number,
  field = 'design',
): SpectrumResult {
  // A carrier that is no whole multiple of the fundamental: the bridge voltage over its span,
  // components at every n/q (the library's designSpanSpectrum, as the report's).
  const span = callLibrary(`${field}.`, () => designCarrierSpan(design));
  if (span !== null)
    return finiteResult(
      field,
      callLibrary(`${field}.`, () => designSpanSpectrum(design, span, { maxOrder }), ['maxOrder']),
    );
  const modulation = callLibrary(`${field}.`, () => designModulation(design));
  return voltageSpectrum(
    modulationOutput(modulation, undefined, `${field}.modulation.`),
    maxOrder,
    field,
  );
}

/**
 * The design report (the library's analyseDesign). Its cost is checked before it is called
 * (services/cost.ts `reportCost`, by ComputeService). Errors name the field by its path in the
 * request: `design.modulation.ma`, `design.carrierFrequency`, or the option (`maxOrder`).
 */
export function designReport(
  design: InverterDesign,
  options: AnalyseDesignOptions = {},
  field = 'design',
): DesignReport {
  callLibrary(`${field}.`, () => assertInverterDesign(design));
  const report = callLibrary(`${field}.`, () => analyseDesign(design, options), OPTION_FIELDS);
  return finiteResult(field, report);
}

/**
 * The spectra of a carrier design whose carrier need not be a whole multiple of the fundamental
 * (the library's asynchronousDesignSpectra: the nearest p/q with q ≤ 64, its carrier error in
 * hertz, phase a, leg a and line a−b over q fundamental periods, orders labelled as fractions).
 * Its cost is checked first (services/cost.ts `asynchronousSpectraCost`). Errors name
 * `design.<field>` or `maxOrder`.
 */
export function asynchronousSpectra(
  design: InverterDesign,
  maxOrder: number,
): AsynchronousDesignSpectra {
  const result = callLibrary('design.', () => asynchronousDesignSpectra(design, { maxOrder }), [
    'maxOrder',
  ]);
  return finiteResult('design', result);
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

/**
 * A function from ma to the analysed voltage, for sweeps of the carrier methods: the voltage
 * {@link modulationOutput} picks (a single-phase bridge's output, a three-phase bridge's line a−b)
 * with the library's name for it.
 */
export function voltageAtMa(modulation: CarrierModulation): (ma: number) => WaveformResult {
  return (ma) => modulationOutput({ ...modulation, ma });
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
    const message =
      "design.load is required: the currents are those of the design's load (r, l and an optional emf)";
    throw badRequest(message, [{ path: 'design.load', message }]);
  }
  const report = designReport(design, points === undefined ? {} : { points });
  return {
    phaseCount: report.phaseCount,
    voltage: report.bridge.name,
    currents: report.currents,
    loadPower: report.loadPower ?? 0,
  };
}

/** The part of a design's report that the filter route returns. */
export interface FilterResult {
  filter: NonNullable<DesignReport['filter']>;
  bridge: DesignReport['bridge'];
  output: NonNullable<DesignReport['output']>;
}

export function computeFilter(
  design: InverterDesign,
  options: Pick<AnalyseDesignOptions, 'maxOrder' | 'points'>,
): FilterResult {
  if (!design.filter) {
    const message =
      'design.filter is required: give the LC filter (l, c and optional damping) to analyse';
    throw badRequest(message, [{ path: 'design.filter', message }]);
  }
  const report = designReport(design, options);
  return {
    filter: report.filter as FilterResult['filter'],
    bridge: report.bridge,
    output: report.output as FilterResult['output'],
  };
}

/** The harmonic-limit check of a design's report (at the filter's output where there is one). */
export function checkDesignLimits(
  design: InverterDesign,
  busVoltage?: number,
): DesignReport['limitCheck'] {
  return designReport(design, busVoltage === undefined ? {} : { busVoltage }).limitCheck;
}

export function computeSpaceVector(
  m: number,
  theta: number,
  options: SpaceVectorSequenceOptions,
): SpaceVectorSequence {
  return callLibrary('', () => spaceVectorSequence({ m, theta }, options));
}

export type { TimerFormat } from './cost.js';

export interface TimerDownload {
  body: string;
  contentType: string;
  fileName: string;
}

/** A timer table rendered by the library in the format asked for, ready to download. */
export function computeTimerTable(
  options: TimerTableRequest,
  format: TimerFormat,
  prefix = 'pwm_table',
): TimerDownload {
  const table = requestedTimerTable(options);
  return callLibrary('', () => {
    if (format === 'csv')
      return {
        body: timerTableToCsv(table),
        contentType: 'text/csv; charset=utf-8',
        fileName: `${prefix}.csv`,
      };
    if (format === 'c-header') {
      return {
        body: timerTableToCHeader(table, { prefix }),
        contentType: 'text/x-c; charset=utf-8',
        fileName: `${prefix}.h`,
      };
    }
    return {
      body: timerTableToJson(table),
      contentType: 'application/json; charset=utf-8',
      fileName: `${prefix}.json`,
    };
  });
}

/**
 * A multilevel timer table (the library's `multilevelTimerTable`) rendered in the format asked
 * for, ready to download; errors name the request's fields.
 */
export function computeMultilevelTimerTable(
  options: MultilevelTimerTableOptions,
  format: TimerFormat,
  prefix = 'pwm_multilevel',
): TimerDownload {
  return callLibrary('', () => {
    const table = multilevelTimerTable(options);
    if (format === 'csv')
      return {
        body: multilevelTimerTableToCsv(table),
        contentType: 'text/csv; charset=utf-8',
        fileName: `${prefix}.csv`,
      };
    if (format === 'c-header') {
      return {
        body: multilevelTimerTableToCHeader(table, { prefix }),
        contentType: 'text/x-c; charset=utf-8',
        fileName: `${prefix}.h`,
      };
    }
    return {
      body: multilevelTimerTableToJson(table),
      contentType: 'application/json; charset=utf-8',
      fileName: `${prefix}.json`,
    };
  });
}

export interface SampleAnalysisOptions {
  window: FftWindowName;
  maxOrder: number;
  fundamentalFrequency?: number;
}

/** The library's fftSpectrum of a capture's samples, without its bins (the routes never return them). */
export function analyseSamples(
  samples: ArrayLike<number>,
  sampleRate: number,
  options: SampleAnalysisOptions,
) {
  const { bins: _bins, ...spectrum } = callLibrary('', () =>
    fftSpectrum(Array.isArray(samples) ? samples : Array.from(samples), sampleRate, {
      window: options.window,
      maxOrder: options.maxOrder,
      ...(options.fundamentalFrequency
        ? { fundamentalFrequency: options.fundamentalFrequency }
        : {}),
    }),
  );
  return spectrum;
}
