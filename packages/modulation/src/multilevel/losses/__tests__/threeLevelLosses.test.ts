import { describe, expect, it } from 'vitest';
import { EXAMPLE_IGBT } from '../../../losses/exampleIgbt.js';
import type { IgbtDevice, MosfetDevice } from '../../../losses/lossTypes.js';
import { assertInDelta } from '../../../testing/assertInDelta.js';
import { multilevelCarrier } from '../../carrier/multilevelCarrier.js';
import { threeLevelLosses, type ThreeLevelLosses } from '../threeLevelLosses.js';

const VDC = 800;
const F1 = 50;
const PEAK = 60;

function bridge(topology: 'npc' | 't-type', ma: number, mf: number, phaseCount: 1 | 3 = 3) {
  return multilevelCarrier({ topology, levels: 3, carriers: 'pd', phaseCount, ma, mf, vdc: VDC });
}

/**
 * Elementary integrals over [a, b] for a current Î·sin(θ − φ) (worked here): of |sin(θ − φ)| with
 * the region's sign s, of sin θ·|sin(θ − φ)|, of sin²(θ − φ) and of sin θ·sin²(θ − φ).
 */
function integrals(a: number, b: number, phi: number, s: 1 | -1) {
  const at = (f: (t: number) => number) => f(b) - f(a);
  const cubic = (t: number) => {
    const u = t - phi;
    return (
      Math.cos(phi) * (-Math.cos(u) + Math.cos(u) ** 3 / 3) + (Math.sin(phi) * Math.sin(u) ** 3) / 3
    );
  };
  return {
    abs: s * at((t) => -Math.cos(t - phi)),
    sinAbs: s * at((t) => (t * Math.cos(phi) - Math.sin(2 * t - phi) / 2) / 2),
    square: at((t) => t / 2 - Math.sin(2 * (t - phi)) / 4),
    sinSquare: at(cubic),
  };
}

/**
 * The average-model conduction loss of each position of a three-level leg under level-shifted
 * carriers with a sine reference m·sin θ and current Î·sin(θ − φ), 0 ≤ φ ≤ π/2, m ≤ 1: duty of
 * the outer level m·|sin θ|, of the midpoint 1 − m·|sin θ| (Holmes and Lipo 2003, ch. 11), times
 * each path's on-state loss (the conduction table of common practice; for the T-type M.
 * Schweizer and J. W. Kolar, IEEE TPE 2013, from memory), integrated analytically over the
 * positive half-period with i > 0 on (φ, π) and i < 0 on (0, φ); the negative half mirrors it
 * (S1 ↔ S4, S2 ↔ S3, D5 ↔ D6).
 */
function averageModel(topology: 'npc' | 't-type', m: number, phi: number, d: IgbtDevice) {
  const plus = integrals(phi, Math.PI, phi, 1);
  const minus = integrals(0, phi, phi, -1);
  // Duty-weighted on-state loss over a region: outer level (m sin θ) and midpoint (1 − m sin θ).
  const outer = (r: typeof plus, v0: number, res: number) =>
    m * (v0 * PEAK * r.sinAbs + res * PEAK * PEAK * r.sinSquare);
  const whole = (r: typeof plus, v0: number, res: number) =>
    v0 * PEAK * r.abs + res * PEAK * PEAK * r.square;
  const middle = (r: typeof plus, v0: number, res: number) => whole(r, v0, res) - outer(r, v0, res);
  const T = [d.vce0, d.rce] as const;
  const D = [d.vf0, d.rf] as const;
  const scale = 1 / (2 * Math.PI);
  if (topology === 'npc') {
    const s1 = outer(plus, ...T);
    const s2 = whole(plus, ...T) + middle(minus, ...T);
    return {
      S1: { transistor: s1 * scale, diode: outer(minus, ...D) * scale },
      S2: { transistor: s2 * scale, diode: outer(minus, ...D) * scale },
      D5: { transistor: 0, diode: (middle(plus, ...D) + middle(minus, ...D)) * scale },
    };
  }
  return {
    S1: { transistor: outer(plus, ...T) * scale, diode: outer(minus, ...D) * scale },
    S2: {
      transistor: (middle(plus, ...T) + middle(minus, ...T)) * scale,
      diode: (middle(plus, ...D) + middle(minus, ...D)) * scale,
    },
  };
}

function position(losses: ThreeLevelLosses, leg: number, name: string) {
  return losses.legs[leg]!.positions.find((p) => p.position === name)!;
}

