import { describe, expect, it } from 'vitest';
import {
  HEXAGON_TRAJECTORY_M,
  HEXAGON_VERTEX_M,
  SIX_STEP_M,
  overmodulatedReference,
  overmodulationGainCurve,
  overmodulationSetting,
  spaceVector,
} from '../index.js';
import type { OvermodulationSettingOptions } from '../index.js';
import { assertInDelta } from '../../testing/assertInDelta.js';
// The per-period shaping with the setting solved once (what the waveform builder uses).
import { applyOvermodulation } from '../applyOvermodulation.js';

const TAU = 2 * Math.PI;

/**
 * Fundamental (m units) of the shaped reference over one turn, by a plain Riemann sum over
 * `steps` commanded angles: the in-phase component mean of m'·cos(θ' − θ) (Fourier
 * coefficient of a vector signal). Independent of the library's closed forms and quadrature.
 */
function trajectoryFundamental(
  m: number,
  options: OvermodulationSettingOptions,
  steps = 72_000,
): number {
  const setting = overmodulationSetting(m, options);
  let sum = 0;
  for (let k = 0; k < steps; k++) {
    const theta = ((k + 0.5) * TAU) / steps;
    const shaped = applyOvermodulation(setting, theta);
    sum += shaped.m * Math.cos(shaped.theta - theta);
  }
  return sum / steps;
}

describe('overmodulation (Holtz, Lotzkat, Khambadkone, IEEE Trans. Power Electron., 1993)', () => {
  it('chooses the mode by m: linear ≤ 1 < mode I ≤ (3/π)ln 3 < mode II < 2√3/π = six-step', () => {
    // Mode boundaries: linear limit m = 1 (inscribed circle); mode I ends when the compensated
    // circle reaches the vertices, i.e. the whole hexagon, fundamental (3/π)·ln 3 (∫sec, standard
    // calculus; Holtz et al. quote ≈ 0.95 of six-step, from memory); six-step (2/π)·vdc.
    expect(overmodulationSetting(0.99).mode).toBe('linear');
    expect(overmodulationSetting(1.01).mode).toBe('overmodulation-i');
    expect(overmodulationSetting(HEXAGON_TRAJECTORY_M - 1e-6).mode).toBe('overmodulation-i');
    expect(overmodulationSetting(HEXAGON_TRAJECTORY_M + 1e-6).mode).toBe('overmodulation-ii');
    expect(overmodulationSetting(SIX_STEP_M).mode).toBe('six-step');
    assertInDelta(HEXAGON_TRAJECTORY_M / SIX_STEP_M, 0.9514, 1e-4);
    // Continuity at the mode boundaries: mode I's radius reaches the vertex, mode II's holding
    // angle starts from 0 and ends at π/6.
    assertInDelta(overmodulationSetting(HEXAGON_TRAJECTORY_M).radius, HEXAGON_VERTEX_M, 1e-7);
    assertInDelta(overmodulationSetting(HEXAGON_TRAJECTORY_M + 1e-9).holdingAngle, 0, 1e-6);
    assertInDelta(overmodulationSetting(SIX_STEP_M - 1e-12).holdingAngle, Math.PI / 6, 1e-5);
  });

  it('gives the shaped trajectory a fundamental equal to the commanded m', () => {
    // The design goal of both modes (Holtz et al. 1993): the fundamental of the shaped
    // reference equals the commanded one. Checked by an independent Riemann sum (error < 1e-8).
    for (const m of [1.005, 1.03, 1.045, 1.06, 1.08, 1.1]) {
      assertInDelta(trajectoryFundamental(m, {}), m, 2e-8, `m ${m}`);
    }
    // The uncompensated hexagon limit falls short: its fundamental is the clipped circle's.
    expect(trajectoryFundamental(1.08, { method: 'hexagon-limit' })).toBeLessThan(1.08 - 0.02);
  });

  it('keeps every shaped vector inside the hexagon so spaceVector realises it', () => {
    // A single switching period realises only vectors inside the hexagon (van der Broeck et al.
    // 1988). spaceVector clamps t0 at 0, so t0 ≥ 0 alone could not fail: the vector itself is
    // checked against the hexagon, whose edge at angle α from a sector's start lies at
    // 1/cos(α − π/6) for an inscribed circle of radius 1 (plane geometry), to 1e-9.
    for (const m of [1.02, 1.07, SIX_STEP_M]) {
      const setting = overmodulationSetting(m);
      for (let theta = 0; theta < TAU; theta += 0.013) {
        const shaped = applyOvermodulation(setting, theta);
        const alpha = ((shaped.theta % (Math.PI / 3)) + Math.PI / 3) % (Math.PI / 3);
        expect(shaped.m).toBeLessThanOrEqual(1 / Math.cos(alpha - Math.PI / 6) + 1e-9);
        expect(() => spaceVector(shaped)).not.toThrow();
      }
    }
    // Mode II and six-step put the vector on the hexagon: no zero-vector time at all.
    const shaped = overmodulatedReference({ m: 1.08, theta: 0.4 });
    expect(shaped.mode).toBe('overmodulation-ii');
    assertInDelta(spaceVector(shaped).t0, 0, 1e-12);
    expect(() => overmodulatedReference({ m: 1.2, theta: 0 })).toThrow(/^m must be/);
    expect(() => overmodulatedReference({ m: 1, theta: 0 }, { method: 'x' as never })).toThrow(
      /^method must be/,
    );
  });
});

