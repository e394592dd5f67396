/** An integer query parameter the validator has already checked, or its default. */
export function intQuery(value: unknown, fallback: number): number {
  const number = typeof value === 'string' || typeof value === 'number' ? Number(value) : NaN;
  return Number.isInteger(number) ? number : fallback;
}
