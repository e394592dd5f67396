import type { TimerTable } from './timerTableTypes.js';

/**
 * Internal to the timer-table writers: whether any entry of any channel has the compare sense
 * `'above'` (only the reduced common-mode methods' tables), so the CSV and the C header carry the
 * sense only where it is needed and every other table's file stays as it was.
 */
export function hasAboveSense(table: Pick<TimerTable, 'channels'>): boolean {
  return table.channels.some((channel) => channel.sense.includes('above'));
}