describe('overmodulationGainCurve', () => {
  it('ends at the six-step fundamental (2/π)·vdc', () => {
    // Fourier fundamental of the ±vdc/2 square leg voltage, 4·(vdc/2)/π (standard Fourier
    // analysis); exact when the switching periods per fundamental are a multiple of 6.
    const vdc = 700;
    const curve = overmodulationGainCurve({ vdc, frequencyRatio: 36, points: 12 });
    expect(curve.m.length).toBe(12);
    expect(curve.mode[curve.mode.length - 1]).toBe('six-step');
    assertInDelta(curve.sixStepFundamental, (2 / Math.PI) * vdc, 1e-12 * vdc);
    assertInDelta(curve.outputFundamental[11] as number, (2 / Math.PI) * vdc, 1e-9 * vdc);
    assertInDelta(curve.m[11] as number, (2 * Math.sqrt(3)) / Math.PI, 1e-15);
  });

  it('follows the commanded fundamental through both modes at a high frequency ratio', () => {
    // Holtz et al. 1993: continuous control up to six-step. At mf = 600 regular sampling's
    // error is small (the linear-range error falls as 1/mf²); allowed 0.1 % of the commanded.
    const vdc = 1;
    const curve = overmodulationGainCurve({ vdc, frequencyRatio: 600, mStart: 0.9, points: 13 });
    curve.m.forEach((m, i) => {
      const commanded = curve.commandedFundamental[i] as number;
      assertInDelta(commanded, (m * vdc) / Math.sqrt(3), 1e-15);
      assertInDelta(curve.outputFundamental[i] as number, commanded, 1e-3 * commanded, `m ${m}`);
    });
    const limited = overmodulationGainCurve({
      vdc,
      frequencyRatio: 600,
      mStart: 0.9,
      points: 13,
      overmodulation: 'hexagon-limit',
    });
    // Without compensation the output stays below the hexagon's (3/π)·ln 3 (see above).
    for (const output of limited.outputFundamental) {
      expect(output).toBeLessThan((HEXAGON_TRAJECTORY_M * vdc) / Math.sqrt(3) + 1e-4);
    }
  });

  it('names bad sweep options', () => {
    expect(() => overmodulationGainCurve({ vdc: 1, frequencyRatio: 12, points: 1 })).toThrow(
      /^points must be/,
    );
    expect(() => overmodulationGainCurve({ vdc: 1, frequencyRatio: 12, mStart: 2 })).toThrow(
      /^mStart must be/,
    );
  });
});
