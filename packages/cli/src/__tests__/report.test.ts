import { readFileSync } from 'node:fs';
import { parse as parseYaml } from 'yaml';
import { describe, expect, it } from 'vitest';
import { analyseDesign, type InverterDesign } from '@pulsewright/modulation';
import { example, runCli, viaJson } from './runCli.js';

// The command line adds no math: every figure must be the library's own, so these tests compare
// the CLI's JSON with the library's result for the same input exactly (same code, same doubles).

const pump = parseYaml(readFileSync(example('pump-inverter.yaml'), 'utf8')) as InverterDesign;
const drive = JSON.parse(readFileSync(example('drive.json'), 'utf8')) as InverterDesign;

describe('pulsewright report', () => {
  it('takes a fixed carrier that is no whole multiple of the fundamental: the library’s report over its span', async () => {
    // 4 kHz at 37 Hz is 4000/37: the report covers 37 periods (carrierSpan), as the library's.
    const flags = [
      '--method',
      'three-phase',
      '--ma',
      '0.7',
      '--vdc',
      '560',
      '--fundamental-frequency',
      '37',
      '--carrier-frequency',
      '4000',
      '--load-r',
      '3',
      '--load-l',
      '0.01',
      '--max-order',
      '50',
      '--points',
      '256',
    ];
    const json = await runCli(['report', ...flags, '--json']);
    expect(json.code).toBe(0);
    const design: InverterDesign = {
      vdc: 560,
      fundamentalFrequency: 37,
      carrierFrequency: 4000,
      modulation: { method: 'three-phase', ma: 0.7 },
      load: { r: 3, l: 0.01 },
    };
    expect(JSON.parse(json.stdout)).toEqual(
      viaJson(analyseDesign(design, { maxOrder: 50, points: 256 })),
    );
    const text = await runCli(['report', ...flags]);
    expect(text.code).toBe(0);
    expect(text.stdout).toContain('frequency ratio mf 4000/37 ≈ 108.108');
    expect(text.stdout).toContain('every figure over 37 fundamental periods');
  });

  it("prints the library's design report for a YAML design file, as JSON", async () => {
    const run = await runCli([
      'report',
      example('pump-inverter.yaml'),
      '--json',
      '--points',
      '256',
    ]);
    expect(run.code).toBe(0);
    expect(run.stderr).toBe('');
    expect(JSON.parse(run.stdout)).toEqual(viaJson(analyseDesign(pump, { points: 256 })));
  });

  it('reads the same design from flags alone, and from an API request body on standard input', async () => {
    const flags = [
      '--method',
      'three-phase',
      '--ma',
      '0.9',
      '--zero-sequence',
      'third-harmonic',
      '--sampling',
      'regular-asymmetric',
      '--vdc',
      '560',
      '--fundamental-frequency',
      '50',
      '--carrier-frequency',
      '4050',
      '--load-r',
      '5.3',
      '--load-l',
      '0.011',
    ];
    const fromFlags = await runCli(['report', ...flags, '--json', '--max-order', '300']);
    const fromFile = await runCli([
      'report',
      example('drive.json'),
      '--json',
      '--max-order',
      '300',
    ]);
    const fromRequest = await runCli(['report', '-', '--json'], {
      input: JSON.stringify({ design: drive, maxOrder: 300 }),
    });
    expect(fromFlags.code).toBe(0);
    expect(fromFlags.stdout).toBe(fromFile.stdout);
    expect(fromRequest.stdout).toBe(fromFile.stdout);
    expect(JSON.parse(fromFile.stdout)).toEqual(viaJson(analyseDesign(drive, { maxOrder: 300 })));
  });

  it("prints a summary a person reads, with the report's figures and its cautions", async () => {
    const run = await runCli(['report', example('pump-inverter.yaml')]);
    expect(run.code).toBe(0);
    const report = analyseDesign(pump);
    expect(run.stdout).toContain(report.methodLabel);
    expect(run.stdout).toContain(
      `load power (all phases): ${Number(report.loadPower?.toPrecision(6))} W`,
    );
    expect(run.stdout).toContain('Inverter DC buses and outputs are lethal');
    expect(run.stdout).toMatch(/limit check \(IEEE Std 519-2022/);
  });

  it('gives byte-identical output for the same design (no timestamps)', async () => {
    const [first, second] = await Promise.all([
      runCli(['report', example('drive.json'), '--json']),
      runCli(['report', example('drive.json'), '--json']),
    ]);
    expect(first.stdout.length).toBeGreaterThan(1000);
    expect(second.stdout).toBe(first.stdout);
  });
});
