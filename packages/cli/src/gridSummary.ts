/** The stderr summary of a grid's tables, shared by `penumbra table` and `penumbra merge`. */
import type { TableSummary } from '@penumbra/grid';

/** Rows and failed rows per table, e.g. `modes 42 rows (0 failed)`. */
export function countsText(summary: TableSummary): string {
  return Object.entries(summary.rows)
    .map(([t, n]) => `${t} ${n} rows (${summary.failed[t as keyof typeof summary.failed]} failed)`)
    .join(', ');
}

/** One line per failed row, at most `limit`. */
export function failuresText(summary: TableSummary, limit = 20): string {
  const lines = summary.failures.slice(0, limit).map((f) => {
    const mode = f.l !== undefined ? ` l=${f.l} m=${f.m}` : '';
    const field = `${f.species !== undefined ? `${f.species} ` : ''}spin=${f.spin}${f.fieldMass !== undefined ? ` Mμ=${f.fieldMass}` : ''}`;
    return `  ${f.status} ${f.table}: ${field} a=${f.a} ω=${f.omega}${mode}: ${f.message}\n`;
  });
  if (summary.failures.length > limit) lines.push(`  … and ${summary.failures.length - limit} more (see table.json "summary")\n`);
  return lines.join('');
}
