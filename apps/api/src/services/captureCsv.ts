import { parse } from 'csv-parse/sync';
import type { CaptureSeries } from '../models/index.js';
import { HttpError } from '../http/errors.js';

/** Header names accepted for each column (case-insensitive, units in brackets ignored). */
const COLUMN_NAMES: Record<'time' | 'voltage' | 'current', readonly string[]> = {
  time: ['time', 't', 'time_s', 'seconds', 's'],
  voltage: ['voltage', 'v', 'voltage_v', 'volts'],
  current: ['current', 'i', 'current_a', 'amps', 'amperes'],
};

/** Time steps may differ from their mean by this fraction (bench scopes round their time stamps). */
export const TIME_STEP_TOLERANCE = 0.01;
export const MIN_CAPTURE_ROWS = 16;
export const MAX_CAPTURE_ROWS = 1_000_000;

export interface ParsedCapture {
  series: CaptureSeries;
  columns: ('time' | 'voltage' | 'current')[];
  rows: number;
  sampleRate: number;
  duration: number;
}

const reject = (message: string, path = 'file'): HttpError =>
  new HttpError(400, message, [{ path, message }]);

/**
 * Checks and parses a bench capture: UTF-8 text, a header naming time and voltage (and
 * optionally current) columns, numeric cells, strictly rising time with an even step. The
 * error names the line of the file and the reason.
 */
export function parseCaptureCsv(buffer: Buffer): ParsedCapture {
  if (buffer.length === 0)
    throw reject('file is empty; upload a CSV with a header and at least 16 rows');
  // Content, not the file name, decides: text without NUL bytes, valid UTF-8.
  if (buffer.includes(0)) throw reject('file is not text (it holds NUL bytes); upload a CSV file');
  const text = new TextDecoder('utf-8', { fatal: false }).decode(buffer);
  if (text.includes('\uFFFD')) throw reject('file is not UTF-8 text; export the capture as CSV');
  // The original bytes are offered for download, so a cell a spreadsheet would run as a formula
  // (even in a comment line the parser skips) is refused: OWASP, "CSV Injection".
  const formula = formulaCells(text)[0];
  if (formula) {
    throw reject(
      `line ${formula.line}: the cell ${JSON.stringify(formula.cell.slice(0, 40))} begins with ${JSON.stringify(formula.cell[0])}, which a spreadsheet runs as a formula; remove it or prefix it with '`,
      `file.line${formula.line}`,
    );
  }
  let records: string[][];
  try {
    records = parse(text.replace(/^\uFEFF/, ''), {
      skip_empty_lines: true,
      trim: true,
      relax_column_count: false,
      comment: '#',
      delimiter: [',', ';', '\t'],
    });
  } catch (error) {
    const line = (error as { lines?: number }).lines;
    throw reject(
      `file is not valid CSV${line ? ` at line ${line}` : ''}: ${(error as Error).message.replace(/^.*?: /, '')}`,
    );
  }
  const header = records[0];
  if (!header)
    throw reject('file has no header row; the first line must name the columns, e.g. time,voltage');
  const columns = header.map((name) => columnOf(name));
  const unknown = header.filter((_, i) => columns[i] === undefined);
  if (unknown.length) {
    throw reject(
      `line 1: unknown column ${unknown.map((u) => JSON.stringify(u)).join(', ')}; allowed columns are time, voltage and optionally current`,
    );
  }
  for (const name of ['time', 'voltage'] as const) {
    if (!columns.includes(name))
      throw reject(
        `line 1: the header has no ${name} column; columns must be time, voltage and optionally current`,
      );
  }
  const duplicate = columns.find((c, i) => columns.indexOf(c) !== i);
  if (duplicate) throw reject(`line 1: the ${duplicate} column appears twice`);
  const rows = records.length - 1;
  if (rows < MIN_CAPTURE_ROWS)
    throw reject(`file has ${rows} data rows; at least ${MIN_CAPTURE_ROWS} are needed`);
  if (rows > MAX_CAPTURE_ROWS)
    throw reject(`file has ${rows} data rows; at most ${MAX_CAPTURE_ROWS} are allowed`);

  const series: CaptureSeries = {
    time: [],
    voltage: [],
    ...(columns.includes('current') ? { current: [] } : {}),
  };
  for (let r = 1; r < records.length; r++) {
    const record = records[r] as string[];
    record.forEach((cell, c) => {
      const value = cell === '' ? NaN : Number(cell);
      const column = columns[c] as 'time' | 'voltage' | 'current';
      if (!Number.isFinite(value)) {
        throw reject(
          `line ${r + 1}: ${column} is ${JSON.stringify(cell.slice(0, 30))}, not a finite number`,
          `file.line${r + 1}.${column}`,
        );
      }
      (series[column] as number[]).push(value);
    });
  }
  const time = series.time;
  for (let i = 1; i < time.length; i++) {
    if (!((time[i] as number) > (time[i - 1] as number))) {
      throw reject(
        `line ${i + 2}: time ${time[i]} does not rise after ${time[i - 1]} (line ${i + 1}); time must increase strictly`,
        `file.line${i + 2}.time`,
      );
    }
  }
  const duration = (time[time.length - 1] as number) - (time[0] as number);
  const step = duration / (time.length - 1);
  for (let i = 1; i < time.length; i++) {
    const dt = (time[i] as number) - (time[i - 1] as number);
    if (Math.abs(dt - step) > TIME_STEP_TOLERANCE * step) {
      throw reject(
        `line ${i + 2}: the time step is ${dt} s where the mean step is ${step} s; samples must be evenly spaced (within 1 %)`,
        `file.line${i + 2}.time`,
      );
    }
  }
  return {
    series,
    columns: (['time', 'voltage', 'current'] as const).filter((c) => columns.includes(c)),
    rows,
    sampleRate: 1 / step,
    duration: duration + step,
  };
}

