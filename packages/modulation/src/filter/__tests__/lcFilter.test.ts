import { describe, expect, it } from 'vitest';
import { Matrix, solve } from 'ml-matrix';
import { filteredSpectrum, lcFilter, lcFilterResponse, sizeFilterInductance } from '../index.js';
import type { DampingPlacement, LcFilterOptions } from '../LcFilterOptions.js';
import { harmonics } from '../../spectrum/harmonics.js';
import { thd } from '../../spectrum/thd.js';
import type { Harmonic } from '../../spectrum/Harmonic.js';
import { assertInDelta } from '../../testing/assertInDelta.js';

const TAU = 2 * Math.PI;
// Invented values for a small single-phase inverter's output filter.
const l = 1.8e-3;
const c = 12e-6;
const f0 = 1 / (TAU * Math.sqrt(l * c));
const z0 = Math.sqrt(l / c);

/**
 * H = V_out/V_in by nodal analysis, written independently of the library: admittances of each
 * branch stamped into a complex nodal matrix, embedded as the real system [G −B; B G] and
 * solved with ml-matrix (standard circuit analysis). Node 0 ground, 1 the source (1 V),
 * 2 the output, 3 the damping branch's inner node.
 */
function nodalTransfer(filter: LcFilterOptions, frequency: number): { re: number; im: number } {
  const w = TAU * frequency;
  const { rDamping = 0, dampingPlacement = 'series-with-capacitor', cDamping = 0, loadR } = filter;
  type Branch = [number, number, number, number]; // from, to, conductance, susceptance
  const resistor = (a: number, b: number, r: number): Branch => [a, b, 1 / r, 0];
  const capacitor = (a: number, b: number, cap: number): Branch => [a, b, 0, w * cap];
  const inductor = (a: number, b: number, ind: number): Branch => [a, b, 0, -1 / (w * ind)];
  const branches: Branch[] = [inductor(1, 2, filter.l)];
  if (dampingPlacement === 'series-with-capacitor') {
    // An undamped filter (R_d = 0) joins C straight to the output; node 3 then hangs on 1 Ω.
    if (rDamping === 0) branches.push(capacitor(2, 0, filter.c), resistor(3, 0, 1));
    else branches.push(resistor(2, 3, rDamping), capacitor(3, 0, filter.c));
  } else if (dampingPlacement === 'parallel-rc') {
    branches.push(capacitor(2, 0, filter.c), resistor(2, 3, rDamping), capacitor(3, 0, cDamping));
  } else {
    branches.push(resistor(1, 2, rDamping), capacitor(2, 0, filter.c), resistor(3, 0, 1));
  }
  if (loadR !== undefined) branches.push(resistor(2, 0, loadR));
  const unknown = [2, 3];
  const size = unknown.length;
  const a = Matrix.zeros(2 * size, 2 * size);
  const rhs = Matrix.zeros(2 * size, 1);
  const stamp = (row: number, node: number, g: number, b: number): void => {
    const col = unknown.indexOf(node);
    if (node === 1) {
      // Known source node (1 + 0j): moves to the right-hand side with opposite sign.
      rhs.set(row, 0, rhs.get(row, 0) + g);
      rhs.set(row + size, 0, rhs.get(row + size, 0) + b);
    } else if (col >= 0) {
      a.set(row, col, a.get(row, col) - g);
      a.set(row, col + size, a.get(row, col + size) + b);
      a.set(row + size, col, a.get(row + size, col) - b);
      a.set(row + size, col + size, a.get(row + size, col + size) - g);
    }
  };
  for (const [from, to, g, b] of branches) {
    for (const [self, other] of [
      [from, to],
      [to, from],
    ] as const) {
      const row = unknown.indexOf(self);
      if (row < 0) continue;
      // KCL at `self`: y·(V_self − V_other) summed = 0.
      stamp(row, self, -g, -b);
      stamp(row, other, g, b);
    }
  }
  const x = solve(a, rhs);
  return { re: x.get(0, 0), im: x.get(size, 0) };
}

