// Number and label formatting for the validation report: one formatter for
// every section, so a number reads the same wherever it appears; spins are
// written by the project's own formatFieldSpin.
import { FIELD_SPINS, formatFieldSpin } from '@penumbra/core';

/** `digits` significant figures; exponent form outside [1e-3, 1e6). */
export function sig(x, digits = 6) {
  if (!Number.isFinite(x)) return String(x);
  if (x === 0) return '0';
  const ax = Math.abs(x);
  return ax >= 1e-3 && ax < 1e6 ? String(Number(x.toPrecision(digits))) : x.toExponential(digits - 1);
}

/** A relative difference or error: two significant figures in exponent form. */
export const rel = (x) => (Number.isFinite(x) ? x.toExponential(1) : String(x));

/** A fraction as per cent with `d` significant figures. */
export const pct = (x, d = 3) => `${(100 * x).toPrecision(d)} %`;

/** A Markdown table; `|` in cells is escaped. */
export function mdTable(header, rows) {
  const cell = (x) => String(x).replaceAll('|', '\\|');
  return [
    `| ${header.map(cell).join(' | ')} |`,
    `| ${header.map(() => '---').join(' | ')} |`,
    ...rows.map((r) => `| ${r.map(cell).join(' | ')} |`),
  ].join('\n');
}

/** The field spins the report covers. */
export const SPINS = FIELD_SPINS;

/** A field's name in words with its spin. */
export const spinName = { 0: 'scalar (s = 0)', 0.5: 'neutrino (s = 1/2)', 1: 'photon (s = 1)', 2: 'graviton (s = 2)' };

/** A field spin or spin weight as written: '1/2' for 0.5. */
export const spinLabel = formatFieldSpin;

/** An integer or half-integer as written: '3/2' for 1.5. */
export const halfLabel = (x) => (Number.isInteger(x) ? String(x) : `${Math.round(2 * x)}/2`);

/** Series sorted by name: the report's figures list their legends alphabetically. */
export const inLegendOrder = (series) => [...series].sort((p, q) => (p.name < q.name ? -1 : p.name > q.name ? 1 : 0));
