import { describe, expect, it } from 'vitest';
import {
  MAX_MULTILEVEL_TIMER_VALUES,
  multilevelTimerSwitches,
  multilevelTimerTable,
  type MultilevelTimerTable,
  type MultilevelTimerTableOptions,
} from '../index.js';
import { multilevelCarrier, type MultilevelCarrierOptions } from '../../multilevel/index.js';
import { harmonics } from '../../spectrum/index.js';
import { combineWaveforms } from '../../waveform/combineWaveforms.js';
import type { Waveform } from '../../waveform/Waveform.js';
import { assertInDelta } from '../../testing/assertInDelta.js';
import { rangeErrorField } from '../../testing/rangeErrorField.js';

const MF = 21;
/** P = 1260 counts: divisible by 2, 3, 4, 5, 6, 7 and 8, so every carrier shift is whole ticks. */
const P = 1260;
const frequencies = {
  fundamentalFrequency: 50,
  carrierFrequency: 50 * MF,
  timerClock: 2 * P * 50 * MF,
};

type Modulation = Omit<MultilevelCarrierOptions, 'mf' | 'sampling'>;

const CASES: { label: string; modulation: Modulation }[] = [
  {
    label: 'NPC, PD, three-phase, min-max',
    modulation: {
      topology: 'npc',
      levels: 3,
      carriers: 'pd',
      phaseCount: 3,
      ma: 1.1,
      vdc: 800,
      zeroSequence: 'min-max',
    },
  },
  {
    label: 'NPC, POD, single-phase',
    modulation: { topology: 'npc', levels: 3, carriers: 'pod', phaseCount: 1, ma: 0.83, vdc: 800 },
  },
  {
    label: 'flying capacitor, 5 levels, three-phase, third harmonic',
    modulation: {
      topology: 'flying-capacitor',
      levels: 5,
      carriers: 'phase-shifted',
      phaseCount: 3,
      ma: 0.95,
      vdc: 1500,
      zeroSequence: 'third-harmonic',
    },
  },
  {
    label: 'flying capacitor, 4 levels, single-phase, carrier delayed 42 ticks',
    modulation: {
      topology: 'flying-capacitor',
      levels: 4,
      carriers: 'phase-shifted',
      phaseCount: 1,
      ma: 0.7,
      vdc: 900,
      carrierPhase: (Math.PI * 42) / P,
    },
  },
  {
    label: 'cascaded, 7 levels, phase-shifted, three-phase',
    modulation: {
      topology: 'cascaded-h-bridge',
      levels: 7,
      carriers: 'phase-shifted',
      phaseCount: 3,
      ma: 0.9,
      vdc: 600,
    },
  },
  {
    label: 'cascaded, 9 levels, APOD, single-phase',
    modulation: {
      topology: 'cascaded-h-bridge',
      levels: 9,
      carriers: 'apod',
      phaseCount: 1,
      ma: 0.92,
      vdc: 600,
    },
  },
  {
    label: 'cascaded, 5 levels, POD, three-phase, min-max',
    modulation: {
      topology: 'cascaded-h-bridge',
      levels: 5,
      carriers: 'pod',
      phaseCount: 3,
      ma: 1.0,
      vdc: 600,
      zeroSequence: 'min-max',
    },
  },
];

const SAMPLINGS = ['regular-symmetric', 'regular-asymmetric'] as const;

function tableFor(
  modulation: Modulation,
  sampling: (typeof SAMPLINGS)[number],
  extra: Partial<MultilevelTimerTableOptions> = {},
): MultilevelTimerTable {
  return multilevelTimerTable({
    modulation: { ...modulation, sampling },
    ...frequencies,
    ...extra,
  });
}

/** The table with every compare value the unrounded duty·P: the timer model without rounding. */
function unrounded(table: MultilevelTimerTable): MultilevelTimerTable {
  return {
    ...table,
    legs: table.legs.map((leg) => ({
      ...leg,
      pairs: leg.pairs.map((pair) => {
        const ideal = pair.duty.map((d) => d * table.fullScaleCounts);
        return { ...pair, compare: ideal, mainCompare: ideal, complementCompare: ideal };
      }),
    })),
  };
}