describe('lcFilter characteristics', () => {
  it('resonates at 1/(2π√(LC)) with Z₀ = √(L/C)', () => {
    // Standard circuit analysis (LC resonance).
    const result = lcFilter({ l, c, rDamping: 3 });
    assertInDelta(result.resonanceFrequency, f0, 1e-12 * f0);
    assertInDelta(result.characteristicImpedance, z0, 1e-12 * z0);
    assertInDelta(f0, 1082.9, 0.1, 'hand value: 1/(2π√(1.8 mH·12 µF))');
  });

  it('gives ζ = R_d/(2Z₀) for R_d in series with C and |H(jω₀)| = √(1 + 4ζ²)/(2ζ)', () => {
    // Unloaded: H = (1 + jωR_dC)/(1 − ω²LC + jωR_dC); at ω₀ the real part of the denominator
    // vanishes, so |H| = |1 + j2ζ|/(2ζ) (derived by hand from the divider).
    const rDamping = 4.5;
    const zeta = rDamping / (2 * z0);
    const result = lcFilter({ l, c, rDamping });
    assertInDelta(result.dampingRatio ?? NaN, zeta, 1e-14);
    assertInDelta(
      result.gainAtResonance ?? NaN,
      Math.sqrt(1 + 4 * zeta * zeta) / (2 * zeta),
      1e-12,
    );
    expect(result.peakGain ?? NaN).toBeGreaterThanOrEqual((result.gainAtResonance ?? NaN) - 1e-12);
  });

  it('gives ζ = Z₀/(2R_d) for R_d across L with the same resonance gain form', () => {
    // Unloaded: H = (R + jωL)/(R + jωL − ω²LCR); at ω₀, |H| = √(1 + (R/(ω₀L))²) with
    // R/(ω₀L) = R/Z₀ = 1/(2ζ) (derived by hand).
    const rDamping = 40;
    const zeta = z0 / (2 * rDamping);
    const result = lcFilter({ l, c, rDamping, dampingPlacement: 'parallel-with-inductor' });
    assertInDelta(result.dampingRatio ?? NaN, zeta, 1e-14);
    assertInDelta(result.gainAtResonance ?? NaN, Math.sqrt(1 + 1 / (4 * zeta * zeta)), 1e-12);
  });

  it('finds the peak of a lightly damped second-order filter at ω₀√(1 − 2ζ²)', () => {
    // Undamped LC with a resistive load: H = 1/(1 − ω²LC + jωL/R), a pure second-order low
    // pass with ζ = Z₀/(2R); its peak 1/(2ζ√(1 − ζ²)) at ω₀√(1 − 2ζ²) (standard second-order
    // system result, any control or circuits text).
    const loadR = 30;
    const zeta = z0 / (2 * loadR);
    const result = lcFilter({ l, c, loadR });
    assertInDelta(result.peakGain ?? NaN, 1 / (2 * zeta * Math.sqrt(1 - zeta * zeta)), 1e-9);
    assertInDelta(result.peakFrequency ?? NaN, f0 * Math.sqrt(1 - 2 * zeta * zeta), 1e-4 * f0);
  });

  it('reports an undamped, unloaded filter as having no finite peak', () => {
    const result = lcFilter({ l, c });
    expect(result.peakGain).toBeNull();
    expect(result.gainAtResonance).toBeNull();
  });
});

