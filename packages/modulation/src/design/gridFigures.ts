import { lcFilterBranches } from '../filter/lcFilterBranches.js';
import { lclResonanceFrequency } from '../filter/lclResonanceFrequency.js';
import {
  outputNetworkResponse,
  type OutputNetwork,
  type OutputNetworkPhasors,
} from '../filter/outputNetworkResponse.js';
import { checkGridCurrentLimits } from '../limits/checkGridCurrentLimits.js';
import { TAU } from '../math.js';
import { complexAbs, phasorOf, type Complex } from '../numeric/complex.js';
import type { Harmonic } from '../spectrum/Harmonic.js';
import type { LabelledHarmonic } from '../spectrum/labelHarmonics.js';
import { meanHarmonic } from '../spectrum/meanHarmonic.js';
import { ParameterRangeError } from '../validation/errors.js';
import type { GridFigures } from './DesignReport.js';
import type { DesignGrid } from './InverterDesign.js';

/** What {@link gridFigures} reads from the analysis of a design with a grid. */
export interface GridFigureInputs {
  grid: DesignGrid;
  /** Filter and grid of one phase (the grid as the network's load: r, l2 + l). */
  network: OutputNetwork;
  /** Phase a's bridge voltage, orders 0..analysisOrder, peak volts. */
  bridge: readonly Harmonic[];
  /** Phase a's grid source phasor at the fundamental, peak volts. */
  source: Complex;
  phaseCount: 1 | 3;
  fundamentalFrequency: number;
  carrierFrequency: number | null;
  /** THD of phase a's grid current over the whole waveform (the report's load current), ratio. */
  gridCurrentThdWholeWaveform: number;
  label: (spectrum: readonly Harmonic[]) => LabelledHarmonic[];
}

const ZERO: Complex = { re: 0, im: 0 };

/** A phasor as a harmonic in the `harmonics` convention. */
function harmonicOf(order: number, phasor: Complex): Harmonic {
  if (order === 0) return meanHarmonic(phasor.re);
  return { order, amplitude: complexAbs(phasor), phase: Math.atan2(phasor.im, phasor.re) };
}

/** ½·V·conj(I): the mean complex power of two phasors (peak amplitudes), watts + j·var. */
function power(v: Complex, i: Complex): Complex {
  return { re: (v.re * i.re + v.im * i.im) / 2, im: (v.im * i.re - v.re * i.im) / 2 };
}

/**
 * The figures of a grid-connected bridge ({@link GridFigures}). Each order of the bridge
 * voltage is solved through the loaded network (`outputNetworkResponse`, nodal analysis) with
 * the grid source added at the fundamental only (superposition: the network is linear). The
 * damping loss is Σ ½·(Re Z_series·|I_inv|² + Re Y_shunt·|V_C|²) over the orders (L and C
 * are lossless). Limits: IEEE Std 519-2022 Table 2 with the generation footnote, and IEEE Std
 * 1547-2018 Tables 26–27, both recalled from memory, with the fundamental grid current as the
 * reference current.
 *
 * @throws ParameterRangeError naming `grid.phase` when the bridge and the grid exchange no
 *   fundamental current (no reference current for the limits)
 */
export function gridFigures(inputs: GridFigureInputs): GridFigures {
  const { grid, network, bridge, source, phaseCount, fundamentalFrequency } = inputs;
  const { carrierFrequency, label } = inputs;
  const omega = TAU * fundamentalFrequency;
  const solved: OutputNetworkPhasors[] = bridge.map((h) =>
    outputNetworkResponse(
      network,
      omega * h.order,
      phasorOf(h.amplitude, h.phase),
      h.order === 1 ? source : ZERO,
    ),
  );
  const gridSpectrum = solved.map((s, order) => harmonicOf(order, s.loadCurrent));
  const inverterSpectrum = solved.map((s, order) => harmonicOf(order, s.inverterCurrent));
  const first = solved[1] as OutputNetworkPhasors;
  const fundamental = complexAbs(first.loadCurrent);
  if (!(fundamental > 0))
    throw new ParameterRangeError(
      'grid.phase',
      'an angle at which the bridge and the grid exchange fundamental current',
      grid.phase ?? 0,
    );
  let harmonicSquares = 0;
  for (const h of gridSpectrum) if (h.order >= 2) harmonicSquares += h.amplitude ** 2;
  const gridPower = power(source, first.loadCurrent);
  const phaseVoltage = complexAbs(source);
  const shortCircuitCurrent = phaseVoltage / Math.SQRT2 / Math.hypot(grid.r, omega * grid.l);
  const shortCircuitRatio = shortCircuitCurrent / (fundamental / Math.SQRT2);

  const filter = network.filter;
  let dampingLoss = 0;
  if (filter !== null) {
    solved.forEach((s, order) => {
      const { seriesImpedance, shuntAdmittance } = lcFilterBranches(filter, omega * order);
      const current = complexAbs(s.inverterCurrent);
      const voltage = complexAbs(s.output);
      dampingLoss += (seriesImpedance.re * current ** 2 + shuntAdmittance.re * voltage ** 2) / 2;
    });
  }
  const l2 = grid.l2 + grid.l;
  const resonanceFrequency =
    filter === null || l2 === 0 ? null : lclResonanceFrequency(filter.l, l2, filter.c);
  const limitOptions = {
    referenceCurrent: fundamental,
    shortCircuitRatio,
    totalWholeWaveform: inputs.gridCurrentThdWholeWaveform,
  };
  return {
    phaseVoltage,
    shortCircuitCurrent,
    shortCircuitRatio,
    gridCurrentSpectrum: label(gridSpectrum),
    inverterCurrentSpectrum: label(inverterSpectrum),
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
            fundamentalCurrent: complexAbs(first.capacitorCurrent) / Math.SQRT2,
            reactivePower: -phaseCount * power(first.output, first.capacitorCurrent).im,
          },
    limits: {
      ieee519: checkGridCurrentLimits(gridSpectrum, { ...limitOptions, standard: 'ieee-519' }),
      ieee1547: checkGridCurrentLimits(gridSpectrum, { ...limitOptions, standard: 'ieee-1547' }),
    },
  };
}
