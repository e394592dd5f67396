import { describe, expect, it } from 'vitest';
import {
  combineWaveforms,
  harmonics,
  reducedCommonModeRange,
  SQRT3,
  threePhase,
  waveformValueAt,
  waveformWthd,
  type Waveform,
} from '../../index.js';
import { assertInDelta } from '../../testing/assertInDelta.js';

// The reduced common-mode methods of A. M. Hava and E. Ün, "Performance analysis of reduced
// common-mode voltage PWM methods and comparison with standard PWM methods for three-phase
// voltage-source inverters", IEEE Trans. Power Electronics, 2009 (from memory): AZSPWM1 replaces
// the zero vectors by two opposite active vectors; NSPWM uses only the three active vectors
// nearest the reference. Both keep the common-mode voltage at ±vdc/6, against ±vdc/2 for the
// zero vectors (a fact of the methods: an active vector has one or two legs high, so
// (v_a + v_b + v_c)/3 = ±(vdc/2)/3).

const vdc = 600;
const TAU = 2 * Math.PI;
const NSPWM_MIN = 4 / (3 * SQRT3);

type Legs = { a: Waveform; b: Waveform; c: Waveform };

function commonMode({ a, b, c }: Legs): Waveform {
  return combineWaveforms([a, b, c], ([x = 0, y = 0, z = 0]) => (x + y + z) / 3);
}

/** The distinct levels of a waveform, rounded to the millivolt. */
function levelsOf(waveform: Waveform): number[] {
  return [...new Set(waveform.levels.map((l) => Math.round(l * 1000) / 1000))].sort(
    (x, y) => x - y,
  );
}

describe('common-mode voltage of the reduced common-mode methods', () => {
  const cases: { zeroSequence: 'azspwm1' | 'nspwm'; mas: number[] }[] = [
    { zeroSequence: 'azspwm1', mas: [0.1, 0.3, 0.6, 0.9, 1.1, 2 / SQRT3 - 1e-9] },
    { zeroSequence: 'nspwm', mas: [NSPWM_MIN + 1e-6, 0.85, 1, 1.1, 2 / SQRT3 - 1e-9] },
  ];
  for (const { zeroSequence, mas } of cases) {
    it(`${zeroSequence}: only ±vdc/6, peak vdc/6 (Hava and Ün 2009), natural and regular-asymmetric`, () => {
      for (const sampling of ['natural', 'regular-asymmetric'] as const)
        for (const mf of [9, 12, 15, 21, 48, 51, 201])
          for (const ma of mas) {
            const { legs } = threePhase({ ma, mf, vdc, zeroSequence, sampling });
            const label = `${zeroSequence} ${sampling} mf=${mf} ma=${ma}`;
            expect(levelsOf(commonMode(legs)), label).toEqual([-vdc / 6, vdc / 6]);
          }
    });
  }

  it('the same modulation waves with one carrier (min-max, dpwm1) reach ±vdc/2: the check can fail', () => {
    for (const zeroSequence of ['min-max', 'dpwm1'] as const) {
      const { legs } = threePhase({ ma: 0.9, mf: 51, vdc, zeroSequence });
      expect(levelsOf(commonMode(legs))).toEqual([-vdc / 2, -vdc / 6, vdc / 6, vdc / 2]);
    }
  });

  it('nspwm keeps ±vdc/6 only from ma = 4/(3√3) ≈ 0.770 (M = π·ma/4 ≈ 0.605; Hava and Ün give about 0.61, from memory)', () => {
    // Derived in reducedCommonModeRange: legs b and c meet (111 or 000) when r_b + r_c > 0,
    // that is ma·sin 60° < 2/3 at the edge of the clamp. 1 % either side of the threshold.
    expect(reducedCommonModeRange('nspwm')?.min).toBeCloseTo(0.7698, 4);
    // Just below it the two legs meet only in the carrier periods next to the clamp's edges:
    // 3 % below, they do at mf = 201 (at 1 % below only from about mf = 500).
    const at = (ma: number) =>
      levelsOf(commonMode(threePhase({ ma, mf: 201, vdc, zeroSequence: 'nspwm' }).legs));
    expect(at(1.001 * NSPWM_MIN)).toEqual([-vdc / 6, vdc / 6]);
    expect(at(0.97 * NSPWM_MIN)).toEqual([-vdc / 2, -vdc / 6, vdc / 6, vdc / 2]);
    expect(reducedCommonModeRange('azspwm1')).toEqual({ min: 0, max: 2 / SQRT3 });
    expect(reducedCommonModeRange('min-max')).toBeNull();
  });
});

