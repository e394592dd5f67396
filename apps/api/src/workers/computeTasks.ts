import { designReportPlans } from '@pulsewright/modulation';
import type {
  AnalyseDesignOptions,
  FftWindowName,
  InverterDesign,
  LossesByPowerFactorOptions,
  Modulation,
  MultilevelTimerTableOptions,
  TimerTableOptions,
} from '@pulsewright/modulation';
import {
  analyseSamples,
  assertDesign,
  asynchronousSpectra,
  checkDesignLimits,
  computeFilter,
  computeLoadCurrent,
  computeSpectrum,
  computeMultilevelTimerTable,
  computeTimerTable,
  designReport,
  designSpectrum,
  modulationOutput,
  type TimerFormat,
  type VoltageOutput,
} from '../services/compute.js';
import { parseCaptureCsv } from '../services/captureCsv.js';
import {
  computeCascadedPattern,
  solveCascadedPatternRequest,
  type CascadedPatternRequest,
  type CascadedSolveRequest,
} from '../services/cascadedPatterns.js';
import { computeLossSweep } from '../services/lossSweeps.js';
import { computeNetlist, type NetlistRequest } from '../services/netlists.js';
import {
  computeAngleTable,
  computePatternEvents,
  optimalSweepChunk,
  type AngleTableRequest,
  type OptimalSweepInput,
  type PatternEventsRequest,
} from '../services/patternTables.js';
import {
  maSweepChunk,
  sheSweepChunk,
  type MaSweepInput,
  type SheSweepInput,
} from '../services/sweeps.js';

/**
 * This thread's transform plans for its design reports: each worker thread loads this module once
 * and runs one task at a time, so its reports reuse the transforms' tables (about 0.65 ms of an
 * 8 ms report at mf 101 with a filter) instead of building them each time. Not sent to the thread:
 * plans are functions and stay where they were made.
 */
const plans = designReportPlans();

/**
 * The work the compute pool runs, by name: each entry calls the same service function (and so the
 * same library call) that the request thread would, so a figure is the same wherever it ran.
 * Arguments and results cross the thread boundary by structured clone: plain data only.
 */
export const COMPUTE_TASKS = {
  spectrum: (a: { modulation: Modulation; maxOrder: number; output?: VoltageOutput }) =>
    computeSpectrum(a.modulation, a.maxOrder, a.output),
  waveform: (a: { modulation: Modulation; output?: VoltageOutput }) =>
    modulationOutput(a.modulation, a.output),
  designReport: (a: { design: InverterDesign; options: AnalyseDesignOptions; field: string }) =>
    designReport(a.design, { ...a.options, plans }, a.field),
  /**
   * The design report as JSON in UTF-8 bytes, serialised and encoded where it was computed: a
   * report of megabytes then costs the request thread a copy of its bytes, instead of a
   * structured clone and a stringify (or, as text, the clone of a two-byte string, since the
   * labels hold U+2212, and its UTF-8 encoding at the socket: about 6 ms of 3.3 MB).
   */
  designReportJson: (a: {
    design: InverterDesign;
    options: AnalyseDesignOptions;
    field: string;
  }): Uint8Array =>
    Buffer.from(JSON.stringify(designReport(a.design, { ...a.options, plans }, a.field)), 'utf8'),
  designSpectrum: (a: { design: InverterDesign; maxOrder: number; field: string }) =>
    designSpectrum(a.design, a.maxOrder, a.field),
  asynchronousSpectra: (a: { design: InverterDesign; maxOrder: number }) =>
    asynchronousSpectra(a.design, a.maxOrder),
  assertDesign: (a: { design: InverterDesign; field: string }) => {
    assertDesign(a.design, a.field);
    return true;
  },
  loadCurrent: (a: { design: InverterDesign; points?: number }) =>
    computeLoadCurrent(a.design, a.points),
  filter: (a: {
    design: InverterDesign;
    options: Pick<AnalyseDesignOptions, 'maxOrder' | 'points'>;
  }) => computeFilter(a.design, a.options),
  limits: (a: { design: InverterDesign; busVoltage?: number }) =>
    checkDesignLimits(a.design, a.busVoltage),
  timerTable: (a: { options: TimerTableOptions; format: TimerFormat; prefix?: string }) =>
    computeTimerTable(a.options, a.format, a.prefix),
  multilevelTimerTable: (a: {
    options: MultilevelTimerTableOptions;
    format: TimerFormat;
    prefix?: string;
  }) => computeMultilevelTimerTable(a.options, a.format, a.prefix),
  netlist: (a: { request: NetlistRequest }) => computeNetlist(a.request),
  lossSweep: (a: { input: LossesByPowerFactorOptions }) => computeLossSweep(a.input),
  captureSpectrum: (a: {
    samples: Float64Array | number[];
    sampleRate: number;
    options: { window: FftWindowName; maxOrder: number; fundamentalFrequency?: number };
  }) => analyseSamples(a.samples, a.sampleRate, a.options),
  // A Buffer arrives as a Uint8Array over the same memory.
  parseCapture: (a: { file: Uint8Array }) =>
    parseCaptureCsv(Buffer.from(a.file.buffer, a.file.byteOffset, a.file.byteLength)),
  maSweepChunk: (a: { input: MaSweepInput; index: number }) => maSweepChunk(a.input, a.index),
  sheSweepChunk: (a: { input: SheSweepInput; index: number; seed?: number[] }) =>
    sheSweepChunk(a.input, a.index, a.seed),
  optimalSweepChunk: (a: { input: OptimalSweepInput; index: number; previous?: number[] }) =>
    optimalSweepChunk(a.input, a.index, a.previous),
  angleTable: (a: { request: AngleTableRequest; format: 'json' | 'csv' | 'c-header' }) =>
    computeAngleTable(a.request, a.format),
  patternEvents: (a: { request: PatternEventsRequest }) => computePatternEvents(a.request),
  cascadedPattern: (a: { request: CascadedPatternRequest }) => computeCascadedPattern(a.request),
  cascadedSolve: (a: { request: CascadedSolveRequest }) => solveCascadedPatternRequest(a.request),
} as const;

export type ComputeTasks = typeof COMPUTE_TASKS;
export type ComputeTaskName = keyof ComputeTasks;
export type TaskArgs<N extends ComputeTaskName> = Parameters<ComputeTasks[N]>[0];
export type TaskResult<N extends ComputeTaskName> = ReturnType<ComputeTasks[N]>;
