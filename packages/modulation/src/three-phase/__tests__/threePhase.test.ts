import { describe, expect, it } from 'vitest';
import {
  harmonics,
  invertsCarrier,
  SQRT3,
  threePhase,
  thd,
  threePhaseReference,
  triangleCarrier,
  waveformValueAt,
  ZERO_SEQUENCES,
  type Waveform,
  type ZeroSequence,
} from '../../index.js';
import { assertInDelta } from '../../testing/assertInDelta.js';

const vdc = 600;

/** The largest baseband (orders 2..maxOrder) amplitude, as a fraction of vdc. */
function basebandDistortion(waveform: Waveform, maxOrder: number): number {
  const spectrum = harmonics(waveform, maxOrder);
  return Math.max(...spectrum.filter((h) => h.order >= 2).map((h) => h.amplitude)) / vdc;
}

describe('threePhase line-to-line voltages', () => {
  it('have fundamental √3·ma·vdc/2 in the linear range (Holmes and Lipo 2003, ch. 5)', () => {
    for (const zeroSequence of ZERO_SEQUENCES) {
      const { lineToLine } = threePhase({ ma: 0.9, mf: 201, vdc, zeroSequence });
      const [, fundamental] = harmonics(lineToLine.ab, 1);
      // Continuous references: sidebands reaching order 1 are below 2e-4 of vdc at mf = 201.
      // The clamped references jump at each change of clamp (by 2 − √3·ma at the 60° clamps),
      // and natural sampling of a jump shifts that carrier period's volt-seconds, so the
      // fundamental departs by O(1/mf): under 0.5 % here, confirmed by brute force below.
      const continuous = ['none', 'third-harmonic', 'min-max'].includes(zeroSequence);
      const ideal = (SQRT3 * 0.9 * vdc) / 2;
      assertInDelta(
        fundamental?.amplitude ?? NaN,
        ideal,
        continuous ? 2e-4 * vdc : 5e-3 * ideal,
        zeroSequence,
      );
    }
  });

  it('agree with a brute-force comparator for every zero sequence (independent method)', () => {
    // Evaluate reference > carrier directly at N midpoints and integrate the fundamental
    // numerically; edges are resolved to 2π/N, so the error is below edges·vdc·(2/π)·(2π/N).
    const mf = 27;
    const ma = 0.9;
    const N = 2 ** 17;
    for (const zeroSequence of ZERO_SEQUENCES) {
      const { lineToLine } = threePhase({ ma, mf, vdc, zeroSequence });
      const exact = harmonics(lineToLine.ab, 1)[1]?.amplitude ?? NaN;
      const ra = threePhaseReference(0, { ma, zeroSequence });
      const rb = threePhaseReference(1, { ma, zeroSequence });
      let a = 0;
      let b = 0;
      for (let k = 0; k < N; k++) {
        const theta = ((k + 0.5) * 2 * Math.PI) / N;
        const carrier = triangleCarrier(theta, { mf });
        // The reduced common-mode methods compare the middle phase with the inverted carrier.
        const carrierOf = (phase: 0 | 1): number =>
          invertsCarrier(zeroSequence, phase, theta, { mf }) ? -carrier : carrier;
        const v =
          ((ra.value(theta) > carrierOf(0) ? 1 : 0) - (rb.value(theta) > carrierOf(1) ? 1 : 0)) *
          vdc;
        a += v * Math.cos(theta);
        b += v * Math.sin(theta);
      }
      const tolerance = lineToLine.ab.edges.length * vdc * (2 / Math.PI) * ((2 * Math.PI) / N);
      assertInDelta(exact, (2 / N) * Math.hypot(a, b), tolerance, zeroSequence);
    }
  });

  it('are the same three waveforms 120° apart', () => {
    const { lineToLine } = threePhase({ ma: 0.7, mf: 30, vdc, zeroSequence: 'min-max' });
    const phaseOf = (w: Waveform): number => harmonics(w, 1)[1]?.phase ?? NaN;
    const wrap = (x: number): number => Math.atan2(Math.sin(x), Math.cos(x));
    assertInDelta(wrap(phaseOf(lineToLine.bc) - phaseOf(lineToLine.ab)), (-2 * Math.PI) / 3, 1e-9);
    assertInDelta(wrap(phaseOf(lineToLine.ca) - phaseOf(lineToLine.ab)), (2 * Math.PI) / 3, 1e-9);
  });

  it('switch between 0 and ±vdc, legs between ±vdc/2', () => {
    const { legs, lineToLine } = threePhase({ ma: 0.8, mf: 15, vdc });
    expect(new Set(legs.a.levels)).toEqual(new Set([vdc / 2, -vdc / 2]));
    for (const level of lineToLine.ab.levels) expect([vdc, 0, -vdc]).toContain(level);
  });
});

