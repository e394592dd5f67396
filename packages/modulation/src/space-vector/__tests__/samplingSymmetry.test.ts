import { describe, expect, it } from 'vitest';
import {
  spaceVectorSequence,
  spaceVectorWaveforms,
  SIX_STEP_M,
  ZERO_VECTOR_CLAMPINGS,
} from '../index.js';
import type { SpaceVectorSampling, SwitchingState, ZeroVectorClamping } from '../index.js';
import { harmonics } from '../../spectrum/harmonics.js';
import { threePhase } from '../../three-phase/threePhase.js';
import type { Waveform } from '../../waveform/Waveform.js';
import { assertInDelta } from '../../testing/assertInDelta.js';

// Samples on the π/6 grid (sector boundaries and sector middles): with N switching periods per
// fundamental period the samples sit at 2πk/N (and (2k + 1)π/N for the second, asymmetric
// sample), which hits every sector middle when N is a multiple of 6 and every boundary when it
// is a multiple of 12. The five-segment clamping choices switch there; they must switch by one
// rule at every such sample, so that the output keeps its three-phase and half-wave symmetry.

const TAU = 2 * Math.PI;
const vdc = 540;
const SAMPLINGS: readonly SpaceVectorSampling[] = ['symmetric', 'asymmetric'];
/** Ratios that put samples on the grid (multiples of 6), and odd multiples of 3 for contrast. */
const ON_GRID = [6, 12, 18, 24, 30, 36, 48, 60, 96];
const ODD_MULTIPLES_OF_3 = [9, 15, 21];
/** Linear, Holtz mode I, mode II and six-step (Holtz, Lotzkat, Khambadkone 1993). */
const INDICES = [0.8, 1.02, 1.08, SIX_STEP_M];
/** Clampings that use each zero vector in one half of the period: 000 at θ, 111 at θ + π. */
const HALF_WAVE_CLAMPINGS: readonly ZeroVectorClamping[] = ['dpwm0', 'dpwm1', 'dpwm2', 'dpwm3'];

/** The waveform delayed by `shift` radians, w(θ − shift), levels scaled by `sign`. */
function delayed({ edges, levels }: Waveform, shift: number, sign = 1): Waveform {
  const moved = edges.map((e, i) => ({
    e: (((e + shift) % TAU) + TAU) % TAU,
    l: sign * (levels[i] as number) + 0,
  }));
  moved.sort((x, y) => x.e - y.e);
  return { edges: moved.map((m) => m.e), levels: moved.map((m) => m.l) };
}

function expectSameWaveform(actual: Waveform, expected: Waveform, label: string): void {
  expect(actual.edges.length, `${label} edge count`).toBe(expected.edges.length);
  actual.edges.forEach((e, i) => {
    // Edges built from samples 2π/3 or π apart agree to rounding of the dwell times (~1e-15).
    assertInDelta(e, expected.edges[i] as number, 1e-12, `${label} edge ${i}`);
    expect((actual.levels[i] as number) + 0, `${label} level ${i}`).toBe(
      (expected.levels[i] as number) + 0,
    );
  });
}

/** Largest amplitude among orders 1 < n ≤ maxOrder that `select` picks, over the fundamental. */
function worstRelative(
  waveform: Waveform,
  maxOrder: number,
  select: (order: number) => boolean,
): number {
  const spectrum = harmonics(waveform, maxOrder);
  const first = spectrum[1]?.amplitude ?? NaN;
  let worst = 0;
  for (const { order, amplitude } of spectrum)
    if (order > 1 && select(order)) worst = Math.max(worst, amplitude / first);
  return worst;
}

const isTriplen = (n: number): boolean => n % 3 === 0;
const isEven = (n: number): boolean => n % 2 === 0;

