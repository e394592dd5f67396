import { TAU } from '../../math.js';
import { assertSemiconductorDevice } from '../../losses/assertSemiconductorDevice.js';
import type { DeviceLoss, SemiconductorDevice } from '../../losses/lossTypes.js';
import { switchingEnergyScale } from '../../losses/switchingEnergyScale.js';
import { assertNumberInRange, assertOneOf } from '../../validation/assertions.js';
import { ParameterRangeError, ParameterTypeError } from '../../validation/errors.js';
import { assertMultilevelWaveforms } from '../balance/assertMultilevelWaveforms.js';
import { forEachPiece } from '../balance/forEachPiece.js';
import { legCurrentModel } from '../balance/legCurrentModel.js';
import type { MultilevelPhaseCurrents } from '../balance/MultilevelPhaseCurrents.js';
import type { MultilevelWaveforms } from '../MultilevelTypes.js';
import {
  THREE_LEVEL_COMMUTATION,
  THREE_LEVEL_CONDUCTION,
  type ConductingPart,
  type ThreeLevelPosition,
} from './threeLevelDevicePaths.js';

/** The parts that conduct in one state: for i > 0 and for i < 0. */
type ConductionPaths = readonly [readonly ConductingPart[], readonly ConductingPart[]];

/** The device classes of a three-level leg. */
export type ThreeLevelDeviceClass =
  'outer switch' | 'inner switch' | 'clamp diode' | 'middle switch';

/** Options of {@link threeLevelLosses}. */
export interface ThreeLevelLossOptions {
  topology: 'npc' | 't-type';
  /** The whole DC link, V, > 0 (each commutation is across vdc/2). */
  vdc: number;
  /** Output frequency f₁, Hz, > 0 (switching energy per period × f₁ = power). */
  fundamentalFrequency: number;
  /** The device at every position unless `devices` names another. */
  device: SemiconductorDevice;
  /**
   * Per-class devices: `outer` S1/S4, `inner` S2/S3 (NPC's inner switches, T-type's middle pair),
   * `clamp` D5/D6 of an NPC leg (an `igbt` device whose diode values vf0, rf, err are used).
   */
  devices?: {
    outer?: SemiconductorDevice;
    inner?: SemiconductorDevice;
    clamp?: SemiconductorDevice;
  };
}

/** Losses of one position of one leg, W. */
export interface ThreeLevelPositionLoss {
  /** `S1`…`S4` (a transistor with its anti-parallel diode) or `D5`, `D6` (NPC clamp diodes). */
  position: ThreeLevelPosition;
  deviceClass: ThreeLevelDeviceClass;
  /** The transistor (a MOSFET's channel, in either direction); zero for a clamp diode. */
  transistor: DeviceLoss;
  /** The anti-parallel diode (reverse recovery as its switching loss), or the clamp diode. */
  diode: DeviceLoss;
  total: number;
}

/** Losses of one device class over the whole bridge, W. */
export interface ThreeLevelClassLoss {
  deviceClass: ThreeLevelDeviceClass;
  positions: ThreeLevelPosition[];
  /** Sum over every position of the class in every leg. */
  transistor: DeviceLoss;
  diode: DeviceLoss;
  total: number;
  /** The highest total of one position of the class (the device to size the cooling for), W. */
  hottestPosition: number;
}

/** Semiconductor losses of a three-level bridge by position and by device class, W. */
export interface ThreeLevelLosses {
  topology: 'npc' | 't-type';
  legs: { name: string; positions: ThreeLevelPositionLoss[]; total: number }[];
  classes: ThreeLevelClassLoss[];
  conduction: number;
  switching: number;
  total: number;
}

const CLASSES: Readonly<
  Record<
    'npc' | 't-type',
    readonly { deviceClass: ThreeLevelDeviceClass; positions: ThreeLevelPosition[] }[]
  >
> = {
  npc: [
    { deviceClass: 'outer switch', positions: ['S1', 'S4'] },
    { deviceClass: 'inner switch', positions: ['S2', 'S3'] },
    { deviceClass: 'clamp diode', positions: ['D5', 'D6'] },
  ],
  't-type': [
    { deviceClass: 'outer switch', positions: ['S1', 'S4'] },
    { deviceClass: 'middle switch', positions: ['S2', 'S3'] },
  ],
};

