import {
  type SineTriangleOptions,
  type ThreePhaseOptions,
  type SpaceVectorWaveformOptions,
  filteredSpectrum,
  harmonics,
  lcFilter,
  rlCurrentSeries,
  rlSteadyState,
  sheWaveform,
  sineTriangle,
  spaceVectorSequence,
  spaceVectorWaveforms,
  thd,
  threePhase,
  timerTable,
  timerTableToCHeader,
  timerTableToCsv,
  timerTableToJson,
  wthd,
  type Harmonic,
  type LcFilterCharacteristics,
  type LcFilterOptions,
  type RlLoadOptions,
  type RlSteadyState,
  type SpaceVectorSequence,
  type SpaceVectorSequenceOptions,
  type TimerTableOptions,
  type Waveform,
  type SheKind,
  ParameterRangeError,
} from '@pulsewright/modulation';
import { callLibrary, finiteResult } from './library.js';

/** Which output of a three-phase bridge spectra analyse. @default 'line-to-line' */
type ThreePhaseOutput = { output?: 'line-to-line' | 'leg' };

/** The fields of the library's `sineTriangle`, chosen by `method`. */
export type SineTriangleInput = { method: 'sine-triangle' } & SineTriangleOptions;
/** The fields of the library's `threePhase`, chosen by `method`. */
export type ThreePhaseInput = { method: 'three-phase' } & ThreePhaseOptions & ThreePhaseOutput;
/** The fields of the library's `spaceVectorWaveforms` (one of m and ma), whole frequency ratio. */
export type SpaceVectorInput = { method: 'space-vector' } & SpaceVectorWaveformOptions & ThreePhaseOutput;
/**
 * A solved selective-harmonic-elimination pattern: the first-quarter angles define the
 * waveform (the library's sheWaveform); `eliminate` and `fundamental` record the solve's goal.
 */
export type SheInput = {
  method: 'selective-harmonic-elimination';
  kind: SheKind;
  vdc: number;
  angles: number[];
  eliminate?: number[];
  fundamental?: number;
};
export type ModulationInput = SineTriangleInput | ThreePhaseInput | SpaceVectorInput | SheInput;
/** The methods whose modulation index a sweep can vary. */
export type CarrierModulationInput = SineTriangleInput | ThreePhaseInput;

export interface SpectrumResult {
  harmonics: Harmonic[];
  thd: number;
  wthd: number;
}

export interface WaveformResult {
  name: string;
  waveform: Waveform;
  traces: { name: string; waveform: Waveform }[];
}

/** The analysed output waveform (and every trace) of a modulation, from the library. */
export function modulationWaveforms(modulation: ModulationInput, prefix = 'modulation.'): WaveformResult {
  return callLibrary(prefix, () => {
    if (modulation.method === 'sine-triangle') {
      const { method: _method, ...options } = modulation;
      const waveform = sineTriangle(options);
      return { name: 'bridge output', waveform, traces: [{ name: 'bridge output', waveform }] };
    }
    if (modulation.method === 'space-vector') return spaceVectorOutput(modulation);
    if (modulation.method === 'selective-harmonic-elimination') return sheOutput(modulation);
    const { method: _method, output = 'line-to-line', ...options } = modulation;
    const result = threePhase(options);
    const traces = [
      { name: 'leg a', waveform: result.legs.a },
      { name: 'leg b', waveform: result.legs.b },
      { name: 'leg c', waveform: result.legs.c },
      { name: 'line ab', waveform: result.lineToLine.ab },
      { name: 'line bc', waveform: result.lineToLine.bc },
      { name: 'line ca', waveform: result.lineToLine.ca },
    ];
    return output === 'leg'
      ? { name: 'leg a', waveform: result.legs.a, traces }
      : { name: 'line ab', waveform: result.lineToLine.ab, traces };
  });
}

