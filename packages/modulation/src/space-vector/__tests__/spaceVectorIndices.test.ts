import { describe, expect, it } from 'vitest';
import { assertInDelta } from '../../testing/assertInDelta.js';
import { rangeErrorField } from '../../testing/rangeErrorField.js';
import { SIX_STEP_M } from '../spaceVectorLimits.js';
import { spaceVectorIndices } from '../spaceVectorIndices.js';

describe('spaceVectorIndices', () => {
  it('relates m and ma by the phase fundamental |V1| = m·vdc/√3 = ma·vdc/2 (van der Broeck et al. 1988)', () => {
    // m = 1 (end of the linear range, |V1| = vdc/√3) is ma = 2/√3 ≈ 1.1547, the third-harmonic
    // and min-max linear limit (Holmes and Lipo 2003, ch. 5).
    assertInDelta(spaceVectorIndices({ m: 1 }).ma, 2 / Math.sqrt(3), 1e-15);
    const { m, ma } = spaceVectorIndices({ ma: 0.9 });
    assertInDelta(m, (Math.sqrt(3) * 0.9) / 2, 1e-15);
    assertInDelta(ma, 0.9, 1e-15);
  });

  it('names the field given both, neither, or out of range', () => {
    expect(rangeErrorField(() => spaceVectorIndices({ m: 0.5, ma: 0.5 }))).toBe('ma');
    expect(rangeErrorField(() => spaceVectorIndices({}))).toBe('m');
    expect(rangeErrorField(() => spaceVectorIndices({ m: SIX_STEP_M * 1.01 }))).toBe('m');
  });
});