describe('five-segment DPWM0–3 at ratios that sample the π/6 grid', () => {
  // A balanced three-phase set (each leg the previous one delayed by 2π/3) has no triplen line
  // harmonics, and one with half-wave symmetry (v(θ + π) = −v(θ)) no even ones: common practice.
  // DPWM0–3 use 000 at θ and 111 at θ + π (the sector's parity flips, the half does not), so for
  // even N the period at θ + π is the exact complement of the one at θ; for N a multiple of 3
  // the period at θ + 2π/3 is the one at θ with the legs rotated. Before the fix DPWM1 and DPWM3
  // chose the zero vector at a sector's middle by comparing t1 ≥ t2, two sines rounded two
  // ways: even and triplen harmonics up to 20 % of the fundamental at N = 6.
  for (const clamping of HALF_WAVE_CLAMPINGS) {
    for (const sampling of SAMPLINGS) {
      it(`${clamping}, ${sampling}: legs 120° apart and half-wave symmetric, no even or triplen line harmonics`, () => {
        for (const m of INDICES) {
          for (const frequencyRatio of ON_GRID) {
            const label = `${clamping} ${sampling} m=${m.toFixed(4)} N=${frequencyRatio}`;
            const w = spaceVectorWaveforms({
              m,
              vdc,
              frequencyRatio,
              sequence: 'five-segment',
              clamping,
              sampling,
            });
            expectSameWaveform(w.b, delayed(w.a, TAU / 3), `${label} b`);
            expectSameWaveform(w.c, delayed(w.a, (2 * TAU) / 3), `${label} c`);
            expectSameWaveform(w.a, delayed(w.a, Math.PI, -1), `${label} a half-wave`);
            expectSameWaveform(w.bc, delayed(w.ab, TAU / 3), `${label} bc`);
            expectSameWaveform(w.ca, delayed(w.ab, (2 * TAU) / 3), `${label} ca`);
            const worst = worstRelative(w.ab, 4 * frequencyRatio, (n) => isEven(n) || isTriplen(n));
            expect(worst, `${label} even and triplen line harmonics`).toBeLessThan(1e-9);
          }
        }
      });
    }
  }
});

describe('every five-segment clamping and the seven-segment sequence: three-phase symmetry', () => {
  // For N a multiple of 3 the sampling grid repeats every 2π/3, so the three legs are one
  // waveform delayed by 0, 2π/3, 4π/3 and the line voltages have no triplen harmonics (common
  // practice), whatever the sequence. The odd multiples of 3 put the asymmetric second sample
  // ((2k + 1)π/N) on the sector middles too.
  const sequences = [
    ...ZERO_VECTOR_CLAMPINGS.map((clamping) => ({ sequence: 'five-segment' as const, clamping })),
    { sequence: 'seven-segment' as const },
  ];
  for (const options of sequences) {
    for (const sampling of SAMPLINGS) {
      it(`${options.sequence} ${'clamping' in options ? options.clamping : ''} ${sampling}: legs 120° apart, no triplens`, () => {
        for (const m of INDICES) {
          for (const frequencyRatio of [...ON_GRID, ...ODD_MULTIPLES_OF_3]) {
            const label = `${JSON.stringify(options)} ${sampling} m=${m.toFixed(4)} N=${frequencyRatio}`;
            const w = spaceVectorWaveforms({ m, vdc, frequencyRatio, sampling, ...options });
            expectSameWaveform(w.b, delayed(w.a, TAU / 3), `${label} b`);
            expectSameWaveform(w.c, delayed(w.a, (2 * TAU) / 3), `${label} c`);
            expect(
              worstRelative(w.ab, 4 * frequencyRatio, isTriplen),
              `${label} triplens`,
            ).toBeLessThan(1e-9);
          }
        }
      });
    }
  }

  it('contrast: at ratios that are not multiples of 3 the triplens are there', () => {
    // The grid does not repeat every 2π/3, so the legs differ and triplens appear (the check above
    // is not vacuous): at least 1e-4 of the fundamental here.
    for (const frequencyRatio of [7, 10, 20, 25]) {
      for (const clamping of ZERO_VECTOR_CLAMPINGS) {
        const w = spaceVectorWaveforms({
          m: 0.8,
          vdc,
          frequencyRatio,
          sequence: 'five-segment',
          clamping,
        });
        expect(
          worstRelative(w.ab, 4 * frequencyRatio, isTriplen),
          `${clamping} N=${frequencyRatio}`,
        ).toBeGreaterThan(1e-4);
      }
    }
  });
});