/** Cells a spreadsheet would run as a formula: beginning with = + - @ (or tab, CR), not a plain number. */
const FORMULA_START = /^[=+\-@\t\r]/;
const PLAIN_NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i;

export interface FormulaCell {
  /** 1-based line of the file. */
  line: number;
  cell: string;
  /** Offset in the text of the cell's first character (inside its quotes when quoted). */
  offset: number;
}

/**
 * Every cell of `text` a spreadsheet would treat as a formula (OWASP, "CSV Injection":
 * cells beginning with = + - @, tab or carriage return), splitting on `,`, `;` and tab as the
 * upload accepts them, with double quotes honoured, comment lines included. Plain numbers such
 * as `-1.5e3` are not formulas.
 */
export function formulaCells(text: string): FormulaCell[] {
  const found: FormulaCell[] = [];
  let line = 1;
  let cell = '';
  let start = -1;
  let quoted = false;
  const end = (): void => {
    if (start >= 0 && FORMULA_START.test(cell) && !PLAIN_NUMBER.test(cell.trim()))
      found.push({ line, cell, offset: start });
    cell = '';
    start = -1;
  };
  for (let i = 0; i < text.length; i++) {
    const ch = text[i] as string;
    if (ch === '"') {
      if (quoted && text[i + 1] === '"') {
        if (start < 0) start = i;
        cell += '"';
        i++;
      } else quoted = !quoted;
    } else if (!quoted && (ch === ',' || ch === ';' || ch === '\t')) {
      end();
    } else if (!quoted && (ch === '\n' || (ch === '\r' && text[i + 1] === '\n'))) {
      end();
      if (ch === '\r') i++;
      line++;
    } else {
      if (start < 0) start = i;
      cell += ch;
    }
  }
  end();
  return found;
}

/**
 * `text` with every formula cell prefixed by `'` so a spreadsheet shows it as text (OWASP,
 * "CSV Injection"); the text itself when it holds none. Used on download, for files stored
 * before uploads were checked.
 */
export function escapeFormulaCells(text: string): string {
  const cells = formulaCells(text);
  if (cells.length === 0) return text;
  let out = '';
  let from = 0;
  for (const { offset } of cells) {
    out += `${text.slice(from, offset)}'`;
    from = offset;
  }
  return out + text.slice(from);
}

function columnOf(name: string): 'time' | 'voltage' | 'current' | undefined {
  const key = name
    .toLowerCase()
    .replace(/\s*[([].*[)\]]\s*$/, '')
    .trim()
    .replace(/\s+/g, '_');
  return (Object.keys(COLUMN_NAMES) as (keyof typeof COLUMN_NAMES)[]).find((c) =>
    COLUMN_NAMES[c].includes(key),
  );
}

/** A file name safe to store and to put in a Content-Disposition header. */
export function sanitiseFileName(name: string | undefined): string {
  const base = (name ?? '').split(/[\\/]/).pop() ?? '';
  const clean = base
    .normalize('NFKC')
    .replace(/[^A-Za-z0-9._ -]/g, '_')
    .replace(/^[.\s]+/, '')
    .slice(0, 100)
    .trim();
  return clean || 'capture.csv';
}