describe('zero-sequence injection extends the linear range to 2/√3', () => {
  // Third-harmonic (1/6) and min-max injection keep every reference within the carrier up to
  // ma = 2/√3 (Houldsworth and Grant 1984; Holmes and Lipo 2003, ch. 5), so the line-to-line
  // voltage has no low-order distortion there. Without injection, the same ma overmodulates.
  const ma = 2 / SQRT3 - 1e-6;
  const mf = 201;
  for (const zeroSequence of ['third-harmonic', 'min-max'] as const) {
    it(`${zeroSequence} at ma = 2/√3: baseband clean`, () => {
      const { lineToLine } = threePhase({ ma, mf, vdc, zeroSequence });
      // Min-max references have kinks whose sidebands reach the baseband faintly (< 1e-4 of
      // vdc at mf = 201); the third-harmonic reference is smooth and leaves only rounding.
      expect(basebandDistortion(lineToLine.ab, 60)).toBeLessThan(1e-4);
      const [, fundamental] = harmonics(lineToLine.ab, 1);
      assertInDelta(fundamental?.amplitude ?? NaN, vdc, 1e-4 * vdc);
    });
  }

  it('none at the same ma overmodulates and distorts (low-order harmonics above 1 %)', () => {
    const { lineToLine } = threePhase({ ma, mf, vdc, zeroSequence: 'none' });
    expect(basebandDistortion(lineToLine.ab, 60)).toBeGreaterThan(1e-2);
  });
});

describe('discontinuous clamping', () => {
  /** Total angle (radians) a leg spends clamped to either rail without switching. */
  function clampedAngle(leg: Waveform, mf: number): number {
    const carrierPeriod = (2 * Math.PI) / mf;
    let clamped = 0;
    leg.edges.forEach((start, i) => {
      const end =
        i + 1 < leg.edges.length
          ? (leg.edges[i + 1] as number)
          : (leg.edges[0] as number) + 2 * Math.PI;
      // A run longer than a carrier period can only be a clamp.
      if (end - start > 1.5 * carrierPeriod) clamped += end - start;
    });
    return clamped;
  }

  // Holmes and Lipo (2003, ch. 7): each discontinuous method clamps every leg for 120° of the
  // fundamental period (two 60° blocks or one 120° block), cutting switching losses by a third.
  const cases: [ZeroSequence, number][] = [
    ['dpwm1', (2 * Math.PI) / 3],
    ['dpwm0', (2 * Math.PI) / 3],
    ['dpwm2', (2 * Math.PI) / 3],
    ['dpwm-max', (2 * Math.PI) / 3],
    ['dpwm-min', (2 * Math.PI) / 3],
  ];
  for (const [zeroSequence, expected] of cases) {
    it(`${zeroSequence} clamps each leg for 120°`, () => {
      const mf = 96;
      const { legs } = threePhase({ ma: 0.9, mf, vdc, zeroSequence });
      // Measured to within one carrier period at each end of each block.
      assertInDelta(clampedAngle(legs.a, mf), expected, (4 * 2 * Math.PI) / mf, zeroSequence);
    });
  }

  it('places the 60° blocks round the peak, 30° before it (lead) or 30° after it (lag)', () => {
    // dpwm1 holds leg a high on (60°, 120°); lead on (30°, 90°); lag on (90°, 150°)
    // (Holmes and Lipo 2003, ch. 7; which shift is called which is from memory).
    const mf = 96;
    const carrierPeriod = (2 * Math.PI) / mf;
    const heldHigh = (
      zeroSequence: ZeroSequence,
      fromDegrees: number,
      toDegrees: number,
    ): boolean => {
      const { legs } = threePhase({ ma: 0.9, mf, vdc, zeroSequence });
      const from = (fromDegrees * Math.PI) / 180 + carrierPeriod;
      const to = (toDegrees * Math.PI) / 180 - carrierPeriod;
      return (
        legs.a.edges.every((e) => e <= from || e >= to) &&
        waveformValueAt(legs.a, (from + to) / 2) === vdc / 2
      );
    };
    expect(heldHigh('dpwm1', 60, 120)).toBe(true);
    expect(heldHigh('dpwm0', 30, 90)).toBe(true);
    expect(heldHigh('dpwm2', 90, 150)).toBe(true);
    expect(heldHigh('dpwm0', 90, 150)).toBe(false);
    expect(heldHigh('dpwm2', 30, 90)).toBe(false);
  });

  it('dpwm-max holds leg a at +vdc/2 round its positive peak', () => {
    const { legs } = threePhase({ ma: 0.9, mf: 96, vdc, zeroSequence: 'dpwm-max' });
    const i = legs.a.edges.findIndex(
      (e, k) => e <= Math.PI / 2 && (legs.a.edges[k + 1] ?? 7) > Math.PI / 2,
    );
    expect(legs.a.levels[i]).toBe(vdc / 2);
  });

  it('lowers the line-to-line THD against continuous PWM only modestly at equal mf', () => {
    // Sanity of magnitudes (common practice): all methods stay within a factor 1.5 of each other.
    const reference = thd(harmonics(threePhase({ ma: 0.9, mf: 45, vdc }).lineToLine.ab, 2000));
    for (const zeroSequence of ZERO_SEQUENCES) {
      const value = thd(
        harmonics(threePhase({ ma: 0.9, mf: 45, vdc, zeroSequence }).lineToLine.ab, 2000),
      );
      expect(value / reference).toBeGreaterThan(1 / 1.5);
      expect(value / reference).toBeLessThan(1.5);
    }
  });
});

describe('threePhase input checks', () => {
  it('names the field and the allowed values', () => {
    expect(() => threePhase({ ma: 0.9, mf: 21, vdc, zeroSequence: 'fifth' as never })).toThrow(
      /zeroSequence must be one of 'none', 'third-harmonic'/,
    );
    expect(() => threePhase({ ma: 0.9, mf: 0, vdc })).toThrow(/mf must be an integer ≥ 1/);
  });
});
