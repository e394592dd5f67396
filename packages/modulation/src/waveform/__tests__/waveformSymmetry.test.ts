import { describe, expect, it } from 'vitest';
import { HALF_PI, TAU } from '../../math.js';
import { threePhase } from '../../three-phase/threePhase.js';
import type { Waveform } from '../Waveform.js';
import { SYMMETRY_TOLERANCE, hasHalfWaveSymmetry, waveformMirror } from '../waveformSymmetry.js';

/** The gap round the circle between second's edge (offset − i) and 2α − first's edge i, largest over i. */
const largestImageGap = (first: Waveform, second: Waveform, axis: number, offset: number) => {
  const count = first.edges.length;
  let largest = 0;
  for (let i = 0; i < count; i++) {
    const k = (((offset - i) % count) + count) % count;
    const gap =
      Math.abs((second.edges[k] as number) - (2 * axis - (first.edges[i] as number))) % TAU;
    largest = Math.max(largest, Math.min(gap, TAU - gap));
  }
  return largest;
};

describe('waveformMirror', () => {
  // Carrier PWM: the references ma·sin(θ − k·2π/3) peak at π/2 + k·2π/3 and the carrier (no
  // delay) is symmetric about π/2, so θ → π − θ keeps leg a and swaps legs b and c, with any
  // zero sequence built from all three (Holmes and Lipo, 2003, ch. 5; the symmetry is read off
  // the definitions).
  for (const zeroSequence of ['none', 'min-max', 'dpwm1', 'dpwm-max'] as const) {
    it(`finds leg a its own image and leg c leg b's about π/2 (${zeroSequence}, mf 40)`, () => {
      const { legs } = threePhase({ ma: 0.9, mf: 40, vdc: 600, zeroSequence });
      const own = waveformMirror(legs.a, legs.a);
      const swapped = waveformMirror(legs.b, legs.c);
      expect(own?.axis).toBe(HALF_PI);
      expect(swapped?.axis).toBe(HALF_PI);
      expect(largestImageGap(legs.a, legs.a, HALF_PI, own?.offset ?? NaN)).toBeLessThanOrEqual(
        SYMMETRY_TOLERANCE,
      );
      expect(largestImageGap(legs.b, legs.c, HALF_PI, swapped?.offset ?? NaN)).toBeLessThanOrEqual(
        SYMMETRY_TOLERANCE,
      );
      // Leg b is no mirror of leg a: its reference peaks 2π/3 away.
      expect(waveformMirror(legs.a, legs.b)).toBeNull();
    });
  }

  it('finds nothing for a delayed carrier, and the axis 0 for a pulse centred there', () => {
    const { legs } = threePhase({ ma: 0.9, mf: 40, vdc: 600, carrierPhase: 0.3 });
    expect(waveformMirror(legs.a, legs.a)).toBeNull();
    // +1 on (2π − 0.4, 0.4) round 0: its own image about 0 (and about π, which is the same map).
    const pulse: Waveform = { edges: [0.4, TAU - 0.4], levels: [0, 1] };
    expect(waveformMirror(pulse, pulse)?.axis).toBe(0);
  });

  it('refuses an image whose levels differ or whose edge is off by more than the tolerance', () => {
    const pulse: Waveform = { edges: [1, 2.1415926535897931], levels: [1, 0] };
    expect(waveformMirror(pulse, pulse)?.axis).toBe(HALF_PI);
    expect(waveformMirror(pulse, { edges: pulse.edges, levels: [2, 0] })).toBeNull();
    const moved = { edges: [1, 2.1415926535897931 + 8 * SYMMETRY_TOLERANCE], levels: [1, 0] };
    expect(waveformMirror(moved, moved)).toBeNull();
  });
});

describe('hasHalfWaveSymmetry', () => {
  it('holds for a bridge at an odd ratio and not at an even one', () => {
    expect(hasHalfWaveSymmetry(threePhase({ ma: 0.9, mf: 41, vdc: 600 }).legs.a)).toBe(true);
    expect(hasHalfWaveSymmetry(threePhase({ ma: 0.9, mf: 40, vdc: 600 }).legs.a)).toBe(false);
  });
});
