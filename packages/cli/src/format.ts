/**
 * Text for people: numbers and aligned tables, for every command's default
 * (text) output. Machine output (JSON, CSV) keeps every digit and goes
 * through output.ts instead.
 */

/** A number for people: `digits` significant figures, exponent form outside [1e-4, 1e6). */
export function formatNumber(value: number, digits = 10): string {
  if (value === 0 || !Number.isFinite(value)) return String(value);
  const magnitude = Math.abs(value);
  if (magnitude >= 1e-4 && magnitude < 1e6) return String(Number(value.toPrecision(digits)));
  return value
    .toExponential(digits - 1)
    .replace(/\.?0+e/, 'e')
    .replace('e+', 'e');
}

/** An error estimate or residual for people: two figures in exponent form, e.g. 3.2e-9. */
export function formatError(value: number): string {
  return value.toExponential(1);
}

/** Rows of text cells as lines with left-aligned columns, two spaces apart. */
export function formatTable(rows: readonly (readonly string[])[], indent = '  '): string {
  const columns = Math.max(...rows.map((row) => row.length));
  const widths = Array.from({ length: columns }, (_, i) => Math.max(...rows.map((row) => (row[i] ?? '').length)));
  return rows.map((row) => (indent + row.map((cell, i) => cell.padEnd(widths[i])).join('  ')).trimEnd()).join('\n') + '\n';
}