describe('line-to-line fundamental equals the reference √3·ma·vdc/2 (Holmes and Lipo 2003, ch. 5)', () => {
  // The middle carrier's inversion moves no volt-seconds over a half period (it is swapped at a
  // carrier peak or valley), so the line voltage keeps the reference's fundamental. Natural
  // sampling of NSPWM inherits DPWM1's O(1/mf) departure at the clamp jumps: measured here for
  // ma 0.78–1.15 at most 1.46·ideal/mf for NSPWM and 1.44·ideal/mf for DPWM1 itself; for AZSPWM1
  // 0.004–0.011 %.
  const tolerances: Record<
    'azspwm1' | 'nspwm',
    Record<'natural' | 'regular-asymmetric', number>
  > = {
    azspwm1: { natural: 5e-4, 'regular-asymmetric': 5e-4 },
    nspwm: { natural: 1.5 / 201, 'regular-asymmetric': 5e-4 },
  };
  for (const zeroSequence of ['azspwm1', 'nspwm'] as const)
    for (const sampling of ['natural', 'regular-asymmetric'] as const)
      it(`${zeroSequence}, ${sampling}, mf = 201`, () => {
        for (const ma of [0.8, 0.9, 1.1]) {
          const { lineToLine } = threePhase({ ma, mf: 201, vdc, zeroSequence, sampling });
          const ideal = (SQRT3 * ma * vdc) / 2;
          const fundamental = harmonics(lineToLine.ab, 1)[1]?.amplitude ?? NaN;
          assertInDelta(fundamental, ideal, tolerances[zeroSequence][sampling] * ideal, `ma ${ma}`);
        }
      });
});

/**
 * A brute-force sampled simulation written from the definitions alone: the sines, the
 * modulation waves (min-max: −(max + min)/2; DPWM1: the phase of largest magnitude clamped to
 * its rail), a triangle carrier with a valley at θ = π/2 (carrierPhase 0), and the middle phase
 * (found by sorting the sines at the centre of each carrier half period) against the inverted
 * carrier. Returns the leg states (1 high, 0 low) at N midpoints.
 */
function bruteForceLegs(
  zeroSequence: 'azspwm1' | 'nspwm',
  { ma, mf, n }: { ma: number; mf: number; n: number },
): Uint8Array[] {
  const sines = (theta: number) => [0, 1, 2].map((k) => ma * Math.sin(theta - (k * TAU) / 3));
  const states = [new Uint8Array(n), new Uint8Array(n), new Uint8Array(n)];
  const h = Math.PI / mf;
  for (let j = 0; j < n; j++) {
    const theta = ((j + 0.5) * TAU) / n;
    const s = sines(theta);
    let offset: number;
    if (zeroSequence === 'azspwm1') offset = -(Math.max(...s) + Math.min(...s)) / 2;
    else {
      const k = [0, 1, 2].reduce((best, i) => (Math.abs(s[i]!) > Math.abs(s[best]!) ? i : best), 0);
      offset = Math.sign(s[k]!) - s[k]!;
    }
    const u = (theta - Math.PI / 2) / h; // half periods since a valley
    const half = Math.floor(u);
    const fraction = u - half;
    const rising = ((half % 2) + 2) % 2 === 0;
    const carrier = rising ? -1 + 2 * fraction : 1 - 2 * fraction;
    const centre = sines(Math.PI / 2 + (half + 0.5) * h);
    const order = [0, 1, 2].sort((x, y) => centre[x]! - centre[y]!);
    const middle = order[1];
    for (let k = 0; k < 3; k++) {
      const c = k === middle ? -carrier : carrier;
      states[k]![j] = s[k]! + offset > c ? 1 : 0;
    }
  }
  return states;
}

