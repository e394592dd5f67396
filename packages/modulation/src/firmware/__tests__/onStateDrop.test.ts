import { describe, expect, it } from 'vitest';
import {
  SQRT3,
  subtractWaveforms,
  timerTable,
  timerTableWaveforms,
  waveformValueAt,
  type TimerTableOptions,
} from '../../index.js';
import { harmonics } from '../../spectrum/index.js';
import { assertInDelta } from '../../testing/assertInDelta.js';

const options: TimerTableOptions = {
  modulation: { method: 'three-phase', zeroSequence: 'min-max', ma: 0.8 },
  fundamentalFrequency: 50,
  carrierFrequency: 5000,
  timerClock: 16e6,
  vdc: 600,
};

describe('timerTableWaveforms with device on-state drops', () => {
  it('equal transistor and diode drops v: the leg loses exactly the square wave −v·sgn(i)', () => {
    // Whatever switch is on, the conducting device's drop opposes the current (standard circuit
    // analysis), so the error is −v·sgn(i): a square wave with harmonics 4v/(nπ) on odd n
    // (Fourier series of a square wave; any signals text).
    const table = timerTable(options);
    const v = 1.7;
    const currentAngle = 0.35;
    const ideal = timerTableWaveforms(table, { includeDeadTime: false, currentAngle });
    const dropped = timerTableWaveforms(table, {
      includeDeadTime: false,
      currentAngle,
      onStateDrop: { transistor: v, diode: v },
    });
    const error = subtractWaveforms(dropped.legs[0]!, ideal.legs[0]!);
    expect(new Set(error.levels.map((l) => Math.round(l * 1e9) / 1e9))).toEqual(new Set([-v, v]));
    const spectrum = harmonics(error, 7);
    for (const n of [1, 3, 5, 7])
      assertInDelta(spectrum[n]?.amplitude ?? NaN, (4 * v) / (n * Math.PI), 1e-6, `order ${n}`);
    // The square wave is in phase with the current: −sgn(sin(θ − φ)).
    expect(waveformValueAt(error, currentAngle + 1)).toBeCloseTo(-v, 12);
    // The line voltage loses √3·(4/π)·v of its fundamental when the current is in phase with it.
    const inPhase = timerTableWaveforms(table, {
      includeDeadTime: false,
      onStateDrop: { transistor: v, diode: v },
    });
    const lost =
      (harmonics(ideal.outputs[0]!, 1)[1]?.amplitude ?? NaN) -
      (harmonics(inPhase.outputs[0]!, 1)[1]?.amplitude ?? NaN);
    assertInDelta(lost, (SQRT3 * 4 * v) / Math.PI, 0.01 * ((SQRT3 * 4 * v) / Math.PI));
  });

  it('different drops: a transistor drop while the switch carries the current, a diode drop otherwise', () => {
    const table = timerTable({ ...options, deadTime: 1e-6 });
    const drops = { transistor: 1.1, diode: 1.6 };
    const { legs } = timerTableWaveforms(table, { currentAngle: 0, onStateDrop: drops });
    const ideal = timerTableWaveforms(table, { currentAngle: 0 });
    const leg = legs[0]!;
    // 5000 samples over the period, off the tick grid; each level by the rule above.
    for (let k = 0; k < 5000; k++) {
      const theta = ((k + 0.37) * 2 * Math.PI) / 5000;
      const level = waveformValueAt(leg, theta);
      const rail = waveformValueAt(ideal.legs[0]!, theta);
      const current = Math.sin(theta);
      const expected =
        current > 0
          ? rail > 0
            ? 300 - drops.transistor
            : -300 - drops.diode
          : rail > 0
            ? 300 + drops.diode
            : -300 + drops.transistor;
      expect(level, `θ = ${theta}`).toBeCloseTo(expected, 9);
    }
  });

  it('names the field of a bad drop', () => {
    const table = timerTable(options);
    expect(() => timerTableWaveforms(table, { onStateDrop: { transistor: -1, diode: 1 } })).toThrow(
      /onStateDrop\.transistor/,
    );
  });
});
