import { analyseDesign } from '@pulsewright/modulation';

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

/** The number of first-quarter angles the form asks for. */
export function angleCountOf(form: EliminationForm): number {
  return form.type === 'she' ? ordersOf(form).length + 1 : form.count;
}

/** Volts of fundamental per unit of ma: vdc, or N·vdc for a staircase of N cells. */
export function maScaleOf(form: Pick<EliminationForm, 'kind' | 'vdc'>, count: number): number {
  return (form.kind === 'staircase' ? count : 1) * form.vdc;
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
}

export function solvedPatternOf(form: EliminationForm): SolvedPattern {
  return {
    type: form.type,
    kind: form.kind,
    vdc: form.vdc,
    count: angleCountOf(form),
    orders: form.type === 'she' ? ordersOf(form) : [],
    objective: form.objective,
    maxOrder: form.maxOrder,
  };
}

/** The angle table's pattern for the API, from a solved pattern. */
export function tablePatternOf(pattern: SolvedPattern) {
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
          }
        : { method: 'optimal-pattern', kind: pattern.kind, angles },
  });
  return { spectrum: report.bridge.spectrum, thd: report.bridge.thd, wthd: report.bridge.wthd };
}
