/// <reference types="node" />
import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import {
  multilevelTimerTable,
  multilevelTimerTableToCHeader,
  multilevelTimerTableToCsv,
  multilevelTimerTableToJson,
  type MultilevelTimerTable,
  type MultilevelTimerTableOptions,
} from '../index.js';

const cascaded: MultilevelTimerTableOptions = {
  modulation: {
    topology: 'cascaded-h-bridge',
    levels: 7,
    carriers: 'phase-shifted',
    phaseCount: 3,
    ma: 0.9,
    vdc: 600,
    sampling: 'regular-asymmetric',
  },
  fundamentalFrequency: 50,
  carrierFrequency: 2050,
  timerClock: 100e6,
  deadTime: 1.5e-6,
};

const npc: MultilevelTimerTableOptions = {
  modulation: { topology: 'npc', levels: 3, carriers: 'pod', phaseCount: 1, ma: 0.9, vdc: 800 },
  fundamentalFrequency: 50,
  carrierFrequency: 5050,
  timerClock: 80e6,
  deadTime: 2e-6,
};

const compilerAvailable = spawnSync('cc', ['--version']).status === 0;

describe('multilevelTimerTableToJson', () => {
  it('round-trips the whole table', () => {
    const table = multilevelTimerTable(cascaded);
    expect(JSON.parse(multilevelTimerTableToJson(table))).toEqual(table);
    expect(multilevelTimerTableToJson(table, { indent: 0 })).not.toContain('\n');
    expect(() => multilevelTimerTableToJson(table, { indent: 11 })).toThrow(/indent/);
  });
});

describe('multilevelTimerTableToCsv', () => {
  it('writes a header row naming every switch and one row per entry', () => {
    const table = multilevelTimerTable(npc);
    const lines = multilevelTimerTableToCsv(table).trimEnd().split('\r\n');
    expect(lines).toHaveLength(table.parameters.tableLength + 1);
    expect(lines[0]).toBe(
      [
        'entry',
        'carrier_1_angle_rad',
        'carrier_2_angle_rad',
        'leg_a_S1_duty',
        'leg_a_S1_compare',
        'leg_a_S1',
        'leg_a_S3',
        'leg_a_S2_duty',
        'leg_a_S2_compare',
        'leg_a_S2',
        'leg_a_S4',
        'leg_b_S1_duty',
        'leg_b_S1_compare',
        'leg_b_S1',
        'leg_b_S3',
        'leg_b_S2_duty',
        'leg_b_S2_compare',
        'leg_b_S2',
        'leg_b_S4',
      ].join(','),
    );
    const row = lines[8]!.split(','); // line 0 is the header
    expect(Number(row[0])).toBe(7);
    expect(Number(row[2])).toBe(table.counters[1]!.entryAngles[7]);
    expect(Number(row[5])).toBe(table.legs[0]!.pairs[0]!.mainCompare[7]);
    expect(Number(row[18])).toBe(table.legs[1]!.pairs[1]!.complementCompare[7]);
    const header = multilevelTimerTableToCsv(multilevelTimerTable(cascaded)).split('\r\n')[0]!;
    expect(header).toContain('cell_3_angle_rad');
    expect(header).toContain('string_c_cell_3_right_upper,string_c_cell_3_right_lower');
  });
});

/** Every array of the header in the order the writer emits them, from the table. */
function expectedArrays(table: MultilevelTimerTable): number[][] {
  return table.legs.flatMap((leg) =>
    leg.pairs.flatMap((pair) => [pair.mainCompare, pair.complementCompare]),
  );
}

