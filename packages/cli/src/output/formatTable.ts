/**
 * A plain-text table: the header row, then the rows, columns padded to their widest cell, the
 * first column aligned left and the others right (numbers line up), two spaces between.
 */
export function formatTable(
  headers: readonly string[],
  rows: readonly (readonly string[])[],
): string {
  const all = [headers, ...rows];
  const widths = headers.map((_, column) =>
    Math.max(...all.map((row) => [...(row[column] ?? '')].length)),
  );
  const line = (row: readonly string[]): string =>
    row
      .map((cell, column) => {
        const pad = ' '.repeat((widths[column] ?? 0) - [...cell].length);
        return column === 0 ? cell + pad : pad + cell;
      })
      .join('  ')
      .trimEnd();
  return [line(headers), ...rows.map(line)].join('\n') + '\n';
}
