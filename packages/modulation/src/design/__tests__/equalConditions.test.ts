import { describe, expect, it } from 'vitest';
import { analyseDesign, EXAMPLE_IGBT, type InverterDesign } from '../../index.js';
import { assertInDelta } from '../../testing/assertInDelta.js';
import { rangeErrorField } from '../../testing/rangeErrorField.js';
import { designCarrierSpan } from '../designCarrierSpan.js';
import { designSpanMaxOrder } from '../designSpanMaxOrder.js';
import { equalConditions } from '../equalConditions.js';

const f1 = 50;
/** A three-phase drive at unity power factor (EMF chosen so the current is in phase; see designLosses.test). */
function drive(zeroSequence: 'none' | 'dpwm1' | 'third-harmonic', mf = 99): InverterDesign {
  const ma = 0.9;
  const v = (ma * 650) / 2;
  const peak = 30;
  const x = 2 * Math.PI * f1 * 0.01;
  return {
    vdc: 650,
    fundamentalFrequency: f1,
    carrierFrequency: mf * f1,
    modulation: { method: 'three-phase', ma, zeroSequence },
    load: {
      r: 8,
      l: 0.01,
      emf: {
        amplitude: Math.hypot(v - peak * 8, peak * x),
        phase: Math.atan2(-peak * x, v - peak * 8),
      },
    },
    device: { ...EXAMPLE_IGBT },
  };
}
const candidate = (design: InverterDesign) => ({ design, report: analyseDesign(design) });