/** Largest distance between corresponding edges, radians; Infinity when the levels differ. */
function edgeDistance(a: Waveform, b: Waveform): number {
  if (a.edges.length !== b.edges.length) return Infinity;
  let worst = 0;
  a.edges.forEach((edge, i) => {
    if (a.levels[i] !== b.levels[i]) worst = Infinity;
    worst = Math.max(worst, Math.abs(edge - (b.edges[i] as number)));
  });
  return worst;
}

/** Widths (radians) of the runs where a 0/1 waveform is 1, a run across 2π counted once. */
function widthsOfOnes(w: Waveform): number[] {
  const n = w.edges.length;
  const widths: number[] = [];
  for (let i = 0; i < n; i++) {
    if (w.levels[i] !== 1) continue;
    const next = i + 1 < n ? (w.edges[i + 1] as number) : (w.edges[0] as number) + 2 * Math.PI;
    widths.push(next - (w.edges[i] as number));
  }
  if (n > 1 && w.levels[0] === 1 && w.levels[n - 1] === 1) {
    widths[0] = (widths[0] as number) + (widths.pop() as number);
  }
  return widths;
}

describe('multilevelTimerTable against multilevelCarrier (the same regular-sampled modulation)', () => {
  for (const { label, modulation } of CASES) {
    for (const sampling of SAMPLINGS) {
      it(`${label}, ${sampling}: every switch equals multilevelCarrier's, exactly without rounding and to half a tick with it`, () => {
        const table = tableFor(modulation, sampling);
        const expected = multilevelCarrier({ ...modulation, mf: MF, sampling });
        const exact = multilevelTimerSwitches(unrounded(table), { includeDeadTime: false });
        const rounded = multilevelTimerSwitches(table, { includeDeadTime: false });
        const tick = (2 * Math.PI) / (2 * P * MF);
        // The carriers' shifts are whole ticks here, so only the compare values round.
        expect(table.maxOffsetRoundingTicks).toBeLessThan(1e-9);
        expect(table.maxCompareRoundingTicks).toBeLessThanOrEqual(0.5);
        expect(rounded.legs.map((l) => l.name)).toEqual(expected.legs.map((l) => l.name));
        expected.legs.forEach((leg, l) => {
          for (const device of leg.switches) {
            const mine = (w: typeof exact) =>
              w.legs[l]?.switches.find((s) => s.name === device.name)?.on as Waveform;
            // A counter below a compare value is the carrier below the reference (a counter
            // value c stands for the carrier 2c/P − 1; centre-aligned timer practice, from
            // memory): the same edges, to rounding (1e-9 rad), without rounded compares.
            expect(edgeDistance(mine(exact), device.on), `${leg.name} ${device.name}`).toBeLessThan(
              1e-9,
            );
            // Rounding a compare value to a count moves each edge by at most half a tick.
            expect(
              edgeDistance(mine(rounded), device.on),
              `${leg.name} ${device.name}`,
            ).toBeLessThanOrEqual(0.5 * tick + 1e-9);
          }
        });
      });
    }
  }

  it('rounds shifts that are not whole ticks: every edge within one tick, and a warning', () => {
    // P = 1000 ticks: the cascaded cells' π/3 shifts are 333⅓ ticks, rounded to 333 and 667.
    const modulation = CASES[4]!.modulation;
    const table = multilevelTimerTable({
      modulation,
      ...frequencies,
      timerClock: 2 * 1000 * 50 * MF,
    });
    expect(table.counters.map((c) => c.offsetTicks)).toEqual([0, 333, 667]);
    assertInDelta(table.maxOffsetRoundingTicks, 1 / 3, 1e-9);
    expect(table.warnings.map((w) => w.field)).toContain('modulation.carrierPhase');
    const expected = multilevelCarrier({ ...modulation, mf: MF, sampling: 'regular-symmetric' });
    const rounded = multilevelTimerSwitches(table, { includeDeadTime: false });
    const tick = (2 * Math.PI) / (2 * 1000 * MF);
    expected.legs.forEach((leg, l) => {
      for (const device of leg.switches) {
        const mine = rounded.legs[l]?.switches.find((s) => s.name === device.name)?.on as Waveform;
        // Half a tick from the compare value and at most half from the counter's start.
        expect(edgeDistance(mine, device.on), device.name).toBeLessThanOrEqual(tick + 1e-9);
      }
    });
  });

  it('T-type: every switch equals multilevelCarrier and the pairs give its output level', () => {
    const modulation: Modulation = {
      topology: 't-type',
      levels: 3,
      carriers: 'apod',
      phaseCount: 3,
      ma: 0.9,
      vdc: 800,
    };
    const table = tableFor(modulation, 'regular-symmetric');
    const expected = multilevelCarrier({ ...modulation, mf: MF, sampling: 'regular-symmetric' });
    const mine = multilevelTimerSwitches(unrounded(table), { includeDeadTime: false });
    expected.legs.forEach((leg, l) => {
      const on = (name: string) =>
        mine.legs[l]?.switches.find((s) => s.name === name)?.on as Waveform;
      for (const name of ['S1', 'S2', 'S3', 'S4']) {
        const theirs = leg.switches.find((s) => s.name === name)?.on as Waveform;
        expect(edgeDistance(on(name), theirs)).toBeLessThan(1e-9);
      }
      // Leg to DC midpoint: +vdc/2 with S1 on, −vdc/2 with S4 on, 0 otherwise (the T-type leg).
      const output = combineWaveforms([on('S1'), on('S4')], ([s1 = 0, s4 = 0]) => 400 * (s1 - s4));
      expect(edgeDistance(output, leg.output)).toBeLessThan(1e-9);
      // Each pair is complementary: S3 = 1 − S1 and S2 = 1 − S4.
      const complementary = (a: string, b: string) =>
        combineWaveforms([on(a), on(b)], ([x = 0, y = 0]) => x + y);
      expect(complementary('S1', 'S3')).toEqual({ edges: [0], levels: [1] });
      expect(complementary('S2', 'S4')).toEqual({ edges: [0], levels: [1] });
    });
  });
});

