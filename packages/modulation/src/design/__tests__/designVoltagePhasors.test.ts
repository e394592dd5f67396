import { describe, expect, it } from 'vitest';
import { multilevelCarrier } from '../../multilevel/carrier/multilevelCarrier.js';
import { harmonicPhasors, type HarmonicPhasors } from '../../spectrum/harmonicPhasors.js';
import { harmonicsOfPhasors } from '../../spectrum/harmonicsOfPhasors.js';
import { labelHarmonics } from '../../spectrum/labelHarmonics.js';
import { harmonics } from '../../spectrum/harmonics.js';
import { assertInDelta } from '../../testing/assertInDelta.js';
import { threePhase } from '../../three-phase/threePhase.js';
import { combineWaveforms } from '../../waveform/combineWaveforms.js';
import type { Waveform } from '../../waveform/Waveform.js';
import { designVoltagePhasors } from '../designVoltagePhasors.js';
import { modulationVoltages, type ModulationVoltages } from '../modulationVoltages.js';
import { spectrumLabeller } from '../spectrumLabeller.js';

/** Largest |X_n − Y_n| over the orders of two spectra. */
const largestDifference = (x: HarmonicPhasors, y: HarmonicPhasors): number => {
  let largest = 0;
  for (let n = 0; n < x.re.length; n++)
    largest = Math.max(
      largest,
      Math.hypot(
        (x.re[n] as number) - (y.re[n] as number),
        (x.im[n] as number) - (y.im[n] as number),
      ),
    );
  return largest;
};

const threePhaseVoltages = (zeroSequence: 'min-max' | 'dpwm1' | 'dpwm-max'): ModulationVoltages =>
  modulationVoltages({ method: 'three-phase', ma: 0.9, mf: 33, vdc: 600, zeroSequence });

describe('designVoltagePhasors: a three-phase bridge read from its legs', () => {
  // The Fourier series is linear (standard Fourier analysis): the spectrum of a fixed linear
  // combination of the legs is that combination of their spectra, so reading the legs once must
  // give each voltage's own exact spectrum to rounding (1e-12 of the 300 V levels here).
  for (const zeroSequence of ['min-max', 'dpwm1', 'dpwm-max'] as const) {
    it(`${zeroSequence}: phases, line a−b and common mode equal each waveform's own spectrum`, () => {
      const voltages = threePhaseVoltages(zeroSequence);
      const spectra = designVoltagePhasors(voltages, 1200);
      voltages.phases.forEach((phase, k) => {
        const own = harmonicPhasors(phase.waveform, 1200);
        expect(largestDifference(spectra.phase(k), own)).toBeLessThan(1e-12 * 600);
      });
      const line = voltages.lines[0]?.waveform as Waveform;
      expect(largestDifference(spectra.line(0), harmonicPhasors(line, 1200))).toBeLessThan(
        1e-12 * 600,
      );
      const commonMode = combineWaveforms(
        voltages.legs.map((leg) => leg.waveform),
        (levels) => ((levels[0] ?? 0) + (levels[1] ?? 0) + (levels[2] ?? 0)) / 3,
      );
      expect(
        largestDifference(spectra.commonMode(), harmonicPhasors(commonMode, 1200)),
      ).toBeLessThan(1e-12 * 600);
    });
  }

  it('the line fundamental is √3 times the phase fundamental (balanced three-phase set, standard circuit analysis)', () => {
    const spectra = designVoltagePhasors(threePhaseVoltages('min-max'), 100);
    const magnitude = (p: HarmonicPhasors): number =>
      Math.hypot(p.re[1] as number, p.im[1] as number);
    assertInDelta(magnitude(spectra.line(0)) / magnitude(spectra.phase(0)), Math.sqrt(3), 1e-12);
  });

  it('a multilevel bridge (NPC, three levels) is read from its legs the same way', () => {
    const waveforms = multilevelCarrier({
      topology: 'npc',
      levels: 3,
      carriers: 'pd',
      phaseCount: 3,
      ma: 0.9,
      mf: 21,
      vdc: 800,
    });
    const voltages = modulationVoltages({
      method: 'multilevel-carrier',
      topology: 'npc',
      levels: 3,
      carriers: 'pd',
      phaseCount: 3,
      ma: 0.9,
      mf: 21,
      vdc: 800,
    });
    expect(voltages.legs.map((leg) => leg.waveform)).toEqual(
      waveforms.legs.map((leg) => leg.output),
    );
    const spectra = designVoltagePhasors(voltages, 800);
    const own = harmonicPhasors(voltages.phases[1]?.waveform as Waveform, 800);
    expect(largestDifference(spectra.phase(1), own)).toBeLessThan(1e-12 * 800);
  });

  it('a single-phase bridge is read as it is', () => {
    const voltages = modulationVoltages({
      method: 'sine-triangle',
      scheme: 'unipolar',
      ma: 0.8,
      mf: 20,
      vdc: 400,
    });
    const spectra = designVoltagePhasors(voltages, 500);
    const own = harmonicPhasors(voltages.phases[0]?.waveform as Waveform, 500);
    expect(largestDifference(spectra.phase(0), own)).toBe(0);
  });

  it('reads a phase to fewer orders as the first orders of the whole, and refuses more than it read', () => {
    // The report's phases b and c are read to the current order only: the same numbers there.
    const spectra = designVoltagePhasors(threePhaseVoltages('dpwm1'), 600);
    const whole = spectra.phase(1);
    const part = spectra.phase(1, 150);
    expect(part.re).toHaveLength(151);
    expect(Array.from(part.re)).toEqual(Array.from(whole.re.subarray(0, 151)));
    expect(Array.from(part.im)).toEqual(Array.from(whole.im.subarray(0, 151)));
    expect(() => spectra.phase(1, 601)).toThrow(RangeError);
  });
});

