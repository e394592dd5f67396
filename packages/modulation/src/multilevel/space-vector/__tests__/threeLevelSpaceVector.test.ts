import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { threeLevelSpaceVector, threeLevelSpaceVectorSequence } from '../index.js';
import { assertInDelta } from '../../../testing/assertInDelta.js';
import { rangeErrorField } from '../../../testing/rangeErrorField.js';
import { ParameterTypeError } from '../../../validation/errors.js';

const vdc = 800;

/** Leg voltages of a state: P +vdc/2, O 0, N −vdc/2 (the three-level leg; Holmes and Lipo ch. 11). */
function legVoltages(state: string): number[] {
  return [...state].map((letter) => (letter === 'P' ? vdc / 2 : letter === 'N' ? -vdc / 2 : 0));
}

/**
 * Space vector of a state by the Clarke transform v = (2/3)·(va + a·vb + a²·vc), a = e^{j2π/3}
 * (Holmes and Lipo 2003, ch. 5 and 11), computed here independently of the library's lattice.
 */
function stateVector(state: string): [number, number] {
  let re = 0;
  let im = 0;
  legVoltages(state).forEach((v, i) => {
    re += (2 / 3) * v * Math.cos((2 * Math.PI * i) / 3);
    im += (2 / 3) * v * Math.sin((2 * Math.PI * i) / 3);
  });
  return [re, im];
}

const ALL_STATES = ['P', 'O', 'N'].flatMap((a) =>
  ['P', 'O', 'N'].flatMap((b) => ['P', 'O', 'N'].map((c) => `${a}${b}${c}`)),
);

/** The 19 distinct vector positions of the 27 states (rounded key → position). */
const POSITIONS = new Map<string, [number, number]>();
for (const state of ALL_STATES) {
  const [re, im] = stateVector(state);
  POSITIONS.set(`${Math.round(re * 1e6)},${Math.round(im * 1e6)}`, [re, im]);
}

/** A uniformly spread double in [min, max] (fc.double crowds towards 0 and the bounds). */
const uniform = (min: number, max: number) =>
  fc.integer({ min: 0, max: 1_000_000 }).map((i) => min + ((max - min) * i) / 1_000_000);

const key = ([re, im]: [number, number]) => `${Math.round(re * 1e6)},${Math.round(im * 1e6)}`;

/** Inside the hexagon: m ≤ 1/cos(θ' − π/6) (outer hexagon of the two-level limit, Holmes and Lipo ch. 5). */
function insideHexagon(m: number, theta: number): boolean {
  const sector = Math.PI / 3;
  const within = theta - sector * Math.floor(theta / sector);
  return m * Math.cos(within - sector / 2) <= 1 - 1e-9;
}

