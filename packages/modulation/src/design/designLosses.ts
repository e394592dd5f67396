import { legLossesOfValidSamples } from '../losses/legLossesOfValidSamples.js';
import type { LegLosses } from '../losses/legLossesFromSamples.js';
import type { DeviceLoss, SemiconductorDevice } from '../losses/lossTypes.js';
import { switchingEnergyScale } from '../losses/switchingEnergyScale.js';
import { TAU } from '../math.js';
import type { Waveform } from '../waveform/Waveform.js';
import { hasAntisymmetricHalves, hasHalfWaveSymmetryAbout } from '../waveform/waveformSymmetry.js';
import type { DesignLossFigures, LegLossFigures } from './DesignReport.js';
import type { SwitchingLeg } from './switchingLegs.js';

/** The four devices of a leg, as `LegLosses` names them. */
type DeviceName = 'upperTransistor' | 'lowerTransistor' | 'upperDiode' | 'lowerDiode';

/** A device's conduction loss, W: the part of a `DeviceLoss` the cells give. */
type Conduction = Pick<DeviceLoss, 'conduction'>;

/** Fewest cells a period the conduction integral is summed over. */
const MIN_CONDUCTION_CELLS = 4096;

/**
 * Internal (part of analyseDesign): the semiconductor losses of a design's bridge from its exact
 * leg switching functions and the report's own phase currents, with the loss model of losses/
 * (IGBT v = vce0 + rce·i and diode v = vf0 + rf·i, or a MOSFET channel rdsOn in both
 * directions; switching energies scaled linearly, E·(vdc/Vref)·(|i|/Iref), common practice).
 *
 * - Conduction: the period is cut into cells centred on the currents' samples 2πj/S (every
 *   k-th sample of a finer grid, keeping at least 4096 cells and 64 a carrier period, 32 per leg
 *   edge); each cell's duty is the exact share of it in which the leg's upper switch is on, read
 *   from the leg's edges, and `legLossesFromSamples` averages the cells (only its conduction is
 *   used: a cell is not a carrier period).
 * - Switching: counted at each exact edge of the leg with the current there (linear
 *   interpolation of the grid): with the current out of the leg (i > 0) a rising edge is the
 *   upper transistor's turn-on (eon) and the lower diode's recovery (err), a falling edge its
 *   turn-off (eoff); with i < 0 the lower transistor and the upper diode take the same roles on
 *   the opposite edges. Summed over the period and times the fundamental frequency, W. This is
 *   the per-carrier-period model of `legLossesFromSamples` (eon + eoff + err each switched
 *   period) resolved to the edges, so clamped stretches (the discontinuous zero sequences,
 *   space vector's clamps, overmodulation) do not switch; switching loss is proportional to the
 *   number of edges, and so, for a given waveform shape, to the carrier frequency.
 *
 * @param legs - the bridge's legs (`switchingLegs`)
 * @param inverterSamples - each phase's inverter current, amperes, on S evenly spaced angles
 * @param context.outputPower - power the bridge delivers to its output, W (vdc × the DC-link current's mean)
 */
export function designLosses(
  legs: readonly SwitchingLeg[],
  inverterSamples: readonly Float64Array[],
  context: {
    device: SemiconductorDevice;
    vdc: number;
    fundamentalFrequency: number;
    outputPower: number;
    /**
     * Whether each phase's samples are exactly half-wave antisymmetric
     * (`hasAntisymmetricHalves`), when the caller has read it for its other uses. @default read here
     */
    antisymmetricCurrents?: readonly boolean[];
  },
): DesignLossFigures {
  const { device, vdc, fundamentalFrequency, outputPower } = context;
  const antisymmetric =
    context.antisymmetricCurrents ?? inverterSamples.map(hasAntisymmetricHalves);
  const figures = legs.map((leg): LegLossFigures => {
    const phase = inverterSamples[leg.phaseIndex] as Float64Array;
    const current = leg.currentSign === 1 ? phase : negated(phase);
    // A filtered report's grid follows its analysis order (up to 131072 samples a period); the
    // conduction integral needs no more than 64 cells a carrier period (32 per leg edge).
    let stride = Math.max(
      1,
      Math.floor(current.length / Math.max(MIN_CONDUCTION_CELLS, 32 * leg.state.edges.length)),
    );
    while (current.length % stride !== 0) stride--;
    const cellCount = current.length / stride;
    // A half-wave symmetric leg and current: the first half's cells give the whole period's.
    const halfWave =
      cellCount % 2 === 0 &&
      hasHalfWaveSymmetryAbout(leg.state, 1) &&
      antisymmetric[leg.phaseIndex] === true;
    const read = halfWave ? cellCount / 2 : cellCount;
    const cells = stride === 1 && !halfWave ? current : everyNth(current, stride, read);
    const summed = legLossesOfValidSamples(
      highFractions(leg.state, cellCount, read),
      cells,
      // Only the conduction part is read; the cells' own switching count is not a carrier's.
      { device, vdc, switchingFrequency: fundamentalFrequency * cellCount },
    );
    const conduction = halfWave ? mirroredHalfConduction(summed) : summed;
    const switching = edgeSwitchingLosses(leg.state, current, device, vdc, fundamentalFrequency);
    const loss = (c: Conduction, s: number): DeviceLoss => ({
      conduction: c.conduction,
      switching: s,
      total: c.conduction + s,
    });
    const upperTransistor = loss(conduction.upperTransistor, switching.upperTransistor);
    const lowerTransistor = loss(conduction.lowerTransistor, switching.lowerTransistor);
    const upperDiode = loss(conduction.upperDiode, switching.upperDiode);
    const lowerDiode = loss(conduction.lowerDiode, switching.lowerDiode);
    return {
      name: leg.name,
      upperTransistor,
      lowerTransistor,
      upperDiode,
      lowerDiode,
      total: upperTransistor.total + lowerTransistor.total + upperDiode.total + lowerDiode.total,
    };
  });
  const sum = (part: 'conduction' | 'switching') =>
    figures.reduce(
      (total, leg) =>
        total +
        leg.upperTransistor[part] +
        leg.lowerTransistor[part] +
        leg.upperDiode[part] +
        leg.lowerDiode[part],
      0,
    );
  const conduction = sum('conduction');
  const switching = sum('switching');
  const total = conduction + switching;
  return {
    deviceKind: device.kind,
    legs: figures,
    conduction,
    switching,
    total,
    outputPower,
    efficiency: outputPower > 0 ? outputPower / (outputPower + total) : null,
  };
}