/**
 * Conduction and switching losses of every device of a three-level NPC or T-type bridge, from
 * the exact leg waveforms and the phase currents, with the loss model of `legLossesFromSamples`
 * (on-state v = v0 + r·i for transistor and diode, a MOSFET's channel rdsOn·i² in either
 * direction while gated; switching energies scaled linearly to the commutated voltage vdc/2 and
 * the current at the edge, `switchingEnergyScale`: common practice). Which positions conduct in
 * each state and which commutate on each transition: see threeLevelDevicePaths.ts (NPC: S1/D5
 * and S2/D4 for i > 0, S3/D1 and S4/D6 for i < 0; T-type: S1/D3 and S2/D4 for i > 0, S3/D1 and
 * S4/D2 for i < 0). A jump between the outer levels counts as two commutations through the
 * midpoint. With MOSFETs the channel of a gated position carries the current its diode would
 * (synchronous rectification, dead time neglected); a clamp diode stays a diode.
 *
 * Conduction is integrated exactly over each state's intervals (see
 * {@link MultilevelPhaseCurrents}); switching energy is summed at every edge of each leg's
 * output, times f₁. The leg's state is read from its output (+vdc/2, 0, −vdc/2).
 *
 * @param waveforms - `multilevelCarrier` (or three-level space-vector) output of an `npc` or
 *   `t-type` bridge
 * @param currents - the phase currents, see {@link MultilevelPhaseCurrents}
 * @throws ParameterRangeError / ParameterTypeError naming `waveforms…` (an output level other
 *   than ±vdc/2 or 0), `currents…`, `topology`, `vdc`, `fundamentalFrequency`, `device.…` or
 *   `devices.outer.…`, `devices.inner.…`, `devices.clamp.…`
 */
export function threeLevelLosses(
  waveforms: MultilevelWaveforms,
  currents: MultilevelPhaseCurrents,
  options: ThreeLevelLossOptions,
): ThreeLevelLosses {
  assertMultilevelWaveforms(waveforms);
  const { topology, vdc, fundamentalFrequency, device, devices = {} } = options;
  assertOneOf('topology', topology, ['npc', 't-type'] as const);
  assertNumberInRange('vdc', vdc, { min: 0, minExclusive: true, max: 1e5 });
  assertNumberInRange('fundamentalFrequency', fundamentalFrequency, {
    min: 0,
    minExclusive: true,
    max: 1e6,
  });
  assertSemiconductorDevice(device);
  const outer = devices.outer ?? device;
  const inner = devices.inner ?? device;
  const clamp = devices.clamp ?? device;
  assertDeviceAt('devices.outer', devices.outer);
  assertDeviceAt('devices.inner', devices.inner);
  assertDeviceAt('devices.clamp', devices.clamp);
  if (topology === 'npc' && clamp.kind !== 'igbt') {
    throw new ParameterRangeError(
      devices.clamp === undefined ? 'devices.clamp' : 'devices.clamp.kind',
      "an 'igbt' device whose diode values (vf0, rf, err) the clamp diodes take (given when device is a MOSFET)",
      clamp.kind,
    );
  }
  const states = waveforms.legs.map((leg, k) => legStates(leg.output.levels, vdc, k));
  const deviceOf = (position: ThreeLevelPosition): SemiconductorDevice =>
    position === 'S1' || position === 'S4'
      ? outer
      : position === 'D5' || position === 'D6'
        ? clamp
        : inner;
  const model = legCurrentModel(waveforms, currents);
  const positions = CLASSES[topology].flatMap((c) => c.positions);
  const legs = waveforms.legs.map((leg, legIndex) => {
    // [transistor conduction, transistor switching, diode conduction, diode switching], J/rad or J.
    const sums = new Map(positions.map((p) => [p, [0, 0, 0, 0]]));
    const add = (position: ThreeLevelPosition, slot: number, value: number) => {
      const entry = sums.get(position) as number[];
      entry[slot] = (entry[slot] as number) + value;
    };
    const legState = states[legIndex] as Map<number, -1 | 0 | 1>;
    forEachPiece([leg.output], model.knots, (a, b, [level]) => {
      const c = model.coefficients(legIndex, a, b);
      const integral = model.integral(c, a, b);
      if (integral === 0) return;
      const positive = integral > 0;
      const absolute = Math.abs(integral);
      const square = model.squareIntegral(c, a, b);
      const state = legState.get(level as number) as -1 | 0 | 1;
      const paths = THREE_LEVEL_CONDUCTION[topology][1 - state] as ConductionPaths;
      for (const { position, part } of paths[positive ? 0 : 1]) {
        const d = deviceOf(position);
        const clampDiode = position === 'D5' || position === 'D6';
        if (d.kind === 'mosfet' && !clampDiode) {
          add(position, 0, d.rdsOn * square);
        } else if (d.kind === 'igbt') {
          if (part === 'transistor') add(position, 0, d.vce0 * absolute + d.rce * square);
          else add(position, 2, d.vf0 * absolute + d.rf * square);
        }
      }
    });
    const { edges, levels } = leg.output;
    levels.forEach((level, i) => {
      const before = legState.get(
        levels[(i + levels.length - 1) % levels.length] as number,
      ) as number;
      const after = legState.get(level) as number;
      if (before === after) return;
      const current = model.valueAt(legIndex, edges[i] as number);
      if (current === 0) return;
      const step = after > before ? 1 : -1;
      for (let from = before; from !== after; from += step) {
        const to = from + step;
        const pair = Math.max(from, to) === 1 ? 0 : 1;
        const commutation = THREE_LEVEL_COMMUTATION[topology][pair]?.[current > 0 ? 0 : 1];
        if (commutation === undefined) continue;
        const transistor = deviceOf(commutation.transistor);
        const scale = switchingEnergyScale(transistor, vdc / 2, current);
        if (to === commutation.onIn) {
          add(commutation.transistor, 1, transistor.eon * scale);
          const diode = deviceOf(commutation.diode);
          add(commutation.diode, 3, diode.err * switchingEnergyScale(diode, vdc / 2, current));
        } else {
          add(commutation.transistor, 1, transistor.eoff * scale);
        }
      }
    });
    const rows = positions.map((position): ThreeLevelPositionLoss => {
      const [tc, ts, dc, ds] = (sums.get(position) as number[]).map((v, slot) =>
        slot % 2 === 0 ? v / TAU : v * fundamentalFrequency,
      ) as [number, number, number, number];
      return {
        position,
        deviceClass: classOf(topology, position),
        transistor: { conduction: tc, switching: ts, total: tc + ts },
        diode: { conduction: dc, switching: ds, total: dc + ds },
        total: tc + ts + dc + ds,
      };
    });
    return { name: leg.name, positions: rows, total: rows.reduce((s, r) => s + r.total, 0) };
  });
  const all = legs.flatMap((leg) => leg.positions);
  const sum = (rows: readonly DeviceLoss[]): DeviceLoss => {
    const conduction = rows.reduce((s, r) => s + r.conduction, 0);
    const switching = rows.reduce((s, r) => s + r.switching, 0);
    return { conduction, switching, total: conduction + switching };
  };
  const classes = CLASSES[topology].map(
    ({ deviceClass, positions: members }): ThreeLevelClassLoss => {
      const rows = all.filter((r) => r.deviceClass === deviceClass);
      const transistor = sum(rows.map((r) => r.transistor));
      const diode = sum(rows.map((r) => r.diode));
      return {
        deviceClass,
        positions: [...members],
        transistor,
        diode,
        total: transistor.total + diode.total,
        hottestPosition: Math.max(...rows.map((r) => r.total)),
      };
    },
  );
  const totals = sum(all.flatMap((r) => [r.transistor, r.diode]));
  return {
    topology,
    legs,
    classes,
    conduction: totals.conduction,
    switching: totals.switching,
    total: totals.total,
  };
}

