import type {
  AnalyseDesignOptions,
  FftWindowName,
  InverterDesign,
  LclDesignOptions,
  LossesByPowerFactorOptions,
  Modulation,
  MultilevelTimerTableOptions,
  SpaceVectorSequenceOptions,
  TimerTableOptions,
} from '@pulsewright/modulation';
import type { ComputeLimits } from '../config.js';
import {
  angleTableCost,
  patternEventsCost,
  type AngleTableRequest,
  type PatternEventsRequest,
} from './patternTables.js';
import { computeSpaceVector, type VoltageOutput } from './compute.js';
import type { ComputePool } from './computePool.js';
import {
  assertReportSeries,
  assertWithinBudget,
  asynchronousSpectraCost,
  captureSpectrumCost,
  captureUploadCost,
  designSpectrumCost,
  multilevelTimerTableCost,
  netlistCost,
  reportCost,
  spaceVectorCost,
  spectrumCost,
  timerTableCost,
  waveformCost,
  type CostEstimate,
  type TimerFormat,
} from './cost.js';
import {
  COMPUTE_TASKS,
  type ComputeTaskName,
  type TaskArgs,
  type TaskResult,
} from '../workers/computeTasks.js';
import { computeLclDesign, lclDesignCost } from './lclDesign.js';
import { lossSweepCost } from './lossSweeps.js';
import {
  cascadedPatternCost,
  cascadedSolveCost,
  type CascadedPatternRequest,
  type CascadedSolveRequest,
} from './cascadedPatterns.js';
import type { NetlistRequest } from './netlists.js';

/**
 * Every compute a request asks for, in one place: its cost is estimated from the inputs
 * (services/cost.ts) and refused with a 400 beyond the request budget or the answer budget; what
 * is cheap runs on the request thread, the rest in the worker pool, through the same service
 * functions either way (workers/computeTasks.ts). Routes and services call this, never the pool.
 */
export class ComputeService {
  constructor(
    private readonly pool: ComputePool,
    private readonly limits: ComputeLimits,
  ) {}

  /** Runs a task where its cost says, after the budget check. */
  private async run<N extends ComputeTaskName>(
    name: N,
    args: TaskArgs<N>,
    cost: CostEstimate,
    what: string,
    budgeted = true,
  ): Promise<TaskResult<N>> {
    if (budgeted) assertWithinBudget(cost, 'request', this.limits);
    if (cost.work <= this.limits.inlineWorkLimit) {
      return (COMPUTE_TASKS[name] as (a: TaskArgs<N>) => TaskResult<N>)(args);
    }
    return this.pool.run(name, args, { what });
  }

  spectrum(modulation: Modulation, maxOrder: number, output?: VoltageOutput) {
    return this.run(
      'spectrum',
      { modulation, maxOrder, ...(output ? { output } : {}) },
      spectrumCost(modulation, maxOrder, output),
      'This spectrum',
    );
  }

  waveform(modulation: Modulation, output?: VoltageOutput) {
    return this.run(
      'waveform',
      { modulation, ...(output ? { output } : {}) },
      waveformCost(modulation),
      'This waveform',
    );
  }

  /** The cost of a design report, with the report's own bound on its time series. */
  private reportCost(
    design: InverterDesign,
    options: AnalyseDesignOptions,
    field: string,
    optionFields?: readonly string[],
  ): CostEstimate {
    const cost = reportCost(design, options, field, optionFields);
    assertReportSeries(cost);
    return cost;
  }

  /** The design report; `optionFields` are the options the caller can lower (none for a shared report). */
  report(
    design: InverterDesign,
    options: AnalyseDesignOptions = {},
    field = 'design',
    optionFields?: readonly string[],
  ) {
    return this.run(
      'designReport',
      { design, options, field },
      this.reportCost(design, options, field, optionFields),
      'This design report',
    );
  }

  /**
   * The design report as JSON in UTF-8 bytes (`designReport`'s answer serialised and encoded in
   * the worker that made it), for routes that send it as it is; same cost check and budget as
   * {@link report}.
   */
  reportJson(design: InverterDesign, options: AnalyseDesignOptions = {}) {
    return this.run(
      'designReportJson',
      { design, options, field: 'design' },
      this.reportCost(design, options, 'design'),
      'This design report',
    );
  }

  loadCurrent(design: InverterDesign, points?: number) {
    const cost = this.reportCost(design, points === undefined ? {} : { points }, 'design', [
      'points',
    ]);
    return this.run(
      'loadCurrent',
      { design, ...(points === undefined ? {} : { points }) },
      cost,
      'This load-current analysis',
    );
  }

  filter(design: InverterDesign, options: Pick<AnalyseDesignOptions, 'maxOrder' | 'points'>) {
    return this.run(
      'filter',
      { design, options },
      this.reportCost(design, options, 'design'),
      'This filter analysis',
    );
  }

