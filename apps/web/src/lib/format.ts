/** Number formatting for tables and readouts (display only; no modulation math). */
export function formatNumber(value: number, digits = 4): string {
  if (!Number.isFinite(value)) return '—';
  if (value === 0) return '0';
  const magnitude = Math.abs(value);
  if (magnitude >= 1e5 || magnitude < 1e-3) return value.toExponential(digits - 1);
  return Number(value.toPrecision(digits)).toString();
}

export function formatPercent(ratio: number, digits = 2): string {
  return Number.isFinite(ratio) ? `${(ratio * 100).toFixed(digits)} %` : '—';
}

/**
 * The worst single order of a limit check and its share of the fundamental, at `digits` decimals
 * of a per cent; when even that share rounds to zero no order is named (which one is largest is
 * then rounding noise): "every order under" half the last digit shown.
 */
export function formatWorstOrder(worst: { order: number; ratio: number }, digits = 2): string {
  const shown = formatPercent(worst.ratio, digits);
  if (shown !== formatPercent(0, digits)) return `${worst.order} at ${shown}`;
  return `every order under ${formatPercent(0.5 * 10 ** -(digits + 2), digits + 1)}`;
}

export function formatDate(iso: string): string {
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? iso : date.toLocaleString();
}

/** A voltage gain as a ratio and in decibels, 20·log10 (display only). */
export function formatGain(ratio: number): string {
  if (!Number.isFinite(ratio) || ratio <= 0) return formatNumber(ratio, 3);
  return `${formatNumber(ratio, 3)} (${(20 * Math.log10(ratio)).toFixed(1)} dB)`;
}
