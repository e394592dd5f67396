import { describe, expect, it } from 'vitest';
import { waveformValueAt } from '../../waveform/waveformValueAt.js';
import { analyseDesign } from '../analyseDesign.js';
import type { InverterDesign } from '../InverterDesign.js';

describe('modulatorSignals: what the chart shows is what the comparator compared', () => {
  const check = (
    design: InverterDesign,
    legOf: (report: ReturnType<typeof analyseDesign>) => { edges: number[]; levels: number[] },
  ) => {
    const report = analyseDesign(design);
    const modulator = report.modulator;
    expect(modulator).not.toBeNull();
    const leg = legOf(report);
    let compared = 0;
    modulator?.angles.forEach((theta, k) => {
      const margin = (modulator.reference[k] ?? 0) - (modulator.carrier?.[k] ?? 0);
      // Natural sampling: the leg is high exactly while the reference is above the carrier
      // (docs/architecture.md's convention; Holmes and Lipo 2003 ch. 3). Skip samples next to a crossing.
      if (Math.abs(margin) < 1e-6) return;
      expect(waveformValueAt(leg, theta) > 0).toBe(margin > 0);
      compared++;
    });
    expect(compared).toBeGreaterThan(1000);
  };

  it('sine-triangle bipolar: the bridge is +vdc where ma·sin θ is above the carrier', () => {
    check(
      {
        vdc: 100,
        fundamentalFrequency: 50,
        carrierFrequency: 50 * 21,
        modulation: { method: 'sine-triangle', scheme: 'bipolar', ma: 0.8 },
      },
      (report) => report.voltages[0]!.waveform,
    );
  });

  it('three-phase DPWM1: leg a is high where its clamped reference is above the carrier', () => {
    check(
      {
        vdc: 600,
        fundamentalFrequency: 50,
        carrierFrequency: 50 * 33,
        modulation: { method: 'three-phase', ma: 0.9, zeroSequence: 'dpwm1' },
      },
      (report) => report.voltages.find((v) => v.name === 'leg a to DC midpoint')!.waveform,
    );
  });

  it('a stored pattern has no modulator', () => {
    const report = analyseDesign({
      vdc: 100,
      fundamentalFrequency: 50,
      modulation: { method: 'optimal-pattern', kind: 'bipolar', angles: [0.3, 0.6] },
    });
    expect(report.modulator).toBeNull();
  });
});
