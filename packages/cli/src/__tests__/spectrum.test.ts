import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { parse as parseYaml } from 'yaml';
import { afterAll, describe, expect, it } from 'vitest';
import { analyseDesign, type InverterDesign } from '@pulsewright/modulation';
import { example, runCli, viaJson } from './runCli.js';

const dir = mkdtempSync(path.join(tmpdir(), 'pulsewright-cli-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const bipolar: InverterDesign = {
  vdc: 400,
  fundamentalFrequency: 50,
  carrierFrequency: 1050,
  modulation: { method: 'sine-triangle', scheme: 'bipolar', ma: 0.8 },
};
const bipolarFlags = [
  '--method',
  'sine-triangle',
  '--scheme',
  'bipolar',
  '--ma',
  '0.8',
  '--vdc',
  '400',
  '--fundamental-frequency',
  '50',
  '--carrier-frequency',
  '1050',
];

describe('pulsewright spectrum', () => {
  it("gives the design report's bridge figures and labelled spectrum, as JSON", async () => {
    const run = await runCli(['spectrum', ...bipolarFlags, '--max-order', '100', '--json']);
    expect(run.code).toBe(0);
    const expected = analyseDesign(bipolar, { maxOrder: 100, points: 64 }).bridge;
    expect(JSON.parse(run.stdout)).toEqual(viaJson(expected));
    // A check value the library did not compute: in the linear range the fundamental of bipolar
    // sine-triangle PWM is ma·vdc = 320 V (common practice, docs/references.md), to rounding.
    expect(Math.abs(expected.fundamental - 320)).toBeLessThan(1e-9);
  });

  it('gives the line-to-line and the filter-output voltages of a design when asked', async () => {
    const line = await runCli(['spectrum', example('drive.json'), '--voltage', 'line', '--json']);
    const drive = JSON.parse(readFileSync(example('drive.json'), 'utf8')) as InverterDesign;
    expect(JSON.parse(line.stdout)).toEqual(
      viaJson(analyseDesign(drive, { points: 64 }).lineToLine),
    );
    const output = await runCli([
      'spectrum',
      example('pump-inverter.yaml'),
      '--voltage',
      'output',
      '--json',
    ]);
    const pump = parseYaml(readFileSync(example('pump-inverter.yaml'), 'utf8')) as InverterDesign;
    const { series: _series, ...figures } = analyseDesign(pump, { points: 64 })
      .output as NonNullable<ReturnType<typeof analyseDesign>['output']>;
    expect(JSON.parse(output.stdout)).toEqual(viaJson(figures));
  });

  it('writes CSV with units in the header to --output, and nothing to standard output', async () => {
    const file = path.join(dir, 'spectrum.csv');
    const run = await runCli([
      'spectrum',
      ...bipolarFlags,
      '--max-order',
      '60',
      '--csv',
      '--output',
      file,
    ]);
    expect(run.code).toBe(0);
    expect(run.stdout).toBe('');
    const lines = readFileSync(file, 'utf8').trimEnd().split('\r\n');
    expect(lines[0]).toBe('order,label,amplitude_V_peak,phase_rad,percent_of_fundamental');
    const spectrum = analyseDesign(bipolar, { maxOrder: 60, points: 64 }).bridge.spectrum;
    expect(lines).toHaveLength(spectrum.length + 1);
    lines.slice(1).forEach((line, i) => {
      const [order, label, amplitude] = line.split(',');
      expect(Number(order)).toBe(spectrum[i]?.order);
      expect(label).toBe(spectrum[i]?.label);
      // Written in JavaScript's shortest round-trip form, so it reads back to the same double.
      expect(Number(amplitude)).toBe(spectrum[i]?.amplitude);
    });
  });

  it('agrees with the generalised harmonics table of bipolar PWM', async () => {
    // N. Mohan, T. M. Undeland, W. P. Robbins, Power Electronics, 3rd ed., 2003, ch. 8, the
    // generalised harmonics table (recalled from memory, docs/references.md): at ma = 0.6 the mf
    // component is 1.006, mf±2 0.131 and 2mf±1 0.370 of the bridge's level (vdc = 1 here). The
    // table holds three digits and assumes a large mf; mf = 41 leaves the groups apart, so
    // ±0.0006 covers its rounding.
    const run = await runCli([
      'spectrum',
      '--method',
      'sine-triangle',
      '--scheme',
      'bipolar',
      '--ma',
      '0.6',
      '--vdc',
      '1',
      '--fundamental-frequency',
      '50',
      '--carrier-frequency',
      '2050',
      '--max-order',
      '100',
      '--json',
    ]);
    const spectrum = (
      JSON.parse(run.stdout) as { spectrum: { order: number; amplitude: number }[] }
    ).spectrum;
    const at = (order: number): number => spectrum[order]?.amplitude ?? NaN;
    expect(Math.abs(at(41) - 1.006)).toBeLessThan(6e-4);
    expect(Math.abs(at(39) - 0.131)).toBeLessThan(6e-4);
    expect(Math.abs(at(43) - 0.131)).toBeLessThan(6e-4);
    expect(Math.abs(at(81) - 0.37)).toBeLessThan(6e-4);
    expect(Math.abs(at(83) - 0.37)).toBeLessThan(6e-4);
  });

  it('lists the significant orders in its table, labelled by carrier group', async () => {
    const run = await runCli(['spectrum', ...bipolarFlags, '--max-order', '50']);
    expect(run.code).toBe(0);
    expect(run.stdout).toMatch(/^bridge output: Single-phase sine-triangle, mf 21, 50 Hz/);
    expect(run.stdout).toMatch(/\n21\s+mf\s+327\.229\s/);
    expect(run.stdout).toMatch(/\n41\s+2mf−1\s/);
  });
});