/** The class a position belongs to in a topology. */
function classOf(topology: 'npc' | 't-type', position: ThreeLevelPosition): ThreeLevelDeviceClass {
  const found = CLASSES[topology].find((c) => c.positions.includes(position));
  return (found as (typeof CLASSES)['npc'][number]).deviceClass;
}

/** The state (+1, 0, −1) of each output level, checked to be +vdc/2, 0 or −vdc/2. */
function legStates(levels: readonly number[], vdc: number, leg: number): Map<number, -1 | 0 | 1> {
  const states = new Map<number, -1 | 0 | 1>();
  levels.forEach((level, i) => {
    const state = Math.round(level / (vdc / 2));
    if (
      (state !== -1 && state !== 0 && state !== 1) ||
      Math.abs(level - (state * vdc) / 2) > 1e-9 * vdc
    ) {
      throw new ParameterRangeError(
        `waveforms.legs[${leg}].output.levels[${i}]`,
        `−vdc/2, 0 or +vdc/2 (vdc = ${vdc} V)`,
        level,
      );
    }
    states.set(level, state);
  });
  return states;
}

/** Asserts an optional per-class device, naming its fields under `field`. */
function assertDeviceAt(field: string, device: unknown): void {
  if (device === undefined) return;
  try {
    assertSemiconductorDevice(device);
  } catch (error) {
    const rename = (name: string) => name.replace(/^device/, field);
    if (error instanceof ParameterRangeError) {
      throw new ParameterRangeError(rename(error.field), error.allowed, error.value);
    }
    if (error instanceof ParameterTypeError) {
      throw new ParameterTypeError(rename(error.field), error.expected, error.value);
    }
    throw error;
  }
}
