import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import {
  angleTable,
  angleTableMidpointErrors,
  angleTableToJson,
  harmonics,
  sheWaveform,
  type AngleTableDocument,
} from '@pulsewright/modulation';
import { runCli } from './runCli.js';

const dir = mkdtempSync(path.join(tmpdir(), 'cli-angle-table-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const SHE_FLAGS = [
  '--method',
  'she',
  '--kind',
  'bipolar',
  '--vdc',
  '300',
  '--eliminate',
  '5,7,11,13',
];
const FIRMWARE = ['--timer-clock', '72e6', '--fundamental-frequency', '50'];

describe('pulsewright angle-table', () => {
  it('JSON: the bytes of the library (and so the API), rows that eliminate the orders', async () => {
    const run = await runCli([
      'angle-table',
      ...SHE_FLAGS,
      '--ma-from',
      '0.2',
      '--ma-to',
      '0.8',
      '--rows',
      '8',
      ...FIRMWARE,
      '--json',
    ]);
    expect(run.code, run.stderr).toBe(0);
    const pattern = {
      method: 'selective-harmonic-elimination' as const,
      kind: 'bipolar' as const,
      vdc: 300,
      eliminate: [5, 7, 11, 13],
    };
    const table = angleTable({ pattern, ma: { from: 0.2, to: 0.8 }, rows: 8 });
    const expected = angleTableToJson(table, {
      midpointErrors: angleTableMidpointErrors(table),
      fixedPoint: { timerClock: 72e6, fundamentalFrequency: 50 },
    });
    expect(run.stdout).toBe(expected);
    const document = JSON.parse(run.stdout) as AngleTableDocument;
    for (const row of document.table.rows) {
      // Patel and Hoft (1973): the eliminated orders vanish on the exact spectrum.
      const spectrum = harmonics(sheWaveform(row.angles, { kind: 'bipolar', vdc: 300 }), 13);
      const v1 = spectrum[1]?.amplitude ?? NaN;
      for (const n of [5, 7, 11, 13])
        expect((spectrum[n]?.amplitude ?? NaN) / v1).toBeLessThan(1e-9);
    }
  });

  it('C header from a design file and an error target: compiles with cc, and the target is met', async () => {
    const design = path.join(dir, 'pump.json');
    writeFileSync(
      design,
      JSON.stringify({
        vdc: 300,
        fundamentalFrequency: 50,
        modulation: {
          method: 'selective-harmonic-elimination',
          kind: 'bipolar',
          angles: [0.2, 0.3, 0.6, 0.7, 1.0],
          eliminate: [5, 7, 11, 13],
        },
      }),
    );
    const header = path.join(dir, 'pump.h');
    const run = await runCli([
      'angle-table',
      '--design',
      design,
      '--ma-from',
      '0.2',
      '--ma-to',
      '0.8',
      '--target',
      '1e-3',
      '--max-rows',
      '64',
      '--timer-clock',
      '72e6',
      '--prefix',
      'pump',
      '-o',
      header,
    ]);
    expect(run.code, run.stderr).toBe(0);
    writeFileSync(
      path.join(dir, 'main.c'),
      '#include <stdio.h>\n#include "pump.h"\nint main(void) { printf("%u\\n", PUMP_ROWS); return 0; }\n',
    );
    execFileSync('cc', [
      '-std=c99',
      '-Wall',
      '-Werror',
      '-o',
      path.join(dir, 'main'),
      path.join(dir, 'main.c'),
    ]);
    const rows = Number(execFileSync(path.join(dir, 'main'), { encoding: 'utf8' }));
    // The chosen rows meet the target and one row fewer does not (by the library's midpoint errors).
    const pattern = {
      method: 'selective-harmonic-elimination' as const,
      kind: 'bipolar' as const,
      vdc: 300,
      eliminate: [5, 7, 11, 13],
    };
    const at = (n: number) =>
      angleTableMidpointErrors(angleTable({ pattern, ma: { from: 0.2, to: 0.8 }, rows: n }))
        .worstResidual as number;
    expect(at(rows)).toBeLessThanOrEqual(1e-3);
    expect(at(rows - 1)).toBeGreaterThan(1e-3);
  });

  it('CSV for an optimal pattern', async () => {
    const run = await runCli([
      'angle-table',
      '--method',
      'optimal',
      '--kind',
      'bipolar',
      '--vdc',
      '100',
      '--count',
      '3',
      '--max-order',
      '49',
      '--ma-from',
      '0.4',
      '--ma-to',
      '0.9',
      '--rows',
      '4',
      ...FIRMWARE,
      '--format',
      'csv',
    ]);
    expect(run.code, run.stderr).toBe(0);
    const lines = run.stdout.trimEnd().split('\r\n');
    expect(lines).toHaveLength(5);
    expect(lines[0]).toMatch(
      /^row,ma,solved,continued,angle_1_rad,angle_2_rad,angle_3_rad,fundamental_V,worst_residual,wthd,fraction_1/,
    );
  });

  it('bad input: exit status 2, the field and its option named', async () => {
    const outside = await runCli([
      'angle-table',
      ...SHE_FLAGS,
      '--ma-from',
      '0.2',
      '--ma-to',
      '1.4',
      ...FIRMWARE,
    ]);
    expect(outside.code).toBe(2);
    expect(outside.stderr).toMatch(/ma\.to must be .*option --ma-to/);
    const unreachable = await runCli([
      'angle-table',
      ...SHE_FLAGS,
      '--ma-from',
      '0.2',
      '--ma-to',
      '0.8',
      '--target',
      '1e-9',
      '--max-rows',
      '8',
      ...FIRMWARE,
    ]);
    expect(unreachable.code).toBe(2);
    expect(unreachable.stderr).toMatch(/target\.value must be reachable .*option --target/);
    const rows = await runCli([
      'angle-table',
      ...SHE_FLAGS,
      '--ma-from',
      '0.2',
      '--ma-to',
      '0.8',
      '--rows',
      '5000',
      ...FIRMWARE,
    ]);
    expect(rows.code).toBe(2);
    expect(rows.stderr).toMatch(/rows must be .*option --rows/);
    const method = await runCli(['angle-table', '--ma-from', '0.2', '--ma-to', '0.8', ...FIRMWARE]);
    expect(method.code).toBe(2);
    expect(method.stderr).toMatch(/--method must be she or optimal/);
  });
});
