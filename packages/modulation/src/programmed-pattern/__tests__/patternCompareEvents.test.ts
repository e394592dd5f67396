import { describe, expect, it } from 'vitest';
import { solveShe } from '../../she/index.js';
import { assertInDelta } from '../../testing/assertInDelta.js';
import { rangeErrorField } from '../../testing/rangeErrorField.js';
import { patternCompareEvents } from '../index.js';

describe('patternCompareEvents', () => {
  it('staircase cell with in-phase current: the dead time shifts leg A only, b₁ = (2vdc/π)(cos(α + δ) + cos α)', () => {
    // Hand derivation (from the leg conventions): leg A is high on [α, π + α); the current
    // sin θ flows out of it at both edges' rise (θ = α) and into it at the fall (θ = π + α),
    // so both of leg A's edges are late by δ = ω·td; leg B (high on [π − α, 2π − α), current
    // −sin θ) has the current flowing into it at its rise and out at its fall: no edge moves.
    // A 50 % square leg high on [x, π + x) has the fundamental (2vdc/π)·sin(θ − x) (standard
    // Fourier series), so vA − vB = (2vdc/π)[cos(α + δ) + cos α]·sin θ + cosine terms.
    const ticksPerPeriod = 3600;
    const alpha = (2 * Math.PI * 300) / ticksPerPeriod; // 30°, exactly on a tick
    const result = patternCompareEvents(
      { kind: 'staircase', vdc: 48, angles: [alpha] },
      {
        fundamentalFrequency: 50,
        timerClock: 50 * ticksPerPeriod,
        deadTime: 4 / (50 * ticksPerPeriod),
        orders: [3],
      },
    );
    const delta = (2 * Math.PI * 4) / ticksPerPeriod;
    expect(result.deadTimeTicks).toBe(4);
    assertInDelta(
      result.ideal.fundamental,
      ((4 * 48) / Math.PI) * Math.cos(alpha),
      1e-10,
      'ideal b₁',
    );
    assertInDelta(result.quantised.fundamental, result.ideal.fundamental, 1e-10, 'edges on ticks');
    assertInDelta(
      result.realised.fundamental,
      ((2 * 48) / Math.PI) * (Math.cos(alpha + delta) + Math.cos(alpha)),
      1e-10,
      'realised b₁',
    );
    // The 3rd is eliminated at α = 30° (cos 3α = 0, Patel and Hoft 1973); the dead time brings it back.
    expect(result.ideal.orders[0]?.relative).toBeLessThan(1e-12);
    expect(result.realised.orders[0]?.relative).toBeGreaterThan(1e-4);
    const legA = result.devices.find((d) => d.device === 'cell 1 leg A high side');
    expect(legA?.events).toEqual([
      { tick: 304, state: 'on' },
      { tick: 2100, state: 'off' },
    ]);
    const lowA = result.devices.find((d) => d.device === 'cell 1 leg A low side');
    expect(lowA?.events).toEqual([
      { tick: 300, state: 'off' },
      { tick: 2104, state: 'on' },
    ]);
  });

  it('bipolar SHE pattern: complementary legs, dead time lowers the fundamental with in-phase current', () => {
    const she = solveShe({
      kind: 'bipolar',
      vdc: 300,
      count: 5,
      eliminate: [5, 7, 11, 13],
      fundamental: 0.6 * 300,
    });
    expect(she.converged).toBe(true);
    const base = { fundamentalFrequency: 50, timerClock: 1e6, orders: [5, 7, 11, 13] };
    const ideal = patternCompareEvents({ kind: 'bipolar', vdc: 300, angles: she.angles }, base);
    const dead = patternCompareEvents(
      { kind: 'bipolar', vdc: 300, angles: she.angles },
      { ...base, deadTime: 2e-6 },
    );
    // Each leg switches at 4·5 = 20 edges a period plus the half-period ones; every high-side
    // command has a matching low-side one, tick for tick, with no dead time.
    expect(ideal.devices.map((d) => d.device)).toEqual([
      'leg A high side',
      'leg A low side',
      'leg B high side',
      'leg B low side',
    ]);
    const [aHigh, aLow, bHigh] = ideal.devices;
    expect(aHigh?.events.map((e) => e.tick)).toEqual(aLow?.events.map((e) => e.tick));
    expect(aHigh?.events.map((e) => e.state)).toEqual(
      bHigh?.events.map((e) => (e.state === 'on' ? 'off' : 'on')),
    );
    assertInDelta(
      ideal.realised.fundamental,
      ideal.quantised.fundamental,
      1e-12,
      'no dead time, no change',
    );
    for (const o of ideal.ideal.orders) expect(o.relative).toBeLessThan(1e-9);
    // Quantisation to 1 µs moves each edge by at most half a tick: each of the 22 edges of vAB
    // (amplitude step 2vdc) changes b₁ by at most (1/π)·2vdc·(half-tick angle) (bound by hand).
    const halfTick = Math.PI / 20000;
    expect(Math.abs(ideal.quantised.fundamental - 0.6 * 300)).toBeLessThan(
      (22 * 2 * 300 * halfTick) / Math.PI,
    );
    // In-phase current: the dead time loses volt-seconds (fact of the trade; Murai et al. 1987).
    expect(dead.deadTimeFundamentalChange).toBeLessThan(0);
    // Average-value bound: a leg loses at most vdc·td per edge pair, an H-bridge twice that:
    // |Δb₁| ≤ (8/π)·vdc·td·f·(pulses a period) (Murai et al. 1987, from memory).
    const pulses = (aHigh?.events.length ?? 0) / 2;
    expect(Math.abs(dead.deadTimeFundamentalChange)).toBeLessThan(
      (8 / Math.PI) * 300 * 2e-6 * 50 * pulses,
    );
  });

  it('names the pulses that rounding or the dead time swallows', () => {
    // Angles 0.1 and 0.2 rad on a timer of 4 ticks a period (0.1 and 0.2 rad are 0.06 and
    // 0.13 of a tick): both edges of the pulse between them round to tick 0 (by hand).
    const coarse = patternCompareEvents(
      { kind: 'bipolar', vdc: 100, angles: [0.1, 0.2] },
      { fundamentalFrequency: 50, timerClock: 200 },
    );
    expect(coarse.warnings.some((w) => /rounds to zero width/.test(w))).toBe(true);
    // A 2-tick high pulse of leg B (between angles 100 and 102 ticks of 3600) with a 4-tick dead
    // time, the current reversed (currentAngle π) so that it flows out of leg B there: its rise is
    // late by 4 ticks, past its fall (the conventions of the function, by hand).
    const tick = (2 * Math.PI) / 3600;
    const narrow = patternCompareEvents(
      { kind: 'bipolar', vdc: 100, angles: [100 * tick, 102 * tick] },
      {
        fundamentalFrequency: 50,
        timerClock: 180_000,
        deadTime: 4 / 180_000,
        currentAngle: Math.PI,
      },
    );
    expect(narrow.warnings.some((w) => /shorter than the dead time/.test(w))).toBe(true);
  });

  it('bad input names the field', () => {
    const pattern = { kind: 'bipolar' as const, vdc: 300, angles: [0.2, 0.5] };
    expect(
      rangeErrorField(() =>
        patternCompareEvents(pattern, { fundamentalFrequency: 50, timerClock: 100 }),
      ),
    ).toBe('timerClock');
    expect(
      rangeErrorField(() =>
        patternCompareEvents(pattern, {
          fundamentalFrequency: 50,
          timerClock: 1e6,
          deadTime: 0.01,
        }),
      ),
    ).toBe('deadTime');
    expect(
      rangeErrorField(() =>
        patternCompareEvents(
          { ...pattern, angles: [0.5, 0.2] },
          { fundamentalFrequency: 50, timerClock: 1e6 },
        ),
      ),
    ).toBe('angles[1]');
    expect(
      rangeErrorField(() =>
        patternCompareEvents(pattern, { fundamentalFrequency: 50, timerClock: 1e6, orders: [4] }),
      ),
    ).toBe('orders[0]');
  });
});
