/**
 * The tables a grid run writes and their columns. A row is a flat object
 * keyed by column; a value is a number, a string or null (null: not computed,
 * e.g. every number of a failed row). Units are geometric, M = 1.
 */
import type { GridSpec } from './grid.js';

export type Cell = number | string | null;
export type Row = Record<string, Cell>;

export interface Column {
  key: string;
  /** unit in geometric units (G = c = ħ = 1, hole mass M = 1); '' for counts, labels and pure numbers */
  unit: string;
  description: string;
}

export type TableName = 'modes' | 'crossSection' | 'spectra';
export const TABLE_NAMES: readonly TableName[] = ['modes', 'crossSection', 'spectra'];
export const TABLE_FILES: Readonly<Record<TableName, string>> = {
  modes: 'modes.csv',
  crossSection: 'cross-section.csv',
  spectra: 'spectra.csv',
};

const pointColumns: Column[] = [
  { key: 's', unit: '1', description: 'field spin' },
  { key: 'a', unit: 'M', description: 'hole spin parameter a = J/M' },
  { key: 'omega', unit: '1/M', description: 'wave frequency ω' },
];
const status: Column = { key: 'status', unit: '', description: "'ok', or 'failed' (numbers left empty, reason in 'failure')" };
const failure: Column = { key: 'failure', unit: '', description: 'why the row failed, with the solver diagnostics' };

export function tableColumns(grid: GridSpec, table: TableName): Column[] {
  if (table === 'modes') {
    const reflection = grid.quantities.includes('reflection');
    return [
      ...pointColumns,
      { key: 'l', unit: '1', description: 'spheroidal index l' },
      { key: 'm', unit: '1', description: 'azimuthal number m' },
      status,
      { key: 'gamma', unit: '1', description: 'greybody factor Γ (absorbed fraction of the incident flux; < 0 when superradiant)' },
      { key: 'relError', unit: '1', description: 'estimated relative error of Γ' },
      ...(reflection
        ? [
            { key: 'reflection', unit: '1', description: 'reflected fraction, from an independent solve' },
            { key: 'residual', unit: '1', description: '|Γ + reflection − 1|, a check of both solves' },
          ]
        : []),
      { key: 'steps', unit: '', description: 'integrator steps' },
      { key: 'rhsEvaluations', unit: '', description: 'right-hand-side evaluations' },
      failure,
    ];
  }
  if (table === 'crossSection') {
    return [
      ...pointColumns,
      status,
      { key: 'sigma', unit: 'M^2', description: 'absorption cross-section σ = (π/ω²) Σ Γ of one helicity' },
      { key: 'relError', unit: '1', description: 'estimated relative error of σ (mode errors plus dropped l-shells)' },
      { key: 'droppedBound', unit: 'M^2', description: 'bound on the l-shells not summed' },
      { key: 'lMax', unit: '1', description: 'largest l summed' },
      { key: 'modes', unit: '', description: 'greybody solves' },
      failure,
    ];
  }
  return [
    ...pointColumns,
    status,
    { key: 'number', unit: '1', description: 'd²N/(dt dω) per degree of freedom' },
    { key: 'energy', unit: '1/M', description: 'd²E/(dt dω) per degree of freedom' },
    { key: 'torque', unit: '1', description: 'd²J/(dt dω) per degree of freedom' },
    { key: 'relError', unit: '1', description: "estimated relative error of 'number'" },
    { key: 'droppedBound', unit: '1', description: "bound on the dropped part of 'number'" },
    { key: 'lMax', unit: '1', description: 'largest l summed' },
    { key: 'modes', unit: '', description: 'greybody solves' },
    failure,
  ];
}

/** The tables a grid produces, in file order. */
export function gridTables(grid: GridSpec): TableName[] {
  const q = grid.quantities;
  const out: TableName[] = [];
  if (q.includes('gamma') || q.includes('reflection')) out.push('modes');
  if (q.includes('crossSection')) out.push('crossSection');
  if (q.includes('spectra')) out.push('spectra');
  return out;
}

/** CSV header cell: the key, with its unit in brackets when it has one. */
export function headerCell(column: Column): string {
  return column.unit ? `${column.key} [${column.unit}]` : column.key;
}
