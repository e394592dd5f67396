import { describe, expect, it } from 'vitest';
import {
  combineWaveforms,
  compensateDeadTime,
  firmwareEffects,
  SQRT3,
  threePhase,
  timerTable,
  timerTableToCsv,
  timerTableToJson,
  timerTableWaveforms,
  type TimerTable,
  type TimerTableOptions,
  type Waveform,
} from '../../index.js';
import { harmonics } from '../../spectrum/index.js';
import { rangeErrorField } from '../../testing/rangeErrorField.js';
import { complementaryCompares } from '../complementaryCompares.js';
import {
  complementCyclic,
  insidePieces,
  mergeCyclic,
  shrinkIntervals,
  splitAtPeriod,
  type Interval,
} from '../pulseTrain.js';

// Timer tables of the reduced common-mode methods of A. M. Hava and E. Ün, "Performance analysis
// of reduced common-mode voltage PWM methods and comparison with standard PWM methods for
// three-phase voltage-source inverters", IEEE Trans. Power Electronics, 2009 (from memory): the
// middle phase compares its reference with the inverted carrier, so its entries have the compare
// sense 'above'. The reference for the pulses is the library's own threePhase with
// regular-asymmetric sampling, itself checked against Hava and Ün in
// three-phase/__tests__/reducedCommonMode.test.ts (common mode ±vdc/6, a brute-force sampled
// simulation of the definition, the vectors each carrier period uses).

const TAU = 2 * Math.PI;
const vdc = 600;
const NSPWM_MIN = 4 / (3 * SQRT3);
const REDUCED = ['azspwm1', 'nspwm'] as const;
type Reduced = (typeof REDUCED)[number];

const options = (
  zeroSequence: Reduced | 'min-max' | 'dpwm1',
  ma: number,
  mf: number,
  extra: Partial<TimerTableOptions> = {},
): TimerTableOptions => ({
  modulation: { method: 'three-phase', zeroSequence, ma },
  fundamentalFrequency: 50,
  carrierFrequency: 50 * mf,
  // 3000 counts per half carrier period: P = 3000.
  timerClock: 50 * mf * 6000,
  vdc,
  ...extra,
});

/** The waveform delayed by `delay` radians (edges moved and re-sorted on [0, 2π)). */
function delayed(waveform: Waveform, delay: number): Waveform {
  const pairs = waveform.edges
    .map((edge, i) => [(((edge + delay) % TAU) + TAU) % TAU, waveform.levels[i] ?? 0] as const)
    .sort((x, y) => x[0] - y[0]);
  return { edges: pairs.map(([edge]) => edge), levels: pairs.map(([, level]) => level) };
}

/** Largest distance (rad, cyclic) between matching edges; Infinity if edges or levels differ. */
function edgeDistance(a: Waveform, b: Waveform): number {
  if (a.edges.length !== b.edges.length) return Infinity;
  let worst = 0;
  for (let i = 0; i < a.edges.length; i++) {
    if (a.levels[i] !== b.levels[i]) return Infinity;
    const d = Math.abs((a.edges[i] ?? 0) - (b.edges[i] ?? 0));
    worst = Math.max(worst, Math.min(d, TAU - d));
  }
  return worst;
}

/**
 * threePhase's legs with its carrier a quarter carrier period behind the table's counter: a
 * peak at θ = π/(2·mf), where the table's counter has its first peak at θ = 0 (carrierAngle
 * x = mf·(θ − π/2) − carrierPhase = π there).
 */
function onlineLegs(zeroSequence: Reduced | 'min-max', ma: number, mf: number): Waveform[] {
  const carrierPhase = (((-Math.PI / 2 - (mf * Math.PI) / 2) % TAU) + TAU) % TAU;
  const { legs } = threePhase({
    ma,
    mf,
    vdc,
    zeroSequence,
    sampling: 'regular-asymmetric',
    carrierPhase,
  });
  return [legs.a, legs.b, legs.c];
}