describe('multilevelTimerTable compare values and counters', () => {
  it('maps the held reference into each band (NPC, POD) and samples it at the counter peaks', () => {
    const table = tableFor(CASES[1]!.modulation, 'regular-symmetric');
    // The carrier's valley sits at θ = π/2 (carrierPhase 0), so its peaks are at
    // π/2 + (2j + 1)π/mf (Holmes and Lipo 2003 ch. 3 alignment); the table's entries start there.
    // Carrier 2 (the upper band) is in phase; carrier 1 (POD, below zero) in opposition.
    table.counters[1]!.entryAngles.forEach((theta, j) => {
      assertInDelta(Math.cos(MF * (theta - Math.PI / 2)), -1, 1e-12, `entry ${j}`);
      if (j > 0) {
        const step = theta - table.counters[1]!.entryAngles[j - 1]!;
        assertInDelta(Math.cos(step), Math.cos((2 * Math.PI) / MF), 1e-12);
      }
    });
    table.counters[0]!.entryAngles.forEach((theta, j) => {
      assertInDelta(Math.cos(MF * (theta - Math.PI / 2)), 1, 1e-12, `entry ${j}`);
    });
    const [s1s3, s2s4] = table.legs[0]!.pairs as [
      MultilevelTimerTable['legs'][number]['pairs'][number],
      MultilevelTimerTable['legs'][number]['pairs'][number],
    ];
    expect([s1s3.main, s1s3.complement, s2s4.main, s2s4.complement]).toEqual([
      'S1',
      'S3',
      'S2',
      'S4',
    ]);
    // Level-shifted three-level PWM: the upper carrier spans [0, 1] and the lower [−1, 0], so
    // S1's duty is max(0, r) and S2's is 1 + min(0, r) for r = ma·sin θ (McGrath and Holmes 2002;
    // Holmes and Lipo 2003 ch. 11); compare = round(duty·P) (centre-aligned practice, from memory).
    // Each pair samples at its own counter's peaks: S1/S3 at carrier 2's, S2/S4 at carrier 1's.
    table.counters[1]!.entryAngles.forEach((theta, i) => {
      expect(s1s3.compare[i]).toBe(Math.round(P * Math.max(0, 0.83 * Math.sin(theta))));
    });
    table.counters[0]!.entryAngles.forEach((theta, i) => {
      expect(s2s4.compare[i]).toBe(Math.round(P * (1 + Math.min(0, 0.83 * Math.sin(theta)))));
    });
    // Leg b of the full bridge takes −ma·sin θ.
    const legB = table.legs[1]!.pairs[0]!;
    table.counters[1]!.entryAngles.forEach((theta, i) => {
      expect(legB.compare[i]).toBe(Math.round(P * Math.max(0, -0.83 * Math.sin(theta))));
    });
  });

  it('starts opposed and phase-shifted carriers the right fraction of a carrier period later', () => {
    // POD: the carrier below zero is in opposition, half a carrier period (P ticks) on
    // (McGrath and Holmes 2002).
    const pod = tableFor(CASES[1]!.modulation, 'regular-symmetric');
    expect(pod.counters.map((c) => c.offsetTicks)).toEqual([0, P]);
    // Flying capacitor, 5 levels: 4 carriers a quarter period apart; cascaded, 3 cells: 3
    // carriers a sixth of a period apart (π/cells), so the first carrier group of the phase
    // voltage moves to 2·cells·mf (Holmes and Lipo 2003 ch. 11).
    expect(
      tableFor(CASES[2]!.modulation, 'regular-symmetric').counters.map((c) => c.offsetTicks),
    ).toEqual([0, P / 2, P, (3 * P) / 2]);
    expect(
      tableFor(CASES[4]!.modulation, 'regular-symmetric').counters.map((c) => c.offsetTicks),
    ).toEqual([0, P / 3, (2 * P) / 3]);
    // The first counter's valley (counter 0) at θ = π/2: tick mf·2P/4, P ticks after its peak.
    const start = pod.counters[1]!.startTick;
    expect((start + P) % (2 * P)).toBe(((MF * 2 * P) / 4) % (2 * P));
  });

  it('gives the string of a phase-shifted cascaded bridge no carrier group below 2·cells·mf', () => {
    // Phase-shifted carriers, N unipolar cells: the carrier groups below 2N·mf cancel in the
    // string and the first one left sits at 2N·mf (McGrath and Holmes 2002; Holmes and Lipo 2003
    // ch. 11). Regular sampling widens each group's sidebands (they fall off more slowly than
    // naturally sampled ones, Holmes and Lipo ch. 3), so the band checked ends 12 orders short.
    const modulation = CASES[4]!.modulation;
    const table = tableFor(modulation, 'regular-asymmetric');
    const legA = multilevelTimerSwitches(unrounded(table), { includeDeadTime: false }).legs[0]!;
    const on = (name: string) => legA.switches.find((s) => s.name === name)?.on as Waveform;
    const cells = [1, 2, 3].map((k) =>
      combineWaveforms(
        [on(`cell ${k} left upper`), on(`cell ${k} right upper`)],
        ([l = 0, r = 0]) => 600 * (l - r),
      ),
    );
    const string = combineWaveforms(cells, (v) => v.reduce((s, x) => s + x, 0));
    const spectrum = harmonics(string, 2 * 3 * MF + 12);
    // Fundamental: ma × half the string's range (3·vdc) in the linear range (Holmes and Lipo ch.
    // 11), to the regular-sampling error.
    assertInDelta(spectrum[1]!.amplitude, 0.9 * 1800, 0.01 * 1800);
    let inBand = 0;
    for (let n = 2; n < 2 * 3 * MF - 12; n++) inBand = Math.max(inBand, spectrum[n]!.amplitude);
    expect(inBand).toBeLessThan(0.02 * 1800);
    let group = 0;
    for (let n = 2 * 3 * MF - 12; n <= 2 * 3 * MF + 12; n++)
      group = Math.max(group, spectrum[n]!.amplitude);
    expect(group).toBeGreaterThan(0.05 * 1800);
  });
});

