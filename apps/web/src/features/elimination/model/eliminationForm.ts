import {
  analyseDesign,
  ParameterRangeError,
  ParameterTypeError,
  sheWaveform,
} from '@pulsewright/modulation';

/** Which pattern the page solves: eliminate chosen orders, or minimise a distortion. */
export type PatternType = 'she' | 'optimal';
export type PatternKind = 'bipolar' | 'staircase';

/** The elimination page's form, in the units it shows (ma, volts). */
export interface EliminationForm {
  type: PatternType;
  kind: PatternKind;
  vdc: number;
  /** SHE: the odd orders to eliminate, as typed. */
  eliminate: string;
  /**
   * SHE staircase: each cascaded cell's DC source, volts, as typed (comma-separated, one per
   * angle); blank for every cell at `vdc`.
   */
  cellVoltages: string;
  /** Optimal: the number of first-quarter angles. */
  count: number;
  objective: 'wthd' | 'thd';
  maxOrder: number;
  /** The range of ma = V₁/(L·vdc) swept (L = 1 bipolar, the number of cells for a staircase). */
  from: number;
  to: number;
  points: number;
}

export const DEFAULT_ELIMINATION_FORM: EliminationForm = {
  type: 'she',
  kind: 'bipolar',
  vdc: 300,
  eliminate: '5, 7',
  cellVoltages: '',
  count: 4,
  objective: 'wthd',
  maxOrder: 99,
  from: 0.3,
  to: 1.2,
  points: 40,
};

/** The orders typed in the eliminate box. */
export function ordersOf(form: Pick<EliminationForm, 'eliminate'>): number[] {
  return form.eliminate
    .split(/[\s,]+/)
    .filter(Boolean)
    .map(Number);
}

/**
 * The cell sources typed, in volts (NaN for what is not a number), or undefined when the field
 * is blank or does not apply (an optimal pattern, a bipolar kind).
 */
export function cellVoltagesOf(
  form: Pick<EliminationForm, 'type' | 'kind' | 'cellVoltages'>,
): number[] | undefined {
  if (form.type !== 'she' || form.kind !== 'staircase') return undefined;
  const words = form.cellVoltages.split(/[\s,]+/).filter(Boolean);
  return words.length === 0 ? undefined : words.map(Number);
}

/**
 * The library's message for cell sources it would refuse with `count` angles (one per angle,
 * each > 0 volts, named `cellVoltages.length` or `cellVoltages[k]`), or undefined: the check
 * `sheWaveform` makes, run on evenly spaced angles so only the voltages can fail.
 */
export function cellVoltagesError(
  cellVoltages: number[] | undefined,
  count: number,
): string | undefined {
  if (cellVoltages === undefined || count < 1) return undefined;
  const angles = Array.from({ length: count }, (_, k) => ((k + 1) * Math.PI) / (2 * (count + 1)));
  try {
    sheWaveform(angles, { kind: 'staircase', vdc: 1, cellVoltages });
    return undefined;
  } catch (error) {
    if (error instanceof ParameterRangeError || error instanceof ParameterTypeError) {
      return error.message;
    }
    throw error;
  }
}

/** The number of first-quarter angles the form asks for. */
export function angleCountOf(form: EliminationForm): number {
  return form.type === 'she' ? ordersOf(form).length + 1 : form.count;
}

/**
 * Volts of fundamental per unit of ma: vdc, N·vdc for a staircase of N equal cells, or ΣV_k for
 * a staircase of unequal cell sources (ma = 4/π then reaches the square-wave limit 4ΣV_k/π;
 * Tolbert, Chiasson, Du and McKenzie, IEEE Trans. Ind. Appl., 2005).
 */
export function maScaleOf(
  pattern: { kind: PatternKind; vdc: number; cellVoltages?: number[] | undefined },
  count: number,
): number {
  if (pattern.kind !== 'staircase') return pattern.vdc;
  return pattern.cellVoltages?.reduce((sum, v) => sum + v, 0) ?? count * pattern.vdc;
}

/** The pattern a finished sweep was solved for, kept apart from later form edits. */
export interface SolvedPattern {
  type: PatternType;
  kind: PatternKind;
  vdc: number;
  count: number;
  orders: number[];
  objective: 'wthd' | 'thd';
  maxOrder: number;
  /** SHE staircase of unequal cell sources: each cell's DC source, volts. */
  cellVoltages?: number[];
}

export function solvedPatternOf(form: EliminationForm): SolvedPattern {
  const cellVoltages = cellVoltagesOf(form);
  return {
    ...(cellVoltages === undefined ? {} : { cellVoltages }),
    type: form.type,
    kind: form.kind,
    vdc: form.vdc,
    count: angleCountOf(form),
    orders: form.type === 'she' ? ordersOf(form) : [],
    objective: form.objective,
    maxOrder: form.maxOrder,
  };
}

/**
 * The angle table's pattern for the API, from a solved pattern; null for a staircase of unequal
 * cell sources, which the angle tables do not take yet.
 */
export function tablePatternOf(pattern: SolvedPattern) {
  if (pattern.cellVoltages !== undefined) return null;
  return pattern.type === 'she'
    ? {
        method: 'selective-harmonic-elimination' as const,
        kind: pattern.kind,
        vdc: pattern.vdc,
        eliminate: pattern.orders,
      }
    : {
        method: 'optimal-pattern' as const,
        kind: pattern.kind,
        vdc: pattern.vdc,
        count: pattern.count,
        objective: pattern.objective,
        maxOrder: pattern.maxOrder,
      };
}

/**
 * The picked point's figures from the library's design report (the same model as every other
 * page): the bridge or staircase voltage's labelled spectrum and its exact whole-waveform THD and
 * WTHD. The fundamental frequency does not change a voltage spectrum; 50 Hz is a placeholder.
 */
export function patternFigures(pattern: SolvedPattern, angles: number[]) {
  const report = analyseDesign({
    vdc: pattern.vdc,
    fundamentalFrequency: 50,
    modulation:
      pattern.type === 'she'
        ? {
            method: 'selective-harmonic-elimination',
            kind: pattern.kind,
            angles,
            eliminate: pattern.orders,
            ...(pattern.cellVoltages === undefined ? {} : { cellVoltages: pattern.cellVoltages }),
          }
        : { method: 'optimal-pattern', kind: pattern.kind, angles },
  });
  return { spectrum: report.bridge.spectrum, thd: report.bridge.thd, wthd: report.bridge.wthd };
}
