import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { example, runCli } from './runCli.js';

const dir = mkdtempSync(path.join(tmpdir(), 'pulsewright-cli-errors-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

// Bad input exits 2 with one line naming the field and its allowed range in the library's words
// (the same words the API's problem+json uses, with the field's path in the design).

describe('bad input', () => {
  it('names the design field and its range, and the flag that set it', async () => {
    const run = await runCli(['spectrum', example('drive.json'), '--ma', '5']);
    expect(run.code).toBe(2);
    expect(run.stdout).toBe('');
    expect(run.stderr).toBe(
      'pulsewright: design.modulation.ma must be a finite number > 0 and ≤ 4; got 5 (from --ma)\n',
    );
  });

  it('names a field of a YAML design file by its path in the design', async () => {
    const file = path.join(dir, 'bad-load.yaml');
    writeFileSync(
      file,
      'vdc: 400\nfundamentalFrequency: 50\ncarrierFrequency: 1050\nmodulation: { method: sine-triangle, scheme: bipolar, ma: 0.8 }\nload: { r: -2, l: 0.01 }\n',
    );
    const run = await runCli(['report', file]);
    expect(run.code).toBe(2);
    expect(run.stderr).toMatch(
      /^pulsewright: design\.load\.r must be a finite number ≥ 0\.000001 and ≤ 1000000; got -2 \(/,
    );
  });

  it('names a carrier frequency whose span is too costly through a filter (3000/37: 821 orders over 37 periods)', async () => {
    const run = await runCli([
      'report',
      '--method',
      'sine-triangle',
      '--scheme',
      'bipolar',
      '--ma',
      '0.8',
      '--vdc',
      '400',
      '--fundamental-frequency',
      '37',
      '--carrier-frequency',
      '3000',
      '--load-r',
      '10',
      '--load-l',
      '0.01',
      '--filter-l',
      '0.002',
      '--filter-c',
      '10e-6',
    ]);
    expect(run.code).toBe(2);
    expect(run.stderr).toMatch(/^pulsewright: design\.carrierFrequency must be /);
  });

  it('names a missing field and the flag that gives it', async () => {
    const run = await runCli(['spectrum', '--vdc', '400']);
    expect(run.code).toBe(2);
    expect(run.stderr).toBe(
      'pulsewright: design.fundamentalFrequency must be a number; got undefined (set it in the design file or with --fundamental-frequency)\n',
    );
  });

  it('gives a JSON error object with --json', async () => {
    const run = await runCli([
      'report',
      example('drive.json'),
      '--set',
      'modulation.ma=-1',
      '--json',
    ]);
    expect(run.code).toBe(2);
    expect(JSON.parse(run.stderr)).toEqual({
      error: {
        status: 2,
        field: 'design.modulation.ma',
        message:
          'design.modulation.ma must be a finite number > 0 and ≤ 4; got -1 (from --set modulation.ma)',
      },
    });
  });

  it('names the timer options and the options of the analysis', async () => {
    const timer = await runCli([
      'timer-table',
      example('drive.json'),
      '--timer-clock',
      '72e6',
      '--table-length',
      '7',
    ]);
    expect(timer.code).toBe(2);
    expect(timer.stderr).toBe(
      'pulsewright: tableLength must be a divisor of 162 (compare updates per fundamental period); got 7 (from --table-length)\n',
    );
    const clock = await runCli(['timer-table', example('drive.json')]);
    expect(clock.stderr).toBe(
      'pulsewright: timerClock must be a number; got undefined (give --timer-clock)\n',
    );
    const order = await runCli(['report', example('drive.json'), '--max-order', '10']);
    expect(order.code).toBe(2);
    expect(order.stderr).toBe(
      'pulsewright: maxOrder must be an integer ≥ 50 and ≤ 5000; got 10 (from --max-order)\n',
    );
  });

  it('refuses a design a timer table cannot follow', async () => {
    const run = await runCli([
      'timer-table',
      '--method',
      'space-vector',
      '--ma',
      '0.9',
      '--vdc',
      '560',
      '--fundamental-frequency',
      '50',
      '--carrier-frequency',
      '5000',
      '--timer-clock',
      '72e6',
    ]);
    expect(run.code).toBe(2);
    expect(run.stderr).toMatch(
      /^pulsewright: design\.modulation\.method must be 'sine-triangle' or 'three-phase' for a timer table/,
    );
  });

  it('names an even order to eliminate', async () => {
    const run = await runCli([
      'she',
      '--vdc',
      '400',
      '--count',
      '5',
      '--eliminate',
      '5,6,11,13',
      '--fundamental',
      '400',
    ]);
    expect(run.code).toBe(2);
    expect(run.stderr).toMatch(
      /^pulsewright: eliminate\[1\] must be an odd order ≥ 3 .*; got 6 \(option --eliminate\)\n$/,
    );
  });

  it('exits 2 for a file it cannot read or parse, an unknown option, or a bad choice', async () => {
    const missing = await runCli(['report', path.join(dir, 'nothere.yaml')]);
    expect(missing.code).toBe(2);
    expect(missing.stderr).toMatch(/design file .*nothere\.yaml cannot be read: no such file/);
    const broken = path.join(dir, 'broken.yaml');
    writeFileSync(broken, 'vdc: [400\n');
    const parse = await runCli(['report', broken]);
    expect(parse.code).toBe(2);
    expect(parse.stderr).toMatch(/is not valid YAML or JSON: .*line/);
    const unknown = await runCli(['spectrum', '--frobnicate']);
    expect(unknown.code).toBe(2);
    expect(unknown.stderr).toMatch(/unknown option '--frobnicate'/);
    const choice = await runCli(['spectrum', example('drive.json'), '--voltage', 'foo']);
    expect(choice.code).toBe(2);
    expect(choice.stderr).toMatch(/Allowed choices are bridge, line, output/);
    const none = await runCli([]);
    expect(none.code).toBe(2);
  });
});

describe('help and version', () => {
  it('lists every subcommand and exits 0', async () => {
    const run = await runCli(['--help']);
    expect(run.code).toBe(0);
    for (const command of [
      'report',
      'spectrum',
      'timer-table',
      'she',
      'optimal-pattern',
      'ma-sweep',
      'waveform',
      'netlist',
    ])
      expect(run.stdout).toContain(`  ${command} `);
    const version = await runCli(['--version']);
    expect(version.stdout).toBe('0.1.0\n');
  });
});