describe('lcFilterResponse', () => {
  it('is 1/(1 − (f/f₀)²) for the undamped, unloaded filter', () => {
    // Hand-derived divider (standard circuit analysis); the sign flips above resonance.
    const frequencies = [0, 50, 400, 900, 1500, 20_000];
    const { magnitude, phase } = lcFilterResponse(frequencies, { l, c });
    frequencies.forEach((f, k) => {
      const h = 1 / (1 - (f / f0) ** 2);
      assertInDelta(magnitude[k] as number, Math.abs(h), 1e-12 * Math.abs(h), `|H(${f})|`);
      assertInDelta(Math.cos(phase[k] as number), Math.sign(h), 1e-12, `phase ${f}`);
    });
  });

  it('passes DC with a load: H(0) = 1 for every placement', () => {
    const placements: [DampingPlacement, LcFilterOptions][] = [
      ['series-with-capacitor', { l, c, rDamping: 3, loadR: 20 }],
      [
        'parallel-rc',
        { l, c, rDamping: 8, cDamping: 36e-6, dampingPlacement: 'parallel-rc', loadR: 20 },
      ],
      [
        'parallel-with-inductor',
        { l, c, rDamping: 40, dampingPlacement: 'parallel-with-inductor', loadR: 20 },
      ],
    ];
    for (const [name, filter] of placements) {
      const { magnitude, phase } = lcFilterResponse([0, 1e-3], filter);
      assertInDelta(magnitude[0] as number, 1, 1e-15, `${name} at 0 Hz`);
      assertInDelta(magnitude[1] as number, 1, 1e-9, `${name} at 1 mHz`);
      assertInDelta(phase[0] as number, 0, 1e-15);
    }
  });

  it('rolls off at −40 dB/decade undamped and with parallel R–C damping, −20 with series R', () => {
    // Asymptotes of the divider (standard circuit analysis): shunt capacitive → |H| ∝ 1/ω²;
    // with R_d in series with C the shunt becomes R_d at high frequency → |H| ∝ 1/ω.
    const slope = (filter: LcFilterOptions, f: number): number => {
      const { magnitudeDb } = lcFilterResponse([f, 10 * f], filter);
      return (magnitudeDb[1] as number) - (magnitudeDb[0] as number);
    };
    assertInDelta(slope({ l, c }, 1000 * f0), -40, 1e-4, 'undamped');
    assertInDelta(
      slope(
        { l, c, rDamping: 8, cDamping: 36e-6, dampingPlacement: 'parallel-rc', loadR: 20 },
        1e4 * f0,
      ),
      -40,
      1e-3,
      'parallel-rc',
    );
    assertInDelta(slope({ l, c, rDamping: 3 }, 1e5 * f0), -20, 1e-3, 'series R');
    assertInDelta(
      slope({ l, c, rDamping: 40, dampingPlacement: 'parallel-with-inductor' }, 1e5 * f0),
      -20,
      1e-3,
      'R across L',
    );
  });

  it('agrees with an independent nodal solve (ml-matrix) for every placement', () => {
    const filters: LcFilterOptions[] = [
      { l, c, rDamping: 3, loadR: 20 },
      { l, c, rDamping: 0 },
      { l, c, rDamping: 8, cDamping: 36e-6, dampingPlacement: 'parallel-rc', loadR: 15 },
      { l, c, rDamping: 8, cDamping: 36e-6, dampingPlacement: 'parallel-rc' },
      { l, c, rDamping: 40, dampingPlacement: 'parallel-with-inductor', loadR: 12 },
    ];
    const frequencies = [50, 333, 1000, 1100, 5000, 48_000];
    for (const filter of filters) {
      const { magnitude, phase } = lcFilterResponse(frequencies, filter);
      frequencies.forEach((f, k) => {
        const h = nodalTransfer(filter, f);
        const m = Math.hypot(h.re, h.im);
        assertInDelta(
          magnitude[k] as number,
          m,
          1e-10 * m,
          `${filter.dampingPlacement ?? 'series'} |H(${f})|`,
        );
        assertInDelta(
          Math.cos((phase[k] as number) - Math.atan2(h.im, h.re)),
          1,
          1e-12,
          `phase ${f}`,
        );
      });
    }
  });
});

describe('filteredSpectrum', () => {
  it('scales a square wave by 1/|1 − (nf₁/f₀)²| and shifts by π above resonance', () => {
    // Fourier series 4V/(nπ) (standard Fourier analysis) times the hand-derived |H|.
    const volts = 325;
    const f1 = 60;
    const filtered = filteredSpectrum(
      harmonics({ edges: [0, Math.PI], levels: [volts, -volts] }, 41),
      {
        filter: { l, c },
        fundamentalFrequency: f1,
      },
    );
    for (const h of filtered) {
      if (h.order % 2 === 0) continue;
      const gain = 1 / (1 - ((h.order * f1) / f0) ** 2);
      const expected = ((4 * volts) / (h.order * Math.PI)) * Math.abs(gain);
      assertInDelta(h.amplitude, expected, 1e-10 * volts, `order ${h.order}`);
      assertInDelta(Math.cos(h.phase), Math.sign(gain), 1e-12, `phase ${h.order}`);
    }
  });

  it('names the bad filter field', () => {
    expect(() => filteredSpectrum([], { filter: { l: 0, c }, fundamentalFrequency: 50 })).toThrow(
      /filter.l must be/,
    );
    expect(() => filteredSpectrum([], { filter: { l, c }, fundamentalFrequency: -1 })).toThrow(
      /fundamentalFrequency/,
    );
  });
});

