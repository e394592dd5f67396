/**
 * A reader of SPICE netlists, written for the tests from the format's published description
 * (the SPICE2 and SPICE3 user's guides: L. W. Nagel, "SPICE2: A computer program to simulate
 * semiconductor circuits", UC Berkeley ERL-M520, 1975; T. Quarles et al., SPICE3 Version 3f3
 * User's Manual, UC Berkeley, 1993; from memory): the first line is the title; a line beginning
 * with `*` is a comment; a line beginning with `+` continues the line before; `.end` ends the
 * deck; fields are separated by blanks, and commas, `=` and parentheses count as blanks; a number
 * may carry a scale factor (T, G, MEG, K, MIL, M, U, N, P, F) followed by letters that are ignored
 * (units); an independent voltage source is `Vname n+ n- ... PWL(t1 v1 t2 v2 ...)`, the time
 * points in increasing order.
 */
export interface ParsedSource {
  name: string;
  nodes: [string, string];
  points: [number, number][];
}

export interface ParsedNetlist {
  title: string;
  sources: ParsedSource[];
  /** The control lines (`.tran …`), without the `.end`. */
  controls: string[][];
}

const SCALE: [string, number][] = [
  ['MEG', 1e6],
  ['MIL', 25.4e-6],
  ['T', 1e12],
  ['G', 1e9],
  ['K', 1e3],
  ['M', 1e-3],
  ['U', 1e-6],
  ['N', 1e-9],
  ['P', 1e-12],
  ['F', 1e-15],
];

/** A SPICE number: a decimal with an optional exponent, then an optional scale factor and unit letters. */
export function spiceValue(field: string): number {
  const match = /^([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)([A-Za-z]*)$/.exec(field);
  if (match === null) throw new Error(`not a SPICE number: ${field}`);
  const suffix = (match[2] as string).toUpperCase();
  const scale = SCALE.find(([name]) => suffix.startsWith(name));
  return Number(match[1]) * (scale === undefined ? 1 : scale[1]);
}

export function parseSpiceNetlist(text: string): ParsedNetlist {
  const raw = text.split(/\r?\n/);
  const title = raw[0] ?? '';
  const lines: string[] = [];
  for (const line of raw.slice(1)) {
    if (line.startsWith('+')) {
      if (lines.length === 0) throw new Error('a continuation line with nothing to continue');
      lines[lines.length - 1] += ` ${line.slice(1)}`;
    } else lines.push(line);
  }
  const sources: ParsedSource[] = [];
  const controls: string[][] = [];
  for (const line of lines) {
    const trimmed = line.trim();
    if (trimmed === '' || trimmed.startsWith('*')) continue;
    const fields = trimmed.split(/[\s,=()]+/).filter((f) => f !== '');
    const head = (fields[0] as string).toUpperCase();
    if (head === '.END') break;
    if (head.startsWith('.')) {
      controls.push(fields);
      continue;
    }
    if (!head.startsWith('V')) throw new Error(`an element this reader does not know: ${trimmed}`);
    const at = fields.findIndex((f) => f.toUpperCase() === 'PWL');
    if (at < 0) throw new Error(`a voltage source without PWL: ${trimmed}`);
    const values = fields.slice(at + 1).map(spiceValue);
    if (values.length % 2 !== 0) throw new Error(`PWL of ${fields[0]} has an odd number of values`);
    const points: [number, number][] = [];
    for (let i = 0; i < values.length; i += 2) {
      const point: [number, number] = [values[i] as number, values[i + 1] as number];
      const last = points[points.length - 1];
      if (last !== undefined && !(point[0] > last[0]))
        throw new Error(`PWL times of ${fields[0]} do not increase at ${point[0]}`);
      points.push(point);
    }
    sources.push({
      name: fields[0] as string,
      nodes: [fields[1] as string, fields[2] as string],
      points,
    });
  }
  return { title, sources, controls };
}
