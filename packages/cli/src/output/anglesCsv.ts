import { toCsv } from './toCsv.js';

/** First-quarter angles of one pattern as CSV: `angle,radians,degrees`, one row per angle. */
export function anglesCsv(angles: readonly number[]): string {
  return toCsv([
    ['angle', 'radians', 'degrees'],
    ...angles.map((a, k) => [`alpha${k + 1}`, a, (a * 180) / Math.PI]),
  ]);
}