describe('sizeFilterInductance', () => {
  // A synthetic spectrum: 230 V fundamental and one carrier harmonic at order 21 of 0.8 p.u.
  const f1 = 50;
  const spectrum: Harmonic[] = [
    { order: 0, amplitude: 0, phase: 0 },
    { order: 1, amplitude: 230, phase: 0 },
    { order: 21, amplitude: 184, phase: 0.3 },
  ];

  it('finds L from the hand-solved limit for one harmonic', () => {
    // Undamped, unloaded: ratio = 0.8·|1 − x²|/|1 − 441x²| with x = f₁/f₀; setting it to t and
    // solving (with 441x² > 1) gives x² = (0.8 + t)/(0.8 + 441t) (algebra by hand), and
    // L = 1/((2πf₀)²C).
    const t = 0.05;
    const x2 = (0.8 + t) / (0.8 + 441 * t);
    const expectedL = x2 / ((TAU * f1) ** 2 * c);
    const result = sizeFilterInductance(spectrum, {
      c,
      fundamentalFrequency: f1,
      maxIndividual: t,
    });
    assertInDelta(result.l, expectedL, 1e-8 * expectedL, 'l');
    expect(result.worstOrder).toBe(21);
    assertInDelta(result.worstIndividual, t, 1e-8 * t);
    assertInDelta(result.fundamentalGain, 1 / (1 - x2), 1e-8, 'fundamental gain 1/(1 − x²)');
  });

  it('returns the smallest L that meets a THD target on a damped, loaded filter', () => {
    const square = harmonics({ edges: [0, Math.PI], levels: [400, -400] }, 199);
    const damping = {
      rDamping: 6,
      cDamping: 3 * c,
      dampingPlacement: 'parallel-rc' as const,
      loadR: 25,
    };
    const result = sizeFilterInductance(square, {
      c,
      ...damping,
      fundamentalFrequency: f1,
      maxThd: 0.08,
    });
    const at = (lValue: number): number =>
      thd(
        filteredSpectrum(square, {
          filter: { c, ...damping, l: lValue },
          fundamentalFrequency: f1,
        }),
      );
    expect(at(result.l)).toBeLessThanOrEqual(0.08);
    expect(at(result.l * (1 - 1e-8))).toBeGreaterThan(0.08);
    assertInDelta(result.thd, 0.08, 1e-8);
  });

  it('says when the target cannot be reached and names the target', () => {
    expect(() =>
      sizeFilterInductance(spectrum, { c, fundamentalFrequency: f1, maxIndividual: 1e-9 }),
    ).toThrow(/maxIndividual must be a target reachable/);
    expect(() => sizeFilterInductance(spectrum, { c, fundamentalFrequency: f1 })).toThrow(/maxThd/);
    expect(() =>
      sizeFilterInductance(spectrum, { c: -1, fundamentalFrequency: f1, maxThd: 0.05 }),
    ).toThrow(/c must be/);
  });
});

describe('filter input checks', () => {
  it('names the field and the range', () => {
    expect(() => lcFilter({ l, c: 0 })).toThrow(/c must be a finite number > 0/);
    expect(() =>
      lcFilter({ l, c, rDamping: 0, dampingPlacement: 'parallel-rc', cDamping: 1e-6 }),
    ).toThrow(/rDamping must be a finite number > 0/);
    expect(() => lcFilter({ l, c, rDamping: 1, dampingPlacement: 'parallel-rc' })).toThrow(
      /cDamping/,
    );
    expect(() => lcFilter({ l, c, dampingPlacement: 'across' as DampingPlacement })).toThrow(
      /dampingPlacement must be one of/,
    );
    expect(() => lcFilter({ l, c, loadR: 0 })).toThrow(/loadR/);
    expect(() => lcFilterResponse([10, -1], { l, c })).toThrow(/frequencies\[1\]/);
  });
});
