import {
  carrierAngle,
  triangleCarrier,
  type CarrierAlignment,
} from '../carrier/triangleCarrier.js';
import { HALF_PI, TAU, wrapAngle } from '../math.js';
import type { Waveform } from '../waveform/Waveform.js';
import type { Modulation } from './Modulation.js';
import type { ModulationVoltages } from './modulationVoltages.js';

/** One two-level leg of a bridge as the loss model sees it. */
export interface SwitchingLeg {
  /** `leg a`, `leg b`, `leg c` (three-phase: the leg of that phase; single-phase: a feeds the load, b returns it). */
  name: string;
  /** Upper switch position over one period: level 1 while it is on, 0 while the lower one is. */
  state: Waveform;
  /** Which phase's inverter current flows out of the leg (index into the report's phases). */
  phaseIndex: number;
  /** +1 when the leg carries that current out of it, −1 when into it (leg b of a single-phase bridge). */
  currentSign: 1 | -1;
}

/**
 * Internal: the two-level legs of a bridge, exact, from its output voltages: a three-phase
 * bridge's legs (upper switch on at +vdc/2); a single-phase bridge's legs a and b from the
 * bridge output v = v_a − v_b: +vdc is a on and b off, −vdc the reverse, and 0 (unipolar
 * sine-triangle) both on or both off. Leg a compares +ref and leg b −ref with one carrier, so
 * both are on only where the carrier is below both, −|ref|, and both off only where it is
 * above |ref|: within a zero interval, both on exactly where the carrier is below 0 (Holmes and
 * Lipo, 2003, ch. 3). Null for anything else (a
 * staircase, a multilevel bridge, or legs with more than two levels), which the two-level loss
 * model cannot take.
 */
export function switchingLegs(
  modulation: Modulation,
  voltages: ModulationVoltages,
  vdc: number,
): SwitchingLeg[] | null {
  // A multilevel bridge's devices are the multilevel loss model's, not this one's.
  if ('multilevel' in voltages && voltages.multilevel !== undefined) return null;
  const tolerance = 1e-9 * vdc;
  const near = (level: number, target: number) => Math.abs(level - target) <= tolerance;
  if (voltages.phaseCount === 3) {
    const legs: SwitchingLeg[] = [];
    for (const [k, leg] of voltages.legs.entries()) {
      if (!leg.waveform.levels.every((v) => near(Math.abs(v), vdc / 2))) return null;
      legs.push({
        name: `leg ${'abc'[k] ?? 'a'}`,
        state: merged(
          leg.waveform.edges,
          leg.waveform.levels.map((v) => (v > 0 ? 1 : 0)),
        ),
        phaseIndex: k,
        currentSign: 1,
      });
    }
    return legs;
  }
  const bridge = voltages.phases[0]?.waveform;
  if (bridge === undefined) return null;
  const starts: number[] = [];
  const a: number[] = [];
  const b: number[] = [];
  const push = (edge: number, upperA: number, upperB: number): void => {
    starts.push(edge);
    a.push(upperA);
    b.push(upperB);
  };
  const { edges, levels } = bridge;
  for (const [i, level] of levels.entries()) {
    const start = edges[i] as number;
    if (near(level, vdc)) push(start, 1, 0);
    else if (near(level, -vdc)) push(start, 0, 1);
    else if (near(level, 0) && modulation.method === 'sine-triangle') {
      // Where ±ref cross the carrier together (the reference's zero) a zero interval runs from
      // both on straight to both off: split it where the carrier crosses 0.
      const end = i + 1 < edges.length ? (edges[i + 1] as number) : (edges[0] as number) + TAU;
      const cuts = [start, ...carrierZeros(start, end, modulation), end];
      for (let k = 0; k + 1 < cuts.length; k++) {
        const middle = ((cuts[k] as number) + (cuts[k + 1] as number)) / 2;
        const both = triangleCarrier(middle, modulation) < 0 ? 1 : 0;
        push(wrapAngle(cuts[k] as number), both, both);
      }
    } else return null;
  }
  // A split past 2π wraps to the start: keep the edges ascending.
  const order = starts
    .map((_, k) => k)
    .sort((x, y) => (starts[x] as number) - (starts[y] as number));
  const sorted = (values: number[]) => order.map((k) => values[k] as number);
  return [
    { name: 'leg a', state: merged(sorted(starts), sorted(a)), phaseIndex: 0, currentSign: 1 },
    { name: 'leg b', state: merged(sorted(starts), sorted(b)), phaseIndex: 0, currentSign: -1 },
  ];
}

/**
 * The angles in (start, end) where the unit triangle carrier crosses 0: carrier phase
 * x = mf·(θ − π/2) − carrierPhase at π/2 + kπ (`triangleCarrier`).
 */
function carrierZeros(start: number, end: number, alignment: CarrierAlignment): number[] {
  const { mf, carrierPhase = 0 } = alignment;
  const angleOf = (k: number) => HALF_PI + (HALF_PI + k * Math.PI + carrierPhase) / mf;
  const zeros: number[] = [];
  for (let k = Math.floor((carrierAngle(start, alignment) - HALF_PI) / Math.PI); ; k++) {
    const theta = angleOf(k);
    if (theta >= end) return zeros;
    if (theta > start) zeros.push(theta);
  }
}

/** The waveform of the given states with the edges between equal states dropped. */
function merged(edges: readonly number[], states: readonly number[]): Waveform {
  const keptEdges: number[] = [];
  const keptLevels: number[] = [];
  const n = states.length;
  for (let i = 0; i < n; i++) {
    const previous = states[(i - 1 + n) % n];
    if (states[i] !== previous || n === 1) {
      keptEdges.push(edges[i] as number);
      keptLevels.push(states[i] as number);
    }
  }
  // Every state equal: one edge holding it all period.
  if (keptEdges.length === 0) return { edges: [edges[0] as number], levels: [states[0] as number] };
  return { edges: keptEdges, levels: keptLevels };
}