function spaceVectorOutput(modulation: SpaceVectorInput): WaveformResult {
  const { method: _method, output = 'line-to-line', ...options } = modulation;
  const result = spaceVectorWaveforms(options);
  const traces = [
    { name: 'leg a', waveform: result.a },
    { name: 'leg b', waveform: result.b },
    { name: 'leg c', waveform: result.c },
    { name: 'line ab', waveform: result.ab },
    { name: 'line bc', waveform: result.bc },
    { name: 'line ca', waveform: result.ca },
  ];
  return output === 'leg' ? { name: 'leg a', waveform: result.a, traces } : { name: 'line ab', waveform: result.ab, traces };
}

function sheOutput(modulation: SheInput): WaveformResult {
  const { kind, vdc, angles, eliminate = [] } = modulation;
  // The schema bounds each order; oddness is the library's rule for what can be eliminated
  // (quarter-wave symmetry leaves no even harmonics), checked here because the pattern is
  // stored, not solved.
  eliminate.forEach((order, i) => {
    if (order % 2 === 0) {
      throw new ParameterRangeError(`eliminate[${i}]`, 'an odd order ≥ 3 (quarter-wave symmetry leaves no even harmonics)', order);
    }
  });
  const waveform = sheWaveform(angles, { kind, vdc });
  const name = kind === 'staircase' ? 'staircase output' : 'bridge output';
  return { name, waveform, traces: [{ name, waveform }] };
}

/**
 * Refuses (400 naming the field) a modulation the library will not build, so a study is
 * never stored with one: the schema bounds each field, the library checks what a schema
 * cannot (first-quarter angles ascending, exactly one of m and ma).
 */
export function assertModulation(modulation: ModulationInput, prefix = 'modulation.'): void {
  modulationWaveforms(modulation, prefix);
}

/** A function from ma to the analysed waveform, for sweeps of the carrier methods. */
export function waveformAtMa(modulation: CarrierModulationInput): (ma: number) => Waveform {
  return (ma) => modulationWaveforms({ ...modulation, ma }).waveform;
}

export function spectrumOf(waveform: Waveform, maxOrder: number): SpectrumResult {
  const result = callLibrary('', () => {
    const spectrum = harmonics(waveform, maxOrder);
    return { harmonics: spectrum, thd: thd(spectrum), wthd: wthd(spectrum) };
  });
  return finiteResult('modulation', result);
}

export function computeSpectrum(modulation: ModulationInput, maxOrder: number): SpectrumResult {
  return spectrumOf(modulationWaveforms(modulation).waveform, maxOrder);
}

export interface LoadCurrentResult extends RlSteadyState {
  series: { angles: number[]; current: number[] };
}

export function computeLoadCurrent(modulation: ModulationInput, load: RlLoadOptions, points: number): LoadCurrentResult {
  const { waveform } = modulationWaveforms(modulation);
  const result = callLibrary('load.', () => ({
    ...rlSteadyState(waveform, load),
    series: rlCurrentSeries(waveform, { ...load, points }),
  }));
  return finiteResult('load', result);
}

export interface FilterResult {
  characteristics: LcFilterCharacteristics;
  output: SpectrumResult | null;
}

export function computeFilter(
  filter: LcFilterOptions,
  spectrumInput?: { modulation: ModulationInput; maxOrder: number; fundamentalFrequency: number },
): FilterResult {
  const characteristics = finiteResult('filter', callLibrary('filter.', () => lcFilter(filter)));
  if (!spectrumInput) return { characteristics, output: null };
  const input = computeSpectrum(spectrumInput.modulation, spectrumInput.maxOrder);
  const output = callLibrary('', () => {
    const spectrum = filteredSpectrum(input.harmonics, { filter, fundamentalFrequency: spectrumInput.fundamentalFrequency });
    return { harmonics: spectrum, thd: thd(spectrum), wthd: wthd(spectrum) };
  });
  return { characteristics, output: finiteResult('filter', output) };
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