describe('threeLevelLosses', () => {
  for (const topology of ['npc', 't-type'] as const) {
    it(`${topology}: conduction of every position against the average model (Holmes and Lipo ch. 11 duties, integrated analytically)`, () => {
      for (const [ma, phi] of [
        [0.9, 0.5],
        [0.4, 0],
        [0.7, 1.2],
      ] as const) {
        const losses = threeLevelLosses(
          bridge(topology, ma, 201),
          { peakCurrent: PEAK, currentAngle: phi },
          { topology, vdc: VDC, fundamentalFrequency: F1, device: EXAMPLE_IGBT },
        );
        const model = averageModel(topology, ma, phi, EXAMPLE_IGBT);
        const mirror: Record<string, string> = { S1: 'S4', S2: 'S3', D5: 'D6' };
        const scale = model.S2.transistor;
        for (const [name, expected] of Object.entries(model)) {
          for (const leg of [0, 1, 2]) {
            for (const p of [name, mirror[name]!]) {
              const row = position(losses, leg, p);
              // Natural sampling against the average model at mf 201: measured within 1.5e-5 of
              // the largest position's conduction loss.
              assertInDelta(
                row.transistor.conduction,
                expected.transistor,
                1e-4 * scale,
                `${topology} ${ma} ${p} T`,
              );
              assertInDelta(
                row.diode.conduction,
                expected.diode,
                1e-4 * scale,
                `${topology} ${ma} ${p} D`,
              );
            }
          }
        }
      }
    });
  }

  it('switching: energy per commutation at vdc/2 and |i|, once each way a carrier period (Bierhoff and Fuchs 2004 scaling, from memory)', () => {
    // NPC at φ: S1 switches while the reference and the current are positive, (φ, π): power
    // f₁·mf·(eon + eoff)·(vdc/2)/Vref·(Î/Iref)·(1 + cos φ)/(2π); D5 recovers on the same edges (err);
    // S3 switches on (0, φ) with D1 recovering: (1 − cos φ) in place of (1 + cos φ).
    const mf = 201;
    const phi = 0.6;
    const losses = threeLevelLosses(
      bridge('npc', 0.8, mf),
      { peakCurrent: PEAK, currentAngle: phi },
      { topology: 'npc', vdc: VDC, fundamentalFrequency: F1, device: EXAMPLE_IGBT },
    );
    const d = EXAMPLE_IGBT;
    const unit =
      (F1 * mf * (VDC / 2 / d.referenceVoltage) * (PEAK / d.referenceCurrent)) / (2 * Math.PI);
    const s1 = position(losses, 0, 'S1');
    assertInDelta(
      s1.transistor.switching,
      unit * (d.eon + d.eoff) * (1 + Math.cos(phi)),
      0.01 * s1.transistor.switching,
      'S1',
    );
    const d5 = position(losses, 0, 'D5');
    assertInDelta(
      d5.diode.switching,
      unit * d.err * (1 + Math.cos(phi)),
      0.01 * d5.diode.switching,
      'D5',
    );
    const s3 = position(losses, 0, 'S3');
    // (0, φ) holds only φ·mf/2π ≈ 19 carrier periods, and whether the period at each end of it
    // commutates S1 or S3 is decided by the current's sign at that edge: within 4 %.
    assertInDelta(
      s3.transistor.switching,
      unit * (d.eon + d.eoff) * (1 - Math.cos(phi)),
      0.04 * s3.transistor.switching,
      'S3',
    );
    assertInDelta(
      s1.diode.switching,
      unit * d.err * (1 - Math.cos(phi)),
      0.04 * s1.diode.switching,
      'D1',
    );
    // Together S1 and S3 take every commutation of the positive half: 2·unit·(eon + eoff), to the
    // pulses of the carrier period that holds the reference's zero crossing (0.5 % at mf 201).
    const both = s1.transistor.switching + s3.transistor.switching;
    assertInDelta(both, 2 * unit * (d.eon + d.eoff), 0.01 * both, 'S1 + S3');
    // S2 turns on entering the midpoint from the bottom with i > 0: (π, π + φ), D4 recovering.
    assertInDelta(
      position(losses, 0, 'S2').transistor.switching,
      unit * (d.eon + d.eoff) * (1 - Math.cos(phi)),
      0.04 * s3.transistor.switching,
      'S2',
    );
    // The diode of S2 never recovers in an NPC leg; the T-type's S2 diode does (S4 turning on).
    expect(position(losses, 0, 'S2').diode.switching).toBe(0);
  });

  it('T-type conducts less than NPC with the same devices, by the second device of the outer levels (Schweizer and Kolar 2013, from memory)', () => {
    let previous = 0;
    for (const ma of [0.2, 0.5, 0.8, 1]) {
      const run = (topology: 'npc' | 't-type') =>
        threeLevelLosses(
          bridge(topology, ma, 201),
          { peakCurrent: PEAK, currentAngle: 0.3 },
          { topology, vdc: VDC, fundamentalFrequency: F1, device: EXAMPLE_IGBT },
        );
      const npc = run('npc');
      const tType = run('t-type');
      expect(tType.conduction).toBeLessThan(npc.conduction);
      // The difference: NPC's S2/S3 (or D2/D3) in series at the outer levels, duty m·|sin θ|.
      const plus = integrals(0.3, Math.PI, 0.3, 1);
      const minus = integrals(0, 0.3, 0.3, -1);
      const d = EXAMPLE_IGBT;
      const extra =
        (3 *
          2 *
          ma *
          (d.vce0 * PEAK * plus.sinAbs +
            d.rce * PEAK ** 2 * plus.sinSquare +
            d.vf0 * PEAK * minus.sinAbs +
            d.rf * PEAK ** 2 * minus.sinSquare)) /
        (2 * Math.PI);
      assertInDelta(npc.conduction - tType.conduction, extra, 0.01 * extra + 1e-3, `ma ${ma}`);
      // The advantage grows with ma (more time at the outer levels).
      expect(npc.conduction - tType.conduction).toBeGreaterThan(previous);
      previous = npc.conduction - tType.conduction;
    }
  });

  it('classes sum their positions; totals sum the classes', () => {
    const losses = threeLevelLosses(
      bridge('npc', 0.8, 51),
      { peakCurrent: PEAK, currentAngle: 0.2 },
      { topology: 'npc', vdc: VDC, fundamentalFrequency: F1, device: EXAMPLE_IGBT },
    );
    expect(losses.classes.map((c) => c.deviceClass)).toEqual([
      'outer switch',
      'inner switch',
      'clamp diode',
    ]);
    const byClass = losses.classes.reduce((s, c) => s + c.total, 0);
    assertInDelta(byClass, losses.total, 1e-9 * losses.total, 'total');
    assertInDelta(losses.conduction + losses.switching, losses.total, 1e-9 * losses.total, 'parts');
    const outer = losses.classes[0]!;
    const s1s4 = losses.legs
      .flatMap((l) => l.positions)
      .filter((p) => p.position === 'S1' || p.position === 'S4');
    assertInDelta(
      outer.total,
      s1s4.reduce((s, p) => s + p.total, 0),
      1e-9 * outer.total,
      'outer',
    );
  });

  it('MOSFETs: each conducting channel rdsOn·i², NPC clamp diodes from the clamp device', () => {
    const mosfet: MosfetDevice = {
      kind: 'mosfet',
      rdsOn: 0.02,
      eon: 1e-4,
      eoff: 1e-4,
      err: 2e-5,
      referenceVoltage: 400,
      referenceCurrent: 50,
    };
    const ma = 0.8;
    const losses = threeLevelLosses(
      bridge('t-type', ma, 201),
      { peakCurrent: PEAK },
      { topology: 't-type', vdc: VDC, fundamentalFrequency: F1, device: mosfet },
    );
    // T-type with channels: at the outer levels one channel, at the midpoint two, whatever the
    // sign: per leg rdsOn·(1/2π)∫ i²·(m|sin θ| + 2(1 − m|sin θ|)) = rdsOn·Î²·(1 − 4m/(3π)) (worked
    // here from ∫ sin² = π and ∫|sin|³ = 8/3 over a period).
    const expected = 3 * mosfet.rdsOn * PEAK ** 2 * (1 - (4 * ma) / (3 * Math.PI));
    assertInDelta(losses.conduction, expected, 2e-3 * expected, 'conduction');
    expect(() =>
      threeLevelLosses(
        bridge('npc', ma, 21),
        { peakCurrent: PEAK },
        { topology: 'npc', vdc: VDC, fundamentalFrequency: F1, device: mosfet },
      ),
    ).toThrow(/^devices\.clamp must be an 'igbt' device/);
  });

  it('names the field of bad input', () => {
    const waveforms = bridge('npc', 0.8, 21);
    const sine = { peakCurrent: PEAK };
    const options = {
      topology: 'npc' as const,
      vdc: VDC,
      fundamentalFrequency: F1,
      device: EXAMPLE_IGBT,
    };
    expect(() => threeLevelLosses(waveforms, sine, { ...options, vdc: 600 })).toThrow(
      /^waveforms\.legs\[0\]\.output\.levels\[\d+\] must be −vdc\/2, 0 or \+vdc\/2/,
    );
    expect(() =>
      threeLevelLosses(waveforms, sine, { ...options, topology: 'anpc' as 'npc' }),
    ).toThrow(/^topology must be one of/);
    expect(() =>
      threeLevelLosses(waveforms, sine, { ...options, fundamentalFrequency: 0 }),
    ).toThrow(/^fundamentalFrequency must be/);
    expect(() =>
      threeLevelLosses(waveforms, sine, { ...options, device: { ...EXAMPLE_IGBT, rce: -1 } }),
    ).toThrow(/^device\.rce must be/);
    expect(() =>
      threeLevelLosses(waveforms, sine, {
        ...options,
        devices: { outer: { ...EXAMPLE_IGBT, eon: -1 } },
      }),
    ).toThrow(/^devices\.outer\.eon must be/);
    expect(() => threeLevelLosses(waveforms, [new Float64Array(8)], options)).toThrow(
      /^currents\.length must be 3/,
    );
  });
});
