import { lcFilterBranches } from '../filter/lcFilterBranches.js';
import { lclResonanceFrequency } from '../filter/lclResonanceFrequency.js';
import type { OutputNetwork } from '../filter/outputNetworkResponse.js';
import { outputNetworkTransfer } from '../filter/outputNetworkTransfer.js';
import { checkGridCurrentLimits } from '../limits/checkGridCurrentLimits.js';
import { HARMONIC_GROUP_RULE, harmonicGroups } from '../limits/harmonicGroups.js';
import { TAU } from '../math.js';
import type { Complex } from '../numeric/complex.js';
import type { HarmonicPhasors } from '../spectrum/harmonicPhasors.js';
import { ParameterRangeError } from '../validation/errors.js';
import type { GridFigures } from './DesignReport.js';
import type { DesignGrid } from './InverterDesign.js';
import { networkPhasors } from './networkPhasors.js';
import type { SpectrumLabeller } from './spectrumLabeller.js';

/** What {@link gridFigures} reads from the analysis of a design with a grid. */
export interface GridFigureInputs {
  grid: DesignGrid;
  /** Filter and grid of one phase (the grid as the network's load: r, l2 + l). */
  network: OutputNetwork;
  /** Phase a's bridge voltage phasors, orders 0..analysisOrder at least, peak volts. */
  bridge: HarmonicPhasors;
  /** The analysis order: orders 0..analysisOrder are solved. */
  analysisOrder: number;
  /**
   * The fundamental's order: 1, or q when the bridge voltage spans q fundamental periods (a
   * carrier at mf = p/q: orders, `analysisOrder` included, are then of the base f₁/q, the grid
   * source drives order q, and the limits are checked on harmonic groups). @default 1
   */
  fundamentalOrder?: number;
  /** Phase a's grid source phasor at the fundamental, peak volts. */
  source: Complex;
  phaseCount: 1 | 3;
  fundamentalFrequency: number;
  carrierFrequency: number | null;
  /** THD of phase a's grid current over the whole waveform (the report's load current), ratio. */
  gridCurrentThdWholeWaveform: number;
  labeller: SpectrumLabeller;
}

/** ½·V·conj(I): the mean complex power of two phasors (peak amplitudes), watts + j·var. */
function power(v: Complex, i: Complex): Complex {
  return { re: (v.re * i.re + v.im * i.im) / 2, im: (v.im * i.re - v.re * i.im) / 2 };
}

/**
 * The figures of a grid-connected bridge ({@link GridFigures}). Each order of the bridge
 * voltage is solved through the loaded network (`networkPhasors`: nodal analysis, the unit
 * response of each order times the bridge voltage) with the grid source added at the
 * fundamental only (superposition: the network is linear). The
 * damping loss is Σ ½·(Re Z_series·|I_inv|² + Re Y_shunt·|V_C|²) over the orders (L and C
 * are lossless). Limits: IEEE Std 519-2022 Table 2 with the generation footnote (unless the
 * design's `grid.generation` is false), and IEEE Std
 * 1547-2018 Tables 26–27, both recalled from memory, with the fundamental grid current as the
 * reference current. Over a span (`fundamentalOrder` q > 1) the grid current's components at
 * n/q are grouped by whole harmonic order first (`harmonicGroups`, IEC 61000-4-7's harmonic
 * groups, from memory) and the groups are checked; `harmonicGrouping` lists what was grouped.
 *
 * @throws ParameterRangeError naming `grid.phase` when the bridge and the grid exchange no
 *   fundamental current (no reference current for the limits)
 */
