import { describe, expect, it } from 'vitest';
import {
  legReferences,
  MAX_TIMER_TABLE_LENGTH,
  timerTable,
  timerTableWaveforms,
  type TimerTableOptions,
} from '../index.js';
import { rangeErrorField } from '../../testing/rangeErrorField.js';
import { harmonics } from '../../spectrum/index.js';
import { ParameterRangeError } from '../../validation/index.js';
import { assertInDelta } from '../../testing/assertInDelta.js';

const base: TimerTableOptions = {
  modulation: { method: 'sine-triangle', scheme: 'bipolar', ma: 0.8 },
  fundamentalFrequency: 50,
  carrierFrequency: 16_000,
  timerClock: 64e6,
  vdc: 400,
};

describe('timerTable period and compare values', () => {
  it('uses TOP = clock/fc − 1 and compare = round(duty·(TOP + 1)) when edge-aligned', () => {
    // Edge-aligned PWM: TOP = f_clk/f_c − 1, compare = duty·(TOP + 1) (common practice: timer
    // reference manuals; from memory). 64 MHz / 16 kHz = 4000 ticks.
    const table = timerTable({ ...base, countingMode: 'edge-aligned' });
    expect(table.periodRegister).toBe(3999);
    expect(table.fullScaleCounts).toBe(4000);
    expect(table.channels).toHaveLength(1);
    const channel = table.channels[0]!;
    expect(channel.compare).toHaveLength(320);
    table.entryAngles.forEach((theta, i) => {
      // Regular sampling of ma·sin θ, duty (1 + ma·sin θ)/2 (sine-triangle PWM, Holmes and
      // Lipo 2003 ch. 3), sampled at the centre of entry i.
      assertInDelta(theta, ((i + 0.5) * 2 * Math.PI) / 320, 1e-12);
      expect(channel.compare[i]).toBe(Math.round(((1 + 0.8 * Math.sin(theta)) / 2) * 4000));
    });
  });

  it('uses P = clock/(2·fc) and compare = round(duty·P) when centre-aligned', () => {
    // Centre-aligned (up-down) PWM: the counter runs P → 0 → P, so P = f_clk/(2·f_c) and
    // compare = duty·P (common practice: timer reference manuals; from memory).
    const table = timerTable({ ...base, countingMode: 'centre-aligned' });
    expect(table.periodRegister).toBe(2000);
    expect(table.ticksPerCarrierPeriod).toBe(4000);
    const channel = table.channels[0]!;
    table.entryAngles.forEach((theta, i) => {
      expect(channel.compare[i]).toBe(Math.round(((1 + 0.8 * Math.sin(theta)) / 2) * 2000));
    });
    // Rounding to the nearest count: error ≤ half a count (arithmetic), one count = vdc/P.
    assertInDelta(table.quantisationStep, 400 / 2000, 1e-12);
    expect(table.maxQuantisationError).toBeLessThanOrEqual(table.quantisationStep / 2 + 1e-12);
    expect(table.maxQuantisationError).toBeGreaterThan(0);
  });

  it('doubles the entries for asymmetric sampling and gives the fundamental ma·vdc', () => {
    const table = timerTable({ ...base, sampling: 'regular-asymmetric' });
    expect(table.parameters.tableLength).toBe(640);
    const [fundamental] = harmonics(
      timerTableWaveforms(table, { counts: 'ideal' }).outputs[0]!,
      1,
    ).slice(1);
    // Linear range: the fundamental of sine-triangle PWM is ma·vdc for a bipolar full bridge
    // (fact of the trade); regular sampling at mf = 320 changes it by order (π/mf)² ≈ 1e-4.
    assertInDelta(fundamental!.amplitude, 0.8 * 400, 1e-3 * 320);
  });

  it('holds each entry for updatesPerEntry updates when tableLength divides the period', () => {
    const table = timerTable({ ...base, carrierFrequency: 10_000, tableLength: 50 });
    expect(table.updatesPerEntry).toBe(4);
    const output = timerTableWaveforms(table, { counts: 'ideal' }).outputs[0]!;
    // A sine held over L equal steps, each at the value at its centre, has fundamental
    // sin(π/L)/(π/L) of the sine's (Fourier series of a sample-and-hold staircase, standard
    // signals analysis); the PWM adds only the (π/mf)² regular-sampling error.
    const x = Math.PI / 50;
    assertInDelta(harmonics(output, 1)[1]!.amplitude, 320 * (Math.sin(x) / x), 1e-3 * 320);
  });

  it('puts three-phase references 2π/3 apart with the zero sequences', () => {
    const table = timerTable({ ...base, modulation: { method: 'three-phase', ma: 0.9 } });
    expect(table.channels.map((c) => c.name)).toEqual(['a', 'b', 'c']);
    // Balanced sines sum to zero, so the three duties sum to 3/2 (trigonometric identity).
    table.entryAngles.forEach((_, i) => {
      assertInDelta(
        table.channels.reduce((s, c) => s + c.duty[i]!, 0),
        1.5,
        1e-12,
      );
    });
    // Third-harmonic (1/6) and min-max injection reach the rail at ma = 2/√3: the peak of the
    // injected reference is (√3/2)·ma (Holmes and Lipo 2003 ch. 5; Houldsworth and Grant 1984).
    for (const zeroSequence of ['third-harmonic', 'min-max'] as const) {
      let peak = 0;
      for (let i = 0; i < 6000; i++) {
        const r = legReferences((i * 2 * Math.PI) / 6000, {
          method: 'three-phase',
          zeroSequence,
          ma: 2 / Math.sqrt(3),
        });
        peak = Math.max(peak, ...r.map(Math.abs));
      }
      assertInDelta(peak, 1, 1e-9, zeroSequence);
    }
  });
});

