import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { EDGE_EPSILON, TAU } from '../../math.js';
import { waveformValueAt } from '../waveformValueAt.js';
import { waveformFromAscending } from '../waveformFromAscending.js';

/**
 * Ascending changes in [0, 2π) with clusters closer than EDGE_EPSILON (also just before 2π and
 * just after 0) and levels drawn from a few values, so repeats and folds are common.
 */
const arbitraryChanges = fc
  .array(
    fc.record({
      angle: fc.oneof(
        fc.double({ min: 0, max: TAU, maxExcluded: true, noNaN: true }),
        fc.double({ min: 0, max: 2 * EDGE_EPSILON, noNaN: true }),
        fc.double({ min: TAU - 2 * EDGE_EPSILON, max: TAU, maxExcluded: true, noNaN: true }),
      ),
      level: fc.integer({ min: -1, max: 1 }),
      // A second change this far after the first, inside a cluster.
      follower: fc.option(fc.double({ min: 0, max: 0.9 * EDGE_EPSILON, noNaN: true })),
    }),
    { minLength: 1, maxLength: 12 },
  )
  .map((drawn) => {
    const changes = drawn.flatMap(({ angle, level, follower }) =>
      follower === null || angle + follower >= TAU
        ? [{ angle, level }]
        : [
            { angle, level: level + 2 },
            { angle: angle + follower, level },
          ],
    );
    changes.sort((x, y) => x.angle - y.angle);
    return changes;
  });

/** The level the changes give at θ, read as a step function round the period (the last wraps). */
function levelAt(changes: readonly { angle: number; level: number }[], theta: number): number {
  let level = (changes[changes.length - 1] as { level: number }).level;
  for (const change of changes) if (change.angle <= theta) level = change.level;
  return level;
}

describe('waveformFromAscending', () => {
  it('gives a canonical waveform equal to the changes away from their clusters', () => {
    fc.assert(
      fc.property(arbitraryChanges, (changes) => {
        const waveform = waveformFromAscending(
          changes.map((c) => c.angle),
          changes.map((c) => c.level),
        );
        const { edges, levels } = waveform;
        // Canonical (the Waveform contract): ascending edges in [0, 2π), at least EDGE_EPSILON
        // apart, also across 2π, and each level differs from the one before it round the period.
        expect(edges.length).toBe(levels.length);
        for (let i = 0; i < edges.length; i++) {
          const edge = edges[i] as number;
          expect(edge).toBeGreaterThanOrEqual(0);
          expect(edge).toBeLessThan(TAU);
          if (edges.length > 1) {
            const before = i === 0 ? (edges[edges.length - 1] as number) - TAU : edges[i - 1];
            expect(edge - (before as number)).toBeGreaterThanOrEqual(EDGE_EPSILON);
            expect(levels[i]).not.toBe(levels[(i + levels.length - 1) % levels.length]);
          }
        }
        // The same step function wherever no change lies within 2·EDGE_EPSILON (a cluster
        // takes its first angle and its last level).
        for (let k = 0; k < 64; k++) {
          const theta = ((k + 0.5) / 64) * TAU;
          const near = changes.some(
            (c) =>
              Math.min(Math.abs(c.angle - theta), TAU - Math.abs(c.angle - theta)) <
              2 * EDGE_EPSILON,
          );
          if (!near) expect(waveformValueAt(waveform, theta)).toBe(levelAt(changes, theta));
        }
      }),
      { numRuns: 2000 },
    );
  });

  it('keeps a single change as it is and turns repeated levels into a constant signal', () => {
    expect(waveformFromAscending([2], [5])).toEqual({ edges: [2], levels: [5] });
    expect(waveformFromAscending([1, 2, 3], [4, 4, 4])).toEqual({ edges: [0], levels: [4] });
  });
});
