import { stringify } from 'csv-stringify/sync';
import type { DesignReport } from '@pulsewright/modulation';
import type { SpectrumResult, WaveformResult } from './compute.js';

/**
 * CSV as the timer-table download writes it (RFC 4180, CRLF line ends), numbers in JavaScript's
 * shortest round-trip form so the values read back equal the JSON answer's. A text cell that a
 * spreadsheet would run as a formula (`=`, `+`, `-`, `@`, tab, carriage return first) is written
 * with a leading single quote (CSV injection; common practice, OWASP guidance, from memory).
 */
function csv(rows: (string | number)[][]): string {
  const safe = rows.map((row) =>
    row.map((cell) => (typeof cell === 'string' && /^[=+\-@\t\r]/.test(cell) ? `'${cell}` : cell)),
  );
  return stringify(safe, { record_delimiter: '\r\n', cast: { number: (n) => String(n) } });
}

/**
 * A spectrum as CSV: one row per order, units in the header (`amplitude_V_peak` peak volts,
 * `phase_rad` radians of sin(order·θ + phase), as the JSON's `harmonics`). THD and WTHD are not
 * rows of a table; they stay in the JSON answer.
 */
export function spectrumCsv(result: SpectrumResult): string {
  return csv([
    ['order', 'amplitude_V_peak', 'phase_rad'],
    ...result.harmonics.map((h) => [h.order, h.amplitude, h.phase]),
  ]);
}

/**
 * Every named voltage of a waveform answer as CSV, one row per edge: the voltage's name, the
 * edge's index, its angle (radians of the fundamental, [0, 2π)) and the level (volts) held from
 * it to the next edge (the last wraps round to the first), as the JSON's `traces`.
 */
export function waveformCsv(result: WaveformResult): string {
  return csv([
    ['voltage', 'edge', 'angle_rad', 'level_V'],
    ...result.traces.flatMap((trace) =>
      trace.waveform.edges.map((angle, i) => [
        trace.name,
        i,
        angle,
        trace.waveform.levels[i] as number,
      ]),
    ),
  ]);
}

/**
 * The spectra of a design report as CSV, one row per order of each voltage the report analyses
 * (the bridge, the line-to-line voltage of a three-phase bridge, the filter's output): the
 * voltage's name, the order, its carrier-group label, its frequency (order × the fundamental,
 * hertz), amplitude (peak volts) and phase (radians), as the report's `spectrum` arrays. The
 * report's single figures (THD, currents, limit check) stay in the JSON answer.
 */
export function reportSpectraCsv(report: DesignReport): string {
  const voltages = [report.bridge, report.lineToLine, report.output].filter(
    (v): v is NonNullable<typeof v> => v !== null,
  );
  return csv([
    ['voltage', 'order', 'label', 'frequency_Hz', 'amplitude_V_peak', 'phase_rad'],
    ...voltages.flatMap((v) =>
      v.spectrum.map((h) => [
        v.name,
        h.order,
        h.label,
        h.order * report.fundamentalFrequency,
        h.amplitude,
        h.phase,
      ]),
    ),
  ]);
}
