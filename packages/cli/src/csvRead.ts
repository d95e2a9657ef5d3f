/**
 * Reading back the CSV the commands write (core's toCsv): a header of
 * `name [unit]` cells, RFC 4180 quoting, numbers in shortest round-trip form,
 * `true`/`false`, and empty cells for missing values.
 */
import type { Cell } from '@penumbra/core';

/** Rows keyed by column name (the header cell without its `[unit]`). */
export function parseCsvRows(text: string): Record<string, Cell>[] {
  const records = parseRecords(text);
  if (records.length === 0) return [];
  const names = records[0].map((h) => h.replace(/\s*\[[^\]]*\]\s*$/, '').trim());
  return records.slice(1).map((record) => Object.fromEntries(names.map((name, i) => [name, cell(record[i] ?? '')])));
}

/** The units in a CSV header, by column name ('' where none is given). */
export function csvUnits(text: string): Record<string, string> {
  const header = parseRecords(text.split(/\r?\n/, 1)[0] ?? '')[0] ?? [];
  return Object.fromEntries(
    header.map((h) => {
      const match = /^(.*?)\s*\[([^\]]*)\]\s*$/.exec(h);
      return match ? [match[1].trim(), match[2]] : [h.trim(), ''];
    }),
  );
}

function cell(text: string): Cell {
  if (text === '') return null;
  if (text === 'true') return true;
  if (text === 'false') return false;
  if (text === 'NaN') return Number.NaN;
  if (text === 'Infinity') return Infinity;
  if (text === '-Infinity') return -Infinity;
  const value = Number(text);
  return text.trim() !== '' && Number.isFinite(value) ? value : text;
}

/** RFC 4180 records; blank lines are skipped. */
function parseRecords(text: string): string[][] {
  const records: string[][] = [];
  let record: string[] = [];
  let field = '';
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const c = text[i];
    if (quoted) {
      if (c === '"' && text[i + 1] === '"') {
        field += '"';
        i++;
      } else if (c === '"') quoted = false;
      else field += c;
    } else if (c === '"') quoted = true;
    else if (c === ',') {
      record.push(field);
      field = '';
    } else if (c === '\n' || c === '\r') {
      if (c === '\r' && text[i + 1] === '\n') i++;
      record.push(field);
      if (record.some((f) => f !== '')) records.push(record);
      record = [];
      field = '';
    } else field += c;
  }
  record.push(field);
  if (record.some((f) => f !== '')) records.push(record);
  return records;
}
