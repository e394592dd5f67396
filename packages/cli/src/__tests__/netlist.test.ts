import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import {
  spiceNetlistSources,
  timerTable,
  timerTableToSpiceNetlist,
  type TimerTableOptions,
} from '@pulsewright/modulation';
import { runCli } from './runCli.js';

const dir = mkdtempSync(path.join(tmpdir(), 'pulsewright-cli-netlist-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

// The netlist's format and every edge of it are checked against the library's waveforms by a
// reader written from the SPICE user's guides, in the library's own test
// (packages/modulation/src/netlist/__tests__/timerTableToSpiceNetlist.test.ts); the command line
// must hand over exactly that text.
describe('pulsewright netlist', () => {
  const request: TimerTableOptions = {
    modulation: { method: 'three-phase', zeroSequence: 'third-harmonic', ma: 0.95 },
    fundamentalFrequency: 50,
    carrierFrequency: 2550,
    timerClock: 64_000_000,
    countingMode: 'edge-aligned',
    deadTime: 8e-7,
    vdc: 600,
  };
  const netlistOptions = {
    riseTime: 5e-8,
    fallTime: 2e-8,
    periods: 2,
    gateVoltage: 15,
    currentAngle: 0.4,
  };
  const flags = [
    '--rise-time',
    '5e-8',
    '--fall-time',
    '2e-8',
    '--periods',
    '2',
    '--gate-voltage',
    '15',
    '--current-angle',
    '0.4',
  ];

  it("writes the library's netlist of the table, byte for byte, from a request file and flags", async () => {
    const file = path.join(dir, 'request.yaml');
    writeFileSync(file, JSON.stringify(request));
    const run = await runCli(['netlist', file, ...flags]);
    expect(run.code, run.stderr).toBe(0);
    expect(run.stdout).toBe(timerTableToSpiceNetlist(timerTable(request), netlistOptions));
    expect(run.stdout).toMatch(/^Vgate_a_high gate_a_high 0 PWL\(0 0 /m);
    expect(run.stdout).toMatch(/^\.end$/m);
  });

  it("gives the library's sources with --json, and the fall time defaults to the rise time", async () => {
    const file = path.join(dir, 'request.json');
    writeFileSync(file, JSON.stringify(request));
    const run = await runCli(['netlist', file, '--json', '--rise-time', '4e-8']);
    expect(run.code, run.stderr).toBe(0);
    const { table: _table, ...expected } = spiceNetlistSources(timerTable(request), {
      riseTime: 4e-8,
    });
    expect(JSON.parse(run.stdout)).toEqual(expected);
    expect(expected.fallTime).toBe(4e-8);
  });

  it('refuses a ramp longer than the time between two edges, naming the option', async () => {
    const run = await runCli([
      'netlist',
      '--method',
      'sine-triangle',
      '--scheme',
      'unipolar',
      '--ma',
      '0.95',
      '--vdc',
      '300',
      '--fundamental-frequency',
      '50',
      '--carrier-frequency',
      '20000',
      '--timer-clock',
      '72e6',
      '--rise-time',
      '2e-5',
    ]);
    expect(run.code).toBe(2);
    expect(run.stderr).toMatch(
      /^pulsewright: (rise|fall)Time must be shorter than the shortest time between two edges of a signal, seconds .*; got 0.00002 \(option --(rise|fall)-time\)/,
    );
  });

  it('refuses too many periods for the table, naming --periods', async () => {
    const file = path.join(dir, 'long.json');
    writeFileSync(file, JSON.stringify({ ...request, carrierFrequency: 20_000 }));
    const run = await runCli(['netlist', file, '--periods', '1000']);
    expect(run.code).toBe(2);
    expect(run.stderr).toMatch(
      /^pulsewright: periods must be an integer from 1 to \d+ for this table .*\(option --periods\)/,
    );
  });
});
