/// <reference types="node" />
import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import {
  timerTable,
  timerTableToCHeader,
  timerTableToCsv,
  timerTableToJson,
  type TimerTableOptions,
} from '../index.js';

const options: TimerTableOptions = {
  modulation: { method: 'three-phase', zeroSequence: 'min-max', ma: 1.05 },
  fundamentalFrequency: 50,
  carrierFrequency: 8000,
  timerClock: 80e6,
  deadTime: 1.5e-6,
  vdc: 650,
};

const compilerAvailable = spawnSync('cc', ['--version']).status === 0;

describe('timerTableToJson', () => {
  it('round-trips the whole table', () => {
    const table = timerTable(options);
    expect(JSON.parse(timerTableToJson(table))).toEqual(table);
    expect(timerTableToJson(table, { indent: 0 })).not.toContain('\n');
  });
});

describe('timerTableToCsv', () => {
  it('writes a header row and one row per entry', () => {
    const table = timerTable(options);
    const lines = timerTableToCsv(table).trimEnd().split('\r\n');
    expect(lines).toHaveLength(table.parameters.tableLength + 1);
    expect(lines[0]).toBe(
      'entry,angle_rad,a_duty,a_compare,a_high,a_low,b_duty,b_compare,b_high,b_low,c_duty,c_compare,c_high,c_low',
    );
    const row = lines[6]!.split(','); // line 0 is the header
    expect(Number(row[0])).toBe(5);
    expect(Number(row[3])).toBe(table.channels[0]!.compare[5]);
    expect(Number(row[13])).toBe(table.channels[2]!.lowSide[5]);
  });

  it('neutralises cells a spreadsheet would evaluate as formulas', () => {
    // CSV formula injection: cells starting with = + - @ are prefixed with ' (OWASP guidance,
    // from memory); RFC 4180 quoting for the embedded quote and comma.
    const table = timerTable(options);
    const hostile = {
      ...table,
      channels: table.channels.map((c, i) => ({
        ...c,
        name: ['=HYPERLINK("http://x","y")', '+1', '@SUM(A1)'][i]!,
      })),
    };
    const header = timerTableToCsv(hostile).split('\r\n')[0]!;
    expect(header).toContain(`"'=HYPERLINK(""http://x"",""y"")_duty"`);
    expect(header).toContain("'+1_duty");
    expect(header).toContain("'@SUM(A1)_duty");
    expect(header.split(',').some((cell) => /^[=+\-@]/.test(cell))).toBe(false);
  });
});