/** The sign of a waveform's level (1 above zero, else 0) at the N midpoints (2π/N)(j + ½). */
function sampledStates(waveform: Waveform, n: number): Uint8Array {
  const states = new Uint8Array(n);
  const { edges, levels } = waveform;
  // Start from the level that wraps round from the last edge.
  let k = -1;
  for (let j = 0; j < n; j++) {
    const theta = ((j + 0.5) * TAU) / n;
    while (k + 1 < edges.length && edges[k + 1]! <= theta) k++;
    const level = k < 0 ? levels[levels.length - 1]! : levels[k]!;
    states[j] = level > 0 ? 1 : 0;
  }
  return states;
}

describe('against a brute-force sampled simulation of the definition (independent method)', () => {
  const n = 2 ** 16;
  for (const zeroSequence of ['azspwm1', 'nspwm'] as const)
    for (const [ma, mf] of [
      [0.85, 21],
      [1.05, 48],
      [0.9, 51],
    ] as const)
      it(`${zeroSequence} ma ${ma} mf ${mf}: every leg, the common mode and the line fundamental`, () => {
        const { legs, lineToLine } = threePhase({ ma, mf, vdc, zeroSequence });
        const brute = bruteForceLegs(zeroSequence, { ma, mf, n });
        const exact = [legs.a, legs.b, legs.c];
        let cmSquares = 0;
        let outside = 0;
        let re = 0;
        let im = 0;
        exact.forEach((leg, k) => {
          const sampled = sampledStates(leg, n);
          let mismatches = 0;
          for (let j = 0; j < n; j++) if (sampled[j] !== brute[k]![j]) mismatches++;
          // A grid of N midpoints can disagree with an exact edge at most once per edge.
          expect(mismatches, `leg ${k}`).toBeLessThanOrEqual(leg.edges.length);
        });
        for (let j = 0; j < n; j++) {
          const theta = ((j + 0.5) * TAU) / n;
          const [a, b, c] = brute.map((s) => (s[j]! - 0.5) * vdc);
          const cm = (a! + b! + c!) / 3;
          if (Math.abs(Math.abs(cm) - vdc / 6) > 1e-9) outside++;
          cmSquares += cm * cm;
          re += (a! - b!) * Math.cos(theta);
          im += (a! - b!) * Math.sin(theta);
        }
        // Each edge misplaced by at most 2π/N moves the fundamental by at most vdc·(2/π)·(2π/N).
        const tolerance = lineToLine.ab.edges.length * vdc * (2 / Math.PI) * (TAU / n);
        assertInDelta(
          harmonics(lineToLine.ab, 1)[1]?.amplitude ?? NaN,
          (2 / n) * Math.hypot(re, im),
          tolerance,
          'line fundamental',
        );
        // The sampled simulation never meets ±vdc/2 either.
        expect(outside).toBe(0);
        assertInDelta(Math.sqrt(cmSquares / n), vdc / 6, 1e-9, 'common-mode rms');
      });
});

