// The cost model's own estimates, from the service's source, to find where each limit falls.
import {
  maSweepCost,
  multilevelTimerTableCost,
  sheSweepCost,
  spectrumCost,
  timerTableCost,
  waveformCost,
  type CostEstimate,
} from '../../../apps/api/src/services/cost.js';
import type { ComputeLimits } from '../../../apps/api/src/config.js';

/**
 * One limit of the cost model as the fuzzer probes it: a request of the operation built from one
 * whole number `x` (the field the probe varies, within the range the OpenAPI document allows),
 * the estimate the service makes of it, and the budget it is held to. The fuzzer finds the
 * largest `x` the budgets allow and sends that request (which must be accepted) and the one at
 * `x + 1` (which must be a 400 naming the fields the estimate names, never a 5xx or a stall).
 */
export interface CostProbe {
  name: string;
  path: string;
  kind: 'request' | 'job';
  /** The range of `x` the document allows; the boundary must fall inside it. */
  range: [number, number];
  body(x: number): Record<string, unknown>;
  cost(x: number): CostEstimate;
}

const bipolar = (mf: number) => ({
  method: 'sine-triangle',
  scheme: 'bipolar',
  ma: 0.8,
  mf,
  vdc: 400,
});

const threePhase = (mf: number) => ({ method: 'three-phase', ma: 0.8, mf, vdc: 400 });

const timerTable = (carrierRatio: number, tableLength?: number) => ({
  modulation: { method: 'sine-triangle', scheme: 'bipolar', ma: 0.8 },
  fundamentalFrequency: 50,
  carrierFrequency: 50 * carrierRatio,
  timerClock: 100e6,
  ...(tableLength === undefined ? {} : { tableLength }),
});

/** A three-phase NPC bridge (6 complementary pairs) at carrierRatio × 50 Hz, default length. */
const multilevelTimerTable = (carrierRatio: number) => ({
  modulation: { topology: 'npc', levels: 3, carriers: 'pd', phaseCount: 3, ma: 0.9, vdc: 800 },
  fundamentalFrequency: 50,
  carrierFrequency: 50 * carrierRatio,
  timerClock: 100e6,
  counterBits: 32,
});

const maSweep = (points: number) => ({
  modulation: bipolar(21),
  ma: { from: 0.1, to: 1, points },
  maxOrder: 2000,
});

const sheSweep = (points: number) => ({
  kind: 'bipolar',
  vdc: 100,
  count: 3,
  eliminate: [3, 5],
  fundamental: { from: 30, to: 90, points },
});

/**
 * The probes, one per limit a request's fields can reach: spectra by maxOrder (answer size) and
 * by mf (work), waveforms by mf, timer tables by an explicit table length and by the default
 * one (carrier ÷ fundamental), multilevel timer tables by the default length, and the two sweep
 * jobs by their points (job budget).
 */
export const COST_PROBES: CostProbe[] = [
  {
    name: 'spectrum, maxOrder',
    path: '/api/v1/spectra',
    kind: 'request',
    range: [1, 5000],
    body: (x) => ({ modulation: bipolar(21), maxOrder: x }),
    cost: (x) => spectrumCost(bipolar(21) as never, x),
  },
  {
    name: 'spectrum, mf',
    path: '/api/v1/spectra',
    kind: 'request',
    range: [1, 1000],
    body: (x) => ({ modulation: bipolar(x), maxOrder: 1000 }),
    cost: (x) => spectrumCost(bipolar(x) as never, 1000),
  },
  {
    name: 'waveform, mf (three-phase: every leg, phase and line)',
    path: '/api/v1/waveforms',
    kind: 'request',
    range: [1, 1000],
    body: (x) => ({ modulation: threePhase(x) }),
    cost: (x) => waveformCost(threePhase(x) as never),
  },
  {
    name: 'timer table, tableLength',
    path: '/api/v1/timer-tables',
    kind: 'request',
    // tableLength must divide the compare updates per period: one row per update (carrier x
    // times the fundamental, tableLength x) is always allowed.
    range: [1, 4096],
    body: (x) => timerTable(x, x),
    cost: (x) => timerTableCost(timerTable(x, x) as never, 'json'),
  },
  {
    name: 'timer table, default length (carrierFrequency ÷ fundamentalFrequency)',
    path: '/api/v1/timer-tables',
    kind: 'request',
    range: [1, 20_000],
    body: (x) => timerTable(x),
    cost: (x) => timerTableCost(timerTable(x) as never, 'json'),
  },
  {
    name: 'multilevel timer table, default length (carrierFrequency ÷ fundamentalFrequency)',
    path: '/api/v1/multilevel-timer-tables',
    kind: 'request',
    range: [1, 10_000],
    body: (x) => multilevelTimerTable(x),
    cost: (x) => multilevelTimerTableCost(multilevelTimerTable(x) as never, 'json'),
  },
  {
    name: 'ma sweep, ma.points',
    path: '/api/v1/jobs/ma-sweeps',
    kind: 'job',
    range: [2, 400],
    body: maSweep,
    cost: (x) => maSweepCost(maSweep(x) as never),
  },
  {
    name: 'SHE sweep, fundamental.points',
    path: '/api/v1/jobs/she-sweeps',
    kind: 'job',
    range: [2, 400],
    body: sheSweep,
    cost: (x) => sheSweepCost(sheSweep(x) as never),
  },
];

/** The budgets an estimate is held to. */
export type Budgets = Pick<
  ComputeLimits,
  'requestWorkBudget' | 'jobWorkBudget' | 'responseBytesBudget'
>;

/** Whether an estimate is within the budgets of its kind. */
export function withinBudget(
  cost: CostEstimate,
  kind: CostProbe['kind'],
  limits: Budgets,
): boolean {
  const budget = kind === 'job' ? limits.jobWorkBudget : limits.requestWorkBudget;
  return cost.work <= budget && cost.responseBytes <= limits.responseBytesBudget;
}

/**
 * The largest `x` in the probe's range whose estimate is within budget (estimates grow with
 * `x`), by bisection; throws when the boundary is not inside the range (a probe that could not
 * reach its limit would test nothing).
 */
export function boundaryOf(probe: CostProbe, limits: Budgets): number {
  let [low, high] = probe.range;
  const ok = (x: number) => withinBudget(probe.cost(x), probe.kind, limits);
  if (!ok(low) || ok(high))
    throw new Error(`${probe.name}: the limit is not inside ${low}..${high} at these budgets`);
  while (high - low > 1) {
    const middle = Math.floor((low + high) / 2);
    if (ok(middle)) low = middle;
    else high = middle;
  }
  return low;
}