  /** Losses of every zero sequence against the load's power-factor angle (lossesByPowerFactor). */
  lossSweep(input: LossesByPowerFactorOptions) {
    return this.run('lossSweep', { input }, lossSweepCost(input), 'This loss sweep');
  }

  harmonicLimits(design: InverterDesign, busVoltage?: number) {
    const cost = this.reportCost(
      design,
      busVoltage === undefined ? {} : { busVoltage },
      'design',
      [],
    );
    return this.run(
      'limits',
      { design, ...(busVoltage === undefined ? {} : { busVoltage }) },
      cost,
      'This limit check',
    );
  }

  /** A carrier design at a ratio p/q, exact over q fundamental periods (compute.ts asynchronousSpectra). */
  asynchronousSpectra(design: InverterDesign, maxOrder: number) {
    return this.run(
      'asynchronousSpectra',
      { design, maxOrder },
      asynchronousSpectraCost(design, maxOrder),
      'These asynchronous spectra',
    );
  }

  /** A study's design checked by a trial analysis before it is stored (compute.ts assertDesign). */
  async assertDesign(design: InverterDesign, field = 'design'): Promise<void> {
    await this.run(
      'assertDesign',
      { design, field },
      this.reportCost(design, { maxOrder: 50, points: 64 }, field, []),
      'The check of this design',
    );
  }

  designSpectrum(design: InverterDesign, maxOrder: number, field = 'design') {
    return this.run(
      'designSpectrum',
      { design, maxOrder, field },
      designSpectrumCost(design, maxOrder, field),
      'This spectrum',
    );
  }

  timerTable(options: TimerTableOptions, format: TimerFormat, prefix?: string) {
    const cost = timerTableCost(options, format);
    return this.run(
      'timerTable',
      { options, format, ...(prefix ? { prefix } : {}) },
      cost,
      'This timer table',
    );
  }

  /** A multilevel timer table, priced by its rows × complementary pairs before any work. */
  multilevelTimerTable(options: MultilevelTimerTableOptions, format: TimerFormat, prefix?: string) {
    return this.run(
      'multilevelTimerTable',
      { options, format, ...(prefix ? { prefix } : {}) },
      multilevelTimerTableCost(options, format),
      'This multilevel timer table',
    );
  }

  /** A timer table's switching pattern as a SPICE netlist (services/netlists.ts). */
  netlist(request: NetlistRequest) {
    return this.run('netlist', { request }, netlistCost(request), 'This netlist');
  }

  /** An LCL filter from its rated point and targets (services/lclDesign.ts). */
  lclDesign(options: LclDesignOptions) {
    assertWithinBudget(lclDesignCost(), 'request', this.limits);
    return computeLclDesign(options);
  }

  spaceVector(m: number, theta: number, options: SpaceVectorSequenceOptions) {
    assertWithinBudget(spaceVectorCost(), 'request', this.limits);
    return computeSpaceVector(m, theta, options);
  }

  /** An uploaded capture checked and parsed (services/captureCsv.ts), in a worker unless it is small. */
  parseCapture(file: Buffer) {
    // Bounded by the upload limit (5 MB) rather than by the request budget.
    return this.run(
      'parseCapture',
      { file },
      captureUploadCost(file.length),
      'Reading this capture',
      false,
    );
  }

  captureSpectrum(
    samples: readonly number[],
    sampleRate: number,
    options: { window: FftWindowName; maxOrder: number; fundamentalFrequency?: number },
  ) {
    const cost = captureSpectrumCost(samples.length, options.maxOrder);
    // A typed copy crosses to a worker as one block of memory rather than a million numbers.
    const args = {
      samples:
        cost.work <= this.limits.inlineWorkLimit
          ? (samples as number[])
          : Float64Array.from(samples),
      sampleRate,
      options,
    };
    return this.run('captureSpectrum', args, cost, 'This capture analysis');
  }

  /** A switching-angle table with its midpoint errors (services/patternTables.ts), as a file. */
  angleTable(request: AngleTableRequest, format: 'json' | 'csv' | 'c-header') {
    return this.run('angleTable', { request, format }, angleTableCost(request), 'This angle table');
  }

  /** The compare events of a stored pattern (services/patternTables.ts). */
  patternEvents(request: PatternEventsRequest) {
    return this.run(
      'patternEvents',
      { request },
      patternEventsCost(request),
      'These compare events',
    );
  }

  /** A cascaded string's waveforms from each cell's pattern, with its spectrum (services/cascadedPatterns.ts). */
  cascadedPattern(request: CascadedPatternRequest) {
    return this.run(
      'cascadedPattern',
      { request },
      cascadedPatternCost(request),
      "This cascaded string's waveforms",
    );
  }

  /** One unipolar pattern per cascaded cell solved jointly (services/cascadedPatterns.ts). */
  cascadedSolve(request: CascadedSolveRequest) {
    return this.run(
      'cascadedSolve',
      { request },
      cascadedSolveCost(request),
      'This cascaded solve',
    );
  }
}
