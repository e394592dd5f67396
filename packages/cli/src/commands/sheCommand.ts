import { Command, Option } from 'commander';
import {
  sheSweep,
  solveShe,
  type SheResult,
  type SheSweepOptions,
  type SheSweepResult,
  type SolveSheOptions,
} from '@pulsewright/modulation';
import { callLibrary } from '../input/callLibrary.js';
import { parseNumberList } from '../input/parseValue.js';
import type { CliIo } from '../output/CliIo.js';
import { formatDegrees, formatNumber } from '../output/formatNumber.js';
import { formatPattern, patternTitle } from '../output/formatPattern.js';
import { formatTable } from '../output/formatTable.js';
import { toCsv } from '../output/toCsv.js';
import { addOutputOptions, numberOption, type OutputFlags } from './commonOptions.js';
import { addPatternOptions, patternBase, patternNotes } from './patternInput.js';
import { runPatternCommand, singlePatternRun } from './runPatternCommand.js';

type SheFlags = Record<string, unknown> & OutputFlags;

/**
 * `pulsewright she`: selective harmonic elimination (Patel and Hoft, 1973) by the library's
 * solveShe at one fundamental, or a table over a range of fundamentals by sheSweep (continuation
 * along each solution branch).
 */
export function sheCommand(io: CliIo): Command {
  const command = new Command('she').description(
    'selective harmonic elimination: first-quarter angles at one fundamental, or a table over a range of fundamentals',
  );
  addPatternOptions(command);
  command.addOption(
    new Option(
      '--eliminate <orders>',
      'odd orders to eliminate, comma-separated (count − 1 of them with a fundamental)',
    )
      .argParser(parseNumberList)
      .makeOptionMandatory()
      .helpGroup('Pattern:'),
  );
  command.addOption(
    new Option(
      '--cell-voltages <volts>',
      "staircase only: each cell's DC source, volts, comma-separated, one per angle (cascaded cells on unequal sources; every cell at --vdc when left out)",
    )
      .argParser(parseNumberList)
      .helpGroup('Pattern:'),
  );
  command.addOption(
    numberOption('--branches <count>', 'solution branches a table follows (default 1)').helpGroup(
      'Table over the fundamental:',
    ),
  );
  addOutputOptions(command, { csv: true, progress: true });
  command.addHelpText(
    'after',
    "\nExit status 1 when no solution is found at the one fundamental, or at none of the table's.",
  );
  command.action((flags: SheFlags) => {
    const base = {
      ...patternBase(flags),
      eliminate: flags.eliminate,
      ...(flags.cellVoltages === undefined ? {} : { cellVoltages: flags.cellVoltages }),
    };
    const notes = patternNotes({ cellVoltages: '--cell-voltages' });
    return runPatternCommand(flags, io, {
      label: 'SHE table',
      single: () => {
        const options = {
          ...base,
          ...(flags.fundamental === undefined ? {} : { fundamental: flags.fundamental }),
        } as SolveSheOptions;
        const result = callLibrary(() => solveShe(options), { notes });
        return singlePatternRun(result, () => sheText(result, options));
      },
      table: (range, onProgress) => {
        const options = {
          ...base,
          fundamentals: range,
          maxBranches: flags.branches ?? 1,
          onProgress,
        } as SheSweepOptions;
        const result = callLibrary(() => sheSweep(options), { notes });
        return {
          result,
          text: () => sheSweepText(result, options),
          csv: () => sheSweepCsv(result),
          failure: result.solvedFraction === 0 ? result.message : null,
        };
      },
    });
  });
  return command;
}

function sheText(result: SheResult, options: SolveSheOptions): string {
  const title = patternTitle(
    'Selective harmonic elimination',
    result.kind,
    result.angles.length,
    result.vdc,
  );
  const orders = `eliminating ${options.eliminate.join(', ')}`;
  return (
    formatPattern(title, result, [orders, ...cellVoltagesLine(result.cellVoltages)]) +
    '\n' +
    formatTable(
      ['order', 'remaining (V peak)', '% of fundamental'],
      result.residual.map((r) => [
        String(r.order),
        formatNumber(r.amplitude),
        formatNumber((100 * r.amplitude) / Math.abs(result.fundamental)),
      ]),
    )
  );
}

/** Every point of every branch, in branch order. */
function sweepRows(
  result: SheSweepResult,
): { branch: number; fundamental: number; converged: boolean; angles: number[] }[] {
  return result.branches.flatMap((branch, b) =>
    branch.points.map((p) => ({ branch: b + 1, ...p })),
  );
}

function angleCount(result: SheSweepResult, options: SheSweepOptions): number {
  return (
    options.angles?.length ??
    options.count ??
    Math.max(0, ...sweepRows(result).map((r) => r.angles.length))
  );
}

function sheSweepText(result: SheSweepResult, options: SheSweepOptions): string {
  const count = angleCount(result, options);
  const sources = cellVoltagesLine(options.cellVoltages).map((line) => `${line}\n`);
  const head = `${patternTitle('Selective harmonic elimination table', options.kind, count, options.vdc)}, eliminating ${options.eliminate.join(', ')}\n${sources.join('')}${result.message}\n`;
  const ends = result.branches.map((b, i) => `branch ${i + 1} ${b.end}`).join('; ');
  const headers = [
    'branch',
    'fundamental (V peak)',
    ...Array.from({ length: count }, (_, k) => `α${k + 1} (°)`),
  ];
  const rows = sweepRows(result).map((r) => [
    String(r.branch),
    formatNumber(r.fundamental),
    ...(r.converged ? r.angles.map(formatDegrees) : Array.from({ length: count }, () => 'lost')),
  ]);
  return `${head}${ends === '' ? '' : `${ends}\n`}\n${formatTable(headers, rows)}`;
}

function sheSweepCsv(result: SheSweepResult): string {
  const count = Math.max(0, ...sweepRows(result).map((r) => r.angles.length));
  return toCsv([
    [
      'branch',
      'fundamental_V_peak',
      'converged',
      ...Array.from({ length: count }, (_, k) => `alpha${k + 1}_rad`),
    ],
    ...sweepRows(result).map((r) => [
      r.branch,
      r.fundamental,
      r.converged,
      ...Array.from({ length: count }, (_, k) => r.angles[k] ?? null),
    ]),
  ]);
}

/** The line naming each cell's source of a staircase of unequal sources (none when equal). */
function cellVoltagesLine(cellVoltages: readonly number[] | undefined): string[] {
  if (cellVoltages === undefined) return [];
  return [
    `cell sources ${cellVoltages.map((v) => formatNumber(v)).join(', ')} V (cell k switches at αk)`,
  ];
}