describe('spectrumLabeller: one label table for a report', () => {
  it("labels as labelHarmonics does, from a spectrum or from its phasors (Holmes and Lipo's m·mf + n)", () => {
    const { legs } = threePhase({ ma: 0.9, mf: 21, vdc: 600 });
    const spectrum = harmonics(legs.a, 400);
    const labeller = spectrumLabeller(300, 21);
    const expected = labelHarmonics(spectrum.slice(0, 301), 21);
    expect(labeller.harmonics(spectrum)).toEqual(expected);
    expect(labeller.phasors(harmonicPhasors(legs.a, 400))).toEqual(expected);
    expect(expected[20]?.label).toBe('mf−1');
    expect(expected[43]?.label).toBe('2mf+1');
  });

  it('gives each order the keys, key order and JSON of a plain labelled harmonic', () => {
    // The entries are built by a constructor (for the garbage collector); what the API sends and
    // the dashboard reads must not tell them from labelHarmonics' object literals.
    const { legs } = threePhase({ ma: 0.9, mf: 21, vdc: 600 });
    const labelled = spectrumLabeller(300, 21).phasors(harmonicPhasors(legs.a, 300));
    const plain = labelHarmonics(harmonics(legs.a, 300), 21);
    expect(Object.keys(labelled[43] ?? {})).toEqual([
      'order',
      'amplitude',
      'phase',
      'carrierGroup',
      'sideband',
      'label',
    ]);
    expect(JSON.stringify(labelled)).toBe(JSON.stringify(plain));
    expect(structuredClone(labelled)).toEqual(plain);
  });

  it('labels an exactly-zero order with the phase atan2 gives its signed zero parts, one entry for every spectrum', () => {
    // Orders 2..5 are exact zeros of each sign pair: atan2(+0, +0) = +0, atan2(+0, −0) = π,
    // atan2(−0, +0) = −0, atan2(−0, −0) = −π (IEEE 754 / ECMAScript Math.atan2), the phases
    // harmonicsOfPhasors and labelHarmonics give them; order 1 is not zero.
    const labeller = spectrumLabeller(5, 3);
    const phasors = (scale: number): HarmonicPhasors => ({
      re: Float64Array.from([0, 2 * scale, 0, -0, 0, -0]),
      im: Float64Array.from([0, scale, 0, 0, -0, -0]),
    });
    const first = labeller.phasors(phasors(1));
    expect(first).toEqual(labelHarmonics(harmonicsOfPhasors(phasors(1)), 3));
    expect(first.slice(2).map((h) => h.phase)).toEqual([0, Math.PI, -0, -Math.PI]);
    // A second spectrum (or report) on the same labeller shares the zero orders' entries only.
    const second = labeller.phasors(phasors(3));
    for (let n = 2; n <= 5; n++) expect(second[n]).toBe(first[n]);
    expect(second[1]).not.toBe(first[1]);
    expect(second[1]?.amplitude).toBeCloseTo(3 * Math.sqrt(5), 12);
  });
});
