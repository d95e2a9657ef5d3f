/**
 * The shape check `penumbra plot` runs on a table read from disk, so that a
 * hand-edited or truncated table.json is refused with one line naming the file
 * and the first bad entry instead of failing inside the figure code.
 */
const isRecord = (x: unknown): x is Record<string, unknown> => typeof x === 'object' && x !== null && !Array.isArray(x);
const isFiniteNumber = (x: unknown): boolean => typeof x === 'number' && Number.isFinite(x);
/** the keys every row needs to be placed in a figure */
const ROW_KEYS = ['spin', 'a', 'omega'];

/** The first problem of a table's shape, or undefined when it is well formed. */
export function tableShapeProblem(table: { tables?: unknown }): string | undefined {
  if (!isRecord(table.tables)) return 'tables is not an object';
  for (const [name, t] of Object.entries(table.tables)) {
    if (!isRecord(t) || !Array.isArray(t.columns) || !Array.isArray(t.rows)) return `tables.${name} lacks columns or rows`;
    const numeric: string[] = [];
    for (const [i, c] of (t.columns as unknown[]).entries()) {
      const key = isRecord(c) ? (c.name ?? c.key) : undefined;
      if (!isRecord(c) || typeof key !== 'string' || typeof c.unit !== 'string')
        return `tables.${name}.columns[${i}] is not a column`;
      if (c.unit !== '') numeric.push(key);
    }
    for (const [i, row] of (t.rows as unknown[]).entries()) {
      const where = `tables.${name}.rows[${i}]`;
      if (!isRecord(row)) return `${where} is not an object`;
      if (typeof row.status !== 'string') return `${where}.status is not a string`;
      for (const key of numeric) {
        const value = row[key];
        const required = ROW_KEYS.includes(key) || row.status === 'success' || row.status === 'ok';
        if (!(isFiniteNumber(value) || (!required && value === null)))
          return `${where}.${key} = ${JSON.stringify(value) ?? 'undefined'} is not a finite number`;
      }
    }
  }
  return undefined;
}
