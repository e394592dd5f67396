import { expect } from 'vitest';
import type { TimerTable } from '../../firmware/timerTableTypes.js';
import { timerTableWaveforms } from '../../firmware/timerTableWaveforms.js';
import type { Waveform } from '../../waveform/Waveform.js';
import type { SpiceNetlistOptions } from '../netlistTypes.js';
import { parseSpiceNetlist, type ParsedNetlist, type ParsedSource } from './spiceNetlist.js';

// Checks of a netlist read back by the reader of ./spiceNetlist.ts against the library's own
// waveforms of the table (timerTableWaveforms), shared by the library's test and the service's
// route test (tests/reference/netlistRoute.test.ts).

/** The resolution the netlist states for its edge times: 1 ps (it writes them as full doubles). */
export const TIME_RESOLUTION = 1e-12;

export interface Edge {
  start: number;
  duration: number;
  from: number;
  to: number;
}

/** The ramps of a parsed PWL source: where its value changes between two time points. */
export function rampsOf(source: ParsedSource): Edge[] {
  const edges: Edge[] = [];
  for (let i = 1; i < source.points.length; i++) {
    const [t0, v0] = source.points[i - 1] as [number, number];
    const [t1, v1] = source.points[i] as [number, number];
    if (v0 !== v1) edges.push({ start: t0, duration: t1 - t0, from: v0, to: v1 });
  }
  return edges;
}

/** The library waveform's level changes over `periods` periods of `period` seconds, from t = 0. */
export function libraryEdges(
  waveform: Waveform,
  period: number,
  periods: number,
  scale = 1,
): { time: number; from: number; to: number }[] {
  const { edges, levels } = waveform;
  const result: { time: number; from: number; to: number }[] = [];
  let previous = (levels[levels.length - 1] as number) * scale;
  for (let p = 0; p < periods; p++) {
    edges.forEach((angle, i) => {
      const level = (levels[i] as number) * scale;
      if (level !== previous)
        result.push({ time: (angle / (2 * Math.PI) + p) * period, from: previous, to: level });
      previous = level;
    });
  }
  return result;
}

export function expectSource(
  source: ParsedSource | undefined,
  expected: ReturnType<typeof libraryEdges>,
  rise: number,
  fall: number,
  end: number,
): void {
  expect(source).toBeDefined();
  const ramps = rampsOf(source as ParsedSource);
  expect(ramps).toHaveLength(expected.length);
  ramps.forEach((ramp, i) => {
    const edge = expected[i] as (typeof expected)[number];
    expect(Math.abs(ramp.start - edge.time)).toBeLessThan(TIME_RESOLUTION);
    expect(ramp.from).toBe(edge.from);
    expect(ramp.to).toBe(edge.to);
    expect(Math.abs(ramp.duration - (edge.to > edge.from ? rise : fall))).toBeLessThan(
      TIME_RESOLUTION,
    );
  });
  const points = (source as ParsedSource).points;
  expect(points[0]?.[0]).toBe(0);
  expect((points[points.length - 1] as [number, number])[0]).toBeGreaterThanOrEqual(
    end - TIME_RESOLUTION,
  );
}

/** The value of a PWL source at time t (linear between points, held after the last). */
export function valueAt(source: ParsedSource, t: number): number {
  const { points } = source;
  // The first point at or after t, by bisection.
  let lo = 1;
  let hi = points.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if ((points[mid] as [number, number])[0] < t) lo = mid + 1;
    else hi = mid;
  }
  const i = lo;
  if (i >= points.length) return (points[points.length - 1] as [number, number])[1];
  const [t0, v0] = points[i - 1] as [number, number];
  const [t1, v1] = points[i] as [number, number];
  return v0 + ((v1 - v0) * (t - t0)) / (t1 - t0);
}

/**
 * Reads `text` back and checks that it holds, for every leg of the table, the high- and low-side
 * gates and the leg voltage, each a PWL source whose every ramp starts at the library's edge
 * (to TIME_RESOLUTION), goes between the library's levels exactly and lasts the rise or fall
 * time, over the periods asked, and the `.tran` line over those periods. Gate on: the leg sits
 * at +vdc/2 with the current forced out of it (the high side) or at −vdc/2 with it forced in
 * (the low side), the dead-time model of timerTableWaveforms. Tables of one channel (a bipolar
 * bridge) are checked on that channel (leg a) only.
 */
export function expectNetlistOfTable(
  text: string,
  table: TimerTable,
  options: Required<Omit<SpiceNetlistOptions, 'onStateDrop'>> &
    Pick<SpiceNetlistOptions, 'onStateDrop'>,
): ParsedNetlist {
  const { riseTime, fallTime, periods, gateVoltage, currentAngle, onStateDrop } = options;
  const netlist = parseSpiceNetlist(text);
  const period = 1 / table.realisedFundamentalFrequency;
  const high = timerTableWaveforms(table, { currentSign: () => 1 }).legs;
  const low = timerTableWaveforms(table, { currentSign: () => -1 }).legs;
  const legs = timerTableWaveforms(table, {
    currentAngle,
    ...(onStateDrop === undefined ? {} : { onStateDrop }),
  }).legs;
  const byName = new Map(netlist.sources.map((s) => [s.name, s]));
  const gateOn = (w: Waveform, sign: number): Waveform => ({
    edges: w.edges,
    levels: w.levels.map((v) => (v * sign > 0 ? gateVoltage : 0)),
  });
  const end = periods * period;
  table.channels.forEach(({ name }, k) => {
    expectSource(
      byName.get(`Vgate_${name}_high`),
      libraryEdges(gateOn(high[k] as Waveform, 1), period, periods),
      riseTime,
      fallTime,
      end,
    );
    expectSource(
      byName.get(`Vgate_${name}_low`),
      libraryEdges(gateOn(low[k] as Waveform, -1), period, periods),
      riseTime,
      fallTime,
      end,
    );
    expectSource(
      byName.get(`Vleg_${name}`),
      libraryEdges(legs[k] as Waveform, period, periods),
      riseTime,
      fallTime,
      end,
    );
    expect(byName.get(`Vleg_${name}`)?.nodes).toEqual([`leg_${name}`, '0']);
  });
  const step = Math.min(riseTime, fallTime);
  const form = (v: number) => (Number.isInteger(v) ? String(v) : v.toExponential());
  expect(netlist.controls).toContainEqual(['.tran', form(step), form(end)]);
  return netlist;
}
