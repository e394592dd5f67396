import { cascadedCellPower } from '../multilevel/balance/cascadedCellPower.js';
import { deviceSwitchingFrequencies } from '../multilevel/balance/deviceSwitchingFrequencies.js';
import { flyingCapacitorCharge } from '../multilevel/balance/flyingCapacitorCharge.js';
import { neutralPointCurrentFigures } from '../multilevel/balance/neutralPointCurrentFigures.js';
import { threeLevelLosses } from '../multilevel/losses/threeLevelLosses.js';
import { threeLevelSpaceVectorTrajectory } from '../multilevel/space-vector/threeLevelSpaceVectorTrajectory.js';
import { threeLevelVectorDiagram } from '../multilevel/space-vector/threeLevelVectorDiagram.js';
import type { SemiconductorDevice } from '../losses/lossTypes.js';
import {
  MULTILEVEL_CARRIER_ARRANGEMENT_LABELS,
  MULTILEVEL_TOPOLOGY_LABELS,
  type MultilevelTopology,
  type MultilevelWaveforms,
} from '../multilevel/MultilevelTypes.js';
import { TAU } from '../math.js';
import type { Waveform } from '../waveform/Waveform.js';
import type { MultilevelBalanceFigures, MultilevelFigures } from './DesignReport.js';
import type { Modulation } from './Modulation.js';

/** The distinct values of a waveform, ascending, rounded so equal sums of cells compare equal. */
function distinctLevels(waveform: Waveform): number[] {
  return [...new Set(waveform.levels.map((level) => Number(level.toPrecision(12))))].sort(
    (x, y) => x - y,
  );
}

/**
 * The multilevel section of the design report from the bridge's own waveforms: each leg's
 * (string's) output and the levels it takes, leg a's cells for the level-by-level chart, the
 * switching frequency of each device (`deviceSwitchingFrequencies`), and with phase currents the
 * balance of what sits inside the bridge, computed from the report's own inverter currents:
 * the DC midpoint current of an NPC or T-type bridge (`neutralPointCurrentFigures`), the charge
 * of each flying capacitor (`flyingCapacitorCharge`), or the power of each cascaded cell's
 * source (`cascadedCellPower`). Carrier-period windows follow the modulator: the carriers of a
 * carrier modulation, the switching periods [k, k + 1)·2π/N of space vector. With the design's
 * `device` at every position, an NPC or T-type bridge's losses per device class
 * (`threeLevelLosses`, from the same currents). A three-level space-vector design's vector
 * diagram and reference trajectory (`threeLevelVectorDiagram`, `threeLevelSpaceVectorTrajectory`).
 * Internal: part of analyseDesign.
 */
export function multilevelFigures(
  modulation: Modulation,
  waveforms: MultilevelWaveforms & { topology: MultilevelTopology },
  context: {
    fundamentalFrequency: number;
    /** The inverter current of each phase on the report's grid (2πj/S); empty without any. */
    currents: readonly Float64Array[];
    /** The whole DC link (or each cascaded cell's source), volts. */
    vdc: number;
    /** The design's switching device at every position; null for none. */
    device: SemiconductorDevice | null;
  },
): MultilevelFigures {
  const { topology, levels, legs } = waveforms;
  const { fundamentalFrequency, currents, vdc, device } = context;
  const carriers = modulation.method === 'multilevel-carrier' ? modulation.carriers : null;
  const switching = deviceSwitchingFrequencies(waveforms, fundamentalFrequency);
  const [legA] = switching.legs;
  return {
    topology,
    topologyLabel: MULTILEVEL_TOPOLOGY_LABELS[topology],
    levels,
    carriers,
    carriersLabel: carriers === null ? null : MULTILEVEL_CARRIER_ARRANGEMENT_LABELS[carriers],
    legs: legs.map((leg) => ({
      name: leg.name,
      levels: distinctLevels(leg.output),
      edgesPerPeriod: leg.output.edges.length,
      waveform: leg.output,
    })),
    cells: (legs[0]?.cells ?? []).map((cell) => ({ name: cell.name, waveform: cell.waveform })),
    devices: legA?.switches ?? [],
    averageDeviceFrequency: switching.meanDeviceFrequency,
    maxDeviceFrequency: switching.maxDeviceFrequency,
    effectiveOutputFrequency: legA?.effectiveFrequency ?? 0,
    balance:
      currents.length === 0
        ? null
        : balanceFigures(modulation, waveforms, currents, { fundamentalFrequency, vdc }),
    losses:
      device === null || currents.length === 0 || (topology !== 'npc' && topology !== 't-type')
        ? null
        : threeLevelLosses(waveforms, currents, { topology, vdc, fundamentalFrequency, device }),
    vectorDiagram:
      modulation.method === 'multilevel-space-vector'
        ? {
            diagram: threeLevelVectorDiagram(),
            trajectory: threeLevelSpaceVectorTrajectory(modulation),
          }
        : null,
  };
}

function balanceFigures(
  modulation: Modulation,
  waveforms: MultilevelWaveforms & { topology: MultilevelTopology },
  currents: readonly Float64Array[],
  { fundamentalFrequency, vdc }: { fundamentalFrequency: number; vdc: number },
): MultilevelBalanceFigures {
  const windows =
    modulation.method === 'multilevel-carrier'
      ? { mf: modulation.mf, carrierPhase: modulation.carrierPhase ?? 0 }
      : spaceVectorWindows(modulation);
  const none: MultilevelBalanceFigures = {
    neutralPoint: null,
    flyingCapacitors: null,
    cellPower: null,
  };
  switch (waveforms.topology) {
    case 'npc':
    case 't-type':
      return {
        ...none,
        neutralPoint: neutralPointCurrentFigures(waveforms, currents, {
          ...windows,
          fundamentalFrequency,
        }),
      };
    case 'flying-capacitor':
      return {
        ...none,
        flyingCapacitors: flyingCapacitorCharge(waveforms, currents, {
          ...windows,
          fundamentalFrequency,
        }),
      };
    case 'cascaded-h-bridge':
      return {
        ...none,
        cellPower: cascadedCellPower(waveforms, currents, { vdc }),
      };
  }
}

/**
 * The switching periods [k, k + 1)·2π/N of a space-vector modulation as carrier windows: the
 * windows run valley to valley of a carrier of N cycles, whose valleys sit at
 * θ = π/2 + (2πk + carrierPhase)/N (`carrierAngle`), so carrierPhase = −N·π/2 (mod 2π) puts one at
 * θ = 0.
 */
function spaceVectorWindows(modulation: Modulation): { mf: number; carrierPhase: number } {
  const mf = 'frequencyRatio' in modulation ? modulation.frequencyRatio : 1;
  const carrierPhase = -((mf * Math.PI) / 2) % TAU;
  return { mf, carrierPhase };
}
