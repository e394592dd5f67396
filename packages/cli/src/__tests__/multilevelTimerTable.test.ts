import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import {
  multilevelTimerTable,
  multilevelTimerTableToCHeader,
  multilevelTimerTableToCsv,
  multilevelTimerTableToJson,
} from '@pulsewright/modulation';
import { runCli } from './runCli.js';

const dir = mkdtempSync(path.join(tmpdir(), 'pulsewright-cli-multilevel-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** The body of POST /api/v1/multilevel-timer-tables: a five-level flying-capacitor drive leg. */
const REQUEST = {
  modulation: {
    topology: 'flying-capacitor',
    levels: 5,
    carriers: 'phase-shifted',
    phaseCount: 3,
    ma: 0.95,
    vdc: 1500,
    zeroSequence: 'min-max',
  },
  fundamentalFrequency: 50,
  carrierFrequency: 2550,
  timerClock: 80e6,
  deadTime: 1.5e-6,
  prefix: 'mv_drive',
};

describe('pulsewright multilevel-timer-table', () => {
  const file = path.join(dir, 'request.json');
  writeFileSync(file, JSON.stringify(REQUEST));
  const { prefix, ...options } = REQUEST;
  const table = multilevelTimerTable(options as Parameters<typeof multilevelTimerTable>[0]);

  it("writes the library's C header, CSV and JSON for the request, byte for byte", async () => {
    const header = await runCli(['multilevel-timer-table', file]);
    expect(header.code, header.stderr).toBe(0);
    expect(header.stdout).toBe(multilevelTimerTableToCHeader(table, { prefix }));
    const csv = await runCli(['multilevel-timer-table', file, '--format', 'csv']);
    expect(csv.stdout).toBe(multilevelTimerTableToCsv(table));
    const json = await runCli(['multilevel-timer-table', file, '--json']);
    expect(json.stdout).toBe(multilevelTimerTableToJson(table));
    const renamed = await runCli(['multilevel-timer-table', file, '--prefix', 'leg_pwm']);
    expect(renamed.stdout).toContain('static const uint16_t leg_pwm_a_c1_upper[LEG_PWM_LENGTH]');
  });

  it('exits 2 naming the field the library refuses', async () => {
    const bad = path.join(dir, 'bad.json');
    writeFileSync(
      bad,
      JSON.stringify({ ...REQUEST, modulation: { ...REQUEST.modulation, levels: 12 } }),
    );
    const run = await runCli(['multilevel-timer-table', bad]);
    expect(run.code).toBe(2);
    expect(run.stderr).toContain(
      "modulation.levels must be an integer in [3, 9] for topology 'flying-capacitor'",
    );
    const prefixed = await runCli(['multilevel-timer-table', file, '--prefix', '9x']);
    expect(prefixed.code).toBe(2);
    expect(prefixed.stderr).toMatch(/prefix must be a C identifier.*\(from --prefix\)/);
    const list = path.join(dir, 'list.json');
    writeFileSync(list, '[]');
    expect((await runCli(['multilevel-timer-table', list])).stderr).toContain(
      'must hold an object',
    );
  });
});