describe('multilevelTimerTableToCHeader', () => {
  it('records the parameters, counters and pairs, and names every switch of every leg', () => {
    const table = multilevelTimerTable(cascaded);
    const header = multilevelTimerTableToCHeader(table, { prefix: 'kestrel_mv' });
    for (const text of [
      'modulation.topology',
      'cascaded-h-bridge (Cascaded H-bridge)',
      'modulation.sampling',
      'regular-asymmetric',
      'timerClock',
      '100000000 Hz',
      '1500 ns requested, 150 ticks = 1500 ns realised',
      '#include <stdint.h>',
      '#define KESTREL_MV_COUNTERS 3u',
      'static const uint32_t kestrel_mv_counter_offset[KESTREL_MV_COUNTERS]',
      'static const uint16_t kestrel_mv_a_c1_left_upper[KESTREL_MV_LENGTH]',
      'static const uint16_t kestrel_mv_c_c3_right_lower[KESTREL_MV_LENGTH]',
      '#define KESTREL_MV_C_C3_RIGHT_LOWER_CTR 2u',
      'string c: cell 3 right upper / cell 3 right lower: counter 2',
    ]) {
      expect(header).toContain(text);
    }
    expect(header).toMatch(/^#ifndef KESTREL_MV_H$/m);
    expect(header.trimEnd().endsWith('#endif /* KESTREL_MV_H */')).toBe(true);
    // Only printable ASCII, so any C compiler accepts it.
    expect(/[^\x20-\x7e\n]/.test(header)).toBe(false);
    // Every switch has its array: 3 strings × 3 cells × 4 switches.
    expect(header.match(/static const uint16_t kestrel_mv_[abc]_/g)).toHaveLength(36);
    expect(
      multilevelTimerTableToCHeader(multilevelTimerTable({ ...cascaded, counterBits: 32 })),
    ).toContain('static const uint32_t pwm_multilevel_a_c1_left_upper');
    expect(() => multilevelTimerTableToCHeader(table, { prefix: '9bad' })).toThrow(
      /prefix must be a C identifier/,
    );
    // The longest names a 40-character prefix gives stay within C99's 63 significant characters
    // of an identifier (ISO/IEC 9899:1999 §5.2.4.1).
    const longest = multilevelTimerTableToCHeader(table, { prefix: 'p'.repeat(40) })
      .match(/[A-Za-z_][A-Za-z0-9_]*/g)!
      .reduce((n, name) => Math.max(n, name.length), 0);
    expect(longest).toBeLessThanOrEqual(63);
  });

  it.runIf(compilerAvailable)(
    'compiles with the C compiler and holds the numbers of the JSON',
    () => {
      // The C language is the outside reference: cc parses the header (C99, pedantic, warnings as
      // errors) and a program built with it prints every array it holds, compared with the JSON.
      const directory = mkdtempSync(join(tmpdir(), 'pulsewright-multilevel-header-'));
      try {
        for (const [name, options] of [
          ['cascaded', cascaded],
          ['npc', npc],
          ['npc32', { ...npc, counterBits: 32 }],
        ] as const) {
          const table = multilevelTimerTable(options);
          const headerPath = join(directory, `${name}.h`);
          writeFileSync(headerPath, multilevelTimerTableToCHeader(table, { prefix: 'bench' }));
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
          const arrays = [
            ...new Set(
              [
                ...multilevelTimerTableToCHeader(table, { prefix: 'bench' }).matchAll(
                  /static const uint(?:16|32)_t (bench_[abc]_\w+)\[/g,
                ),
              ].map((m) => m[1]!),
            ),
          ];
          const program = join(directory, `${name}.c`);
          writeFileSync(
            program,
            [
              '#include <stdio.h>',
              `#include "${name}.h"`,
              'int main(void) {',
              '  unsigned i;',
              '  printf("%lu %lu %lu\\n", (unsigned long)BENCH_PERIOD_REGISTER, (unsigned long)BENCH_START_TICK, (unsigned long)BENCH_LENGTH);',
              '  for (i = 0; i < BENCH_COUNTERS; i++) printf("%lu ", (unsigned long)bench_counter_offset[i]);',
              '  printf("\\n");',
              ...arrays.flatMap((array) => [
                `  for (i = 0; i < BENCH_LENGTH; i++) printf("%lu ", (unsigned long)${array}[i]);`,
                '  printf("\\n");',
              ]),
              '  return 0;',
              '}',
            ].join('\n'),
          );
          const binary = join(directory, name);
          execFileSync('cc', ['-std=c99', '-Wall', '-Werror', '-o', binary, program]);
          const lines = execFileSync(binary)
            .toString()
            .trim()
            .split('\n')
            .map((line) => line.trim().split(' ').map(Number));
          const json = JSON.parse(multilevelTimerTableToJson(table)) as MultilevelTimerTable;
          expect(lines[0]).toEqual([
            json.periodRegister,
            json.counters[0]!.startTick,
            json.parameters.tableLength,
          ]);
          expect(lines[1]).toEqual(json.counters.map((c) => c.offsetTicks));
          expect(lines.slice(2)).toEqual(expectedArrays(json));
        }
      } finally {
        rmSync(directory, { recursive: true, force: true });
      }
    },
  );

  if (!compilerAvailable) {
    it.skip('compiling the header is skipped: no C compiler (cc) on this machine', () => undefined);
  }
});
