/** ISO 8601 text of a date column (the API never returns Date objects). */
export function iso(date: Date | string): string {
  return (date instanceof Date ? date : new Date(date)).toISOString();
}

export function isoOrNull(date: Date | string | null | undefined): string | null {
  return date === null || date === undefined ? null : iso(date);
}