describe('where even harmonics are inherent', () => {
  it('dpwm-max at θ + π is dpwm-min at θ negated (each alone is not half-wave symmetric)', () => {
    // DPWMMIN uses 000 in every period, so at θ + π the period is not the complement of the one
    // at θ (that would need 111): Z-N-F order puts the active vectors the other way round, the
    // line voltage has no half-wave symmetry and even harmonics are expected. The complement of
    // DPWMMIN's period at θ is DPWMMAX's at θ + π (111 and the complemented actives, same
    // order), which is the exact symmetry that must hold, for even N.
    for (const sampling of SAMPLINGS) {
      for (const m of INDICES) {
        for (const frequencyRatio of ON_GRID) {
          const label = `${sampling} m=${m.toFixed(4)} N=${frequencyRatio}`;
          const options = { m, vdc, frequencyRatio, sequence: 'five-segment' as const, sampling };
          const min = spaceVectorWaveforms({ ...options, clamping: 'dpwm-min' });
          const max = spaceVectorWaveforms({ ...options, clamping: 'dpwm-max' });
          expectSameWaveform(max.a, delayed(min.a, Math.PI, -1), `${label} a`);
          expectSameWaveform(max.ab, delayed(min.ab, Math.PI, -1), `${label} ab`);
        }
      }
    }
  });

  it('seven-segment equals carrier PWM with min-max injection, regular-symmetric, at any N', () => {
    // Holmes and Lipo (2003, ch. 5): the centred space vector is carrier PWM with the
    // zero sequence −(max + min)/2. With the carrier's peaks on the switching-period boundaries
    // (carrierPhase −π·(N/2 + 1): peaks at π/2 + (2k + 1 − N/2 − 1)π/N = 2πk'/N) and the sample
    // at each peak, both give the same pulses, so the seven-segment line voltage has the even
    // harmonics carrier PWM has at an even frequency ratio (sidebands N ± 2, …; common
    // practice) and none at odd N with asymmetric sampling. Exact waveforms: edges to 1e-12.
    for (const frequencyRatio of [6, 9, 12, 24, 30, 96]) {
      const m = 0.8;
      const space = spaceVectorWaveforms({ m, vdc, frequencyRatio });
      const carrier = threePhase({
        ma: (2 * m) / Math.sqrt(3),
        mf: frequencyRatio,
        vdc,
        zeroSequence: 'min-max',
        sampling: 'regular-symmetric',
        carrierPhase: -Math.PI * (frequencyRatio / 2 + 1),
      });
      expectSameWaveform(space.a, carrier.legs.a, `N=${frequencyRatio} a`);
      expectSameWaveform(space.ab, carrier.lineToLine.ab, `N=${frequencyRatio} ab`);
    }
  });
});

describe('spaceVectorSequence on the π/6 grid: one rule however the angle was computed', () => {
  /** The state with the legs rotated a → b → c (the state of the vector 2π/3 further on). */
  const rotated = (s: SwitchingState): string => `${s[2]}${s[0]}${s[1]}`;
  const complement = (s: SwitchingState): string =>
    [...s].map((bit) => (bit === '1' ? '0' : '1')).join('');

  // The same grid angles computed several ways, as a sampler might: they differ by ulps.
  const representations = (k: number): number[] => [
    (k * Math.PI) / 6,
    k * (Math.PI / 6),
    (TAU * k) / 12,
    (k * 30 * Math.PI) / 180,
    (k * Math.PI) / 6 + TAU,
    (k * Math.PI) / 6 - TAU,
  ];

  for (const clamping of ZERO_VECTOR_CLAMPINGS) {
    it(`${clamping}: same states for every representation, rotated at +2π/3, complemented at +π where the clamping is half-wave`, () => {
      for (let k = 0; k < 12; k++) {
        const states = (theta: number) =>
          spaceVectorSequence({ m: 0.7, theta }, { sequence: 'five-segment', clamping }).states;
        const [first, ...others] = representations(k).map(states);
        for (const other of others) expect(other, `k=${k}`).toEqual(first);
        // The rule (locateSector): intervals are [start, end), so a sector's middle belongs to
        // its second half and a boundary to the sector that starts there.
        const sector = Math.floor(k / 2) + 1;
        const secondHalf = k % 2 === 1;
        const nearSingle = (sector % 2 === 1) === !secondHalf;
        const expectedZero = {
          'dpwm-min': '000',
          'dpwm-max': '111',
          dpwm1: nearSingle ? '111' : '000',
          dpwm3: nearSingle ? '000' : '111',
          dpwm2: sector % 2 === 1 ? '111' : '000',
          dpwm0: sector % 2 === 1 ? '000' : '111',
        }[clamping];
        expect(first?.[0], `k=${k} zero vector`).toBe(expectedZero);
        const ahead = states((k * Math.PI) / 6 + TAU / 3);
        expect(ahead, `k=${k} +2π/3`).toEqual(first?.map(rotated));
        if (HALF_WAVE_CLAMPINGS.includes(clamping)) {
          expect(states((k * Math.PI) / 6 + Math.PI), `k=${k} +π`).toEqual(first?.map(complement));
        }
      }
    });
  }
});
