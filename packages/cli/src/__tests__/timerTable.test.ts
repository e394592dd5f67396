import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { parse as parseYaml } from 'yaml';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp, type PulsewrightApp } from '@pulsewright/api';
import {
  timerTable,
  timerTableToCHeader,
  type InverterDesign,
  type TimerTable,
} from '@pulsewright/modulation';
import { example, runCli } from './runCli.js';

// The C header a firmware build generates with the CLI must be the one the service downloads for
// the same input, byte for byte, and must compile. The service runs in-process (createApp with a
// temporary SQLite file, driven by supertest, as apps/api's own tests do).

const dir = mkdtempSync(path.join(tmpdir(), 'pulsewright-cli-timer-'));
const PASSWORD = 'cli-test-password';
let app: PulsewrightApp;
let token: string;

beforeAll(async () => {
  app = await createApp({
    databaseUrl: `sqlite:${path.join(dir, 'api.sqlite')}`,
    demoPassword: PASSWORD,
    bcryptRounds: 4,
    logErrors: false,
    webDist: path.join(dir, 'no-web'),
    smtpUrl: '',
    mailDir: path.join(dir, 'mail'),
  });
  const login = await request(app)
    .post('/api/v1/auth/login')
    .send({ email: 'viewer@kestrel.example', password: PASSWORD });
  expect(login.status).toBe(200);
  token = login.body.token as string;
});

afterAll(async () => {
  await app?.close();
  rmSync(dir, { recursive: true, force: true });
});

/** The API's download of a timer table for this request body. */
async function apiTable(body: object, format: 'c-header' | 'csv' | 'json'): Promise<string> {
  const res = await request(app)
    .post(`/api/v1/timer-tables?format=${format}`)
    .set('Authorization', `Bearer ${token}`)
    .send(body)
    .buffer(true)
    .parse((response, callback) => {
      let text = '';
      response.setEncoding('utf8');
      response.on('data', (chunk: string) => (text += chunk));
      response.on('end', () => callback(null, text));
    });
  expect(res.status, String(res.body)).toBe(200);
  return res.body as string;
}

/**
 * Compiles a C99 program that includes the header and prints its macros and every array entry,
 * runs it, and returns the numbers it printed (so the values are read by a C compiler, not by
 * parsing the text).
 */
function compileAndRead(
  header: string,
  prefix: string,
  channels: readonly string[],
): { macros: number[]; arrays: Record<string, number[]> } {
  const headerFile = path.join(dir, `${prefix}.h`);
  writeFileSync(headerFile, header);
  const upper = prefix.toUpperCase();
  const names = channels.flatMap((c) => [`${prefix}_${c}_high`, `${prefix}_${c}_low`]);
  const program = [
    '#include <stdio.h>',
    `#include "${prefix}.h"`,
    'int main(void) {',
    `  unsigned long i;`,
    `  printf("%lu %lu %lu %lu %lu\\n", (unsigned long)${upper}_LENGTH, (unsigned long)${upper}_UPDATES_PER_ENTRY, (unsigned long)${upper}_PERIOD_REGISTER, (unsigned long)${upper}_FULL_SCALE, (unsigned long)${upper}_DEAD_TIME_TICKS);`,
    ...names.map(
      (name) =>
        `  for (i = 0; i < ${upper}_LENGTH; i++) printf("%lu%c", (unsigned long)${name}[i], i + 1 == ${upper}_LENGTH ? '\\n' : ' ');`,
    ),
    '  return 0;',
    '}',
    '',
  ].join('\n');
  const source = path.join(dir, `${prefix}_main.c`);
  const binary = path.join(dir, `${prefix}_main`);
  writeFileSync(source, program);
  execFileSync(
    'cc',
    ['-std=c99', '-Wall', '-Wextra', '-pedantic', '-Werror', '-o', binary, source],
    { stdio: 'pipe' },
  );
  const lines = execFileSync(binary, { encoding: 'utf8' }).trimEnd().split('\n');
  const numbers = lines.map((line) => line.split(' ').map(Number));
  return {
    macros: numbers[0] as number[],
    arrays: Object.fromEntries(names.map((name, i) => [name, numbers[i + 1] as number[]])),
  };
}

function expectHeaderValues(header: string, prefix: string, table: TimerTable): void {
  const channels = table.channels.map((c) => c.name);
  const { macros, arrays } = compileAndRead(header, prefix, channels);
  expect(macros).toEqual([
    table.parameters.tableLength,
    table.updatesPerEntry,
    table.periodRegister,
    table.fullScaleCounts,
    table.deadTimeCounts,
  ]);
  for (const channel of table.channels) {
    expect(arrays[`${prefix}_${channel.name}_high`]).toEqual(channel.highSide);
    expect(arrays[`${prefix}_${channel.name}_low`]).toEqual(channel.lowSide);
  }
}

