import { describe, expect, it } from 'vitest';
import { harmonics } from '../../spectrum/harmonics.js';
import { assertInDelta } from '../../testing/assertInDelta.js';
import { rangeErrorField } from '../../testing/rangeErrorField.js';
import { ParameterTypeError } from '../../validation/errors.js';
import { combineWaveforms } from '../../waveform/combineWaveforms.js';
import type { Waveform } from '../../waveform/Waveform.js';
import { waveformValueAt } from '../../waveform/waveformValueAt.js';
import { multilevelCarrier } from '../carrier/multilevelCarrier.js';
import type {
  MultilevelCarrierOptions,
  MultilevelLeg,
  MultilevelSwitch,
} from '../MultilevelTypes.js';

const vdc = 600;

/** Every combination the validator accepts, one of each kind. */
const CASES: MultilevelCarrierOptions[] = [
  ...(['pd', 'pod', 'apod'] as const).flatMap((carriers) => [
    { topology: 'npc', levels: 3, carriers, phaseCount: 3, ma: 0.9, mf: 15, vdc } as const,
    { topology: 't-type', levels: 3, carriers, phaseCount: 1, ma: 0.9, mf: 15, vdc } as const,
    {
      topology: 'cascaded-h-bridge',
      levels: 7,
      carriers,
      phaseCount: 1,
      ma: 0.9,
      mf: 15,
      vdc,
    } as const,
  ]),
  {
    topology: 'flying-capacitor',
    levels: 4,
    carriers: 'phase-shifted',
    phaseCount: 3,
    ma: 0.9,
    mf: 15,
    vdc,
  },
  {
    topology: 'flying-capacitor',
    levels: 5,
    carriers: 'phase-shifted',
    phaseCount: 1,
    ma: 0.9,
    mf: 16,
    vdc,
  },
  {
    topology: 'cascaded-h-bridge',
    levels: 7,
    carriers: 'phase-shifted',
    phaseCount: 3,
    ma: 0.9,
    mf: 15,
    vdc,
  },
];

function title(o: MultilevelCarrierOptions): string {
  return `${o.topology} ${o.levels}-level ${o.carriers} ${o.phaseCount}-phase`;
}

/**
 * The midpoints between neighbouring edges of all the waveforms given. Gaps under 1e-9 rad are
 * skipped: two switches crossing at one instant (both legs of an H-bridge cell at a zero
 * crossing of the reference that meets the carrier's zero) land a few ulp apart, and the
 * waveform built from both merges them (EDGE_EPSILON), so the sliver between says nothing.
 */
function probeAngles(waveforms: readonly Waveform[]): number[] {
  const edges = [...new Set(waveforms.flatMap((w) => w.edges))].sort((a, b) => a - b);
  edges.push((edges[0] as number) + 2 * Math.PI);
  const probes: number[] = [];
  for (let i = 0; i + 1 < edges.length; i++) {
    const [a, b] = [edges[i] as number, edges[i + 1] as number];
    if (b - a > 1e-9) probes.push((a + b) / 2);
  }
  return probes;
}

function switchOn(leg: MultilevelLeg, name: string): Waveform {
  const found = leg.switches.find((s: MultilevelSwitch) => s.name === name);
  if (found === undefined) throw new Error(`no switch ${name} in ${leg.name}`);
  return found.on;
}

