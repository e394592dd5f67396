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
    // No grid: the LC filter keeps its own resonance, 1/(2π√(1.5 mH·20 µF)) = 918.881 Hz
    // (standard circuit analysis, hand-worked), and no LCL is named.
    expect(run.stdout).toContain('filter: resonance 918.881 Hz, characteristic impedance');
    expect(run.stdout).not.toContain('LCL');
    expect(run.stdout).toMatch(/limit check \(IEEE Std 519-2022/);
  });

  it('prints a grid-tied design as one: the grid, its impedance and LCL, and each standard’s verdict on the grid current with the from-memory caution', async () => {
    // Invented: a 400 V, 50 Hz grid fed from 700 V at 10 kHz through an LCL.
    const design: InverterDesign = {
      vdc: 700,
      fundamentalFrequency: 50,
      carrierFrequency: 10_000,
      modulation: { method: 'three-phase', ma: 1, zeroSequence: 'third-harmonic' },
      filter: { l: 2e-3, c: 10e-6, rDamping: 2 },
      grid: { lineVoltage: 400, r: 0.05, l: 0.2e-3, l2: 0.5e-3, controlBandwidth: 1000 },
    };
    const run = await runCli(['report', '-'], { input: JSON.stringify({ design, maxOrder: 100 }) });
    expect(run.code).toBe(0);
    const { limits } = analyseDesign(design, { maxOrder: 100 }).grid!;
    expect(run.stdout).toContain('grid connection:');
    expect(run.stdout).not.toContain('load power');
    expect(run.stdout).toContain("power into the grid's series resistance (all phases)");
    expect(run.stdout).toContain('Grid: 400 V rms line to line, 50 Hz');
    // I_SC = V_ph/|r + jω₁l| = (400/√3)/|0.05 + j·0.06283| = 2876 A rms (hand-worked).
    expect(run.stdout).toContain('R 0.05 Ω, L 0.2 mH; short-circuit current 2876 A rms');
    // (1/2π)·√((L1 + L2')/(L1·L2'·C)) = 2210 Hz (Liserre, Blaabjerg and Hansen, 2005), named as
    // the LCL's, 10 kHz/2210 Hz = 4.524 and 2210 Hz/1 kHz = 2.21 from the carrier and the control
    // bandwidth (hand-worked); L1 with C alone, 1/(2π√(LC)) = 1125 Hz, is said to be only that.
    const distances = '(carrier 4.524× above it; 2.21× the control bandwidth)';
    expect(run.stdout).toContain(`L1 2 mH, C 10 µF, L2 0.5 mH; LCL resonance 2210 Hz ${distances}`);
    expect(run.stdout).toContain(
      `filter: LCL resonance 2210.23 Hz ${distances}; L1 with C alone (without L2 and the grid): resonance 1125.4 Hz,`,
    );
    // I_SC/I_L is above 20, yet generating equipment takes IEEE 519's first row (Table 2's
    // footnote, from memory): the verdict says why.
    expect(limits.ieee519.shortCircuitRatio).toBeGreaterThan(20);
    expect(run.stdout).toContain('The I_SC/I_L < 20 row is used although I_SC/I_L is');
    expect(run.stdout).toContain(
      `IEEE Std 519-2022 (${limits.ieee519.row.label}, the row for generating equipment): ${limits.ieee519.pass ? 'within' : 'over'} the limits; TDD`,
    );
    expect(run.stdout).toContain(
      `IEEE Std 1547-2018 (${limits.ieee1547.row.label}): ${limits.ieee1547.pass ? 'within' : 'over'} the limits; TRD`,
    );
    expect(run.stdout).toMatch(/caution: The current limits are .* recalled from memory/);
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