describe('timerTableToCHeader', () => {
  it('records every parameter with its unit and the conventions', () => {
    const table = timerTable(options);
    const header = timerTableToCHeader(table);
    for (const field of [
      'modulation.ma',
      'fundamentalFrequency',
      'carrierFrequency',
      'timerClock',
      'countingMode',
      'counterBits',
      'deadTime',
      'tableLength',
      'vdc',
    ]) {
      expect(header).toContain(field);
    }
    expect(header).toContain('80000000 Hz');
    expect(header).toContain('1500 ns requested, 120 ticks = 1500 ns realised');
    // Times print cleanly (issue 10): 500 ns held as 5.000000000000001e-7 s in binary, and a
    // realised dead time of 40 ticks at 80 MHz, are written in ns without binary rounding.
    const fine = timerTableToCHeader(timerTable({ ...options, deadTime: 500 * 1e-9 }));
    expect(500 * 1e-9).toBe(5.000000000000001e-7);
    expect(fine).toContain('deadTime');
    expect(fine).toContain('500 ns requested, 40 ticks = 500 ns realised');
    // No number longer than 12 significant digits and a point (5.000000000000001e-7 has 17).
    expect(fine).not.toMatch(/\d[\d.]{15,}|e-\d/);
    expect(header).toContain('#include <stdint.h>');
    expect(header).toContain('static const uint16_t pwm_table_a_high[PWM_TABLE_LENGTH]');
    expect(header).toMatch(/^#ifndef PWM_TABLE_H$/m);
    expect(header.trimEnd().endsWith('#endif /* PWM_TABLE_H */')).toBe(true);
    // Only printable ASCII inside the comment, so any C compiler accepts it.
    expect(/[^\x20-\x7e\n]/.test(header)).toBe(false);
    expect(timerTableToCHeader(timerTable({ ...options, counterBits: 32 }))).toContain(
      'static const uint32_t',
    );
    expect(() => timerTableToCHeader(table, { prefix: '9bad' })).toThrow(
      /prefix must be a C identifier/,
    );
  });

  it.runIf(compilerAvailable)('compiles with the C compiler and holds the same numbers', () => {
    // The C language is the outside reference here: cc parses the header (C99, pedantic,
    // warnings as errors) and a program built with it prints the arrays it holds.
    const directory = mkdtempSync(join(tmpdir(), 'pulsewright-header-'));
    try {
      for (const counterBits of [16, 32]) {
        const table = timerTable({ ...options, counterBits });
        const headerPath = join(directory, `table${counterBits}.h`);
        writeFileSync(headerPath, timerTableToCHeader(table, { prefix: 'kestrel_drive' }));
        execFileSync('cc', [
          '-std=c99',
          '-pedantic',
          '-Wall',
          '-Wextra',
          '-Werror',
          '-fsyntax-only',
          '-x',
          'c',
          headerPath,
        ]);
        const program = join(directory, `main${counterBits}.c`);
        writeFileSync(
          program,
          [
            '#include <stdio.h>',
            `#include "table${counterBits}.h"`,
            'int main(void) {',
            '  unsigned long sum = 0; unsigned i;',
            '  for (i = 0; i < KESTREL_DRIVE_LENGTH; i++) sum += kestrel_drive_b_high[i] + 3ul * kestrel_drive_c_low[i];',
            '  printf("%lu %lu %lu\\n", sum, (unsigned long)KESTREL_DRIVE_PERIOD_REGISTER, (unsigned long)(sizeof kestrel_drive_a_low / sizeof kestrel_drive_a_low[0]));',
            '  return 0;',
            '}',
          ].join('\n'),
        );
        const binary = join(directory, `main${counterBits}`);
        execFileSync('cc', ['-std=c99', '-Wall', '-Werror', '-o', binary, program]);
        const [sum, period, length] = execFileSync(binary).toString().trim().split(' ').map(Number);
        const b = table.channels[1]!;
        const c = table.channels[2]!;
        expect(sum).toBe(b.highSide.reduce((s, v, i) => s + v + 3 * c.lowSide[i]!, 0));
        expect(period).toBe(table.periodRegister);
        expect(length).toBe(table.parameters.tableLength);
      }
    } finally {
      rmSync(directory, { recursive: true, force: true });
    }
  });

  it.runIf(compilerAvailable)(
    'a reduced common-mode table compiles and holds its compare senses (uint8_t _above arrays)',
    () => {
      // azspwm1 (A. M. Hava and E. Ün, IEEE Trans. Power Electronics, 2009): one channel in
      // each entry, the middle phase, compares with the inverted carrier. The compiler reads
      // the arrays back; the other tables' headers have no _above array (test above).
      const table = timerTable({
        ...options,
        modulation: { method: 'three-phase', zeroSequence: 'azspwm1', ma: 0.9 },
      });
      const header = timerTableToCHeader(table, { prefix: 'kestrel_rcm' });
      expect(header).toContain('static const uint8_t kestrel_rcm_a_above[KESTREL_RCM_LENGTH]');
      expect(timerTableToCHeader(timerTable(options))).not.toContain('_above');
      const directory = mkdtempSync(join(tmpdir(), 'pulsewright-header-'));
      try {
        writeFileSync(join(directory, 'rcm.h'), header);
        const program = join(directory, 'rcm.c');
        writeFileSync(
          program,
          [
            '#include <stdio.h>',
            '#include "rcm.h"',
            'int main(void) {',
            '  unsigned long above = 0, weighted = 0; unsigned i;',
            '  for (i = 0; i < KESTREL_RCM_LENGTH; i++) {',
            '    above += kestrel_rcm_a_above[i] + kestrel_rcm_b_above[i] + kestrel_rcm_c_above[i];',
            '    weighted += (unsigned long)kestrel_rcm_b_above[i] * kestrel_rcm_b_high[i];',
            '  }',
            '  printf("%lu %lu\\n", above, weighted);',
            '  return 0;',
            '}',
          ].join('\n'),
        );
        const binary = join(directory, 'rcm');
        execFileSync('cc', [
          '-std=c99',
          '-pedantic',
          '-Wall',
          '-Wextra',
          '-Werror',
          '-o',
          binary,
          program,
        ]);
        const [above, weighted] = execFileSync(binary).toString().trim().split(' ').map(Number);
        // Exactly one channel per entry is the middle phase.
        expect(above).toBe(table.parameters.tableLength);
        const b = table.channels[1]!;
        expect(weighted).toBe(
          b.highSide.reduce((s, v, i) => s + (b.sense[i] === 'above' ? v : 0), 0),
        );
      } finally {
        rmSync(directory, { recursive: true, force: true });
      }
    },
  );

  if (!compilerAvailable) {
    it.skip('compiling the header is skipped: no C compiler (cc) on this machine', () => undefined);
  }
});