describe('threeLevelSpaceVector: nearest three vectors', () => {
  it('finds 19 positions for the 27 states (Holmes and Lipo 2003, ch. 11)', () => {
    expect(POSITIONS.size).toBe(19);
  });

  it('reproduces the reference volt-seconds with dwell times summing to 1', () => {
    // Nearest-three-vector principle: Σ dwell·V = Vref over a switching period, dwell ≥ 0,
    // Σ dwell = 1 (Celanovic and Boroyevich, IEEE Trans. Power Electron., 2000), with
    // |Vref| = m·vdc/√3 (the two-level m, van der Broeck et al. 1988).
    fc.assert(
      fc.property(
        uniform(0, 2 / Math.sqrt(3)),
        uniform(-10, 10),
        uniform(0, 1),
        (m, theta, split) => {
          fc.pre(insideHexagon(m, theta));
          const { vectors, redundant } = threeLevelSpaceVector({
            m,
            theta,
            smallVectorSplit: split,
          });
          let re = 0;
          let im = 0;
          let total = 0;
          for (const { states, dwell } of vectors) {
            expect(dwell).toBeGreaterThanOrEqual(-1e-15);
            const [vr, vi] = stateVector(states[0] as string);
            re += dwell * vr;
            im += dwell * vi;
            total += dwell;
          }
          const magnitude = (m * vdc) / Math.sqrt(3);
          assertInDelta(total, 1, 1e-12, 'dwell sum');
          assertInDelta(re, magnitude * Math.cos(theta), 1e-9 * vdc, 're');
          assertInDelta(im, magnitude * Math.sin(theta), 1e-9 * vdc, 'im');
          // The split shares the small vector's dwell between its two forms.
          assertInDelta(redundant.positiveDwell, split * vectors[0].dwell, 1e-15, 'P share');
          assertInDelta(
            redundant.positiveDwell + redundant.negativeDwell,
            vectors[0].dwell,
            1e-15,
            'pair',
          );
        },
      ),
      { numRuns: 3000 },
    );
  });

  it('selects the three positions nearest the reference (brute force over all 27 states)', () => {
    // Nearest-three-vector selection (Celanovic and Boroyevich 2000; Holmes and Lipo ch. 11):
    // the vertices of the lattice triangle that holds the reference are its three nearest
    // vector positions. Checked by sorting all 19 positions by distance, for random references
    // whose third and fourth nearest are not tied.
    let checked = 0;
    fc.assert(
      fc.property(uniform(0, 2 / Math.sqrt(3)), uniform(0, 2 * Math.PI), (m, theta) => {
        fc.pre(insideHexagon(m, theta));
        const magnitude = (m * vdc) / Math.sqrt(3);
        const reference: [number, number] = [
          magnitude * Math.cos(theta),
          magnitude * Math.sin(theta),
        ];
        const ranked = [...POSITIONS.values()]
          .map((p) => ({ p, d: Math.hypot(p[0] - reference[0], p[1] - reference[1]) }))
          .sort((x, y) => x.d - y.d);
        fc.pre((ranked[3] as { d: number }).d - (ranked[2] as { d: number }).d > 1e-6 * vdc);
        const nearest = new Set(ranked.slice(0, 3).map(({ p }) => key(p)));
        const { vectors } = threeLevelSpaceVector({ m, theta });
        const selected = new Set(
          vectors.map(({ states }) => key(stateVector(states[0] as string))),
        );
        expect(selected).toEqual(nearest);
        checked++;
      }),
      { numRuns: 2000 },
    );
    expect(checked).toBeGreaterThan(1500);
  });

  it('gives each redundant small vector as its P-type and N-type form of one position', () => {
    // A small vector's two forms differ by one level on every leg and give the same vector
    // (Celanovic and Boroyevich 2000); the P-type form has no N leg, the N-type no P leg.
    for (let theta = 0; theta < 2 * Math.PI; theta += 0.05) {
      for (const m of [0.2, 0.6, 0.95]) {
        const { vectors, redundant } = threeLevelSpaceVector({ m, theta });
        expect(vectors[0].kind).toBe('small');
        expect(vectors[0].states).toEqual([redundant.negative, redundant.positive]);
        expect(redundant.positive).not.toMatch(/N/);
        expect(redundant.negative).not.toMatch(/P/);
        expect(key(stateVector(redundant.positive))).toBe(key(stateVector(redundant.negative)));
        // The used small vector is the nearer of the sector's two (the reference's half).
        const [sr, si] = stateVector(redundant.positive);
        const angle = Math.atan2(si, sr);
        const gap = Math.abs(Math.atan2(Math.sin(theta - angle), Math.cos(theta - angle)));
        expect(gap).toBeLessThanOrEqual(Math.PI / 6 + 1e-12);
      }
    }
  });

  it('numbers sectors from the phase-a axis and regions 1–4 inside each', () => {
    // Sector k spans [(k − 1)π/3, kπ/3) as for two levels (Holmes and Lipo ch. 5). In sector 1,
    // hand-placed references: near the origin region 1 (zero and two small vectors); near the
    // large vector PNN region 2; at the sector's middle at radius between the small and medium
    // vectors region 3; near the large vector PPN region 4.
    const cases = [
      { m: 0.2, theta: 0.3, region: 1, kinds: ['small', 'small', 'zero'] },
      { m: 0.95, theta: 0.1, region: 2, kinds: ['small', 'large', 'medium'] },
      { m: 0.8, theta: Math.PI / 6 + 0.01, region: 3, kinds: ['small', 'medium', 'small'] },
      { m: 0.95, theta: Math.PI / 3 - 0.1, region: 4, kinds: ['small', 'medium', 'large'] },
    ];
    for (const { m, theta, region, kinds } of cases) {
      for (let k = 1; k <= 6; k++) {
        const result = threeLevelSpaceVector({ m, theta: theta + ((k - 1) * Math.PI) / 3 });
        expect(result.sector).toBe(k);
        expect(result.region).toBe(region);
        // The order of the other two follows the sequence, which alternates with the sector.
        expect(result.vectors.map((v) => v.kind).sort()).toEqual([...kinds].sort());
      }
    }
    expect(threeLevelSpaceVector({ m: 0.95, theta: 0.1 }).vectors.map((v) => v.states)).toEqual([
      ['ONN', 'POO'],
      ['PNN'],
      ['PON'],
    ]);
  });

  it('refuses bad input, naming the field', () => {
    expect(rangeErrorField(() => threeLevelSpaceVector({ m: -0.1, theta: 0 }))).toBe('m');
    // At a sector's middle the hexagon's edge is at m = 1 (the inscribed circle).
    expect(rangeErrorField(() => threeLevelSpaceVector({ m: 1.01, theta: Math.PI / 6 }))).toBe('m');
    expect(rangeErrorField(() => threeLevelSpaceVector({ m: 1.1, theta: 0 }))).toBeUndefined();
    expect(rangeErrorField(() => threeLevelSpaceVector({ m: 0.5, theta: Infinity }))).toBe('theta');
    expect(
      rangeErrorField(() => threeLevelSpaceVector({ m: 0.5, theta: 0, smallVectorSplit: 1.5 })),
    ).toBe('smallVectorSplit');
    expect(() => threeLevelSpaceVector(null as never)).toThrow(ParameterTypeError);
  });
});

