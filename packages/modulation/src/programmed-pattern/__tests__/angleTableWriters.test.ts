import { execFileSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { rangeErrorField } from '../../testing/rangeErrorField.js';
import {
  angleTable,
  angleTableFixedPoint,
  angleTableMidpointErrors,
  angleTableToCHeader,
  angleTableToCsv,
  angleTableToJson,
  type AngleTableDocument,
  type EliminationTablePattern,
} from '../index.js';

const dir = mkdtempSync(join(tmpdir(), 'angle-table-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

// A table with a gap at its end (staircase, two cells, 3rd removed: the branch b = a + π/3
// ends at V₁/(4vdc/π) = 1.5; pen and paper), so the header's zero rows and flags are exercised.
const pattern: EliminationTablePattern = {
  method: 'selective-harmonic-elimination',
  kind: 'staircase',
  vdc: 10,
  eliminate: [3],
};
const table = angleTable({ pattern, ma: { from: 0.6, to: 1.05 }, rows: 10 });
const midpointErrors = angleTableMidpointErrors(table);
const fixedPoint = { fractionBits: 16, timerClock: 72e6, fundamentalFrequency: 50 };

describe('angle table writers', () => {
  it('the C header compiles with cc and reads back equal to the JSON within the fixed-point resolution', () => {
    expect(table.gaps.length).toBeGreaterThan(0);
    const header = angleTableToCHeader(table, {
      ...fixedPoint,
      prefix: 'pump_she',
      midpointErrors,
    });
    const json = JSON.parse(
      angleTableToJson(table, { midpointErrors, fixedPoint }),
    ) as AngleTableDocument;
    writeFileSync(join(dir, 'pump_she.h'), header);
    writeFileSync(
      join(dir, 'main.c'),
      [
        '#include <stdio.h>',
        '#include "pump_she.h"',
        'int main(void) {',
        '  printf("%u %u %u %lu %.17g %.17g\\n", PUMP_SHE_ROWS, PUMP_SHE_ANGLES, PUMP_SHE_FRACTION_BITS,',
        '         (unsigned long)PUMP_SHE_TICKS_PER_PERIOD, PUMP_SHE_MA_FIRST, PUMP_SHE_MA_STEP);',
        '  for (unsigned r = 0; r < PUMP_SHE_ROWS; r++) {',
        '    printf("%u %u", pump_she_solved[r], r + 1u < PUMP_SHE_ROWS ? pump_she_interpolable[r] : 9u);',
        '    for (unsigned k = 0; k < PUMP_SHE_ANGLES; k++)',
        '      printf(" %lu %lu", (unsigned long)pump_she_fraction[r][k], (unsigned long)pump_she_ticks[r][k]);',
        '    printf("\\n");',
        '  }',
        '  return 0;',
        '}',
        '',
      ].join('\n'),
    );
    execFileSync('cc', [
      '-std=c99',
      '-Wall',
      '-Wextra',
      '-Werror',
      '-o',
      join(dir, 'main'),
      join(dir, 'main.c'),
    ]);
    const lines = execFileSync(join(dir, 'main'), { encoding: 'utf8' }).trim().split('\n');
    const [rows, angles, bits, ticksPerPeriod, maFirst, maStep] = (lines[0] as string)
      .split(' ')
      .map(Number);
    expect([rows, angles, bits, ticksPerPeriod]).toEqual([10, 2, 16, 72e6 / 50]);
    expect(maFirst).toBe(json.table.parameters.ma.from);
    expect(maStep).toBe(json.table.step);
    json.table.rows.forEach((row, r) => {
      const values = (lines[r + 1] as string).split(' ').map(Number);
      expect(values[0]).toBe(row.solved ? 1 : 0);
      if (r + 1 < json.table.rows.length) {
        expect(values[1]).toBe(json.midpointErrors?.intervals[r]?.interpolable === true ? 1 : 0);
      }
      for (let k = 0; k < 2; k++) {
        const fraction = values[2 + 2 * k] as number;
        const ticks = values[3 + 2 * k] as number;
        if (!row.solved) {
          expect([fraction, ticks]).toEqual([0, 0]);
          continue;
        }
        const exact = (row.angles[k] as number) / (2 * Math.PI);
        // Q0.16 read back: value·2^−16 within half a step of the exact fraction (round to nearest).
        expect(Math.abs(fraction / 2 ** 16 - exact)).toBeLessThanOrEqual(2 ** -17);
        // Ticks within half a tick of α/2π·ticksPerPeriod.
        expect(Math.abs(ticks - exact * 1_440_000)).toBeLessThanOrEqual(0.5);
      }
    });
  });

  it('wide formats use uint32_t and still compile', () => {
    const header = angleTableToCHeader(table, {
      fractionBits: 32,
      timerClock: 1e9,
      fundamentalFrequency: 0.5,
    });
    expect(header).toMatch(/static const uint32_t angle_table_fraction/);
    writeFileSync(
      join(dir, 'wide.c'),
      `${header}\nint main(void) { return (int)(angle_table_fraction[0][0] == 0u) + (int)angle_table_ticks[0][0] * 0 + (int)angle_table_solved[0] * 0 + (int)angle_table_interpolable[0] * 0; }\n`,
    );
    execFileSync('cc', [
      '-std=c99',
      '-Wall',
      '-Werror',
      '-o',
      join(dir, 'wide'),
      join(dir, 'wide.c'),
    ]);
  });

  it('CSV: one line per row, the angles and fixed-point values as the JSON holds them', () => {
    const csv = angleTableToCsv(table, { midpointErrors, fixedPoint });
    const lines = csv.trimEnd().split('\r\n');
    expect(lines.length).toBe(11);
    const header = (lines[0] as string).split(',');
    expect(header.slice(0, 6)).toEqual([
      'row',
      'ma',
      'solved',
      'continued',
      'angle_1_rad',
      'angle_2_rad',
    ]);
    const fixed = angleTableFixedPoint(table, fixedPoint);
    table.rows.forEach((row, i) => {
      const cells = (lines[i + 1] as string).split(',');
      const at = (name: string) => cells[header.indexOf(name)] as string;
      expect(Number(at('ma'))).toBe(row.ma);
      expect(at('solved')).toBe(row.solved ? '1' : '0');
      expect(at('angle_1_rad')).toBe(row.solved ? String(row.angles[0]) : '');
      expect(at('fraction_2')).toBe(row.solved ? String(fixed.fractions[i]?.[1]) : '');
      expect(at('residual_3_V')).toBe(row.solved ? String(row.residuals[0]?.amplitude) : '');
    });
  });

  it('bad writer options name the field', () => {
    expect(
      rangeErrorField(() => angleTableToCHeader(table, { ...fixedPoint, prefix: '9lives' })),
    ).toBe('prefix');
    expect(
      rangeErrorField(() => angleTableFixedPoint(table, { ...fixedPoint, fractionBits: 40 })),
    ).toBe('fractionBits');
    expect(
      rangeErrorField(() => angleTableFixedPoint(table, { ...fixedPoint, timerClock: 100 })),
    ).toBe('timerClock');
  });
});