export function gridFigures(inputs: GridFigureInputs): GridFigures {
  const { grid, network, bridge, source, phaseCount, fundamentalFrequency } = inputs;
  const { carrierFrequency, labeller, analysisOrder } = inputs;
  const omega = TAU * fundamentalFrequency;
  const f = inputs.fundamentalOrder ?? 1;
  // Angular frequency of order 1: the fundamental's, or the span's base ω₁/q.
  const base = omega / f;
  const count = analysisOrder + 1;
  const solved = networkPhasors(bridge, outputNetworkTransfer(network, base, analysisOrder), {
    count,
    network,
    omega: base,
    emf: source,
    fundamentalOrder: f,
  });
  const at = (phasors: HarmonicPhasors, order: number): Complex => ({
    re: phasors.re[order] as number,
    im: phasors.im[order] as number,
  });
  const first = {
    loadCurrent: at(solved.loadCurrent, f),
    capacitorCurrent: at(solved.capacitorCurrent, f),
    output: at(solved.output, f),
  };
  const fundamental = Math.hypot(first.loadCurrent.re, first.loadCurrent.im);
  if (!(fundamental > 0))
    throw new ParameterRangeError(
      'grid.phase',
      'an angle at which the bridge and the grid exchange fundamental current',
      grid.phase ?? 0,
    );
  const squareAt = (phasors: HarmonicPhasors, order: number): number =>
    (phasors.re[order] as number) ** 2 + (phasors.im[order] as number) ** 2;
  let harmonicSquares = 0;
  for (let order = 1; order < count; order++)
    if (order !== f) harmonicSquares += squareAt(solved.loadCurrent, order);
  const gridSpectrum = labeller.phasors(solved.loadCurrent);
  const gridPower = power(source, first.loadCurrent);
  const phaseVoltage = Math.hypot(source.re, source.im);
  const shortCircuitCurrent = phaseVoltage / Math.SQRT2 / Math.hypot(grid.r, omega * grid.l);
  const shortCircuitRatio = shortCircuitCurrent / (fundamental / Math.SQRT2);

  const filter = network.filter;
  let dampingLoss = 0;
  if (filter !== null) {
    for (let order = 0; order < count; order++) {
      const { seriesImpedance, shuntAdmittance } = lcFilterBranches(filter, base * order);
      dampingLoss +=
        (seriesImpedance.re * squareAt(solved.inverterCurrent, order) +
          shuntAdmittance.re * squareAt(solved.output, order)) /
        2;
    }
  }
  const l2 = grid.l2 + grid.l;
  const resonanceFrequency =
    filter === null || l2 === 0 ? null : lclResonanceFrequency(filter.l, l2, filter.c);
  const limitOptions = {
    referenceCurrent: fundamental,
    shortCircuitRatio,
    generation: grid.generation ?? true,
    totalWholeWaveform: inputs.gridCurrentThdWholeWaveform,
  };
  // Over a span the limits (by whole order, to 50) read the harmonic groups of every component.
  const groups =
    f === 1
      ? null
      : harmonicGroups(
          labeller.phasors({
            re: solved.loadCurrent.re.subarray(0, Math.min(count, f * 51)),
            im: solved.loadCurrent.im.subarray(0, Math.min(count, f * 51)),
          }),
          { maxOrder: 50 },
        );
  const limitSpectrum = groups ?? gridSpectrum;
  return {
    phaseVoltage,
    shortCircuitCurrent,
    shortCircuitRatio,
    gridCurrentSpectrum: gridSpectrum,
    inverterCurrentSpectrum: labeller.phasors(solved.inverterCurrent),
    gridCurrentFundamental: fundamental,
    gridCurrentPhase: Math.atan2(first.loadCurrent.im, first.loadCurrent.re),
    gridCurrentThd: Math.sqrt(harmonicSquares) / fundamental,
    power: phaseCount * gridPower.re,
    reactivePower: phaseCount * gridPower.im,
    powerFactor: gridPower.re / Math.hypot(gridPower.re, gridPower.im),
    resonance:
      resonanceFrequency === null
        ? null
        : {
            frequency: resonanceFrequency,
            carrierRatio: carrierFrequency === null ? null : carrierFrequency / resonanceFrequency,
            controlBandwidthRatio:
              grid.controlBandwidth === undefined
                ? null
                : resonanceFrequency / grid.controlBandwidth,
            withinLiserreRange:
              carrierFrequency === null
                ? null
                : resonanceFrequency >= 10 * fundamentalFrequency &&
                  resonanceFrequency <= carrierFrequency / 2,
          },
    dampingLoss: phaseCount * dampingLoss,
    capacitor:
      filter === null
        ? null
        : {
            fundamentalCurrent:
              Math.hypot(first.capacitorCurrent.re, first.capacitorCurrent.im) / Math.SQRT2,
            reactivePower: -phaseCount * power(first.output, first.capacitorCurrent).im,
          },
    limits: {
      ieee519: checkGridCurrentLimits(limitSpectrum, { ...limitOptions, standard: 'ieee-519' }),
      ieee1547: checkGridCurrentLimits(limitSpectrum, { ...limitOptions, standard: 'ieee-1547' }),
    },
    ...(groups === null ? {} : { harmonicGrouping: { rule: HARMONIC_GROUP_RULE, groups } }),
  };
}