const commonModeLevels = (legs: Waveform[]): number[] =>
  [
    ...new Set(
      combineWaveforms(legs, ([x = 0, y = 0, z = 0]) => (x + y + z) / 3).levels.map(
        (level) => Math.round(level * 1000) / 1000,
      ),
    ),
  ].sort((x, y) => x - y);

describe('timer tables of the reduced common-mode methods (azspwm1, nspwm)', () => {
  it('give the middle phase the sense above: one channel in every entry, each phase a third of them', () => {
    for (const zeroSequence of REDUCED) {
      const table = timerTable(options(zeroSequence, 0.9, 25));
      expect(table.parameters.sampling).toBe('regular-asymmetric');
      expect(table.parameters.deadTimeMethod).toBe('dead-time-register');
      table.entryAngles.forEach((_, i) =>
        expect(table.channels.filter((c) => c.sense[i] === 'above')).toHaveLength(1),
      );
      // The middle phase of three balanced sines is each phase for two 60° windows a period
      // (30° either side of its zero crossings); the entries decide at multiples of 7.2°
      // (mf = 25), 8 or 9 in a window, so each phase takes 16 to 18 of the 50 entries.
      for (const channel of table.channels) {
        const above = channel.sense.filter((s) => s === 'above').length;
        expect(above).toBeGreaterThanOrEqual(16);
        expect(above).toBeLessThanOrEqual(18);
      }
    }
  });

  it('rebuild the pulses of threePhase (regular-asymmetric) a quarter carrier period early, edge for edge', () => {
    // The table samples each half period at its centre and threePhase at its start, so the
    // table's pulses are threePhase's with its carrier delayed a quarter carrier period. Ideal
    // counts: equal to rounding of the angles; the table's rounded counts: within half a count,
    // the timer's resolution (one count is one tick of the up-down counter). Odd mf: with an
    // even mf a carrier zero crossing, where threePhase reads the middle phase, falls exactly on
    // 90° and 270°, where two sines are equal and either may be inverted (rounding of the angle
    // picks one, in threePhase and in the table alike; both keep the common mode at ±vdc/6).
    for (const zeroSequence of REDUCED)
      for (const mf of [7, 25, 51])
        for (const ma of zeroSequence === 'azspwm1' ? [0.2, 0.7, 1.1] : [0.8, 1, 1.15]) {
          const table = timerTable(options(zeroSequence, ma, mf));
          const reference = onlineLegs(zeroSequence, ma, mf);
          const quarter = Math.PI / (2 * mf);
          const tick = TAU / (table.ticksPerCarrierPeriod * mf);
          const label = `${zeroSequence} mf=${mf} ma=${ma}`;
          for (const [counts, tolerance] of [
            ['ideal', 1e-12],
            ['quantised', tick / 2 + 1e-12],
          ] as const) {
            const { legs } = timerTableWaveforms(table, { counts, includeDeadTime: false });
            legs.forEach((leg, k) =>
              expect(
                edgeDistance(delayed(leg, quarter), reference[k] as Waveform),
                `${label} ${counts} leg ${k}`,
              ).toBeLessThanOrEqual(tolerance),
            );
          }
        }
  });

  it('the same comparison fails for a table of the same waves without the inverted carrier (min-max)', () => {
    const table = timerTable(options('min-max', 0.7, 25, { sampling: 'regular-asymmetric' }));
    const reference = onlineLegs('azspwm1', 0.7, 25);
    const { legs } = timerTableWaveforms(table, { counts: 'ideal', includeDeadTime: false });
    const distances = legs.map((leg, k) =>
      edgeDistance(delayed(leg, Math.PI / 50), reference[k] as Waveform),
    );
    expect(Math.min(...distances)).toBe(Infinity);
    // ... while the min-max table itself equals threePhase's min-max the same way.
    const own = onlineLegs('min-max', 0.7, 25);
    legs.forEach((leg, k) =>
      expect(edgeDistance(delayed(leg, Math.PI / 50), own[k] as Waveform)).toBeLessThan(1e-12),
    );
  });

  it('keep the common mode at ±vdc/6 (no 000 or 111): azspwm1 at every ma, nspwm from ma = 4/(3√3) (Hava and Ün 2009)', () => {
    // The rebuilt gates with the table's rounded counts, no dead time (the switches as commanded).
    // Ties: at odd mf some samples fall on 30° boundaries (two sines equal), and with min-max
    // waves r_max + r_min = 0 always, so an inverted leg's threshold can equal a normal leg's
    // exactly; ma 0.5 and 0.02 put those on half counts, where rounding the on-time (0.5) or the
    // last bit of the references (0.02, mf 3) gave a tick of 000 or 111 before senseCompares
    // rounded the threshold and made such ties one register value. Also a clock giving an odd
    // number of counts (6001 a half period).
    const cases: [Reduced, number[]][] = [
      ['azspwm1', [0.001, 0.02, 0.3, 0.5, 0.6, 0.9, 1.1, 2 / SQRT3 - 1e-9]],
      ['nspwm', [1.002 * NSPWM_MIN, 0.85, 1, 1.1, 2 / SQRT3 - 1e-9]],
    ];
    for (const [zeroSequence, mas] of cases)
      for (const mf of [3, 7, 9, 12, 15, 18, 25, 48, 51, 201])
        for (const ma of mas)
          for (const timerClock of [50 * mf * 6000, 50 * mf * 12_002]) {
            const table = timerTable(options(zeroSequence, ma, mf, { timerClock }));
            const { legs } = timerTableWaveforms(table, { includeDeadTime: false });
            expect(commonModeLevels(legs), `${zeroSequence} mf=${mf} ma=${ma}`).toEqual([
              -vdc / 6,
              vdc / 6,
            ]);
          }
    // The check can fail: the same waves with one carrier reach ±vdc/2, and so does nspwm 3 %
    // below its threshold (as threePhase does at mf 201).
    for (const zeroSequence of ['min-max', 'dpwm1'] as const) {
      const table = timerTable(options(zeroSequence, 0.9, 51, { sampling: 'regular-asymmetric' }));
      expect(commonModeLevels(timerTableWaveforms(table, { includeDeadTime: false }).legs)).toEqual(
        [-vdc / 2, -vdc / 6, vdc / 6, vdc / 2],
      );
    }
    const below = timerTable(options('nspwm', 0.97 * NSPWM_MIN, 201));
    expect(commonModeLevels(timerTableWaveforms(below, { includeDeadTime: false }).legs)).toEqual([
      -vdc / 2,
      -vdc / 6,
      vdc / 6,
      vdc / 2,
    ]);
  });

  it('load into a timer with a dead-time generator: registers and senses give the library gates, never both switches on', () => {
    // A timer model written from the conventions (common practice, from memory): sense 'below'
    // = output on while the counter is below highSide, 'above' = while above it; the
    // complementary output is its opposite; the dead-time generator delays every turn-on by D.
    for (const zeroSequence of REDUCED) {
      const table = timerTable(options(zeroSequence, 0.95, 25, { deadTime: 1.2e-6 }));
      const D = table.deadTimeCounts;
      expect(D).toBe(Math.ceil(1.2e-6 * table.parameters.timerClock - 1e-9));
      const period = table.ticksPerCarrierPeriod * table.carrierPeriodsPerFundamental;
      const out = timerTableWaveforms(table, { currentSign: () => 1 }).legs;
      const into = timerTableWaveforms(table, { currentSign: () => -1 }).legs;
      table.channels.forEach((channel, k) => {
        const main = registerGate(table, channel.highSide, channel.sense);
        const high = splitAtPeriod(shrinkIntervals(main, D, 0, period), period);
        const low = splitAtPeriod(
          shrinkIntervals(complementCyclic(main, period), D, 0, period),
          period,
        );
        // The library's gates: with the current forced out of the leg it is at +vdc/2 exactly
        // while the high side is on; forced in, at −vdc/2 exactly while the low side is on.
        const on = (leg: Waveform, level: number): Interval[] =>
          splitAtPeriod(
            mergeCyclic(
              leg.edges.flatMap((edge, i): Interval[] =>
                leg.levels[i] === level
                  ? [
                      [
                        (edge * period) / TAU,
                        ((leg.edges[i + 1] ?? TAU + (leg.edges[0] ?? 0)) * period) / TAU,
                      ],
                    ]
                  : [],
              ),
              period,
            ),
            period,
          );
        expectSameIntervals(on(out[k] as Waveform, vdc / 2), high, `${zeroSequence} ${k} high`);
        expectSameIntervals(on(into[k] as Waveform, -vdc / 2), low, `${zeroSequence} ${k} low`);
        // Never both on, and each turn-on at least D ticks after the other switch turned off.
        for (const [s] of high)
          for (const before of [1e-6, D / 2, D - 1e-6])
            expect(insidePieces(low, (s - before + period) % period)).toBe(false);
        for (const [s] of low)
          for (const before of [1e-6, D / 2, D - 1e-6])
            expect(insidePieces(high, (s - before + period) % period)).toBe(false);
      });
    }
  });

  it('refuse the timers that cannot run them, naming the field', () => {
    const base = options('azspwm1', 0.9, 24);
    expect(rangeErrorField(() => timerTable({ ...base, countingMode: 'edge-aligned' }))).toBe(
      'countingMode',
    );
    expect(() => timerTable({ ...base, sampling: 'regular-symmetric' })).toThrow(
      /sampling must be 'regular-asymmetric' for zeroSequence 'azspwm1'/,
    );
    expect(() => timerTable({ ...base, deadTime: 1e-6, deadTimeMethod: 'compare-offset' })).toThrow(
      /deadTimeMethod must be 'dead-time-register' for zeroSequence 'azspwm1'/,
    );
    expect(rangeErrorField(() => timerTable({ ...base, tableLength: 24 }))).toBe('tableLength');
    // Without a dead time compare-offset is the same table; the default length is accepted.
    expect(
      timerTable({ ...base, deadTimeMethod: 'compare-offset', tableLength: 48 }).channels[0]
        ?.highSide,
    ).toEqual(timerTable(base).channels[0]?.highSide);
  });

  it('write the sense: full − compare in the registers of the above entries, a CSV column, a JSON field', () => {
    const table = timerTable(options('nspwm', 0.9, 25));
    const full = table.fullScaleCounts;
    for (const channel of table.channels)
      channel.sense.forEach((sense, i) => {
        const duty = channel.duty[i] ?? NaN;
        // The register holds the rounded threshold: full·(1 − duty) above, full·duty below.
        expect(channel.highSide[i]).toBe(
          sense === 'above' ? Math.round((1 - duty) * full) : Math.round(duty * full),
        );
        expect(channel.highSide[i]).toBe(
          sense === 'above' ? full - (channel.compare[i] ?? 0) : channel.compare[i],
        );
      });
    expect(JSON.parse(timerTableToJson(table))).toEqual(table);
    // RFC 4180 without quoting (no cell holds a comma or quote): split and read back.
    const [header, ...rows] = timerTableToCsv(table).trimEnd().split('\r\n');
    const columns = (header ?? '').split(',');
    expect(columns.slice(2, 7)).toEqual(['a_duty', 'a_compare', 'a_sense', 'a_high', 'a_low']);
    expect(rows).toHaveLength(50);
    rows.forEach((row, i) => {
      const cells = row.split(',');
      table.channels.forEach((channel) => {
        const at = (name: string): string =>
          cells[columns.indexOf(`${channel.name}_${name}`)] ?? '';
        expect(at('sense')).toBe(channel.sense[i]);
        expect(Number(at('high'))).toBe(channel.highSide[i]);
        expect(Number(at('low'))).toBe(channel.lowSide[i]);
        expect(Number(at('duty'))).toBe(channel.duty[i]);
      });
    });
  });

  it('compare-offset registers of an above entry leave D ticks each side (the mirror of below)', () => {
    // full 100, compare 30, D = 5: below → high 30 − 2, low 30 + 3; above → edge 70, high 72, low 67.
    expect(complementaryCompares([30, 30], 100, 5, ['below', 'above'])).toEqual({
      highSide: [28, 72],
      lowSide: [33, 67],
    });
  });

  it('dead time and its compensation act on the above entries as on the others (Murai et al. 1987)', () => {
    // Average-value model (T. Murai, T. Watanabe, S. Miyairi, IEEE Trans. Ind. Appl., 1987, from
    // memory): each leg loses td·fsw·vdc with the sign of its current, so the line fundamental
    // drops by √3·(4/π)·td·fsw·vdc at unity power factor, whichever carrier a leg compares with.
    const table = timerTable(options('azspwm1', 0.9, 100, { deadTime: 2e-6 }));
    const effects = firmwareEffects(table, { currentAngle: 0 });
    const predicted =
      SQRT3 * (4 / Math.PI) * table.realisedDeadTime * table.realisedCarrierFrequency * vdc;
    expect(effects.deadTime.fundamentalChange).toBeLessThan(0);
    expect(Math.abs(-effects.deadTime.fundamentalChange - predicted) / predicted).toBeLessThan(
      0.05,
    );
    // The corrected table keeps the senses and restores the fundamental: the per-period rule
    // plus a whole dead time at each sense change (where the leg switches at the update event:
    // four a phase and period, the "+4/period" switchings of AZSPWM1). Measured 0.004 V of a
    // 13.5 V loss; without the sense-change term it was 0.21 V (1.6 %).
    const corrected = compensateDeadTime(table).table;
    expect(corrected.channels.map((c) => c.sense)).toEqual(table.channels.map((c) => c.sense));
    const fundamental = (t: TimerTable, includeDeadTime: boolean): number => {
      const output = timerTableWaveforms(t, { includeDeadTime }).outputs[0] as Waveform;
      return harmonics(output, 1)[1]?.amplitude ?? NaN;
    };
    const ideal = fundamental(table, false);
    expect(Math.abs(fundamental(corrected, true) - ideal)).toBeLessThan(0.005 * predicted);
    // NSPWM keeps only DPWM1's own residual (its clamps switch at update events too, which the
    // per-period rule leaves alone), the same within 0.02 V: its sense changes are corrected.
    const residual = (zeroSequence: 'nspwm' | 'dpwm1'): number => {
      const t = timerTable(
        options(zeroSequence, 0.9, 100, {
          deadTime: 2e-6,
          sampling: 'regular-asymmetric',
          deadTimeMethod: 'dead-time-register',
        }),
      );
      return fundamental(compensateDeadTime(t).table, true) - fundamental(t, false);
    };
    expect(Math.abs(residual('nspwm') - residual('dpwm1'))).toBeLessThan(0.02);
  });
});

/** The output of one channel before dead time, read from its registers as a timer would. */
function registerGate(
  table: TimerTable,
  registers: readonly number[],
  sense: readonly ('below' | 'above')[],
): Interval[] {
  const full = table.fullScaleCounts;
  const raw: Interval[] = [];
  registers.forEach((v, h) => {
    const start = h * full;
    const down = h % 2 === 0; // the counter runs P → 0 (τ ticks in: counter = P − τ), then 0 → P
    if (sense[h] === 'above')
      raw.push(down ? [start, start + full - v] : [start + v, start + full]);
    else raw.push(down ? [start + full - v, start + full] : [start, start + v]);
  });
  return mergeCyclic(raw, table.ticksPerCarrierPeriod * table.carrierPeriodsPerFundamental);
}

function expectSameIntervals(actual: Interval[], expected: Interval[], label: string): void {
  expect(actual.length, label).toBe(expected.length);
  actual.forEach(([s, e], i) => {
    expect(Math.abs(s - (expected[i]?.[0] ?? NaN)), label).toBeLessThan(1e-6);
    expect(Math.abs(e - (expected[i]?.[1] ?? NaN)), label).toBeLessThan(1e-6);
  });
}
