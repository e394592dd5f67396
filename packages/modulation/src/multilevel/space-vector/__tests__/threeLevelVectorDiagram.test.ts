import { describe, expect, it } from 'vitest';
import {
  threeLevelSpaceVectorSequence,
  threeLevelSpaceVectorTrajectory,
  threeLevelVectorDiagram,
} from '../index.js';
import { assertInDelta } from '../../../testing/assertInDelta.js';

/** Clarke transform (2/3)·(va + a·vb + a²·vc) of a state, legs at ±1/2 or 0 (per unit of vdc). */
function clarke(state: string): [number, number] {
  const legs = [...state].map((letter) => (letter === 'P' ? 0.5 : letter === 'N' ? -0.5 : 0));
  let alpha = 0;
  let beta = 0;
  legs.forEach((v, i) => {
    alpha += (2 / 3) * v * Math.cos((2 * Math.PI * i) / 3);
    beta += (2 / 3) * v * Math.sin((2 * Math.PI * i) / 3);
  });
  return [alpha, beta];
}

describe('threeLevelVectorDiagram', () => {
  it('places the 27 states on 19 points: zero, six small, six medium, six large', () => {
    // Three-level hexagon (Holmes and Lipo 2003, ch. 11; Celanovic and Boroyevich 2000): small
    // vectors vdc/3 with two states each, medium vdc/√3, large 2vdc/3, three zero states.
    const diagram = threeLevelVectorDiagram();
    const lengths = { zero: 0, small: 1 / 3, medium: 1 / Math.sqrt(3), large: 2 / 3 };
    const stateCounts = { zero: 3, small: 2, medium: 1, large: 1 };
    const seen = new Set<string>();
    for (const kind of ['zero', 'small', 'medium', 'large'] as const) {
      expect(diagram[kind]).toHaveLength(kind === 'zero' ? 1 : 6);
      let previous = -1;
      for (const { alpha, beta, states } of diagram[kind]) {
        assertInDelta(Math.hypot(alpha, beta), lengths[kind], 1e-12, kind);
        expect(states).toHaveLength(stateCounts[kind]);
        for (const state of states) {
          const [a, b] = clarke(state);
          assertInDelta(a, alpha, 1e-12, state);
          assertInDelta(b, beta, 1e-12, state);
          seen.add(state);
        }
        // Ordered by angle from the phase-a axis.
        const angle = (Math.atan2(beta, alpha) + 2 * Math.PI + 1e-9) % (2 * Math.PI);
        if (kind !== 'zero') expect(angle).toBeGreaterThan(previous);
        previous = angle;
      }
    }
    expect(seen.size).toBe(27);
  });
});

describe('threeLevelSpaceVectorTrajectory', () => {
  it('samples the reference circle and lists the states of each period', () => {
    // The reference vector of phase a ∝ sin θ lies at θ − π/2 with radius m/√3 of vdc (the
    // two-level convention, van der Broeck et al. 1988); its states are the sequence's.
    for (const sampling of ['symmetric', 'asymmetric'] as const) {
      const samples = threeLevelSpaceVectorTrajectory({
        m: 0.8,
        frequencyRatio: 12,
        sampling,
        smallVectorSplit: 0.3,
      });
      expect(samples).toHaveLength(sampling === 'symmetric' ? 12 : 24);
      samples.forEach(({ period, theta, alpha, beta, sector, region, states }, i) => {
        expect(period).toBe(sampling === 'symmetric' ? i : Math.floor(i / 2));
        assertInDelta(theta, (i * 2 * Math.PI) / samples.length, 1e-12, 'theta');
        assertInDelta(alpha, (0.8 / Math.sqrt(3)) * Math.cos(theta - Math.PI / 2), 1e-12, 'α');
        assertInDelta(beta, (0.8 / Math.sqrt(3)) * Math.sin(theta - Math.PI / 2), 1e-12, 'β');
        const sequence = threeLevelSpaceVectorSequence({
          m: 0.8,
          theta: theta - Math.PI / 2,
          smallVectorSplit: 0.3,
        });
        expect([sector, region]).toEqual([sequence.sector, sequence.region]);
        expect(states).toEqual(sequence.states.slice(0, 4));
      });
    }
  });
});
