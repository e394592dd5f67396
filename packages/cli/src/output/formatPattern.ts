import type { QuarterWavePattern } from '@pulsewright/modulation';
import { formatDegrees, formatNumber } from './formatNumber.js';
import { formatTable } from './formatTable.js';

/** The headline of a pattern: its kind, angle count and DC voltage. */
export function patternTitle(what: string, kind: string, count: number, vdc: number): string {
  return `${what}, ${kind}, ${count} angle${count === 1 ? '' : 's'}, vdc ${formatNumber(vdc)} V`;
}

/**
 * One quarter-wave pattern as text: whether it met its goal and why, its fundamental and
 * modulation index m = V₁/(4·vdc/π) (N·4·vdc/π for a staircase of N cells, 4·ΣV_k/π for a
 * staircase of unequal cell sources V_k), and its angles in radians and degrees.
 */
export function formatPattern(
  title: string,
  pattern: QuarterWavePattern & { cellVoltages?: number[] },
  extra: string[] = [],
): string {
  const cells = pattern.kind === 'staircase' ? pattern.angles.length : 1;
  const sources = pattern.cellVoltages?.reduce((sum, v) => sum + v, 0);
  const m = pattern.fundamental / ((4 * (sources ?? cells * pattern.vdc)) / Math.PI);
  const limit =
    sources === undefined
      ? `4·vdc/π${cells > 1 ? ` × ${cells}` : ''}`
      : `4·ΣV_k/π = ${formatNumber((4 * sources) / Math.PI)} V`;
  const head =
    `${title}: ${pattern.converged ? 'converged' : 'NOT converged'}\n${pattern.message}\n` +
    `fundamental ${formatNumber(pattern.fundamental)} V peak (m = ${formatNumber(m)} of the ${pattern.kind === 'staircase' ? "staircase's" : "square wave's"} ${limit})\n` +
    extra.map((line) => `${line}\n`).join('') +
    '\n';
  return (
    head +
    formatTable(
      ['angle', 'radians', 'degrees'],
      pattern.angles.map((a, k) => [`α${k + 1}`, formatNumber(a, 10), formatDegrees(a)]),
    )
  );
}
