import { describe, expect, it } from 'vitest';
import {
  harmonics,
  optimalPulsePattern,
  optimalPulseSweep,
  sheSweep,
  solveShe,
} from '@pulsewright/modulation';
import { runCli, viaJson } from './runCli.js';

describe('pulsewright she', () => {
  // Cascaded cells on unequal DC sources (invented PV strings): b_n = (4/(nπ))·Σ V_k cos nα_k
  // (Tolbert, Chiasson, Du and McKenzie, IEEE Trans. Ind. Appl., 2005, from memory).
  const unequal = ['--kind', 'staircase', '--vdc', '400', '--count', '3', '--eliminate', '5,7'];
  const cellVoltages = [430, 385, 360];
  const fundamental = 0.8 * ((4 * (430 + 385 + 360)) / Math.PI);

  it('solves a staircase of unequal cell sources (--cell-voltages) as solveShe does', async () => {
    const args = [...unequal, '--cell-voltages', '430,385,360', '--fundamental', `${fundamental}`];
    const run = await runCli(['she', ...args, '--json']);
    expect(run.code, run.stderr).toBe(0);
    const expected = solveShe({
      kind: 'staircase',
      vdc: 400,
      count: 3,
      eliminate: [5, 7],
      fundamental,
      cellVoltages,
    });
    expect(expected.converged, expected.message).toBe(true);
    expect(JSON.parse(run.stdout)).toEqual(viaJson(expected));
    // The eliminated orders on the exact spectrum of the staircase of these sources, below 1e-9
    // of the fundamental; the fundamental itself to 1e-9.
    const spectrum = harmonics(expected.waveform, 7);
    expect(Math.abs(spectrum[1]!.amplitude - fundamental)).toBeLessThan(1e-9 * fundamental);
    for (const n of [5, 7]) expect(spectrum[n]!.amplitude).toBeLessThan(1e-9 * fundamental);
    const text = await runCli(['she', ...args]);
    expect(text.stdout).toContain('cell sources 430, 385, 360 V');
    // m against the sources' own limit 4·ΣV_k/π: 0.8 as asked.
    expect(text.stdout).toMatch(/m = 0\.8 of the staircase's 4·ΣV_k\/π = 1496\.\d+ V/);
  });

  it('tabulates unequal cell sources as sheSweep does, and names a short list', async () => {
    const range = ['--from', `${0.7 * fundamental}`, '--to', `${fundamental}`, '--points', '4'];
    const run = await runCli([
      'she',
      ...unequal,
      '--cell-voltages',
      '430,385,360',
      ...range,
      '--json',
    ]);
    expect(run.code, run.stderr).toBe(0);
    const expected = sheSweep({
      kind: 'staircase',
      vdc: 400,
      count: 3,
      eliminate: [5, 7],
      cellVoltages,
      fundamentals: { from: 0.7 * fundamental, to: fundamental, points: 4 },
      maxBranches: 1,
    });
    expect(JSON.parse(run.stdout)).toEqual(viaJson(expected));

    const short = await runCli(['she', ...unequal, '--cell-voltages', '430,385', ...range]);
    expect(short.code).toBe(2);
    expect(short.stderr).toMatch(
      /^pulsewright: cellVoltages\.length must be count = 3 .*\(option --cell-voltages\)\n$/,
    );
  });

  it("solves one pattern as the library's solveShe does", async () => {
    const run = await runCli([
      'she',
      '--kind',
      'bipolar',
      '--vdc',
      '400',
      '--count',
      '5',
      '--eliminate',
      '5,7,11,13',
      '--fundamental',
      '400',
      '--json',
    ]);
    expect(run.code, run.stderr).toBe(0);
    const expected = solveShe({
      kind: 'bipolar',
      vdc: 400,
      count: 5,
      eliminate: [5, 7, 11, 13],
      fundamental: 400,
    });
    expect(JSON.parse(run.stdout)).toEqual(viaJson(expected));
    // Patel and Hoft (1973): the solved angles null the listed orders; checked on the exact
    // spectrum by the library, below 1e-9 of the fundamental (docs/references.md).
    for (const { amplitude } of expected.residual) expect(amplitude).toBeLessThan(1e-9 * 400);
  });

  it('finds the pen-and-paper angle that removes the 3rd harmonic: 20°', async () => {
    // One bipolar angle α with b₃ ∝ 1 − 2cos 3α = 0 gives α = π/9 (Patel and Hoft, 1973; a
    // closed case worked by hand). Printed to ten significant digits in radians.
    const run = await runCli(['she', '--vdc', '100', '--count', '1', '--eliminate', '3']);
    expect(run.code, run.stderr).toBe(0);
    expect(run.stdout).toMatch(/\nα1\s+0\.3490658504\s+20\n/);
  });

  it('tabulates a range of fundamentals as sheSweep does, following one branch, as CSV', async () => {
    const run = await runCli([
      'she',
      '--vdc',
      '400',
      '--count',
      '3',
      '--eliminate',
      '5,7',
      '--from',
      '100',
      '--to',
      '450',
      '--points',
      '8',
      '--csv',
    ]);
    expect(run.code, run.stderr).toBe(0);
    expect(run.stderr).toBe(''); // no progress bar without a terminal
    const expected = sheSweep({
      kind: 'bipolar',
      vdc: 400,
      count: 3,
      eliminate: [5, 7],
      fundamentals: { from: 100, to: 450, points: 8 },
      maxBranches: 1,
    });
    const rows = run.stdout.trimEnd().split('\r\n');
    expect(rows[0]).toBe('branch,fundamental_V_peak,converged,alpha1_rad,alpha2_rad,alpha3_rad');
    const points = expected.branches.flatMap((b) => b.points);
    expect(rows).toHaveLength(points.length + 1);
    points.forEach((point, i) => {
      const cells = (rows[i + 1] as string).split(',');
      expect(Number(cells[1])).toBe(point.fundamental);
      expect(cells[2]).toBe(String(point.converged));
      expect(cells.slice(3).map(Number)).toEqual(point.converged ? point.angles : [0, 0, 0]);
    });
  });

  it("exits 1 with the library's reason when no solution is found", async () => {
    const run = await runCli([
      'she',
      '--vdc',
      '100',
      '--count',
      '2',
      '--eliminate',
      '3',
      '--fundamental',
      '126',
      '--starts',
      '3',
    ]);
    expect(run.code).toBe(1);
    expect(run.stdout).toMatch(/NOT converged/);
    expect(run.stderr).toMatch(/^pulsewright: No solution found from 3 start\(s\)/);
  });
});

describe('pulsewright optimal-pattern', () => {
  it("gives the library's optimal pulse pattern at one fundamental", async () => {
    const run = await runCli([
      'optimal-pattern',
      '--vdc',
      '400',
      '--count',
      '5',
      '--fundamental',
      '400',
      '--json',
    ]);
    expect(run.code, run.stderr).toBe(0);
    expect(JSON.parse(run.stdout)).toEqual(
      viaJson(optimalPulsePattern({ kind: 'bipolar', vdc: 400, count: 5, fundamental: 400 })),
    );
  });

  it("gives the library's table over a range of fundamentals", async () => {
    const run = await runCli([
      'optimal-pattern',
      '--kind',
      'staircase',
      '--vdc',
      '100',
      '--count',
      '3',
      '--objective',
      'thd',
      '--max-order',
      '49',
      '--from',
      '150',
      '--to',
      '350',
      '--points',
      '5',
      '--json',
    ]);
    expect(run.code, run.stderr).toBe(0);
    const expected = optimalPulseSweep({
      kind: 'staircase',
      vdc: 100,
      count: 3,
      objective: 'thd',
      maxOrder: 49,
      fundamentals: { from: 150, to: 350, points: 5 },
    });
    expect(JSON.parse(run.stdout)).toEqual(viaJson(expected));
  });
});
