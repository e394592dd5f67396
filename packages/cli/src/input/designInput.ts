import { Option, type Command } from 'commander';
import type { AnalyseDesignOptions } from '@pulsewright/modulation';
import { InputError } from '../errors.js';
import { readDataFile } from './readDataFile.js';
import { parseNumber, parseNumberList, parseSetValue } from './parseValue.js';
import { setPath } from './setPath.js';

/** A design flag: the option, the field of the InverterDesign it sets, and how its text is read. */
interface DesignFlag {
  flag: string;
  /** Commander's attribute name for the option. */
  key: string;
  path: string;
  read: (text: string) => unknown;
  help: string;
}

const text = (value: string): string => value;

/** Flags that set a field of the design; a value given here replaces the design file's. */
export const DESIGN_FLAGS: readonly DesignFlag[] = [
  {
    flag: '--method <method>',
    key: 'method',
    path: 'modulation.method',
    read: text,
    help: 'modulation method (sine-triangle, three-phase, space-vector, selective-harmonic-elimination, optimal-pattern)',
  },
  {
    flag: '--scheme <scheme>',
    key: 'scheme',
    path: 'modulation.scheme',
    read: text,
    help: 'sine-triangle scheme: bipolar or unipolar',
  },
  {
    flag: '--ma <ma>',
    key: 'ma',
    path: 'modulation.ma',
    read: parseNumber,
    help: 'modulation index',
  },
  {
    flag: '--sampling <sampling>',
    key: 'sampling',
    path: 'modulation.sampling',
    read: text,
    help: 'carrier sampling: natural, regular-symmetric, regular-asymmetric',
  },
  {
    flag: '--zero-sequence <name>',
    key: 'zeroSequence',
    path: 'modulation.zeroSequence',
    read: text,
    help: 'three-phase zero sequence (none, third-harmonic, min-max, dpwm…)',
  },
  {
    flag: '--kind <kind>',
    key: 'kind',
    path: 'modulation.kind',
    read: text,
    help: 'stored pattern kind: bipolar or staircase',
  },
  {
    flag: '--angles <radians>',
    key: 'angles',
    path: 'modulation.angles',
    read: parseNumberList,
    help: 'stored pattern first-quarter angles, comma-separated radians',
  },
  { flag: '--vdc <volts>', key: 'vdc', path: 'vdc', read: parseNumber, help: 'DC bus, volts' },
  {
    flag: '--fundamental-frequency <hertz>',
    key: 'fundamentalFrequency',
    path: 'fundamentalFrequency',
    read: parseNumber,
    help: 'output frequency, hertz',
  },
  {
    flag: '--carrier-frequency <hertz>',
    key: 'carrierFrequency',
    path: 'carrierFrequency',
    read: parseNumber,
    help: 'carrier frequency, hertz (a whole multiple of the fundamental, or any ratio for sine-triangle, three-phase and space vector: analysed over q periods of its nearest p/q)',
  },
  {
    flag: '--load-r <ohms>',
    key: 'loadR',
    path: 'load.r',
    read: parseNumber,
    help: 'load resistance per phase, ohms',
  },
  {
    flag: '--load-l <henries>',
    key: 'loadL',
    path: 'load.l',
    read: parseNumber,
    help: 'load inductance per phase, henries',
  },
  {
    flag: '--filter-l <henries>',
    key: 'filterL',
    path: 'filter.l',
    read: parseNumber,
    help: 'LC filter inductance per phase, henries',
  },
  {
    flag: '--filter-c <farads>',
    key: 'filterC',
    path: 'filter.c',
    read: parseNumber,
    help: 'LC filter capacitance per phase, farads',
  },
];

/** Adds the design argument and flags to a command. */
export function addDesignOptions(command: Command): Command {
  command.argument(
    '[design]',
    'design file, JSON or YAML (an InverterDesign, or an API request { design, ... }); - reads standard input',
  );
  for (const { flag, help } of DESIGN_FLAGS)
    command.addOption(new Option(flag, help).helpGroup('Design:'));
  command.addOption(
    new Option(
      '--set <path=value>',
      'set any design field by its path, e.g. load.emf.amplitude=300 (JSON value); repeatable',
    )
      .argParser((value: string, previous: string[] | undefined) => [...(previous ?? []), value])
      .helpGroup('Design:'),
  );
  return command;
}

/** A design as read from the command line, not yet checked. */
export interface DesignInput {
  /** The design, unchecked (the library checks it). */
  design: unknown;
  /** Report options an API request file held beside the design (maxOrder, points, busVoltage). */
  options: AnalyseDesignOptions;
  /**
   * For each design field a flag can set (`design.modulation.ma`), the note an error about it
   * ends with: which flag set it, or which flag can.
   */
  notes: Map<string, string>;
}

const UNSAFE_KEYS = new Set(['__proto__', 'prototype', 'constructor']);

/**
 * Reads the design from the file (when given; `read` holds its document when the caller has
 * read it already, standard input being readable once) and applies the flags over it.
 * @throws InputError for an unreadable file, a document that is not an object, or a bad --set
 */
export function readDesignInput(
  file: string | undefined,
  flags: Record<string, unknown>,
  read?: { document: unknown },
): DesignInput {
  let design: Record<string, unknown> = {};
  let options: AnalyseDesignOptions = {};
  if (file !== undefined) {
    const document = read === undefined ? readDataFile(file, 'design file') : read.document;
    if (typeof document !== 'object' || document === null || Array.isArray(document)) {
      throw new InputError(
        'design',
        `design file ${file} must hold an object (an InverterDesign: vdc, fundamentalFrequency, carrierFrequency, modulation, …)`,
      );
    }
    const record = document as Record<string, unknown>;
    if (!('modulation' in record) && typeof record.design === 'object' && record.design !== null) {
      // An API request body ({ design, maxOrder, points, busVoltage }) as a script sent it.
      const { design: inner, maxOrder, points, busVoltage } = record;
      design = structuredClone(inner) as Record<string, unknown>;
      options = Object.fromEntries(
        Object.entries({ maxOrder, points, busVoltage }).filter(([, value]) => value !== undefined),
      );
    } else {
      design = structuredClone(record);
    }
  }
  const notes = new Map<string, string>();
  for (const { flag, key, path, read } of DESIGN_FLAGS) {
    const name = flag.split(' ')[0] as string;
    const value = flags[key];
    if (typeof value === 'string') {
      setPath(design, path, read(value));
      notes.set(`design.${path}`, `from ${name}`);
    } else {
      notes.set(`design.${path}`, `set it in the design file or with ${name}`);
    }
  }
  for (const entry of (flags.set as string[] | undefined) ?? []) {
    const at = entry.indexOf('=');
    const path = at > 0 ? entry.slice(0, at) : '';
    if (path === '' || path.split('.').some((key) => key === '' || UNSAFE_KEYS.has(key))) {
      throw new InputError(
        '--set',
        `--set must be path=value with a dotted design path such as load.r=4.2; got ${JSON.stringify(entry)}`,
      );
    }
    setPath(design, path, parseSetValue(entry.slice(at + 1)));
    notes.set(`design.${path}`, `from --set ${path}`);
  }
  return { design, options, notes };
}
