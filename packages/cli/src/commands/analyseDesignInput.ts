import {
  analyseDesign,
  assertInverterDesign,
  type AnalyseDesignOptions,
  type DesignReport,
  type InverterDesign,
} from '@pulsewright/modulation';
import { callLibrary } from '../input/callLibrary.js';
import { readDesignInput, type DesignInput } from '../input/designInput.js';

/** The report options, as the library names them, and the flag that sets each. */
const REPORT_OPTION_FLAGS = {
  maxOrder: '--max-order',
  points: '--points',
  busVoltage: '--bus-voltage',
} as const;

export const REPORT_OPTION_FIELDS = Object.keys(REPORT_OPTION_FLAGS);

/** A design read and checked by the library, with the notes its errors end with. */
export interface CheckedDesign {
  design: InverterDesign;
  input: DesignInput;
}

/**
 * Reads the design (file and flags) and checks it with the library's `assertInverterDesign`;
 * errors name the field as `design.<path>`.
 */
export function readCheckedDesign(
  file: string | undefined,
  flags: Record<string, unknown>,
  read?: { document: unknown },
): CheckedDesign {
  const input = readDesignInput(file, flags, read);
  const { design, notes } = input;
  callLibrary(() => assertInverterDesign(design), { prefix: 'design.', notes });
  return { design: design as InverterDesign, input };
}

/**
 * The design report of the design on the command line, by the library's `analyseDesign`.
 * Options come from the flags, else from an API request file, else the library's defaults.
 */
export function analyseDesignInput(
  file: string | undefined,
  flags: Record<string, unknown>,
): { design: InverterDesign; report: DesignReport } {
  const { design, input } = readCheckedDesign(file, flags);
  const options: AnalyseDesignOptions = { ...input.options };
  const notes = new Map(input.notes);
  for (const [field, flag] of Object.entries(REPORT_OPTION_FLAGS)) {
    const value = flags[field];
    if (value !== undefined) {
      (options as Record<string, unknown>)[field] = value;
      notes.set(field, `from ${flag}`);
    }
  }
  const report = callLibrary(() => analyseDesign(design, options), {
    prefix: 'design.',
    keep: REPORT_OPTION_FIELDS,
    notes,
  });
  return { design, report };
}