describe('pulsewright timer-table', () => {
  const pump = parseYaml(readFileSync(example('pump-inverter.yaml'), 'utf8')) as InverterDesign;
  /** The API request body for the pump design with the timer options the CLI is given below. */
  const pumpRequest = {
    modulation: {
      method: 'sine-triangle',
      scheme: 'unipolar',
      ma: pump.modulation.method === 'sine-triangle' ? pump.modulation.ma : 0,
    },
    fundamentalFrequency: pump.fundamentalFrequency,
    carrierFrequency: pump.carrierFrequency,
    sampling: 'regular-symmetric',
    vdc: pump.vdc,
    timerClock: 72_000_000,
    countingMode: 'centre-aligned',
    deadTime: 1e-6,
    tableLength: 200,
    prefix: 'pump_pwm',
  };

  it("writes a C header from a design file that is the API's download byte for byte, and compiles", async () => {
    const file = path.join(dir, 'cli_pump.h');
    const run = await runCli([
      'timer-table',
      example('pump-inverter.yaml'),
      '--timer-clock',
      '72000000',
      '--dead-time',
      '1e-6',
      '--table-length',
      '200',
      '--prefix',
      'pump_pwm',
      '--output',
      file,
    ]);
    expect(run.code, run.stderr).toBe(0);
    expect(run.stdout).toBe('');
    const header = readFileSync(file, 'utf8');
    expect(header).toBe(await apiTable(pumpRequest, 'c-header'));
    const table = JSON.parse(await apiTable(pumpRequest, 'json')) as TimerTable;
    expectHeaderValues(header, 'pump_pwm', table);
    // And the library's own table for the same options (the API calls the same function).
    const { prefix: _prefix, ...options } = pumpRequest;
    expect(header).toBe(
      timerTableToCHeader(timerTable(options as Parameters<typeof timerTable>[0]), {
        prefix: 'pump_pwm',
      }),
    );
  });

  it("takes the API's request body as its input file and gives the same C header, CSV and JSON", async () => {
    const body = {
      modulation: { method: 'three-phase', zeroSequence: 'min-max', ma: 1.1 },
      fundamentalFrequency: 60,
      carrierFrequency: 7200,
      sampling: 'regular-asymmetric',
      timerClock: 170_000_000,
      countingMode: 'centre-aligned',
      counterBits: 32,
      deadTime: 5e-7,
      deadTimeMethod: 'dead-time-register',
      vdc: 700,
      prefix: 'drive_pwm',
    };
    const file = path.join(dir, 'drive-request.json');
    writeFileSync(file, JSON.stringify(body));
    for (const format of ['c-header', 'csv', 'json'] as const) {
      const run = await runCli(['timer-table', file, '--format', format]);
      expect(run.code, run.stderr).toBe(0);
      expect(run.stdout, format).toBe(await apiTable(body, format));
    }
    const header = (await runCli(['timer-table', file])).stdout;
    expect(header).toContain('static const uint32_t drive_pwm_a_high[DRIVE_PWM_LENGTH]');
    expectHeaderValues(header, 'drive_pwm', JSON.parse(await apiTable(body, 'json')) as TimerTable);
  });

  it('is deterministic: the same design file gives the same bytes', async () => {
    const args = [
      'timer-table',
      example('drive.json'),
      '--sampling',
      'regular-symmetric',
      '--timer-clock',
      '80e6',
      '--counting-mode',
      'edge-aligned',
      '--format',
      'csv',
    ];
    const [first, second] = await Promise.all([runCli(args), runCli(args)]);
    expect(first.code, first.stderr).toBe(0);
    expect(second.stdout).toBe(first.stdout);
    expect(first.stdout.split('\r\n')[0]).toBe(
      'entry,angle_rad,a_duty,a_compare,a_high,a_low,b_duty,b_compare,b_high,b_low,c_duty,c_compare,c_high,c_low',
    );
    // The same design on standard input (read once, as a pipe can be).
    const piped = await runCli(['timer-table', '-', ...args.slice(2)], {
      input: readFileSync(example('drive.json'), 'utf8'),
    });
    expect(piped.stdout).toBe(first.stdout);
  });

  it('says on standard error when a naturally sampled design becomes a regular-sampled table', async () => {
    const run = await runCli([
      'timer-table',
      '--method',
      'sine-triangle',
      '--scheme',
      'bipolar',
      '--ma',
      '0.7',
      '--vdc',
      '48',
      '--fundamental-frequency',
      '400',
      '--carrier-frequency',
      '20000',
      '--timer-clock',
      '64e6',
      '--json',
    ]);
    expect(run.code).toBe(0);
    expect(run.stderr).toMatch(
      /^pulsewright: note: the design's natural sampling becomes regular-symmetric/,
    );
    const table = JSON.parse(run.stdout) as TimerTable;
    expect(table.parameters.sampling).toBe('regular-symmetric');
    expect(table.channels.map((c) => c.name)).toEqual(['a']);
  });

  it('writes the reduced common-mode methods with their compare senses (azspwm1, nspwm: Hava and Ün 2009)', async () => {
    const flags = [
      '--method',
      'three-phase',
      '--ma',
      '0.9',
      '--vdc',
      '650',
      '--fundamental-frequency',
      '50',
      '--carrier-frequency',
      '5000',
      '--timer-clock',
      '16e6',
      '--dead-time',
      '1e-6',
    ];
    for (const zeroSequence of ['azspwm1', 'nspwm']) {
      const args = ['timer-table', ...flags, '--zero-sequence', zeroSequence];
      const json = await runCli([...args, '--json']);
      expect(json.code, json.stderr).toBe(0);
      // A natural design samples each half period in the table, as threePhase samples it.
      expect(json.stderr).toMatch(/natural sampling becomes regular-asymmetric/);
      const table = JSON.parse(json.stdout) as TimerTable;
      const request = {
        modulation: { method: 'three-phase', zeroSequence, ma: 0.9 },
        fundamentalFrequency: 50,
        carrierFrequency: 5000,
        sampling: 'regular-asymmetric',
        vdc: 650,
        timerClock: 16e6,
        deadTime: 1e-6,
      };
      expect(json.stdout).toBe(await apiTable(request, 'json'));
      expect(table.channels.map((c) => c.sense.filter((s) => s === 'above').length)).not.toContain(
        0,
      );
      const csv = await runCli([...args, '--format', 'csv']);
      expect(csv.stdout.split('\r\n')[0]).toContain('a_compare,a_sense,a_high');
      const header = await runCli(args);
      expect(header.stdout).toContain('static const uint8_t pwm_table_b_above[PWM_TABLE_LENGTH]');
    }
  });
});
