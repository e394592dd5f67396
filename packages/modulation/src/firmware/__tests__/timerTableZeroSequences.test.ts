import { describe, expect, it } from 'vitest';
import {
  spaceVectorSequence,
  SQRT3,
  TIMER_ZERO_SEQUENCES,
  timerTable,
  timerTableWaveforms,
  ZERO_SEQUENCES,
  type TimerTableOptions,
  type TimerZeroSequence,
} from '../../index.js';
import { harmonics } from '../../spectrum/index.js';
import { assertInDelta } from '../../testing/assertInDelta.js';

const options = (zeroSequence: TimerZeroSequence, ma = 0.9): TimerTableOptions => ({
  modulation: { method: 'three-phase', zeroSequence, ma },
  fundamentalFrequency: 50,
  carrierFrequency: 50 * 96,
  timerClock: 48e6,
  vdc: 650,
});

const CLAMPS = ['dpwm-min', 'dpwm-max', 'dpwm0', 'dpwm1', 'dpwm2'] as const;

describe('timer tables for every carrier zero sequence', () => {
  it('takes every zero sequence, the reduced common-mode methods included (see timerTableReducedCommonMode.test.ts)', () => {
    expect(TIMER_ZERO_SEQUENCES).toEqual(ZERO_SEQUENCES);
    expect(() => timerTable(options('dpwm3' as TimerZeroSequence))).toThrow(
      /modulation\.zeroSequence must be one of 'none', 'third-harmonic', 'min-max', 'dpwm1'/,
    );
  });

  for (const clamping of CLAMPS)
    it(`${clamping}: the duties of five-segment space vector with the same clamping (Holmes and Lipo 2003, ch. 7)`, () => {
      // Centred five-segment space vector and the carrier clamp with regular sampling put the
      // same volt-seconds in every period: the duties at each entry's angle must agree. The
      // space vector of ma·sin(θ − k·2π/3) has m = (√3/2)·ma and angle θ − π/2.
      const table = timerTable(options(clamping));
      const m = (SQRT3 / 2) * 0.9;
      table.entryAngles.forEach((theta, i) => {
        const { duties } = spaceVectorSequence(
          { m, theta: theta - Math.PI / 2 },
          { sequence: 'five-segment', clamping },
        );
        (['a', 'b', 'c'] as const).forEach((leg, k) =>
          assertInDelta(table.channels[k]?.duty[i] ?? NaN, duties[leg], 1e-12, `${leg} ${i}`),
        );
      });
      expect(table.warnings).toEqual([]);
    });

  for (const zeroSequence of CLAMPS)
    it(`${zeroSequence}: each leg held at 0 or 100 % for a third of the entries (120° a period)`, () => {
      const table = timerTable(options(zeroSequence));
      const { compare } = table.channels[0] ?? { compare: [] };
      const held = compare.filter((c) => c === 0 || c === table.fullScaleCounts).length;
      expect(held).toBe(compare.length / 3);
    });

  it('the waveform each table produces has the line fundamental √3·ma·vdc/2 (regular sampling, mf 96)', () => {
    for (const zeroSequence of TIMER_ZERO_SEQUENCES) {
      const table = timerTable(options(zeroSequence));
      const { outputs } = timerTableWaveforms(table, { includeDeadTime: false });
      const fundamental = harmonics(outputs[0] ?? { edges: [0], levels: [0] }, 1)[1]?.amplitude;
      // Symmetric regular sampling lowers the fundamental by sin(h)/h with h = π/mf (Bowes 1975;
      // Holmes and Lipo ch. 3): 0.018 % at mf 96; compare rounding adds well under 0.01 %.
      assertInDelta(fundamental ?? NaN, (SQRT3 * 0.9 * 650) / 2, 1e-3 * 650, zeroSequence);
    }
  });
});