describe('equalConditions', () => {
  it('equal average device switching frequency: DPWM1 runs its carrier 1.5× faster than SPWM', () => {
    // A fact of the trade: a 120° clamp (60° about each peak) leaves each leg switching 2/3 of
    // the period, so at equal average device switching frequency the carrier is 1.5× faster
    // (A. M. Hava, R. J. Kerkman, T. A. Lipo, IEEE Trans. Power Electronics, 1999; J. W. Kolar,
    // H. Ertl, F. C. Zach, IEEE Trans. Ind. Appl., 1991; from memory). With natural sampling at
    // mf 99 a clamp's first and last carrier periods may still switch once: up to 4 edges of
    // 132 at the four clamp boundaries a period, so within 0.03.
    const spwm = candidate(drive('none'));
    const dpwm = candidate(drive('dpwm1'));
    const third = candidate(drive('third-harmonic'));
    const result = equalConditions([spwm, dpwm, third], { condition: 'equal-device-frequency' });
    expect(result.target).toBe(spwm.report.switching?.averageDeviceFrequency);
    const [a, b, c] = result.candidates;
    expect(a?.factor).toBe(1);
    expect(a?.carrierFrequency).toBe(99 * f1);
    assertInDelta(b?.wantedFactor ?? 0, 1.5, 0.03, 'DPWM1 factor');
    // Kept as scaled: mf is the fraction p/q with the fewest periods within 0.1 % of the scaled
    // ratio (where rounding to a whole mf could move it 0.34 % at mf ≈ 146), exactly p/q.
    const span = designCarrierSpan(b?.design as InverterDesign);
    expect(span?.q).toBeGreaterThan(1);
    assertInDelta(b?.factor ?? 0, b?.wantedFactor ?? 0, 1e-3 * (b?.wantedFactor ?? 0), 'kept');
    assertInDelta(span?.error ?? NaN, 0, 1e-9, 'the carrier is exactly p/q');
    expect(b?.design.carrierFrequency).toBe(b?.carrierFrequency);
    // A continuous sequence switches every carrier period: unchanged.
    assertInDelta(c?.wantedFactor ?? 0, 1, 1e-12, 'third harmonic');
    // The adjusted DPWM1 design's own report (over its span) meets the condition within two mf
    // steps (2/99): the clamp boundaries' partial carrier periods at the new carrier.
    const adjusted = analyseDesign(b?.design as InverterDesign);
    assertInDelta(
      adjusted.switching?.averageDeviceFrequency ?? 0,
      result.target ?? 0,
      (2 * (result.target ?? 0)) / 99,
      'device frequency at the condition',
    );
  });

  it('equal switching loss: DPWM1 at unity power factor may run its carrier about twice as fast', () => {
    // DPWM1's switching-loss function at unity power factor is 0.5 (Kolar, Ertl, Zach 1991; Hava,
    // Kerkman, Lipo 1998/1999; from memory), and switching loss is proportional to the carrier in
    // the model: the factor is 1/0.5 = 2 within the ripple's effect (0.05), and the adjusted
    // design's switching loss equals SPWM's within 2 %.
    const spwm = candidate(drive('none'));
    const dpwm = candidate(drive('dpwm1'));
    const result = equalConditions([spwm, dpwm], { condition: 'equal-switching-loss' });
    const adjusted = result.candidates[1];
    assertInDelta(adjusted?.wantedFactor ?? 0, 2, 0.05, 'factor');
    const loss = analyseDesign(adjusted?.design as InverterDesign).losses?.switching ?? 0;
    assertInDelta(loss, result.target ?? 0, 0.02 * (result.target ?? 0), 'switching loss');
  });

  it('a kept carrier is within 0.1 % of the scaled one with a span cheap to report, over mf 1 to 1000', () => {
    // Candidates need only the figure the condition reads: the reference's device frequency over
    // each candidate's sets the wanted factor. Fractions of denominator ≤ N leave no gap wider
    // than 1/N (Farey sequences, a fact of number theory), so the fewest periods within 0.1 % are
    // at most ⌈1000/mf⌉ (or 64) and p·q ≤ (1000 + mf)²/mf, below 7e4: inside the report's bound
    // (designSpanMaxOrder, p·q ≤ 4e5), which must not refuse it, with a filter either (its span
    // solved to ⌈10·p/q⌉ + 10 orders within q·order ≤ 20000 and p·q·order ≤ 2e7).
    const design = drive('none', 1);
    const reference = {
      design,
      report: { switching: { legEdgesPerPeriod: 2, averageDeviceFrequency: 1000 }, losses: null },
    };
    for (let k = 0; k < 400; k++) {
      const wanted = 1 + 998.9 * ((k * 0.6180339887) % 1);
      const candidate = {
        design,
        report: {
          switching: { legEdgesPerPeriod: 2, averageDeviceFrequency: 1000 / wanted },
          losses: null,
        },
      };
      const result = equalConditions([reference, candidate], {
        condition: 'equal-device-frequency',
      });
      const kept = result.candidates[1];
      const span = designCarrierSpan(kept?.design as InverterDesign) ?? {
        p: Math.round(wanted),
        q: 1,
        error: 0,
      };
      const q64 = span.q === 64;
      if (!q64) assertInDelta(kept?.factor ?? 0, wanted, 1e-3 * wanted, `mf ${wanted}`);
      expect(span.q).toBeLessThanOrEqual(Math.min(64, Math.ceil(1000 / wanted)));
      expect(span.p * span.q).toBeLessThan(70_000);
      expect(() => designSpanMaxOrder(kept?.design as InverterDesign, span)).not.toThrow();
      const filtered = { ...(kept?.design as InverterDesign), filter: { l: 1e-3, c: 1e-5 } };
      expect(() => designSpanMaxOrder(filtered, span), `mf ${wanted}`).not.toThrow();
    }
  });

  it('a design with a filter keeps its scaled carrier too: its report spans p/q through the filter', () => {
    // The filtered report is solved component by component over the span (analyseDesignSpan),
    // so DPWM1 at 1.5× is kept within 0.1 % as without a filter, and reported over its span.
    const filter = { l: 0.002, c: 10e-6, rDamping: 2 };
    const spwm = candidate({ ...drive('none'), filter });
    const dpwm = candidate({ ...drive('dpwm1'), filter });
    const result = equalConditions([spwm, dpwm], { condition: 'equal-device-frequency' });
    const b = result.candidates[1];
    assertInDelta(b?.factor ?? 0, b?.wantedFactor ?? 0, 1e-3 * (b?.wantedFactor ?? 0), 'kept');
    const span = designCarrierSpan(b?.design as InverterDesign);
    expect(span?.q).toBeGreaterThan(1);
    const report = analyseDesign(b?.design as InverterDesign);
    expect(report.carrierSpan?.q).toBe(span?.q);
    expect(report.output).not.toBeNull();
  });

  it('equal carrier leaves every design as it is; patterns and missing figures are noted, not scaled', () => {
    const spwm = candidate(drive('none'));
    const pattern = candidate({
      vdc: 100,
      fundamentalFrequency: f1,
      modulation: {
        method: 'selective-harmonic-elimination',
        kind: 'bipolar',
        angles: [0.3, 0.5, 0.9],
      },
      load: { r: 10, l: 0.01 },
    });
    const bridge = candidate({
      vdc: 400,
      fundamentalFrequency: f1,
      carrierFrequency: 101 * f1,
      modulation: { method: 'sine-triangle', scheme: 'bipolar', ma: 0.8 },
      load: { r: 5, l: 0.02 },
    });
    const same = equalConditions([spwm, pattern, bridge], { condition: 'equal-carrier' });
    expect(same.candidates.map((c) => c.factor)).toEqual([1, 1, 1]);
    expect(same.candidates[1]?.design).toBe(pattern.design);
    const result = equalConditions([spwm, pattern, bridge], {
      condition: 'equal-device-frequency',
    });
    expect(result.candidates[1]?.note).toContain('no carrier');
    // A bipolar bridge's switches turn on once a carrier period, as continuous three-phase PWM's:
    // at equal device switching frequency it takes the reference's carrier (mf 101 → 99).
    expect(result.candidates[2]?.carrierFrequency).toBe(99 * f1);
    // A factor past mf 1000 is refused for that candidate alone.
    const slow = candidate(drive('none', 3));
    const far = equalConditions([spwm, slow], {
      condition: 'equal-device-frequency',
      reference: 0,
    });
    expect(far.candidates[1]?.carrierFrequency).toBe(99 * f1);
    const back = equalConditions([slow, spwm], { condition: 'equal-device-frequency' });
    expect(back.candidates[1]?.carrierFrequency).toBe(3 * f1);
  });

  it('errors name the field and the allowed range', () => {
    const spwm = candidate(drive('none'));
    const { device: _device, ...bare } = drive('dpwm1');
    const noDevice = candidate(bare);
    expect(
      rangeErrorField(() =>
        equalConditions([noDevice, spwm], { condition: 'equal-switching-loss' }),
      ),
    ).toBe('candidates[0].report.losses');
    expect(
      rangeErrorField(() => equalConditions([spwm], { condition: 'equal-carrier', reference: 1 })),
    ).toBe('reference');
    expect(
      rangeErrorField(() =>
        equalConditions([spwm], { condition: 'equal-speed' as 'equal-carrier' }),
      ),
    ).toBe('condition');
    expect(() => equalConditions([], { condition: 'equal-carrier' })).toThrow(/candidates/);
  });
});
