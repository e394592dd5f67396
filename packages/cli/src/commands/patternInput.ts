import { Option, type Command } from 'commander';
import type { FundamentalRange } from '@pulsewright/modulation';
import { InputError } from '../errors.js';
import { parseNumberList } from '../input/parseValue.js';
import { numberOption } from './commonOptions.js';

/** The options the pattern commands (she, optimal-pattern) share, and the flag of each field. */
export const PATTERN_FIELD_FLAGS: Readonly<Record<string, string>> = {
  kind: '--kind',
  vdc: '--vdc',
  count: '--count',
  angles: '--angles',
  fundamental: '--fundamental',
  'fundamentals.from': '--from',
  'fundamentals.to': '--to',
  'fundamentals.points': '--points',
  fundamentals: '--from, --to and --points',
  starts: '--starts',
  seed: '--seed',
  maxOrder: '--max-order',
  objective: '--objective',
  eliminate: '--eliminate',
  maxBranches: '--branches',
};

/** Adds the options the pattern commands share. */
export function addPatternOptions(command: Command): Command {
  command.addOption(
    new Option('--kind <kind>', 'bipolar (two-level ±vdc) or staircase (equal DC cells)')
      .default('bipolar')
      .helpGroup('Pattern:'),
  );
  command.addOption(
    numberOption(
      '--vdc <volts>',
      'DC voltage: the bipolar level or each staircase cell, volts',
    ).helpGroup('Pattern:'),
  );
  command.addOption(
    numberOption('--count <angles>', 'number of first-quarter switching angles').helpGroup(
      'Pattern:',
    ),
  );
  command.addOption(
    new Option(
      '--angles <radians>',
      'starting guess: first-quarter angles, comma-separated radians (fixes the count)',
    )
      .argParser(parseNumberList)
      .helpGroup('Pattern:'),
  );
  command.addOption(
    numberOption('--fundamental <volts>', 'wanted fundamental, peak volts (one pattern)').helpGroup(
      'Pattern:',
    ),
  );
  command.addOption(
    numberOption('--from <volts>', 'first fundamental of a table, peak volts').helpGroup(
      'Table over the fundamental:',
    ),
  );
  command.addOption(
    numberOption('--to <volts>', 'last fundamental of a table, peak volts').helpGroup(
      'Table over the fundamental:',
    ),
  );
  command.addOption(
    numberOption('--points <count>', 'fundamentals in the table, evenly spaced').helpGroup(
      'Table over the fundamental:',
    ),
  );
  command.addOption(
    numberOption('--starts <count>', 'seeded starts tried by the search').helpGroup('Solver:'),
  );
  command.addOption(
    numberOption(
      '--seed <integer>',
      'seed of the deterministic start generator (default 1)',
    ).helpGroup('Solver:'),
  );
  return command;
}

/** The base options as the library names them, from the flags (left out where not given). */
export function patternBase(flags: Record<string, unknown>): Record<string, unknown> {
  const base: Record<string, unknown> = { kind: flags.kind, vdc: flags.vdc };
  for (const key of ['count', 'angles', 'starts', 'seed'] as const)
    if (flags[key] !== undefined) base[key] = flags[key];
  return base;
}

/**
 * The table's range of fundamentals, or null for a single pattern.
 * @throws InputError when both --fundamental and a range are given, or a range is incomplete
 */
export function fundamentalRange(flags: Record<string, unknown>): FundamentalRange | null {
  const given = (['from', 'to', 'points'] as const).filter((key) => flags[key] !== undefined);
  if (given.length === 0) return null;
  if (flags.fundamental !== undefined) {
    throw new InputError(
      '--fundamental',
      '--fundamental gives one pattern and --from/--to/--points a table: give one or the other',
    );
  }
  if (given.length < 3) {
    const missing = (['from', 'to', 'points'] as const)
      .filter((key) => flags[key] === undefined)
      .map((key) => `--${key}`);
    throw new InputError(
      missing[0] as string,
      `a table needs --from, --to and --points; ${missing.join(' and ')} missing`,
    );
  }
  return { from: flags.from, to: flags.to, points: flags.points } as FundamentalRange;
}

/** The notes errors end with: the option that sets the field. */
export function patternNotes(extra: Readonly<Record<string, string>> = {}): Map<string, string> {
  return new Map(
    Object.entries({ ...PATTERN_FIELD_FLAGS, ...extra }).map(([field, flag]) => [
      field,
      `option ${flag}`,
    ]),
  );
}