/** −x, sample by sample. */
function negated(samples: Float64Array): Float64Array {
  const result = new Float64Array(samples.length);
  for (let j = 0; j < samples.length; j++) result[j] = -(samples[j] as number);
  return result;
}

/**
 * The whole period's conduction from the first half's cells of a half-wave symmetric leg: half a
 * period on, the state is 1 − s and the current −i, so each cell's upper transistor (diode)
 * conducts there as the lower one did in the first half, and the reverse: over the period each
 * device of a pair averages the pair's two first-half means.
 */
function mirroredHalfConduction(half: LegLosses): Record<DeviceName, Conduction> {
  const transistors = (half.upperTransistor.conduction + half.lowerTransistor.conduction) / 2;
  const diodes = (half.upperDiode.conduction + half.lowerDiode.conduction) / 2;
  return {
    upperTransistor: { conduction: transistors },
    lowerTransistor: { conduction: transistors },
    upperDiode: { conduction: diodes },
    lowerDiode: { conduction: diodes },
  };
}

/** Samples 0, stride, 2·stride, … (stride divides the length), the first `count` of them. */
function everyNth(
  samples: Float64Array,
  stride: number,
  count = samples.length / stride,
): Float64Array {
  const result = new Float64Array(count);
  for (let j = 0; j < result.length; j++) result[j] = samples[j * stride] as number;
  return result;
}

/**
 * The share of each of `size` cells (centred on 2πj/size) in which the state is 1, for the first
 * `upTo` cells.
 */
function highFractions(state: Waveform, size: number, upTo = size): Float64Array {
  const width = TAU / size;
  const high = new Float64Array(upTo);
  const { edges, levels } = state;
  // Shifted by half a cell, cell j is [j·width, (j + 1)·width).
  const add = (from: number, to: number): void => {
    const first = Math.min(size - 1, Math.floor(from / width));
    if (first >= upTo) return;
    const last = Math.floor(to / width);
    if (first >= last) {
      high[first] = (high[first] as number) + (to - from);
      return;
    }
    high[first] = (high[first] as number) + ((first + 1) * width - from);
    const through = Math.min(last, upTo);
    for (let j = first + 1; j < through; j++) high[j] = (high[j] as number) + width;
    if (last < upTo) high[last] = (high[last] as number) + (to - last * width);
  };
  edges.forEach((edge, i) => {
    if (levels[i] !== 1) return;
    const next = i + 1 < edges.length ? (edges[i + 1] as number) : (edges[0] as number) + TAU;
    let from = edge + width / 2;
    let to = next + width / 2;
    // Bring the segment into [0, 2π), split where it wraps.
    const turns = Math.floor(from / TAU);
    from -= turns * TAU;
    to -= turns * TAU;
    if (to <= TAU) add(from, to);
    else {
      add(from, TAU);
      add(0, Math.min(to - TAU, TAU));
    }
  });
  for (let j = 0; j < upTo; j++) high[j] = Math.min(1, Math.max(0, (high[j] as number) / width));
  return high;
}

/** Switching loss of each device of one leg from its edges, W. */
function edgeSwitchingLosses(
  state: Waveform,
  current: Float64Array,
  device: SemiconductorDevice,
  vdc: number,
  fundamentalFrequency: number,
): Record<DeviceName, number> {
  const energy = { upperTransistor: 0, lowerTransistor: 0, upperDiode: 0, lowerDiode: 0 };
  const { edges, levels } = state;
  const size = current.length;
  edges.forEach((edge, i) => {
    const level = levels[i];
    const previous = levels[(i - 1 + levels.length) % levels.length];
    if (level === previous) return;
    const x = (edge / TAU) * size;
    const j = Math.floor(x) % size;
    const fraction = x - Math.floor(x);
    const i0 = current[j] as number;
    const i1 = current[(j + 1) % size] as number;
    const at = i0 + fraction * (i1 - i0);
    const scale = switchingEnergyScale(device, vdc, at);
    const rising = level === 1;
    if (at > 0) {
      if (rising) {
        energy.upperTransistor += device.eon * scale;
        energy.lowerDiode += device.err * scale;
      } else energy.upperTransistor += device.eoff * scale;
    } else if (at < 0) {
      if (rising) energy.lowerTransistor += device.eoff * scale;
      else {
        energy.lowerTransistor += device.eon * scale;
        energy.upperDiode += device.err * scale;
      }
    }
  });
  return {
    upperTransistor: energy.upperTransistor * fundamentalFrequency,
    lowerTransistor: energy.lowerTransistor * fundamentalFrequency,
    upperDiode: energy.upperDiode * fundamentalFrequency,
    lowerDiode: energy.lowerDiode * fundamentalFrequency,
  };
}
