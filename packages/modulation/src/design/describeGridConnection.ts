import type { GridCurrentLimitCheck } from '../limits/checkGridCurrentLimits.js';
import { generationRowReason } from '../limits/generationRowReason.js';
import type { GridFigures } from './DesignReport.js';
import { designResonance } from './designResonance.js';
import type { InverterDesign } from './InverterDesign.js';
import { modulationPhaseCount } from './modulationPhaseCount.js';

/** A grid-tied design in words, for every layer that prints it ({@link describeGridConnection}). */
export interface GridConnectionText {
  /** Label–value rows of the grid and its LCL (or L) filter, units written out. */
  rows: [string, string][];
  /**
   * One sentence a standard (IEEE Std 519, then 1547): within or over its limits, the row applied,
   * the total and worst order against their limits. Empty without the report's grid figures.
   */
  verdicts: string[];
  /**
   * The caution the grid-current check carries (the limits recalled from memory: confirm with the
   * standards and the utility), and over a span the harmonic-group rule; null without figures.
   */
  caution: string | null;
}

/** Four significant digits, as plain text (no exponent below 1e21; no trailing zeros). */
const digits = (value: number): string => String(Number(value.toPrecision(4)));
/** A ratio in per cent; below a thousandth of a per cent (rounding of the solve) as such. */
const percent = (ratio: number): string =>
  Math.abs(ratio) < 1e-5 ? '< 0.001 %' : `${digits(100 * ratio)} %`;

/**
 * One standard's verdict on the grid current, in the words of the check's own fields, and why
 * 519's first row applies when the generation footnote chose it over a higher ratio.
 */
function verdict(check: GridCurrentLimitCheck, total: string, grouped: boolean): string {
  const { standard, row } = check;
  const reason = generationRowReason(row, check.shortCircuitRatio);
  return (
    `${standard.name}-${standard.edition} (${row.label}${row.byGenerationRule ? ', the row for generating equipment' : ''}): ` +
    `${check.pass ? 'within' : 'over'} the limits; ${total} ${percent(check.total)} to order ${standard.maxOrder} (limit ${percent(check.totalLimit)}), ` +
    `${percent(check.totalWholeWaveform)} over the whole waveform; worst order ${check.worstIndividual.order} at ${percent(check.worstIndividual.ratio)} of the reference current` +
    (check.violations.length > 0 ? `; ${check.violations.length} figure(s) over their limit` : '') +
    (grouped ? '; read on harmonic groups of the span’s components' : '') +
    (reason === null ? '' : `. ${reason}`)
  );
}

/** The LCL resonance and its distances from the carrier and the control bandwidth, or ''. */
function resonanceText(figures: GridFigures | null): string {
  const resonance = figures ? designResonance({ filter: null, grid: figures }) : null;
  if (!resonance) return '';
  const distances = resonance.distances === null ? '' : ` (${resonance.distances})`;
  return `; ${resonance.name} ${digits(resonance.frequency)} Hz${distances}`;
}

/**
 * The grid a grid-tied design feeds and the verdict on its current, as words a person reads: the
 * one text the printed report's design table, the shared report's e-mail and the command line's
 * report print, so a grid design reads the same everywhere (and never as "Load: none").
 *
 * Rows: the grid (rms volts line to line for a three-phase bridge, rms for a single-phase one; the
 * design's fundamental frequency, hertz; phase a's angle, degrees), its impedance per phase (R in
 * ohms, L in millihenries, with the report's short-circuit current, amperes rms, and I_SC/I_L
 * when `figures` is given), the filter per phase (L1 and C of the design's `filter` with the
 * grid-side L2, an LCL; without a filter the L of L2 plus the grid's L) with the report's LCL
 * resonance and its distances from the carrier and the control bandwidth
 * ({@link designResonance}), and the control bandwidth when given. Verdicts: IEEE Std 519-2022
 * Table 2 (TDD) and IEEE Std 1547-2018 Tables 26–27 (TRD), recalled from memory, read from
 * `figures.limits`; 519's ends with {@link generationRowReason}'s sentence when the generation
 * footnote applied its first row although I_SC/I_L is higher.
 * Numbers carry four significant digits. Returns null for a design without a grid.
 */
export function describeGridConnection(
  design: InverterDesign,
  figures: GridFigures | null,
): GridConnectionText | null {
  const { grid, filter } = design;
  if (!grid) return null;
  const three = modulationPhaseCount(design.modulation) === 3;
  const perPhase = three ? ' per phase (star)' : '';
  const mH = (henries: number): string => `${digits(henries * 1e3)} mH`;
  const rows: [string, string][] = [
    [
      'Grid',
      `${digits(grid.lineVoltage)} V rms${three ? ' line to line' : ''}, ${digits(design.fundamentalFrequency)} Hz, phase a at ${digits(((grid.phase ?? 0) * 180) / Math.PI)}°`,
    ],
    [
      `Grid impedance${perPhase}`,
      `R ${digits(grid.r)} Ω, L ${mH(grid.l)}` +
        (figures
          ? `; short-circuit current ${digits(figures.shortCircuitCurrent)} A rms, I_SC/I_L ${digits(figures.shortCircuitRatio)}`
          : ''),
    ],
    [
      filter ? `LCL filter${perPhase}` : `L filter${perPhase}`,
      (filter
        ? `L1 ${mH(filter.l)}, C ${digits(filter.c * 1e6)} µF, L2 ${mH(grid.l2)}`
        : `L2 ${mH(grid.l2)} with the grid's ${mH(grid.l)} (no capacitor)`) +
        resonanceText(figures),
    ],
  ];
  if (grid.controlBandwidth !== undefined)
    rows.push(['Current control bandwidth', `${digits(grid.controlBandwidth)} Hz`]);
  if (!figures) return { rows, verdicts: [], caution: null };
  const grouped = figures.harmonicGrouping !== undefined;
  const { ieee519, ieee1547 } = figures.limits;
  return {
    rows,
    verdicts: [verdict(ieee519, 'TDD', grouped), verdict(ieee1547, 'TRD', grouped)],
    caution: figures.harmonicGrouping
      ? `${ieee519.caution} ${figures.harmonicGrouping.rule}`
      : ieee519.caution,
  };
}
