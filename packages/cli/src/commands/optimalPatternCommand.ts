import { Command, Option } from 'commander';
import {
  optimalPulsePattern,
  optimalPulseSweep,
  type OptimalPulseOptions,
  type OptimalPulseResult,
  type OptimalPulseSweepOptions,
  type OptimalPulseSweepResult,
} from '@pulsewright/modulation';
import { callLibrary } from '../input/callLibrary.js';
import type { CliIo } from '../output/CliIo.js';
import { formatDegrees, formatNumber, formatPercent } from '../output/formatNumber.js';
import { formatPattern, patternTitle } from '../output/formatPattern.js';
import { formatTable } from '../output/formatTable.js';
import { toCsv } from '../output/toCsv.js';
import { addOutputOptions, numberOption, type OutputFlags } from './commonOptions.js';
import { addPatternOptions, patternBase, patternNotes } from './patternInput.js';
import { runPatternCommand, singlePatternRun } from './runPatternCommand.js';

type OptimalFlags = Record<string, unknown> & OutputFlags;

/**
 * `pulsewright optimal-pattern`: the quarter-wave pattern of least weighted distortion at one
 * fundamental (optimalPulsePattern), or a table over a range of fundamentals (optimalPulseSweep).
 */
export function optimalPatternCommand(io: CliIo): Command {
  const command = new Command('optimal-pattern').description(
    'optimal pulse pattern (least WTHD or THD) at one fundamental, or a table over a range of fundamentals',
  );
  addPatternOptions(command);
  command.addOption(
    new Option(
      '--objective <objective>',
      'wthd (weights 1/n²) or thd (weights 1) over the odd orders 3..max-order (default wthd)',
    ).helpGroup('Pattern:'),
  );
  command.addOption(
    numberOption(
      '--max-order <order>',
      'highest order in the objective, 3..10000 (default 99)',
    ).helpGroup('Pattern:'),
  );
  addOutputOptions(command, { csv: true, progress: true });
  command.addHelpText(
    'after',
    "\nExit status 1 when no optimum is found at the one fundamental, or at none of the table's.",
  );
  command.action((flags: OptimalFlags) => {
    const base = patternBase(flags);
    if (flags.objective !== undefined) base.objective = flags.objective;
    if (flags.maxOrder !== undefined) base.maxOrder = flags.maxOrder;
    const notes = patternNotes();
    return runPatternCommand(flags, io, {
      label: 'optimal patterns',
      single: () => {
        const options = { ...base, fundamental: flags.fundamental } as OptimalPulseOptions;
        const result = callLibrary(() => optimalPulsePattern(options), { notes });
        return singlePatternRun(result, () => patternText(result));
      },
      table: (range, onProgress) => {
        const options = { ...base, fundamentals: range, onProgress } as OptimalPulseSweepOptions;
        const result = callLibrary(() => optimalPulseSweep(options), { notes });
        return {
          result,
          text: () => sweepText(result, options),
          csv: () => sweepCsv(result),
          failure: result.solvedFraction === 0 ? result.message : null,
        };
      },
    });
  });
  return command;
}

function patternText(result: OptimalPulseResult): string {
  const title = patternTitle(
    'Optimal pulse pattern',
    result.kind,
    result.angles.length,
    result.vdc,
  );
  return formatPattern(title, result, [
    `objective (weighted distortion) ${formatPercent(result.objective)} %`,
  ]);
}

function angleCount(result: OptimalPulseSweepResult): number {
  return Math.max(0, ...result.points.map((p) => p.angles.length));
}

function sweepText(result: OptimalPulseSweepResult, options: OptimalPulseSweepOptions): string {
  const count = angleCount(result);
  const head = `${patternTitle('Optimal pulse pattern table', options.kind, count, options.vdc)}, objective ${options.objective ?? 'wthd'}\n${result.message}\n\n`;
  const headers = [
    'fundamental (V peak)',
    'objective (%)',
    'followed',
    ...Array.from({ length: count }, (_, k) => `α${k + 1} (°)`),
  ];
  const rows = result.points.map((p) => [
    formatNumber(p.fundamental),
    p.converged ? formatPercent(p.objective) : 'none',
    p.continued ? 'yes' : 'no',
    ...Array.from({ length: count }, (_, k) =>
      p.converged ? formatDegrees(p.angles[k] as number) : '—',
    ),
  ]);
  return head + formatTable(headers, rows);
}

function sweepCsv(result: OptimalPulseSweepResult): string {
  const count = angleCount(result);
  return toCsv([
    [
      'fundamental_V_peak',
      'converged',
      'continued',
      'objective_ratio',
      ...Array.from({ length: count }, (_, k) => `alpha${k + 1}_rad`),
    ],
    ...result.points.map((p) => [
      p.fundamental,
      p.converged,
      p.continued,
      p.converged ? p.objective : null,
      ...Array.from({ length: count }, (_, k) => p.angles[k] ?? null),
    ]),
  ]);
}
