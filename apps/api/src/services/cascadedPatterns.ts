import {
  cascadedPatternWaveform,
  solveCascadedPattern,
  type CascadedCellPattern,
  type CascadedPatternWaveforms,
  type NamedVoltage,
  type OrderAmplitude,
} from '@pulsewright/modulation';
import { voltageSpectrum, type SpectrumResult } from './compute.js';
import type { CostEstimate } from './cost.js';
import { callLibrary, finiteResult } from './library.js';

/**
 * Units of the cost model (services/cost.ts) per Newton iteration of a joint cascaded solve:
 * 200 per unknown angle squared (the Jacobian and its solve) and 30 000 for the rest (the
 * start's model, the ordering step). Measured on the loaded 2-core build machine with starts
 * that do not converge: 170–180 units per angle² at 64 angles (3.5 ms an iteration), 0.1–0.15 ms
 * an iteration below 10 angles; rounded up.
 */
const UNITS_PER_ANGLE_SQUARED = 200;
const UNITS_PER_ITERATION = 30_000;
/** The library's Newton iterations per start (`maxIterations`' default, not asked of callers). */
const ITERATIONS_PER_START = 60;
/** Units of work per edge to build a waveform (as services/cost.ts counts them). */
const BUILD_PER_EDGE = 100;
/** Bytes of one number in the JSON answer (as services/cost.ts measures them). */
const BYTES_PER_NUMBER = 20;
/** The name of the string's output voltage in the answers. */
const STRING_OUTPUT = 'string output';

/** POST /cascaded-patterns/waveform: the cells' patterns and the spectrum of the string. */
export interface CascadedPatternRequest {
  cells: CascadedCellPattern[];
  maxOrder: number;
}

/** POST /cascaded-patterns/solve: the library's `solveCascadedPattern` options and the spectrum's order. */
export interface CascadedSolveRequest {
  cells: number;
  vdc: number;
  count: number;
  eliminate: number[];
  fundamental: number;
  angles?: number[][];
  starts: number;
  maxOrder: number;
}

/** The waveforms of a string with its output named and the exact spectrum of that output. */
export interface CascadedPatternAnswer {
  output: NamedVoltage;
  cells: NamedVoltage[];
  spectrum: SpectrumResult;
}

/** A joint solve's outcome (the library's `CascadedPatternResult`) with the string's spectrum. */
export interface CascadedSolveAnswer extends CascadedPatternAnswer {
  converged: boolean;
  message: string;
  patterns: CascadedCellPattern[];
  fundamental: number;
  residual: OrderAmplitude[];
  iterations: number;
  starts: number;
}

/** The answer's waveforms and spectrum: the string's output analysed to maxOrder exactly. */
function answerOf(waveforms: CascadedPatternWaveforms, maxOrder: number): CascadedPatternAnswer {
  const output = { name: STRING_OUTPUT, waveform: waveforms.output };
  return { output, cells: waveforms.cells, spectrum: voltageSpectrum(output, maxOrder, 'cells') };
}

/**
 * The exact waveforms of a cascaded string whose cells run their own bipolar or unipolar
 * patterns (the library's `cascadedPatternWaveform`) and the string's spectrum, THD and WTHD.
 * Errors name `cells[i].kind`, `cells[i].vdc`, `cells[i].angles[k]` in the library's words.
 */
export function computeCascadedPattern(request: CascadedPatternRequest): CascadedPatternAnswer {
  const waveforms = callLibrary('', () => cascadedPatternWaveform({ cells: request.cells }));
  return finiteResult('cells', answerOf(waveforms, request.maxOrder));
}

/**
 * One unipolar harmonic-elimination pattern per cell of a cascaded string, solved jointly (the
 * library's `solveCascadedPattern`: Patel and Hoft, 1973), with the string's exact spectrum.
 * Errors name the request's field (`count`, `eliminate.length`, `fundamental`, `angles[c]`).
 */
export function solveCascadedPatternRequest(request: CascadedSolveRequest): CascadedSolveAnswer {
  const { maxOrder, ...options } = request;
  const result = callLibrary('', () => solveCascadedPattern(options));
  return finiteResult('fundamental', {
    ...answerOf(result, maxOrder),
    converged: result.converged,
    message: result.message,
    patterns: result.patterns,
    fundamental: result.fundamental,
    residual: result.residual,
    iterations: result.iterations,
    starts: result.starts,
  });
}

/**
 * Work of a joint solve at its worst: every start (a given guess and `starts` seeded ones)
 * runs its Newton iterations to the limit without converging, each costing the Jacobian of
 * cells·count unknowns; then the string is built (4 edges per angle a cell, at most that many
 * in the string) and analysed to maxOrder. The answer holds the cells' and the string's edges
 * and levels and the spectrum.
 *
 * The request is first put to the library with one start of one iteration (a few milliseconds
 * at the largest size it allows), so a value it refuses (cells·count over its limit, the wrong
 * number of orders, a fundamental past cells·4vdc/π, a bad guess) is named in its words, never
 * priced as if it were valid.
 */
export function cascadedSolveCost(request: CascadedSolveRequest): CostEstimate {
  const { maxOrder: _maxOrder, ...options } = request;
  callLibrary('', () => solveCascadedPattern({ ...options, starts: 1, maxIterations: 1 }));
  const unknowns = request.cells * request.count;
  // The given guess, or none: one start more than asked, counted either way (it errs high).
  const starts = request.starts + 1;
  const iterations = starts * ITERATIONS_PER_START;
  const edges = 4 * unknowns;
  return {
    work:
      iterations * (UNITS_PER_ANGLE_SQUARED * unknowns * unknowns + UNITS_PER_ITERATION) +
      2 * edges * BUILD_PER_EDGE +
      edges * (request.maxOrder + 1),
    basis: `${starts} starts × ${ITERATIONS_PER_START} Newton iterations × ${unknowns} angles squared, none converging at worst`,
    fields: ['cells', 'count', 'starts'],
    responseBytes: (4 * edges + 3 * (request.maxOrder + 1) + 4 * unknowns) * BYTES_PER_NUMBER,
    responseFields: ['maxOrder'],
  };
}

/** Work of a string's waveforms: 4 edges per angle a cell, built, summed and analysed to maxOrder. */
export function cascadedPatternCost(request: CascadedPatternRequest): CostEstimate {
  const edges = request.cells.reduce((sum, cell) => sum + 4 * cell.angles.length, 0);
  return {
    work: 2 * edges * BUILD_PER_EDGE + edges * (request.maxOrder + 1),
    basis: `${edges} edges × ${request.maxOrder + 1} orders`,
    fields: ['maxOrder', 'cells'],
    responseBytes: (4 * edges + 3 * (request.maxOrder + 1)) * BYTES_PER_NUMBER,
    responseFields: ['maxOrder', 'cells'],
  };
}
