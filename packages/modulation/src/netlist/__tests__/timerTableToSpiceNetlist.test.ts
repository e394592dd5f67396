import { describe, expect, it } from 'vitest';
import { timerTable } from '../../firmware/timerTable.js';
import type { TimerTable, TimerTableOptions } from '../../firmware/timerTableTypes.js';
import { ParameterRangeError } from '../../validation/errors.js';
import { spiceNetlistSources } from '../spiceNetlistSources.js';
import { timerTableToSpiceNetlist } from '../timerTableToSpiceNetlist.js';
import { expectNetlistOfTable, rampsOf, TIME_RESOLUTION, valueAt } from './netlistChecks.js';
import { parseSpiceNetlist, spiceValue, type ParsedSource } from './spiceNetlist.js';

describe('timerTableToSpiceNetlist', () => {
  it("writes each gate and leg of a three-phase table as a PWL source whose edges are the library's, over the periods asked", () => {
    const request: TimerTableOptions = {
      modulation: { method: 'three-phase', zeroSequence: 'third-harmonic', ma: 0.95 },
      fundamentalFrequency: 50,
      carrierFrequency: 2550,
      timerClock: 64_000_000,
      countingMode: 'edge-aligned',
      deadTime: 8e-7,
      vdc: 600,
    };
    const table: TimerTable = timerTable(request);
    const text = timerTableToSpiceNetlist(table, {
      riseTime: 5e-8,
      fallTime: 2e-8,
      periods: 2,
      gateVoltage: 15,
      currentAngle: 0.4,
    });
    const netlist = expectNetlistOfTable(text, table, {
      riseTime: 5e-8,
      fallTime: 2e-8,
      periods: 2,
      gateVoltage: 15,
      currentAngle: 0.4,
    });
    expect(netlist.sources.map((s) => s.name)).toEqual([
      'Vgate_a_high',
      'Vgate_a_low',
      'Vgate_b_high',
      'Vgate_b_low',
      'Vgate_c_high',
      'Vgate_c_low',
      'Vleg_a',
      'Vleg_b',
      'Vleg_c',
    ]);
  });

  it('puts the on-state drops in the leg voltages only: with equal drops v each leg is its ideal self less v·sgn(i)', () => {
    // Whichever device conducts takes v against the current (standard circuit analysis), so
    // with equal transistor and diode drops the leg voltage is the ideal one less v·sgn(i).
    const table = timerTable({
      modulation: { method: 'sine-triangle', scheme: 'unipolar', ma: 0.9 },
      vdc: 400,
      fundamentalFrequency: 50,
      carrierFrequency: 5000,
      timerClock: 64e6,
      deadTime: 1e-6,
    });
    const v = 1.8;
    const phi = 0.5;
    const options = { riseTime: 2e-8, fallTime: 2e-8, periods: 1, gateVoltage: 15 };
    const text = timerTableToSpiceNetlist(table, {
      ...options,
      currentAngle: phi,
      onStateDrop: { transistor: v, diode: v },
    });
    expect(text).toMatch(/on-state drops of 1\.8 V a transistor, 1\.8 V a diode/);
    const dropped = expectNetlistOfTable(text, table, {
      ...options,
      currentAngle: phi,
      onStateDrop: { transistor: v, diode: v },
    });
    const ideal = parseSpiceNetlist(
      timerTableToSpiceNetlist(table, { ...options, currentAngle: phi }),
    );
    const named = (n: typeof ideal, name: string) =>
      n.sources.find((s) => s.name === name) as ParsedSource;
    // Gates unchanged.
    for (const gate of ['Vgate_a_high', 'Vgate_a_low', 'Vgate_b_high', 'Vgate_b_low'])
      expect(named(dropped, gate).points).toEqual(named(ideal, gate).points);
    // Leg a carries sin(θ − φ), leg b its opposite; sampled off the ramps.
    const period = 1 / table.realisedFundamentalFrequency;
    let checked = 0;
    for (const [leg, sign] of [
      ['Vleg_a', 1],
      ['Vleg_b', -1],
    ] as const) {
      for (let k = 0; k < 997; k++) {
        const t = ((k + 0.5) / 997) * period;
        const current = sign * Math.sin((2 * Math.PI * t) / period - phi);
        const before = valueAt(named(ideal, leg), t);
        if (Math.abs(before) !== 200 || Math.abs(current) < 1e-3) continue; // on a ramp or at a zero
        expect(valueAt(named(dropped, leg), t), `${leg} at ${t}`).toBeCloseTo(
          before - v * Math.sign(current),
          9,
        );
        checked++;
      }
    }
    expect(checked).toBeGreaterThan(1800);
  });

  it("keeps the dead time between the two gates of a leg, and the bipolar bridge's crosswise leg b", () => {
    const table = timerTable({
      modulation: { method: 'sine-triangle', scheme: 'bipolar', ma: 0.9 },
      sampling: 'regular-symmetric',
      vdc: 300,
      fundamentalFrequency: 60,
      carrierFrequency: 3600,
      timerClock: 72e6,
      deadTime: 5e-7,
    });
    const netlist = parseSpiceNetlist(timerTableToSpiceNetlist(table));
    const byName = new Map(netlist.sources.map((s) => [s.name, s]));
    const highA = byName.get('Vgate_a_high') as ParsedSource;
    const lowA = byName.get('Vgate_a_low') as ParsedSource;
    expect(byName.get('Vgate_b_high')?.points).toEqual(lowA.points);
    expect(byName.get('Vgate_b_low')?.points).toEqual(highA.points);
    expect(byName.get('Vleg_b')?.points).toEqual(
      (byName.get('Vleg_a') as ParsedSource).points.map(([t, v]) => [t, -v]),
    );
    // Between a gate's turn-off and the other gate's turn-on there is the table's dead time,
    // 36 ticks of 72 MHz = 0.5 µs (compare-offset splits it over both edges of each pulse).
    const onsets = (s: ParsedSource) =>
      rampsOf(s)
        .filter((r) => r.to > r.from)
        .map((r) => r.start);
    const offsets = (s: ParsedSource) =>
      rampsOf(s)
        .filter((r) => r.to < r.from)
        .map((r) => r.start);
    for (const [on, off] of [
      [onsets(highA), offsets(lowA)],
      [onsets(lowA), offsets(highA)],
    ] as const) {
      on.forEach((t) => {
        const before = off.filter((u) => u <= t).at(-1);
        if (before !== undefined) expect(t - before).toBeGreaterThanOrEqual(5e-7 - TIME_RESOLUTION);
      });
    }
    // And never both on, sampled finely over the period (every 20 ns, a fifth of a ramp).
    let overlap = 0;
    for (let t = 0; t < 1 / 60; t += 2e-8)
      overlap = Math.max(overlap, Math.min(valueAt(highA, t), valueAt(lowA, t)));
    expect(overlap).toBe(0);
  });

  it('refuses a ramp longer than the time between two edges, and each option out of range, naming it', () => {
    const table = timerTable({
      modulation: { method: 'sine-triangle', scheme: 'unipolar', ma: 0.95 },
      vdc: 300,
      fundamentalFrequency: 50,
      carrierFrequency: 20000,
      timerClock: 72e6,
    });
    const fieldOf = (options: Parameters<typeof spiceNetlistSources>[1]): string => {
      try {
        spiceNetlistSources(table, options);
      } catch (error) {
        expect(error).toBeInstanceOf(ParameterRangeError);
        return `${(error as ParameterRangeError).field}: ${(error as Error).message}`;
      }
      return 'no error';
    };
    // A carrier period here is 50 µs; a 20 µs ramp reaches the next edge of some narrow pulse.
    expect(fieldOf({ riseTime: 2e-5 })).toMatch(
      /^(riseTime|fallTime): (riseTime|fallTime) must be shorter than the shortest time between two edges of a signal/,
    );
    // The ramp named is the one that is too long, whichever edge comes next.
    expect(fieldOf({ riseTime: 4e-5, fallTime: 1e-8 })).toMatch(
      /^riseTime: riseTime must be shorter than .*; got 0\.00004$/,
    );
    expect(fieldOf({ riseTime: 1e-8, fallTime: 4e-5 })).toMatch(
      /^fallTime: fallTime must be shorter than .*; got 0\.00004$/,
    );
    expect(fieldOf({ riseTime: 0 })).toMatch(/^riseTime: riseTime must be a finite number > 0/);
    expect(fieldOf({ fallTime: -1e-9 })).toMatch(/^fallTime: /);
    expect(fieldOf({ periods: 1.5 })).toMatch(/^periods: periods must be an integer/);
    expect(fieldOf({ periods: 1001 })).toMatch(/^periods: /);
    expect(fieldOf({ gateVoltage: 0 })).toMatch(/^gateVoltage: /);
    expect(fieldOf({ currentAngle: 7 })).toMatch(/^currentAngle: /);
    // 400 carrier periods × 4 edges a pulse × 6 signals: 1000 periods would exceed 2 million points.
    expect(fieldOf({ periods: 1000 })).toMatch(
      /^periods: periods must be an integer from 1 to \d+ for this table/,
    );
  });

  it('reads scale factors as the format describes them', () => {
    expect(spiceValue('1.5u')).toBeCloseTo(1.5e-6, 18);
    expect(spiceValue('10MEG')).toBe(1e7);
    expect(spiceValue('3ns')).toBeCloseTo(3e-9, 20);
    expect(spiceValue('2.5e-5')).toBe(2.5e-5);
  });
});
