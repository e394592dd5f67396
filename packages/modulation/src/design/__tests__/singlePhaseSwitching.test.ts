import { describe, expect, it } from 'vitest';
import { analyseDesign } from '../../index.js';

/**
 * The switching figure of a single-phase bridge, from leg a as the loss model reads it off the
 * bridge output: every switch of a sine-triangle bridge turns on once a carrier period in the
 * linear range (each leg compares its reference with the carrier once a period: Holmes and Lipo
 * 2003, ch. 3; a fact of the trade), and a bipolar pattern's leg a switches where its output does.
 */
describe('analyseDesign: switching of a single-phase bridge', () => {
  for (const scheme of ['bipolar', 'unipolar'] as const) {
    it(`${scheme}: each switch turns on at the carrier frequency`, () => {
      const report = analyseDesign({
        vdc: 400,
        fundamentalFrequency: 50,
        carrierFrequency: 50 * 21,
        modulation: { method: 'sine-triangle', scheme, ma: 0.8 },
      });
      expect(report.switching).toEqual({ legEdgesPerPeriod: 42, averageDeviceFrequency: 1050 });
    });
  }

  it('a bipolar pattern: leg a switches exactly where the bridge output does', () => {
    // v = v_a − v_b of a two-level bridge with v_b = −v_a: +vdc is leg a on, −vdc leg a off.
    const report = analyseDesign({
      vdc: 100,
      fundamentalFrequency: 50,
      modulation: {
        method: 'selective-harmonic-elimination',
        kind: 'bipolar',
        angles: [0.3, 0.5, 0.9],
      },
    });
    const edges = report.voltages[0]?.waveform.edges.length ?? 0;
    expect(edges).toBeGreaterThanOrEqual(12);
    expect(report.switching).toEqual({
      legEdgesPerPeriod: edges,
      averageDeviceFrequency: (edges / 2) * 50,
    });
  });

  it('a staircase has none (a source a cell)', () => {
    const report = analyseDesign({
      vdc: 100,
      fundamentalFrequency: 50,
      modulation: {
        method: 'selective-harmonic-elimination',
        kind: 'staircase',
        angles: [0.2, 0.6, 1.0],
      },
    });
    expect(report.switching).toBeNull();
  });
});
