import { describe, expect, it } from 'vitest';
import { multilevelCarrier } from '../../multilevel/carrier/multilevelCarrier.js';
import { threeLevelSpaceVectorWaveforms } from '../../multilevel/space-vector/threeLevelSpaceVectorWaveforms.js';
import { EXAMPLE_IGBT } from '../../losses/exampleIgbt.js';
import { harmonics } from '../../spectrum/harmonics.js';
import { waveformThd } from '../../spectrum/waveformThd.js';
import { waveformWthd } from '../../spectrum/waveformWthd.js';
import { assertInDelta } from '../../testing/assertInDelta.js';
import { rangeErrorField } from '../../testing/rangeErrorField.js';
import { combineWaveforms } from '../../waveform/combineWaveforms.js';
import type { Waveform } from '../../waveform/Waveform.js';
import { waveformValueAt } from '../../waveform/waveformValueAt.js';
import { analyseDesign } from '../analyseDesign.js';
import { assertInverterDesign } from '../assertInverterDesign.js';
import type { DesignModulation, InverterDesign } from '../InverterDesign.js';
import { modulationPhaseCount } from '../modulationPhaseCount.js';

type MultilevelDesignModulation = Extract<DesignModulation, { method: 'multilevel-carrier' }>;

const design = (
  modulation: Omit<MultilevelDesignModulation, 'method'>,
  mf: number,
  extra: Partial<InverterDesign> = {},
): InverterDesign => ({
  vdc: 800,
  fundamentalFrequency: 50,
  carrierFrequency: 50 * mf,
  modulation: { method: 'multilevel-carrier', ...modulation },
  ...extra,
});

/** The library's own waveforms for the same design (the design supplies vdc and mf). */
const library = (modulation: Omit<MultilevelDesignModulation, 'method'>, mf: number) =>
  multilevelCarrier({ ...modulation, vdc: 800, mf });

const npc = { topology: 'npc', levels: 3, carriers: 'pd', phaseCount: 3, ma: 0.9 } as const;

