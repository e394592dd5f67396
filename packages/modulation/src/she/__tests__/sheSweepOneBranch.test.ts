import { describe, expect, it } from 'vitest';
import { sheWaveform } from '../index.js';
import { harmonics } from '../../spectrum/index.js';
import { sheSweep } from '../sheSweep.js';

// Bipolar, 5 angles, eliminating 5, 7, 11, 13 (Patel and Hoft, IEEE Trans. Ind. Appl., 1973):
// at vdc = 400 this problem has more than one solution branch over ma 0.1–1.1, so a sweep allowed
// eight branches keeps searching after the first solution.
const problem = { kind: 'bipolar' as const, vdc: 400, count: 5, eliminate: [5, 7, 11, 13] };

describe('sheSweep with maxBranches: 1 (the angle table follows one branch)', () => {
  it('stops the first search at the first solution: fewer Newton iterations, the same branch', () => {
    const fundamentals = { from: 40, to: 40, points: 1 };
    const one = sheSweep({ ...problem, fundamentals, maxBranches: 1 });
    const eight = sheSweep({ ...problem, fundamentals });
    expect(one.branches).toHaveLength(1);
    // The first branch is the first solution found, whatever the number of branches allowed.
    expect(one.branches[0]?.points[0]?.angles).toEqual(eight.branches[0]?.points[0]?.angles);
    expect(one.iterations).toBeLessThan(eight.iterations);
  });

  it('follows the same first branch over the whole range, each point eliminating its orders', () => {
    const fundamentals = { from: 40, to: 440, points: 64 };
    const one = sheSweep({ ...problem, fundamentals, maxBranches: 1 });
    const eight = sheSweep({ ...problem, fundamentals });
    expect(one.branches[0]?.points).toEqual(eight.branches[0]?.points);
    for (const point of one.branches[0]?.points ?? []) {
      const spectrum = harmonics(sheWaveform(point.angles, problem), 13);
      const v1 = spectrum[1]?.amplitude ?? NaN;
      // Exact spectrum: eliminated orders below 1e-9 of the fundamental (issue 17's check).
      for (const n of problem.eliminate) {
        expect(spectrum[n]?.amplitude ?? NaN).toBeLessThan(1e-9 * v1);
      }
    }
  });
});