describe('timerTable input checks', () => {
  it('rejects a period that does not fit the counter, naming the fields and the range', () => {
    // 64 MHz / 500 Hz = 128000 ticks > 2^16.
    expect(() =>
      timerTable({
        ...base,
        carrierFrequency: 500,
        fundamentalFrequency: 50,
        countingMode: 'edge-aligned',
      }),
    ).toThrow(/timerClock\/carrierFrequency must be 2 to 2\^16 = 65536 counts/);
    expect(() => timerTable({ ...base, carrierFrequency: 400, fundamentalFrequency: 50 })).toThrow(
      /timerClock\/\(2·carrierFrequency\)/,
    );
    // The same period fits a 32-bit counter.
    expect(timerTable({ ...base, carrierFrequency: 400, counterBits: 32 }).periodRegister).toBe(
      80_000,
    );
  });

  it('rejects a non-integer carrier/fundamental ratio and a table length that does not divide it', () => {
    expect(() => timerTable({ ...base, carrierFrequency: 1000, fundamentalFrequency: 60 })).toThrow(
      /carrierFrequency\/fundamentalFrequency must be an integer ≥ 3/,
    );
    expect(() => timerTable({ ...base, tableLength: 7 })).toThrow(
      /tableLength must be a divisor of 320/,
    );
    expect(() => timerTable({ ...base, tableLength: 7 })).toThrow(ParameterRangeError);
  });

  it('rejects a dead time of half a carrier period or more', () => {
    expect(() => timerTable({ ...base, deadTime: 1 / 32_000 })).toThrow(
      /deadTime must be a time in seconds ≥ 0 and < half the carrier period/,
    );
    expect(() => timerTable({ ...base, deadTime: -1e-6 })).toThrow(/deadTime/);
  });

  it('rejects asymmetric sampling and compare-offset dead time on an up-counter', () => {
    expect(() =>
      timerTable({ ...base, countingMode: 'edge-aligned', sampling: 'regular-asymmetric' }),
    ).toThrow(/sampling must be 'regular-symmetric'/);
    expect(() =>
      timerTable({ ...base, countingMode: 'edge-aligned', deadTimeMethod: 'compare-offset' }),
    ).toThrow(/deadTimeMethod/);
    expect(() => timerTable({ ...base, counterBits: 7 })).toThrow(
      /counterBits must be an integer ≥ 8 and ≤ 32/,
    );
    expect(() =>
      timerTable({
        ...base,
        modulation: { method: 'sine-triangle', scheme: 'bipolar', ma: Number.NaN },
      }),
    ).toThrow(/modulation.ma/);
    expect(() =>
      timerTable({
        ...base,
        modulation: { method: 'sine-triangle', scheme: 'tri' as 'bipolar', ma: 0.5 },
      }),
    ).toThrow(/modulation.scheme/);
  });

  it('warns when pulses are shorter than the dead time and when the clock does not divide', () => {
    // ma = 0.98: the narrowest duty (1 − 0.98)/2 = 1 % of 62.5 µs ≈ 0.6 µs < 2 µs dead time.
    const narrow = timerTable({
      ...base,
      modulation: { method: 'sine-triangle', scheme: 'unipolar', ma: 0.98 },
      deadTime: 2e-6,
    });
    expect(narrow.warnings.map((w) => w.field)).toContain('deadTime');
    expect(timerTable({ ...base, deadTime: 2e-6 }).warnings).toEqual([]);
    const rounded = timerTable({ ...base, timerClock: 64_000_123 });
    expect(rounded.warnings.map((w) => w.field)).toContain('timerClock');
    assertInDelta(rounded.realisedCarrierFrequency, 64_000_123 / 4000, 1e-9);
  });

  it('rounds the dead time up and splits it about the ideal edge for compare-offset', () => {
    // 1.01 µs at 64 MHz = 64.64 ticks → 65 (never shorter than asked).
    const table = timerTable({ ...base, deadTime: 1.01e-6 });
    expect(table.deadTimeCounts).toBe(65);
    const { compare, highSide, lowSide } = table.channels[0]!;
    compare.forEach((c, i) => {
      expect(lowSide[i]! - highSide[i]!).toBe(65);
      expect(c - highSide[i]!).toBe(32);
    });
  });
});

describe('timerTable: size bounded before work (issue 11: a default table length crashed the service)', () => {
  it('refuses a default table length past MAX_TIMER_TABLE_LENGTH, naming tableLength, and accepts a divisor', () => {
    const options = {
      modulation: { method: 'three-phase' as const, ma: 0.9, zeroSequence: 'min-max' as const },
      fundamentalFrequency: 0.05,
      carrierFrequency: 1e6,
      timerClock: 1e9,
      sampling: 'regular-asymmetric' as const,
    };
    expect(rangeErrorField(() => timerTable(options))).toBe('tableLength');
    expect(() => timerTable(options)).toThrow(
      /tableLength must be given when .* \(40000000 compare updates per period\) exceeds 65536/,
    );
    expect(
      rangeErrorField(() => timerTable({ ...options, tableLength: 2 * MAX_TIMER_TABLE_LENGTH })),
    ).toBe('tableLength');
    expect(timerTable({ ...options, tableLength: 50_000 }).entryAngles).toHaveLength(50_000);
  });
});