describe('analyseDesign: multilevel carrier designs', () => {
  it('reports phase a to star point of the library’s legs: the same harmonics, THD and WTHD', () => {
    const options = { ...npc, zeroSequence: 'min-max' } as const;
    const report = analyseDesign(design(options, 39), { maxOrder: 400 });
    const { legs } = library(options, 39);
    const [a, b, c] = legs.map((leg) => leg.output) as [Waveform, Waveform, Waveform];
    // A balanced star load sees (2·v_a − v_b − v_c)/3 (standard circuit analysis).
    const phaseA = combineWaveforms([a, b, c], ([x = 0, y = 0, z = 0]) => (2 * x - y - z) / 3);
    const expected = harmonics(phaseA, 400);
    expect(report.bridge.name).toBe('phase a to star point');
    report.bridge.spectrum.forEach((h, order) =>
      assertInDelta(h.amplitude, expected[order]?.amplitude ?? NaN, 1e-9, `order ${order}`),
    );
    assertInDelta(report.bridge.thd, waveformThd(phaseA), 1e-12, 'THD');
    assertInDelta(report.bridge.wthd, waveformWthd(phaseA), 1e-12, 'WTHD');
    // Linear range: the phase fundamental is ma·vdc/2, the sidebands carrying the rest (Holmes
    // and Lipo, 2003, ch. 11; min-max keeps it linear to 2/√3). Within 1 % at mf 39.
    assertInDelta(report.bridge.fundamental, 0.9 * 400, 3.6, 'fundamental');
    expect(report.voltages.map((v) => v.name)).toContain('leg a to DC midpoint');
    expect(report.multilevel?.legs.map((leg) => leg.levels)).toEqual([
      [-400, 0, 400],
      [-400, 0, 400],
      [-400, 0, 400],
    ]);
  });

  it('a three-phase NPC bridge under PD has no carrier harmonic in its line voltage (Holmes and Lipo 2003, ch. 11)', () => {
    const mf = 21;
    const report = analyseDesign(design(npc, mf), { maxOrder: 100 });
    const legA = harmonics(
      report.voltages.find((v) => v.name === 'leg a to DC midpoint')!.waveform,
      100,
    );
    const line = report.lineToLine!;
    // PD puts a large carrier harmonic at mf in each leg, in phase in all three, so it cancels
    // between lines (McGrath and Holmes, IEEE Trans. Ind. Electron., 2002); the bound
    // for the double Fourier checks is 1e-3 of vdc.
    expect(legA[mf]?.amplitude ?? 0).toBeGreaterThan(0.05 * 800);
    expect(line.spectrum[mf]?.amplitude ?? NaN).toBeLessThan(1e-3 * 800);
  });

  it('PD gives a lower line THD than POD and APOD (McGrath and Holmes, 2002; Holmes and Lipo 2003, ch. 11)', () => {
    const thdOf = (carriers: 'pd' | 'pod' | 'apod') =>
      analyseDesign(design({ ...npc, topology: 'cascaded-h-bridge', levels: 5, carriers }, 39))
        .lineToLine!.thd;
    expect(thdOf('pd')).toBeLessThan(thdOf('pod'));
    expect(thdOf('pd')).toBeLessThan(thdOf('apod'));
  });

  it('a single-phase NPC design is a full bridge: bridge output = leg a − leg b, five levels', () => {
    const options = { ...npc, phaseCount: 1 } as const;
    const report = analyseDesign(design(options, 40));
    const { legs } = library(options, 40);
    const [a, b] = legs.map((leg) => leg.output) as [Waveform, Waveform];
    const output = combineWaveforms([a, b], ([x = 0, y = 0]) => x - y);
    expect(report.phaseCount).toBe(1);
    expect(report.bridge.name).toBe('bridge output');
    assertInDelta(report.bridge.thd, waveformThd(output), 1e-12, 'THD');
    // The full bridge's output spans ±vdc in vdc/2 steps (common practice).
    expect(new Set(report.voltages[0]!.waveform.levels)).toEqual(
      new Set([-800, -400, 0, 400, 800]),
    );
    // A single-phase bridge has no legs or lines in `voltages`, as the two-level bridges.
    expect(report.voltages).toHaveLength(1);
    expect(report.lineToLine).toBeNull();
  });

  it('a cascaded string: legs named as strings, cells of string a, and 2N·fc effective frequency with N phase-shifted cells', () => {
    const mf = 21;
    const cells = 3;
    const report = analyseDesign(
      design(
        {
          topology: 'cascaded-h-bridge',
          levels: 2 * cells + 1,
          carriers: 'phase-shifted',
          phaseCount: 3,
          ma: 0.9,
        },
        mf,
      ),
    );
    const multilevel = report.multilevel!;
    expect(report.voltages.map((v) => v.name)).toContain('string a to its neutral');
    expect(multilevel.cells.map((cell) => cell.name)).toEqual(['cell 1', 'cell 2', 'cell 3']);
    // The cells sum to the string's output (each on its own source vdc; Holmes and Lipo ch. 11).
    const string = multilevel.legs[0]!.waveform;
    const summed = combineWaveforms(
      multilevel.cells.map((cell) => cell.waveform),
      (values) => values.reduce((s, v) => s + v, 0),
    );
    for (const theta of [0.1, 0.7, 1.3, 2.9, 4.4, 5.8])
      assertInDelta(
        waveformValueAt(summed, theta),
        waveformValueAt(string, theta),
        1e-9,
        `θ ${theta}`,
      );
    // Phase-shifted carriers over N unipolar cells step the string 2N times a carrier period
    // (issue 13; McGrath and Holmes, 2002): 2N·fc within the pulses the peaks drop (5 %).
    const fc = 50 * mf;
    expect(Math.abs(multilevel.effectiveOutputFrequency - 2 * cells * fc)).toBeLessThan(
      0.05 * 2 * cells * fc,
    );
    // And the first carrier group of the string's voltage sits at 2N·mf: nothing near mf.
    const spectrum = harmonics(string, 2 * cells * mf + 10);
    const nearMf = spectrum.slice(mf - 6, mf + 7).reduce((s, h) => Math.max(s, h.amplitude), 0);
    expect(nearMf).toBeLessThan(1e-3 * 800);
    expect(report.commonMode?.name).toBe("common mode, star point to the strings' neutral");
    // The default spectrum reaches past the output's third carrier group, at 3·2N·mf.
    expect(report.maxOrder).toBe(3 * 2 * cells * mf + 20);
    expect(report.bridge.spectrum[2 * cells * mf]?.label).toMatch(/mf/);
  });

  it('device switching frequencies: the report’s mean is the mean over every device of the library’s switches', () => {
    const options = {
      topology: 'flying-capacitor',
      levels: 5,
      carriers: 'phase-shifted',
      phaseCount: 3,
      ma: 0.8,
    } as const;
    const mf = 30;
    const report = analyseDesign(design(options, mf));
    const { legs } = library(options, mf);
    const turnOns = legs.flatMap((leg) =>
      leg.switches.map(
        ({ on }) =>
          on.levels.filter(
            (level, i) =>
              level === 1 && on.levels[(i - 1 + on.levels.length) % on.levels.length] === 0,
          ).length,
      ),
    );
    const mean = (turnOns.reduce((s, n) => s + n, 0) / turnOns.length) * 50;
    assertInDelta(report.switching!.averageDeviceFrequency, mean, 1e-9, 'mean device frequency');
    assertInDelta(report.multilevel!.averageDeviceFrequency, mean, 1e-9, 'multilevel section');
    // Each flying-capacitor cell compares the whole reference with its own carrier, so every
    // device switches once a carrier period below overmodulation (Holmes and Lipo ch. 11), and
    // the leg output steps at (levels − 1)·fc (issue 13).
    for (const device of report.multilevel!.devices) expect(device.frequency).toBe(50 * mf);
    assertInDelta(
      report.multilevel!.effectiveOutputFrequency,
      4 * 50 * mf,
      0.02 * 4 * 50 * mf,
      'effective',
    );
    expect(report.dcLink).toBeNull();
  });

  it('balance at the load: cell sources deliver the load power, the NPC midpoint draws no mean, flying capacitors hold their charge', () => {
    const load = { r: 8, l: 0.01 };
    // Cascaded: the cell sources are the only sources, so their powers sum to the load's
    // (conservation of energy); phase-shifted carriers share it evenly between the cells
    // (McGrath and Holmes, 2002). The currents are the report's samples, linear between them.
    const cascaded = analyseDesign(
      design(
        {
          topology: 'cascaded-h-bridge',
          levels: 7,
          carriers: 'phase-shifted',
          phaseCount: 3,
          ma: 0.9,
        },
        21,
        { load },
      ),
    );
    const cellPower = cascaded.multilevel!.balance!.cellPower!;
    const sources = cellPower.strings.reduce((sum, string) => sum + string.power, 0);
    expect(Math.abs(sources - cascaded.loadPower!) / cascaded.loadPower!).toBeLessThan(1e-3);
    expect(cellPower.powerSpread!).toBeLessThan(0.02);
    expect(cascaded.multilevel!.balance!.neutralPoint).toBeNull();
    // NPC, PD, balanced three-phase load: the midpoint current has zero mean over a fundamental
    // and a ripple at three times it (N. Celanovic and D. Boroyevich, IEEE Trans. Power
    // Electronics, 2000). Tolerance: 1 % of the peak phase current (the carrier's residue).
    const npcReport = analyseDesign(design(npc, 45, { load }));
    const neutral = npcReport.multilevel!.balance!.neutralPoint!;
    const peak = npcReport.currents[0]!.inverter.fundamental;
    expect(Math.abs(neutral.mean)).toBeLessThan(0.01 * peak);
    expect(neutral.lowFrequencyRipple).toBeGreaterThan(0.1 * peak);
    // Flying capacitor, phase-shifted carriers: every cell has the same duty over a carrier period,
    // so each capacitor's net charge over the fundamental is near zero (natural balancing,
    // Meynard and Foch 1992, from memory): within 1 % of one carrier period's largest charge.
    const fc = analyseDesign(
      design(
        {
          topology: 'flying-capacitor',
          levels: 4,
          carriers: 'phase-shifted',
          phaseCount: 1,
          ma: 0.8,
        },
        30,
        { load },
      ),
    );
    for (const leg of fc.multilevel!.balance!.flyingCapacitors!.legs)
      for (const capacitor of leg.capacitors)
        expect(Math.abs(capacitor.netCharge)).toBeLessThan(
          0.01 * capacitor.maxChargePerCarrierPeriod,
        );
    // A flying-capacitor bridge has one DC current, Σ s₁·i (cell 1's state): its mean times vdc
    // is the power the load takes (conservation of energy; no losses in the model), within the
    // DC current's sampling on the currents' grid (0.5 %: the cells step (levels − 1) times a
    // carrier period). An NPC link has a midpoint as well, so no one DC current: null.
    const fcThree = analyseDesign(
      design(
        {
          topology: 'flying-capacitor',
          levels: 5,
          carriers: 'phase-shifted',
          phaseCount: 3,
          ma: 0.9,
        },
        24,
        { load },
      ),
    );
    for (const report of [fc, fcThree]) {
      const drawn = report.dcLink!.mean * 800;
      expect(Math.abs(drawn - report.loadPower!) / report.loadPower!).toBeLessThan(5e-3);
    }
    expect(npcReport.dcLink).toBeNull();
    // Without a load there is no current, so no balance figure.
    expect(analyseDesign(design(npc, 45)).multilevel!.balance).toBeNull();
  });

  it('losses by device class with the design’s device: T-type conducts through fewer devices than NPC at a high index', () => {
    const withDevice = (topology: 'npc' | 't-type' | 'flying-capacitor', levels = 3) =>
      analyseDesign(
        design(
          {
            topology,
            levels,
            carriers: topology === 'flying-capacitor' ? 'phase-shifted' : 'pd',
            phaseCount: 3,
            ma: 0.95,
          },
          39,
          { load: { r: 8, l: 0.01 }, device: EXAMPLE_IGBT },
        ),
      ).multilevel!.losses;
    const npcLosses = withDevice('npc')!;
    const tType = withDevice('t-type')!;
    // At the outer levels an NPC leg's current passes two series devices (S1 and S2), a T-type
    // leg's one (S1); near ma = 1 the outer levels dominate, so T-type conducts with less loss
    // (M. Schweizer and J. W. Kolar, IEEE Trans. Power Electronics, 2013, from memory).
    expect(tType.conduction).toBeLessThan(npcLosses.conduction);
    // The parts add up: classes to the total, conduction plus switching to the total.
    for (const losses of [npcLosses, tType]) {
      const byClass = losses.classes.reduce((sum, c) => sum + c.total, 0);
      expect(Math.abs(byClass - losses.total)).toBeLessThan(1e-9 * losses.total);
      expect(Math.abs(losses.conduction + losses.switching - losses.total)).toBeLessThan(
        1e-9 * losses.total,
      );
    }
    expect(npcLosses.classes.map((c) => c.deviceClass)).toContain('clamp diode');
    // No three-level loss model for a flying-capacitor leg: null, not a wrong number.
    expect(withDevice('flying-capacitor', 4)).toBeNull();
  });

  it('the modulator chart holds every carrier: the leg’s level index is the count of carriers below the reference', () => {
    for (const options of [
      {
        topology: 'flying-capacitor',
        levels: 4,
        carriers: 'phase-shifted',
        phaseCount: 1,
        ma: 0.85,
      },
      {
        topology: 'npc',
        levels: 3,
        carriers: 'apod',
        phaseCount: 3,
        ma: 0.85,
        zeroSequence: 'third-harmonic',
      },
      { topology: 'cascaded-h-bridge', levels: 5, carriers: 'pod', phaseCount: 1, ma: 0.85 },
    ] as const) {
      const report = analyseDesign(design(options, 15));
      const modulator = report.modulator!;
      expect(modulator.carriers).toHaveLength(options.levels - 1);
      const leg = report.multilevel!.legs[0]!;
      const low = leg.levels[0]!;
      const step = (leg.levels.at(-1)! - low) / (options.levels - 1);
      let compared = 0;
      modulator.angles.forEach((theta, k) => {
        const margins = modulator.carriers!.map((carrier) => modulator.reference[k]! - carrier[k]!);
        // Skip samples next to a crossing; natural sampling switches exactly at each one.
        if (margins.some((m) => Math.abs(m) < 1e-6)) return;
        const above = margins.filter((m) => m > 0).length;
        assertInDelta(
          waveformValueAt(leg.waveform, theta),
          low + above * step,
          1e-9,
          `${options.topology} θ ${theta}`,
        );
        compared++;
      });
      expect(compared).toBeGreaterThan(1000);
    }
  });

  it('errors name the field by its path in the design and the allowed range', () => {
    const cases: [Record<string, unknown>, string, RegExp][] = [
      [{ ...npc, levels: 5 }, 'modulation.levels', /3 for topology 'npc'/],
      [{ ...npc, topology: 'cascaded-h-bridge', levels: 6 }, 'modulation.levels', /odd/],
      [{ ...npc, levels: 19 }, 'modulation.levels', /≤ 17/],
      [
        { ...npc, carriers: 'phase-shifted' },
        'modulation.carriers',
        /'pd', 'pod', 'apod' for topology 'npc'/,
      ],
      [{ ...npc, topology: 'hexagonal' }, 'modulation.topology', /one of/],
      [{ ...npc, phaseCount: 2 }, 'modulation.phaseCount', /1 or 3/],
      [
        { ...npc, phaseCount: 1, zeroSequence: 'min-max' },
        'modulation.zeroSequence',
        /single-phase/,
      ],
      [{ ...npc, ma: 5 }, 'modulation.ma', /≤ 4/],
    ];
    for (const [modulation, field, words] of cases) {
      const bad = design(modulation as never, 21);
      expect(rangeErrorField(() => assertInverterDesign(bad))).toBe(field);
      expect(() => analyseDesign(bad)).toThrow(words);
    }
  });

  it('three-level space vector: the report is the library’s legs, and the symmetric split draws no mean midpoint current', () => {
    const sv: InverterDesign = {
      vdc: 800,
      fundamentalFrequency: 50,
      carrierFrequency: 50 * 36,
      modulation: { method: 'multilevel-space-vector', m: 0.8, topology: 't-type' },
      load: { r: 8, l: 0.01 },
    };
    const report = analyseDesign(sv, { maxOrder: 300 });
    const { legs } = threeLevelSpaceVectorWaveforms({
      m: 0.8,
      vdc: 800,
      frequencyRatio: 36,
      topology: 't-type',
    });
    const [a, b, c] = legs.map((leg) => leg.output) as [Waveform, Waveform, Waveform];
    const phaseA = combineWaveforms([a, b, c], ([x = 0, y = 0, z = 0]) => (2 * x - y - z) / 3);
    assertInDelta(report.bridge.thd, waveformThd(phaseA), 1e-12, 'THD');
    harmonics(phaseA, 300).forEach((h, order) =>
      assertInDelta(
        report.bridge.spectrum[order]?.amplitude ?? NaN,
        h.amplitude,
        1e-9,
        `order ${order}`,
      ),
    );
    // m = √3·|V1|/vdc (Celanovic and Boroyevich, 2000): the phase fundamental is m·vdc/√3,
    // within 1 % at N = 36 (regular sampling delays it, hardly shrinks it).
    assertInDelta(report.bridge.fundamental, (0.8 * 800) / Math.sqrt(3), 3.7, 'fundamental');
    expect(report.multilevel).toMatchObject({ topology: 't-type', levels: 3, carriers: null });
    expect(report.modulator?.carrier).toBeNull();
    // The symmetric small-vector split: zero mean midpoint current over a fundamental for a
    // balanced load (Celanovic and Boroyevich, 2000; issue 13), within 1 % of the peak current.
    const neutral = report.multilevel!.balance!.neutralPoint!;
    expect(Math.abs(neutral.mean)).toBeLessThan(0.01 * report.currents[0]!.inverter.fundamental);
    expect(neutral.carrierAverages.values).toHaveLength(36);
    for (const [modulation, field] of [
      [
        { method: 'multilevel-space-vector', m: 0.8, topology: 'flying-capacitor' },
        'modulation.topology',
      ],
      [
        { method: 'multilevel-space-vector', m: 0.8, smallVectorSplit: 1.5 },
        'modulation.smallVectorSplit',
      ],
      [{ method: 'multilevel-space-vector', m: 0.8, ma: 0.9 }, 'modulation.ma'],
    ] as const) {
      expect(rangeErrorField(() => analyseDesign({ ...sv, modulation } as InverterDesign))).toBe(
        field,
      );
    }
  });

  it('the phase count is the modulation’s own', () => {
    expect(modulationPhaseCount({ method: 'multilevel-carrier', ...npc })).toBe(3);
    expect(modulationPhaseCount({ method: 'multilevel-carrier', ...npc, phaseCount: 1 })).toBe(1);
    expect(modulationPhaseCount({ method: 'space-vector', ma: 0.5 })).toBe(3);
    expect(modulationPhaseCount({ method: 'multilevel-space-vector', m: 0.5 })).toBe(3);
    expect(modulationPhaseCount({ method: 'sine-triangle', scheme: 'bipolar', ma: 0.5 })).toBe(1);
  });
});