/** The output level the switch states imply at `angle`, or NaN for a forbidden state. */
function impliedLevel(o: MultilevelCarrierOptions, leg: MultilevelLeg, angle: number): number {
  const on = (name: string): number => waveformValueAt(switchOn(leg, name), angle);
  if (o.topology === 'npc') {
    // Nabae, Takahashi and Akagi (1981): S1S2 connect the positive rail, S2S3 the midpoint
    // through a clamp diode, S3S4 the negative rail; S1/S3 and S2/S4 are complementary.
    const [s1, s2, s3, s4] = [on('S1'), on('S2'), on('S3'), on('S4')];
    if (s1 + s3 !== 1 || s2 + s4 !== 1) return NaN;
    if (s1 === 1 && s2 === 1) return vdc / 2;
    if (s2 === 1 && s3 === 1) return 0;
    if (s3 === 1 && s4 === 1) return -vdc / 2;
    return NaN;
  }
  if (o.topology === 't-type') {
    // T-type leg: S1 to +, S4 to −, the anti-series pair S2/S3 to the midpoint only with both
    // on; gated as NPC's pairs S1/S3 and S2/S4 (Schweizer and Kolar, IEEE Trans. Power
    // Electron., 2013, from memory), so S2 stays on at + and S3 at −, blocking nothing.
    const [s1, s2, s3, s4] = [on('S1'), on('S2'), on('S3'), on('S4')];
    if (s1 + s3 !== 1 || s2 + s4 !== 1) return NaN;
    return s1 === 1 ? vdc / 2 : s4 === 1 ? -vdc / 2 : 0;
  }
  if (o.topology === 'flying-capacitor') {
    // Each commutation cell with its upper switch on adds vdc/(levels − 1) (Meynard and Foch).
    let sum = -vdc / 2;
    for (let k = 1; k < o.levels; k++) {
      const upper = on(`cell ${k} upper`);
      if (upper + on(`cell ${k} lower`) !== 1) return NaN;
      sum += (upper * vdc) / (o.levels - 1);
    }
    return sum;
  }
  // H-bridge cell: +vdc with left upper and right lower on, −vdc the other way, 0 otherwise.
  let sum = 0;
  for (let k = 1; k <= (o.levels - 1) / 2; k++) {
    const left = on(`cell ${k} left upper`);
    const right = on(`cell ${k} right upper`);
    if (left + on(`cell ${k} left lower`) !== 1 || right + on(`cell ${k} right lower`) !== 1) {
      return NaN;
    }
    const cellVoltage = vdc * (left - right);
    const cell = leg.cells[k - 1];
    if (cell === undefined || waveformValueAt(cell.waveform, angle) !== cellVoltage) return NaN;
    sum += cellVoltage;
  }
  return sum;
}

function allowedLevels(o: MultilevelCarrierOptions): number[] {
  if (o.topology === 'cascaded-h-bridge') {
    const cells = (o.levels - 1) / 2;
    return Array.from({ length: o.levels }, (_, k) => (k - cells) * vdc);
  }
  return Array.from({ length: o.levels }, (_, k) => -vdc / 2 + (k * vdc) / (o.levels - 1));
}

