/** Hawking emission totals and spectra as CSV tables and as text, for `penumbra emission`. */
import { OMEGA_COLUMN, type Cell, type Column, type Table } from '@penumbra/core';
import { INACCURATE_COLUMN, isInaccurate } from './accuracy.js';
import { formatError, formatNumber, formatTable } from './format.js';

/** A total with its error estimate. */
export interface Estimate {
  value: number;
  relError: number;
}

/** The totals per degree of freedom, geometric units. */
export interface Totals {
  numberRate: Estimate;
  power: Estimate;
  torque: Estimate;
}

/** The totals in physical units (with --mass). */
export interface PhysicalTotals {
  numberRatePerSecond: number;
  powerWatts: number;
  torqueJoules: number;
}

/** One spectrum row as the JSON output has it (the physical keys with --mass). */
export interface SpectrumRow {
  omega: number;
  number: number;
  energy: number;
  torque: number;
  relError: number;
  lMax: number;
  /** relError above 1e-3 */
  inaccurate: boolean;
  energyGeV?: number;
  perGeVPerSecond?: number;
}

/** CSV columns of the spectrum: the keys of the JSON spectrum rows. */
const SPECTRUM_COLUMNS: Column[] = [
  OMEGA_COLUMN,
  { name: 'number', unit: '1', description: 'd²N/(dt dω) per degree of freedom' },
  { name: 'energy', unit: '1/M', description: 'd²E/(dt dω) per degree of freedom' },
  { name: 'torque', unit: '1', description: 'd²J/(dt dω) per degree of freedom' },
  { name: 'relError', unit: '1', description: "estimated relative error of 'number'" },
  { name: 'lMax', unit: '1', description: 'largest l summed' },
  INACCURATE_COLUMN,
];
/** Added with --mass. */
const PHYSICAL_SPECTRUM_COLUMNS: Column[] = [
  { name: 'energyGeV', unit: 'GeV', description: 'particle energy ħω' },
  { name: 'perGeVPerSecond', unit: 'GeV^-1 s^-1', description: 'd²N/(dt dE) per degree of freedom' },
];
/** CSV columns of the totals, one row per quantity and unit. */
const TOTALS_COLUMNS: Column[] = [
  { name: 'quantity', unit: '', description: 'numberRate, power or torque, per degree of freedom' },
  { name: 'value', unit: '', description: "the rate in the row's unit" },
  { name: 'unit', unit: '', description: 'unit of the value' },
  { name: 'relError', unit: '1', description: 'estimated relative error' },
  INACCURATE_COLUMN,
];

/** The totals as a table: geometric units, then physical units when given. */
export function totalsTable(totals: Totals, physical?: PhysicalTotals): Table {
  const rows: Cell[][] = [
    ['numberRate', totals.numberRate.value, '1/M', totals.numberRate.relError, isInaccurate(totals.numberRate.relError)],
    ['power', totals.power.value, '1/M^2', totals.power.relError, isInaccurate(totals.power.relError)],
    ['torque', totals.torque.value, '1/M', totals.torque.relError, isInaccurate(totals.torque.relError)],
  ];
  if (physical) {
    rows.push(
      ['numberRate', physical.numberRatePerSecond, 's^-1', totals.numberRate.relError, isInaccurate(totals.numberRate.relError)],
      ['power', physical.powerWatts, 'W', totals.power.relError, isInaccurate(totals.power.relError)],
      ['torque', physical.torqueJoules, 'J', totals.torque.relError, isInaccurate(totals.torque.relError)],
    );
  }
  return { columns: TOTALS_COLUMNS, rows };
}

/** The spectrum as a table, with the physical columns when `physical`. */
export function spectrumTable(rows: readonly SpectrumRow[], physical: boolean): Table {
  const columns = physical ? [...SPECTRUM_COLUMNS, ...PHYSICAL_SPECTRUM_COLUMNS] : SPECTRUM_COLUMNS;
  return { columns, rows: rows.map((r) => columns.map((c) => r[c.name as keyof SpectrumRow] ?? null)) };
}

/** Totals (and the spectrum, if any) as text for people. */
export function emissionText(
  totals: Totals,
  physical: PhysicalTotals | undefined,
  spectrum: readonly SpectrumRow[] | undefined,
): string {
  const t: string[][] = [
    ['quantity', 'value', 'rel. error'],
    ['dN/dt  [1/M]', formatNumber(totals.numberRate.value, 8), formatError(totals.numberRate.relError)],
    ['dE/dt  [1/M²]', formatNumber(totals.power.value, 8), formatError(totals.power.relError)],
    ['dJ/dt  [1/M]', formatNumber(totals.torque.value, 8), formatError(totals.torque.relError)],
  ];
  if (physical) {
    t.push(['dN/dt  [s⁻¹]', formatNumber(physical.numberRatePerSecond, 6), '']);
    t.push(['dE/dt  [W]', formatNumber(physical.powerWatts, 6), '']);
    t.push(['dJ/dt  [J]', formatNumber(physical.torqueJoules, 6), '']);
  }
  let out = formatTable(t);
  if (spectrum) {
    out += 'spectrum per degree of freedom:\n';
    out += formatTable(spectrumTextRows(spectrum));
  }
  return out;
}

/** The spectrum as aligned text rows, header first, with units: every column the JSON and CSV carry. */
export function spectrumTextRows(spectrum: readonly SpectrumRow[]): string[][] {
  const physical = spectrum.every((r) => r.energyGeV !== undefined && r.perGeVPerSecond !== undefined);
  const header = ['Mω', 'd²N/dtdω [1]', 'd²E/dtdω [1/M]', 'd²J/dtdω [1]', 'rel. error', 'l max'];
  if (physical) header.push('E [GeV]', 'd²N/dtdE [GeV⁻¹ s⁻¹]');
  return [
    header,
    ...spectrum.map((r) => {
      const cells = [
        formatNumber(r.omega, 6),
        formatNumber(r.number, 8),
        formatNumber(r.energy, 8),
        formatNumber(r.torque, 8),
        formatError(r.relError),
        String(r.lMax),
      ];
      if (physical) cells.push(formatNumber(r.energyGeV!, 6), formatNumber(r.perGeVPerSecond!, 6));
      return cells;
    }),
  ];
}
