import type { DesignReport } from './DesignReport.js';

/** The resonance that matters in a design's report, named ({@link designResonance}). */
export interface DesignResonance {
  /**
   * 'LCL resonance' for a grid-tied design, 'LC filter resonance' without a grid, 'L1–C
   * resonance' for a grid design with no inductance on the grid side (l2 + l = 0, no LCL).
   */
  name: 'LCL resonance' | 'LC filter resonance' | 'L1–C resonance';
  /** Hertz. */
  frequency: number;
  /** f_carrier/f_res (LCL only, null otherwise or without a carrier). */
  carrierRatio: number | null;
  /** f_res/f_bw (LCL only, null otherwise or without a control bandwidth). */
  controlBandwidthRatio: number | null;
  /** The distances in words ("carrier 4.525× above it; 2.21× the control bandwidth"); null when none. */
  distances: string | null;
}

/** Four significant digits, as plain text. */
const digits = (value: number): string => String(Number(value.toPrecision(4)));

/**
 * The filter resonance a report should show, named as such. A grid-tied design's is the LCL's,
 * (1/2π)·√((L1 + L2')/(L1·L2'·C)) with L2' = l2 + l (`report.grid.resonance`; Liserre, Blaabjerg
 * and Hansen, IEEE Trans. Ind. Appl. 41(5), 2005), with its distance from the carrier and from the
 * current controller's bandwidth: the report's `filter.characteristics.resonanceFrequency` is
 * then only L1 with C, without L2 and the grid, and is not the one a grid design resonates at.
 * An LC-filtered design (no grid) keeps its LC resonance 1/(2π√(LC)) (standard circuit
 * analysis); so does a grid design with l2 + l = 0 (no LCL), named its L1–C resonance. Null
 * without a filter.
 */
export function designResonance(
  report: Pick<DesignReport, 'filter' | 'grid'>,
): DesignResonance | null {
  const { filter, grid } = report;
  const r = grid?.resonance;
  if (r) {
    const parts = [
      ...(r.carrierRatio !== null ? [`carrier ${digits(r.carrierRatio)}× above it`] : []),
      ...(r.controlBandwidthRatio !== null
        ? [`${digits(r.controlBandwidthRatio)}× the control bandwidth`]
        : []),
    ];
    return {
      name: 'LCL resonance',
      frequency: r.frequency,
      carrierRatio: r.carrierRatio,
      controlBandwidthRatio: r.controlBandwidthRatio,
      distances: parts.length > 0 ? parts.join('; ') : null,
    };
  }
  if (!filter) return null;
  return {
    name: grid ? 'L1–C resonance' : 'LC filter resonance',
    frequency: filter.characteristics.resonanceFrequency,
    carrierRatio: null,
    controlBandwidthRatio: null,
    distances: null,
  };
}