describe('the vectors used in each carrier period (the methods’ definitions)', () => {
  // States as (a, b, c) high bits; active vectors V1…V6 at 0°, 60°, …, 300° of the αβ plane:
  // 100, 110, 010, 011, 001, 101 (van der Broeck et al., 1988). The reference of sin θ
  // references points at θ − 90°.
  const ACTIVE = ['100', '110', '010', '011', '001', '101'];
  const degrees = (x: number) => ((((x * 180) / Math.PI) % 360) + 360) % 360;

  function statesPerCarrierPeriod(legs: Legs, mf: number): { centre: number; used: Set<string> }[] {
    const periods: { centre: number; used: Set<string> }[] = [];
    const samples = 400;
    for (let p = 0; p < mf; p++) {
      const start = Math.PI / 2 + (p * TAU) / mf;
      const used = new Set<string>();
      for (let s = 0; s < samples; s++) {
        const theta = start + ((s + 0.5) * TAU) / mf / samples;
        used.add(
          [legs.a, legs.b, legs.c].map((w) => (waveformValueAt(w, theta) > 0 ? '1' : '0')).join(''),
        );
      }
      periods.push({ centre: start + Math.PI / mf, used });
    }
    return periods;
  }

  it('nspwm: only the three active vectors nearest the reference, never 000 or 111', () => {
    const mf = 60;
    const { legs } = threePhase({ ma: 0.95, mf, vdc, zeroSequence: 'nspwm' });
    let checked = 0;
    for (const { centre, used } of statesPerCarrierPeriod(legs, mf)) {
      const angle = degrees(centre - Math.PI / 2);
      const nearest = Math.round(angle / 60) % 6;
      // Skip periods within a carrier period of a region boundary (at 30° + k·60°).
      const toBoundary = Math.abs(((angle - 30) % 60) + 60) % 60;
      if (Math.min(toBoundary, 60 - toBoundary) < 360 / mf) continue;
      const allowed = new Set([
        ACTIVE[(nearest + 5) % 6],
        ACTIVE[nearest],
        ACTIVE[(nearest + 1) % 6],
      ]);
      for (const state of used) expect(allowed.has(state), `${angle}° ${state}`).toBe(true);
      checked++;
    }
    expect(checked).toBeGreaterThan(mf / 2);
  });

  it('azspwm1: the two vectors of the sector and one opposite pair, never 000 or 111', () => {
    const mf = 60;
    const { legs } = threePhase({ ma: 0.7, mf, vdc, zeroSequence: 'azspwm1' });
    let checked = 0;
    for (const { centre, used } of statesPerCarrierPeriod(legs, mf)) {
      const angle = degrees(centre - Math.PI / 2);
      const sector = Math.floor(angle / 60);
      const toBoundary = angle - sector * 60;
      if (Math.min(toBoundary, 60 - toBoundary) < 360 / mf) continue;
      // Sector k lies between V(k+1) and V(k+2) (1-based); the opposite pair that keeps one
      // switching per leg per half period is V(k+3) and V(k+6).
      const allowed = new Set([
        ACTIVE[sector],
        ACTIVE[(sector + 1) % 6],
        ACTIVE[(sector + 2) % 6],
        ACTIVE[(sector + 5) % 6],
      ]);
      expect(used.has('000') || used.has('111'), `${angle}°`).toBe(false);
      for (const state of used) expect(allowed.has(state), `${angle}° ${state}`).toBe(true);
      // The opposite pair is used for equal times, so both appear.
      expect(used.has(ACTIVE[(sector + 2) % 6]!) && used.has(ACTIVE[(sector + 5) % 6]!)).toBe(true);
      checked++;
    }
    expect(checked).toBeGreaterThan(mf / 2);
  });
});

describe('costs against the standard methods at equal carrier frequency', () => {
  const mf = 201;
  const at = (zeroSequence: 'min-max' | 'azspwm1' | 'dpwm1' | 'nspwm', ma: number) =>
    threePhase({ ma, mf, vdc, zeroSequence });

  it('nspwm switches each leg about 2/3 as often as azspwm1 (120° clamped, Holmes and Lipo 2003, ch. 7)', () => {
    const ratio = at('nspwm', 0.9).legs.a.edges.length / at('azspwm1', 0.9).legs.a.edges.length;
    assertInDelta(ratio, 2 / 3, 0.02);
  });

  it('both have more line-voltage ripple (WTHD) than the standard method with the same waves (Hava and Ün 2009, from memory)', () => {
    for (const ma of [0.8, 0.9, 1.1]) {
      expect(waveformWthd(at('azspwm1', ma).lineToLine.ab)).toBeGreaterThan(
        waveformWthd(at('min-max', ma).lineToLine.ab),
      );
      expect(waveformWthd(at('nspwm', ma).lineToLine.ab)).toBeGreaterThan(
        waveformWthd(at('dpwm1', ma).lineToLine.ab),
      );
    }
  });
});

describe('input checks', () => {
  it('refuses symmetric regular sampling, naming the field and the allowed values', () => {
    for (const zeroSequence of ['azspwm1', 'nspwm'] as const)
      expect(() =>
        threePhase({
          ma: 0.9,
          mf: 21,
          vdc,
          zeroSequence,
          sampling: 'regular-symmetric',
        }),
      ).toThrow(/sampling must be 'natural' or 'regular-asymmetric'/);
  });
});