describe('multilevelCarrier: levels and devices', () => {
  for (const o of CASES) {
    it(`${title(o)}: every level of the leg and only those`, () => {
      const result = multilevelCarrier(o);
      expect(result.legs).toHaveLength(
        o.phaseCount === 3 ? 3 : o.topology === 'cascaded-h-bridge' ? 1 : 2,
      );
      const allowed = allowedLevels(o);
      for (const leg of result.legs) {
        const used = [...new Set(leg.output.levels)].sort((a, b) => a - b);
        // ma 0.9 with mf ≥ 15 sweeps the reference through every band, so every level appears.
        expect(used.length, leg.name).toBe(allowed.length);
        used.forEach((level, i) =>
          assertInDelta(level, allowed[i] as number, 1e-9 * vdc, leg.name),
        );
      }
    });

    it(`${title(o)}: the switches give the leg's output at every instant`, () => {
      const result = multilevelCarrier(o);
      for (const leg of result.legs) {
        const angles = probeAngles([leg.output, ...leg.switches.map((s) => s.on)]);
        for (const angle of angles) {
          const implied = impliedLevel(o, leg, angle);
          expect(Number.isNaN(implied), `${leg.name} forbidden state at ${angle}`).toBe(false);
          assertInDelta(
            waveformValueAt(leg.output, angle),
            implied,
            1e-9 * vdc,
            `${leg.name} at ${angle}`,
          );
        }
      }
    });

    it(`${title(o)}: fundamental of a leg is ma times half its range (mf 81)`, () => {
      // Linear range of carrier PWM (Holmes and Lipo, 2003, ch. 3 and 11): the reference's
      // fundamental appears at the output scaled by half the output range. The carrier groups
      // reach order 1 only through their sidebands m·mf − n = 1: Bessel terms J_n(n ≈ mf), nil,
      // for phase-shifted, POD and APOD; PD's band-edge terms decay far more slowly (measured,
      // of half the range: 3 levels 1.6e-3 at mf 15, 9e-6 at mf 81; 7 levels 5e-4 at mf 81, the
      // same as a sampled brute-force comparator gives), hence mf 81 and 1e-3 for PD.
      const result = multilevelCarrier({ ...o, mf: 81 });
      const halfRange = o.topology === 'cascaded-h-bridge' ? ((o.levels - 1) / 2) * vdc : vdc / 2;
      const first = harmonics((result.legs[0] as MultilevelLeg).output, 1)[1];
      const inPhase = (first?.amplitude ?? NaN) * Math.cos(first?.phase ?? NaN);
      const tolerance = o.carriers === 'pd' ? 1e-3 : 1e-9;
      assertInDelta(inPhase, o.ma * halfRange, tolerance * halfRange, 'fundamental');
    });
  }

  it('a single-phase full bridge of two legs gives 2·levels − 1 levels (npc: five)', () => {
    const result = multilevelCarrier({
      topology: 'npc',
      levels: 3,
      carriers: 'pd',
      phaseCount: 1,
      ma: 0.9,
      mf: 15,
      vdc,
    });
    const [a, b] = result.legs as [MultilevelLeg, MultilevelLeg];
    const bridge = combineWaveforms([a.output, b.output], ([x = 0, y = 0]) => x - y);
    // Counting: each leg takes −vdc/2, 0, +vdc/2, so a − b takes −vdc…vdc in steps of vdc/2.
    expect([...new Set(bridge.levels)].sort((x, y) => x - y)).toEqual([
      -vdc,
      -vdc / 2,
      0,
      vdc / 2,
      vdc,
    ]);
  });

  it('POD and APOD coincide for three levels (McGrath and Holmes, 2002)', () => {
    const base = { topology: 'npc', levels: 3, phaseCount: 1, ma: 0.8, mf: 9, vdc } as const;
    const pod = multilevelCarrier({ ...base, carriers: 'pod' });
    const apod = multilevelCarrier({ ...base, carriers: 'apod' });
    expect(apod.legs[0]?.output).toEqual(pod.legs[0]?.output);
  });
});

describe('multilevelCarrier: errors name the field', () => {
  const good: MultilevelCarrierOptions = {
    topology: 'npc',
    levels: 3,
    carriers: 'pd',
    phaseCount: 3,
    ma: 0.9,
    mf: 15,
    vdc,
  };
  const cases: [string, Record<string, unknown>][] = [
    ['topology', { topology: 'diode-clamped-5' }],
    ['levels', { levels: 5 }],
    ['levels', { topology: 'flying-capacitor', carriers: 'phase-shifted', levels: 10 }],
    ['levels', { topology: 'flying-capacitor', carriers: 'phase-shifted', levels: 3.5 }],
    ['levels', { topology: 'cascaded-h-bridge', levels: 6 }],
    ['levels', { topology: 'cascaded-h-bridge', levels: 19 }],
    ['carriers', { carriers: 'phase-shifted' }],
    ['carriers', { topology: 'flying-capacitor', levels: 4, carriers: 'pd' }],
    ['phaseCount', { phaseCount: 2 }],
    ['ma', { ma: 0 }],
    ['mf', { mf: 10.5 }],
    ['vdc', { vdc: -1 }],
    ['zeroSequence', { zeroSequence: 'dpwm1' }],
    ['zeroSequence', { phaseCount: 1, zeroSequence: 'min-max' }],
    ['sampling', { sampling: 'sampled' }],
    ['carrierPhase', { carrierPhase: Number.NaN }],
  ];
  for (const [field, change] of cases) {
    it(`${field}: ${JSON.stringify(change)}`, () => {
      expect(rangeErrorField(() => multilevelCarrier({ ...good, ...change }))).toBe(field);
    });
  }

  it('carriers lists what the topology allows', () => {
    expect(() => multilevelCarrier({ ...good, carriers: 'phase-shifted' })).toThrow(
      /'pd', 'pod', 'apod' for topology 'npc'/,
    );
  });

  it('a wrong kind is a ParameterTypeError', () => {
    expect(() =>
      multilevelCarrier({ ...good, levels: '3' } as unknown as MultilevelCarrierOptions),
    ).toThrow(ParameterTypeError);
  });
});
