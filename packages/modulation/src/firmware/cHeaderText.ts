import type { TimerPeriodFigures } from './timerTableTypes.js';

/* Internal to the C header writers (not exported by the package): text that C accepts. */

/**
 * A number with 12 significant digits and no trailing zeros: drops binary rounding such as
 * 5.000000000000001e-7 while keeping every digit a timer or table parameter needs.
 */
export function clean(value: number): string {
  return String(Number(value.toPrecision(12)));
}

/** A time in seconds written in nanoseconds, the unit dead times are specified in. */
export function nanoseconds(seconds: number): string {
  return `${clean(seconds * 1e9)} ns`;
}

/** Text safe inside a C block comment: no comment terminator, printable ASCII only. */
export function commentSafe(text: string): string {
  return text.replace(/\*\//g, '* /').replace(/[^\x20-\x7e]/g, (ch) => ASCII_FOR[ch] ?? '?');
}

const ASCII_FOR: Record<string, string> = {
  θ: 'theta',
  π: 'pi',
  '−': '-',
  '±': '+/-',
  '·': '*',
  '≥': '>=',
  '≤': '<=',
  Δ: 'delta',
};

/**
 * A C array definition `declaration = { … };` of whole numbers, ten a line, each with `suffix`
 * (`u`, `UL`), and a blank line after it.
 */
export function cArrayLines(
  declaration: string,
  values: readonly number[],
  suffix: string,
): string[] {
  const lines = [`${declaration} = {`];
  for (let i = 0; i < values.length; i += 10) {
    lines.push(
      `  ${values
        .slice(i, i + 10)
        .map((v) => `${Math.round(v)}${suffix}`)
        .join(', ')},`,
    );
  }
  lines.push('};', '');
  return lines;
}

/** The parameters every timer table records (two-level and multilevel). */
interface TimerHeaderTable extends TimerPeriodFigures {
  parameters: {
    fundamentalFrequency: number;
    carrierFrequency: number;
    timerClock: number;
    countingMode: string;
    counterBits: number;
    deadTime: number;
    deadTimeMethod: string;
    tableLength: number;
  };
}

/** The parameter lines of the frequencies, with the realised values. */
export function frequencyLines(table: TimerHeaderTable): [string, string][] {
  const p = table.parameters;
  return [
    [
      'fundamentalFrequency',
      `${clean(p.fundamentalFrequency)} Hz (realised ${clean(table.realisedFundamentalFrequency)} Hz)`,
    ],
    [
      'carrierFrequency',
      `${clean(p.carrierFrequency)} Hz (realised ${clean(table.realisedCarrierFrequency)} Hz)`,
    ],
  ];
}

/** The parameter lines of the timer: clock, counting, dead time, table length. */
export function timerLines(table: TimerHeaderTable): [string, string][] {
  const p = table.parameters;
  return [
    ['timerClock', `${clean(p.timerClock)} Hz`],
    ['countingMode', p.countingMode],
    ['counterBits', `${p.counterBits} bits`],
    [
      'deadTime',
      `${nanoseconds(p.deadTime)} requested, ${table.deadTimeCounts} ticks = ${nanoseconds(table.realisedDeadTime)} realised`,
    ],
    ['deadTimeMethod', p.deadTimeMethod],
    [
      'tableLength',
      `${p.tableLength} entries per fundamental period, ${table.updatesPerEntry} compare update(s) per entry`,
    ],
  ];
}

/** The parameter lines of the period register and full scale. */
export function registerLines(table: TimerHeaderTable): [string, string][] {
  return [
    ['periodRegister', `${table.periodRegister} counts`],
    ['fullScaleCounts', `${table.fullScaleCounts} counts (100 % duty)`],
  ];
}

/**
 * The header's comment block: a title, the bench caution, the parameters (names padded to one
 * width), then each section's lines and the warnings, if any; ASCII only.
 */
export function headerComment(
  title: string,
  parameters: readonly [string, string][],
  sections: readonly { heading: string; lines: readonly string[] }[],
  warnings: readonly { field: string; message: string }[],
): string[] {
  const width = Math.max(...parameters.map(([name]) => name.length));
  const all = [
    ...sections,
    ...(warnings.length === 0
      ? []
      : [{ heading: 'Warnings', lines: warnings.map((w) => `${w.field}: ${w.message}`) }]),
  ];
  return [
    '/*',
    ` * ${title}`,
    ' * Check it on the bench before use: an inverter DC bus and output are lethal.',
    ' *',
    ' * Parameters',
    ...parameters.map(([name, value]) => ` *   ${name.padEnd(width)}  ${commentSafe(value)}`),
    ...all.flatMap(({ heading, lines }) => [
      ' *',
      ` * ${heading}`,
      ...lines.map((line) => ` *   ${commentSafe(line)}`),
    ]),
    ' */',
  ];
}

/**
 * The header around a comment and a body: include guard `<PREFIX>_H`, `#include <stdint.h>`,
 * the macros every timer table defines (`_LENGTH`, `_UPDATES_PER_ENTRY`, `_PERIOD_REGISTER`,
 * `_FULL_SCALE`, `_DEAD_TIME_TICKS`), then `macros` and `body`.
 */
export function headerFile(
  comment: readonly string[],
  upper: string,
  table: TimerHeaderTable,
  suffix: string,
  macros: readonly string[],
  body: readonly string[],
): string {
  const guard = `${upper}_H`;
  return [
    ...comment,
    `#ifndef ${guard}`,
    `#define ${guard}`,
    '',
    '#include <stdint.h>',
    '',
    `#define ${upper}_LENGTH ${table.parameters.tableLength}u`,
    `#define ${upper}_UPDATES_PER_ENTRY ${table.updatesPerEntry}u`,
    `#define ${upper}_PERIOD_REGISTER ${table.periodRegister}${suffix}`,
    `#define ${upper}_FULL_SCALE ${table.fullScaleCounts}${suffix}`,
    `#define ${upper}_DEAD_TIME_TICKS ${table.deadTimeCounts}u`,
    ...macros,
    '',
    ...body,
    `#endif /* ${guard} */`,
    '',
  ].join('\n');
}