describe('multilevelTimerTable dead time', () => {
  const timerClock = frequencies.timerClock;
  // 1 µs at 2.646 MHz is 2.646 ticks: rounded up to 3 (never shorter than asked).
  const deadTime = 1e-6;

  function assertBlanking(table: MultilevelTimerTable, label: string): void {
    const tick = (2 * Math.PI) / (table.ticksPerCarrierPeriod * table.carrierPeriodsPerFundamental);
    const withDead = multilevelTimerSwitches(table);
    const ideal = multilevelTimerSwitches(table, { includeDeadTime: false });
    withDead.legs.forEach((leg, l) => {
      for (let k = 0; k < leg.switches.length; k += 2) {
        const main = leg.switches[k]!.on;
        const complement = leg.switches[k + 1]!.on;
        const name = `${label} ${leg.name} ${leg.switches[k]!.name}`;
        // Shoot-through: the two switches of a pair are never on together.
        expect(
          combineWaveforms([main, complement], ([a = 0, b = 0]) => a * b),
          name,
        ).toEqual({
          edges: [0],
          levels: [0],
        });
        // Every edge of the ideal gate gets one blanking interval of exactly D ticks.
        const gaps = widthsOfOnes(
          combineWaveforms([main, complement], ([a = 0, b = 0]) => (1 - a) * (1 - b)),
        );
        const idealEdges = ideal.legs[l]!.switches[k]!.on.edges.length;
        const edges = idealEdges === 1 ? 0 : idealEdges;
        expect(gaps.length, name).toBe(edges);
        for (const gap of gaps) assertInDelta(gap / tick, 3, 1e-6, name);
      }
    });
  }

  it('the dead-time generator: no pair on together, blanking of ceil(deadTime·clock) ticks at every edge', () => {
    for (const { label, modulation } of CASES) {
      const table = tableFor(modulation, 'regular-symmetric', { deadTime });
      expect(table.deadTimeCounts).toBe(3);
      assertInDelta(table.realisedDeadTime, 3 / timerClock, 1e-18);
      expect(table.legs[0]!.pairs[0]!.mainCompare).toEqual(table.legs[0]!.pairs[0]!.compare);
      // No pulse here is as short as the dead time (it would be swallowed, and warned of).
      expect(table.warnings.map((w) => w.field)).not.toContain('deadTime');
      assertBlanking(table, label);
    }
  });

  it('compare offsets: half the dead time each side where every edge falls inside an update', () => {
    const table = tableFor(CASES[2]!.modulation, 'regular-asymmetric', {
      deadTime,
      deadTimeMethod: 'compare-offset',
    });
    const pair = table.legs[0]!.pairs[0]!;
    pair.compare.forEach((c, i) => {
      expect(c - pair.mainCompare[i]!).toBe(1);
      expect(pair.complementCompare[i]! - c).toBe(2);
    });
    assertBlanking(table, 'compare-offset');
  });

  it('refuses compare offsets where a band switches at a counter peak, naming deadTimeMethod', () => {
    // A level-shifted band's duty reaches 100 %: the switch turns off at the counter peak, where
    // the next update begins; a compare offset cannot move an edge that is not a compare match.
    expect(
      rangeErrorField(() =>
        tableFor(CASES[0]!.modulation, 'regular-symmetric', {
          deadTime,
          deadTimeMethod: 'compare-offset',
        }),
      ),
    ).toBe('deadTimeMethod');
    expect(() =>
      tableFor(CASES[0]!.modulation, 'regular-symmetric', {
        deadTime,
        deadTimeMethod: 'compare-offset',
      }),
    ).toThrow(
      /deadTimeMethod must be 'dead-time-register' for this modulation \(pair S\d\/S\d of leg a/,
    );
  });
});

describe('multilevelTimerTable input checks', () => {
  const base = CASES[0]!.modulation;

  it('names the modulation field multilevelCarrier would name, with the prefix', () => {
    expect(rangeErrorField(() => tableFor({ ...base, levels: 5 }, 'regular-symmetric'))).toBe(
      'modulation.levels',
    );
    expect(() => tableFor({ ...base, carriers: 'phase-shifted' }, 'regular-symmetric')).toThrow(
      /modulation.carriers must be one of 'pd', 'pod', 'apod' for topology 'npc'/,
    );
    expect(rangeErrorField(() => tableFor({ ...base, ma: -1 }, 'regular-symmetric'))).toBe(
      'modulation.ma',
    );
    expect(
      rangeErrorField(() =>
        multilevelTimerTable({
          modulation: { ...base, sampling: 'natural' as 'regular-symmetric' },
          ...frequencies,
        }),
      ),
    ).toBe('modulation.sampling');
    expect(() => multilevelTimerTable({ modulation: { ...base, mf: 20 }, ...frequencies })).toThrow(
      /modulation.mf must be carrierFrequency\/fundamentalFrequency = 21, or left out/,
    );
    expect(
      multilevelTimerTable({ modulation: { ...base, mf: 21 }, ...frequencies }).parameters
        .modulation.mf,
    ).toBe(21);
  });

  it("records the modulation's own fields only, defaults filled in", () => {
    // A design's modulation carries `method`; the table's parameters hold what the table used.
    const table = multilevelTimerTable({
      modulation: { ...base, method: 'multilevel-carrier' } as typeof base,
      ...frequencies,
    });
    expect(table.parameters.modulation).toEqual({
      ...base,
      mf: MF,
      sampling: 'regular-symmetric',
      carrierPhase: 0,
    });
  });

  it('names the timer fields and their ranges', () => {
    expect(() =>
      multilevelTimerTable({
        modulation: base,
        ...frequencies,
        countingMode: 'edge-aligned' as 'centre-aligned',
      }),
    ).toThrow(/countingMode must be 'centre-aligned'/);
    expect(() =>
      multilevelTimerTable({ modulation: base, ...frequencies, carrierFrequency: 1060 }),
    ).toThrow(/carrierFrequency\/fundamentalFrequency must be an integer from 1 to 10000/);
    expect(() =>
      multilevelTimerTable({ modulation: base, ...frequencies, tableLength: 4 }),
    ).toThrow(/tableLength must be a divisor of 21/);
    expect(() =>
      multilevelTimerTable({ modulation: base, ...frequencies, deadTime: 1e-3 }),
    ).toThrow(/deadTime must be a time in seconds ≥ 0 and < half the carrier period/);
    expect(
      rangeErrorField(() =>
        multilevelTimerTable({ modulation: base, ...frequencies, timerClock: 1e10 }),
      ),
    ).toBe('timerClock/(2·carrierFrequency)');
    expect(
      multilevelTimerTable({ modulation: base, ...frequencies, timerClock: 1e10, counterBits: 32 })
        .periodRegister,
    ).toBe(Math.round(1e10 / (2 * 1050)));
  });

  it('holds each entry for updatesPerEntry updates, sampled where its first update begins', () => {
    const full = tableFor(CASES[2]!.modulation, 'regular-asymmetric');
    const short = tableFor(CASES[2]!.modulation, 'regular-asymmetric', { tableLength: 14 });
    expect(short.updatesPerEntry).toBe(3);
    short.legs.forEach((leg, l) =>
      leg.pairs.forEach((pair, k) => {
        const every = full.legs[l]!.pairs[k]!.compare.filter((_, i) => i % 3 === 0);
        expect(pair.compare).toEqual(every);
      }),
    );
    // Held entries: each half period u is on for compare[⌊u/3⌋] ticks (a centre-aligned counter
    // is below c for c ticks of each half), so a switch is on for 3·Σ compare ticks a period.
    const tick = (2 * Math.PI) / (2 * P * MF);
    const switches = multilevelTimerSwitches(short, { includeDeadTime: false });
    short.legs[0]!.pairs.forEach((pair, k) => {
      const on = widthsOfOnes(switches.legs[0]!.switches[2 * k]!.on).reduce((a, b) => a + b, 0);
      assertInDelta(on / tick, 3 * pair.compare.reduce((a, b) => a + b, 0), 1e-6, pair.main);
    });
  });

  it('bounds the table before any work, the default length too', () => {
    // Cascaded, 17 levels, three-phase: 3 strings × 16 pairs; mf 10 000 with asymmetric
    // sampling is 20 000 updates × 48 pairs = 960 000 compare values per period.
    const options: MultilevelTimerTableOptions = {
      modulation: {
        topology: 'cascaded-h-bridge',
        levels: 17,
        carriers: 'phase-shifted',
        phaseCount: 3,
        ma: 0.9,
        vdc: 600,
        sampling: 'regular-asymmetric',
      },
      fundamentalFrequency: 1,
      carrierFrequency: 10_000,
      timerClock: 1e8,
    };
    expect(rangeErrorField(() => multilevelTimerTable(options))).toBe('tableLength');
    expect(() => multilevelTimerTable(options)).toThrow(
      new RegExp(`tableLength must be given when .* exceed ${MAX_MULTILEVEL_TIMER_VALUES}`),
    );
    expect(rangeErrorField(() => multilevelTimerTable({ ...options, tableLength: 10_000 }))).toBe(
      'tableLength',
    );
    const table = multilevelTimerTable({ ...options, tableLength: 5000 });
    expect(table.updatesPerEntry).toBe(4);
    expect(table.legs.flatMap((l) => l.pairs)).toHaveLength(48);
  });
});
