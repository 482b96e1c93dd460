/** How a column lines up. */
export type Align = 'left' | 'right';

/**
 * Lays out rows as aligned columns separated by two spaces. Columns are sized to their widest
 * cell; the last column is not padded.
 */
export function textTable(
  rows: readonly (readonly string[])[],
  align: readonly Align[],
  indent = '  ',
): string[] {
  const widths: number[] = [];
  for (const row of rows)
    row.forEach((cell, i) => (widths[i] = Math.max(widths[i] ?? 0, [...cell].length)));
  return rows.map((row) => {
    const cells = row.map((cell, i) => {
      const pad = ' '.repeat(widths[i] - [...cell].length);
      if (i === row.length - 1 && align[i] !== 'right') return cell;
      return align[i] === 'right' ? pad + cell : cell + pad;
    });
    return (indent + cells.join('  ')).trimEnd();
  });
}
