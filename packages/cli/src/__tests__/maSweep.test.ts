import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import {
  designModulation,
  modulationVoltages,
  sweepModulationIndex,
  type InverterDesign,
  type NamedVoltage,
} from '@pulsewright/modulation';
import { example, runCli, viaJson } from './runCli.js';

const drive = JSON.parse(readFileSync(example('drive.json'), 'utf8')) as InverterDesign;

/** The library's sweep of a design's voltage, built the way the library's own docs suggest. */
function librarySweep(
  design: InverterDesign,
  voltage: 'phases' | 'lines',
  options: Parameters<typeof sweepModulationIndex>[1],
) {
  return sweepModulationIndex((ma) => {
    const modulation = { ...design.modulation, ma } as InverterDesign['modulation'];
    return (
      modulationVoltages(designModulation({ ...design, modulation }))[voltage][0] as NamedVoltage
    ).waveform;
  }, options);
}

describe('pulsewright ma-sweep', () => {
  it("gives sweepModulationIndex's series for the line-to-line voltage of a design", async () => {
    const run = await runCli([
      'ma-sweep',
      example('drive.json'),
      '--voltage',
      'line',
      '--from',
      '0.2',
      '--to',
      '1.15',
      '--points',
      '20',
      '--orders',
      '77,79,83',
      '--json',
    ]);
    expect(run.code, run.stderr).toBe(0);
    expect(run.stderr).toBe('');
    const expected = librarySweep(drive, 'lines', {
      from: 0.2,
      to: 1.15,
      points: 20,
      maxOrder: 100_000,
      orders: [77, 79, 83],
    });
    expect(JSON.parse(run.stdout)).toEqual(viaJson({ voltage: 'line a−b', ...expected }));
  });

  it("tabulates the bridge voltage by default, with the library's defaults (0.05 to 1.3, 100 points)", async () => {
    const run = await runCli([
      'ma-sweep',
      '--method',
      'sine-triangle',
      '--scheme',
      'unipolar',
      '--vdc',
      '200',
      '--fundamental-frequency',
      '50',
      '--carrier-frequency',
      '1500',
      '--csv',
    ]);
    expect(run.code, run.stderr).toBe(0);
    const rows = run.stdout.trimEnd().split('\r\n');
    expect(rows[0]).toBe('ma,fundamental_V_peak,thd_ratio,wthd_ratio');
    expect(rows).toHaveLength(101);
    const design: InverterDesign = {
      vdc: 200,
      fundamentalFrequency: 50,
      carrierFrequency: 1500,
      modulation: { method: 'sine-triangle', scheme: 'unipolar', ma: 1 },
    };
    const expected = librarySweep(design, 'phases', { maxOrder: 100_000 });
    rows.slice(1).forEach((row, i) => {
      expect(row.split(',').map(Number)).toEqual([
        expected.ma[i],
        expected.fundamental[i],
        expected.thd[i],
        expected.wthd[i],
      ]);
    });
    // In the linear range (ma ≤ 1) the fundamental of naturally sampled sine-triangle PWM is
    // ma·vdc (common practice, docs/references.md); 1e-9 of vdc allows for rounding only.
    rows.slice(1).forEach((row) => {
      const [ma = NaN, fundamental = NaN] = row.split(',').map(Number);
      if (ma <= 1) expect(Math.abs(fundamental - 200 * ma)).toBeLessThan(200e-9);
    });
  });

  it('refuses a stored pattern, which has no modulation index, naming the field', async () => {
    const run = await runCli([
      'ma-sweep',
      '--method',
      'optimal-pattern',
      '--kind',
      'bipolar',
      '--angles',
      '0.2,0.5',
      '--vdc',
      '100',
      '--fundamental-frequency',
      '50',
    ]);
    expect(run.code).toBe(2);
    expect(run.stderr).toMatch(
      /^pulsewright: design\.modulation\.method must be one of 'sine-triangle', 'three-phase', 'space-vector', 'multilevel-carrier', 'multilevel-space-vector' for an ma sweep/,
    );
  });
});