describe('threeLevelSpaceVectorSequence', () => {
  it('starts and ends on the N-type form, one leg one level a step, durations summing to 1', () => {
    // The symmetric seven-state sequence of Holmes and Lipo ch. 11 (from memory): each state
    // differs from the last by one level in one leg; the period is its own mirror image.
    fc.assert(
      fc.property(uniform(0, 1), uniform(-7, 7), uniform(0, 1), (m, theta, split) => {
        const sequence = threeLevelSpaceVectorSequence({ m, theta, smallVectorSplit: split });
        const { states, durations, redundant } = sequence;
        expect(states).toHaveLength(7);
        expect(states[0]).toBe(redundant.negative);
        expect(states[3]).toBe(redundant.positive);
        expect([...states].reverse()).toEqual(states);
        expect([...durations].reverse()).toEqual(durations);
        for (let i = 1; i < 7; i++) {
          const now = legVoltages(states[i] as string);
          const before = legVoltages(states[i - 1] as string);
          const steps = now.map((v, leg) => Math.abs(v - (before[leg] as number)));
          expect(steps.filter((s) => s > 0)).toEqual([vdc / 2]);
        }
        assertInDelta(
          durations.reduce((s, d) => s + d, 0),
          1,
          1e-12,
          'sum',
        );
        assertInDelta(durations[0] as number, redundant.negativeDwell / 2, 1e-15, 'N ends');
        assertInDelta(durations[3] as number, redundant.positiveDwell, 1e-15, 'P middle');
      }),
      { numRuns: 2000 },
    );
  });
});
