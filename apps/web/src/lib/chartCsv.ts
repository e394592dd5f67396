import { toCsv } from './download';

/**
 * The data a chart draws, as CSV with the unit of each column in its header (RFC 4180, one header
 * row; numbers in JavaScript's shortest round-trip form). Each function takes the chart's own
 * props, so the file holds exactly what the chart shows, in the library's units: radians of the
 * fundamental for angles, volts (peak for harmonics) or the unit the chart names.
 */

/** Harmonic amplitudes of one or more series, one row per order (the orders of the first). */
export function spectrumCsv(
  series: readonly {
    name: string;
    harmonics: readonly { order: number; amplitude: number; label?: string }[];
  }[],
  unit = 'V',
): string {
  const orders = [...new Set(series.flatMap((s) => s.harmonics.map((h) => h.order)))].sort(
    (a, b) => a - b,
  );
  const byOrder = series.map((s) => new Map(s.harmonics.map((h) => [h.order, h])));
  const labels = new Map(
    series.flatMap((s) => s.harmonics.filter((h) => h.label).map((h) => [h.order, h.label])),
  );
  return toCsv(
    ['order', 'label', ...series.map((s) => `${s.name} amplitude (${unit} peak)`)],
    orders.map((order) => [
      order,
      labels.get(order) ?? '',
      ...byOrder.map((m) => m.get(order)?.amplitude ?? ''),
    ]),
  );
}

/** y(x) series, one row per point: the series' name, x and y under the axes' labels. */
export function lineSeriesCsv(
  series: readonly { name: string; x: readonly number[]; y: readonly number[] }[],
  xLabel: string,
  yLabel: string,
): string {
  return toCsv(
    ['series', xLabel, yLabel],
    series.flatMap((s) => s.x.map((x, i) => [s.name, x, s.y[i] ?? ''])),
  );
}

/**
 * Quantities over one period: one column per trace when they share their angles, else one row
 * per point with the trace's name.
 */
export function periodTracesCsv(
  traces: readonly { name: string; angles: readonly number[]; values: readonly number[] }[],
  unit: string,
): string {
  const first = traces[0];
  const shared =
    first !== undefined &&
    traces.every(
      (t) =>
        t.angles.length === first.angles.length && t.angles.every((a, i) => a === first.angles[i]),
    );
  if (shared) {
    return toCsv(
      ['angle (rad)', ...traces.map((t) => `${t.name} (${unit})`)],
      first.angles.map((angle, i) => [angle, ...traces.map((t) => t.values[i] ?? '')]),
    );
  }
  return toCsv(
    ['trace', 'angle (rad)', `value (${unit})`],
    traces.flatMap((t) => t.angles.map((angle, i) => [t.name, angle, t.values[i] ?? ''])),
  );
}

/**
 * The waveform chart's signals, one row per edge or sample: the switched output's edges (the
 * level in volts held from that angle to the next edge), a smooth overlay in volts, and the
 * modulator's reference and carrier in per unit of the carrier peak, each in its own column.
 */
export function waveformChartCsv({
  output,
  outputName,
  overlay,
  modulator,
}: {
  output: { edges: readonly number[]; levels: readonly number[] };
  outputName: string;
  overlay?: { name: string; angles: readonly number[]; values: readonly number[] } | undefined;
  modulator?:
    | {
        angles: readonly number[];
        reference: readonly number[];
        carrier: readonly number[] | null;
        carriers?: readonly (readonly number[])[] | undefined;
      }
    | undefined;
}): string {
  const rows: (string | number)[][] = output.edges.map((angle, i) => [
    `${outputName} (level from this edge)`,
    angle,
    output.levels[i] ?? '',
    '',
  ]);
  if (overlay)
    overlay.angles.forEach((angle, i) =>
      rows.push([overlay.name, angle, overlay.values[i] ?? '', '']),
    );
  if (modulator) {
    modulator.angles.forEach((angle, i) =>
      rows.push(['reference', angle, '', modulator.reference[i] ?? '']),
    );
    const carrier = modulator.carrier;
    if (carrier)
      modulator.angles.forEach((angle, i) => rows.push(['carrier', angle, '', carrier[i] ?? '']));
    // A multilevel modulator's carriers, numbered as the report lists them (lowest band or cell 1 first).
    (modulator.carriers ?? []).forEach((values, k) =>
      modulator.angles.forEach((angle, i) =>
        rows.push([`carrier ${k + 1}`, angle, '', values[i] ?? '']),
      ),
    );
  }
  return toCsv(['signal', 'angle (rad)', 'voltage (V)', 'per unit of carrier peak'], rows);
}

/**
 * A space-vector switching sequence, one row per state: its start and end as fractions of the
 * switching period and each leg's gate (1 upper switch on, 0 lower), read from the state's digits.
 */
export function sequenceCsv(
  segments: readonly { state: string; from: number; to: number }[],
): string {
  return toCsv(
    [
      'state',
      'start (fraction of switching period)',
      'end (fraction of switching period)',
      'leg a',
      'leg b',
      'leg c',
    ],
    segments.map((s) => [s.state, s.from, s.to, ...s.state.split('').map(Number)]),
  );
}
