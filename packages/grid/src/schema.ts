/**
 * The tables a grid run writes and their columns, in core's table model: a
 * column has a camelCase name (the CSV header `name [unit]` and the JSON key
 * alike), a unit and a description. A row is a flat object keyed by column
 * name; a value is a number, a string or null (null: not computed, e.g.
 * every number of a failed row). Units are geometric, M = 1.
 */
import {
  FIELD_MASS_COLUMN,
  GAMMA_COLUMN,
  HOLE_SPIN_COLUMN,
  L_COLUMN,
  M_COLUMN,
  OMEGA_COLUMN,
  SPIN_COLUMN,
  type Cell,
  type Column,
  type Status,
  type Table,
} from '@penumbra/core';
import { hasFieldMasses, hasSpecies, type GridSpec } from './grid.js';

/** One row of a grid table, keyed by column name. */
export type Row = Record<string, Cell>;

/** The tables a grid can hold. */
export type TableName = 'modes' | 'crossSection' | 'spectra';
/** Every table name, in file order. */
export const TABLE_NAMES: readonly TableName[] = ['modes', 'crossSection', 'spectra'];
/** The CSV file of each table. */
export const TABLE_FILES: Readonly<Record<TableName, string>> = {
  modes: 'modes.csv',
  crossSection: 'cross-section.csv',
  spectra: 'spectra.csv',
};

/** The status of a row: core's solve statuses. */
export type RowStatus = Status;

/** The columns of a grid point: the species and its dof, the field's mass only when the grid has them (older grids keep their bytes). */
function pointColumns(grid: GridSpec): Column[] {
  return [
    ...(hasSpecies(grid)
      ? [
          { name: 'species', unit: '', description: 'the emitted species' },
          {
            name: 'dof',
            unit: '1',
            description: 'degrees of freedom of the species (helicities or spin states, particle and antiparticle)',
          },
        ]
      : []),
    SPIN_COLUMN,
    ...(hasFieldMasses(grid) ? [FIELD_MASS_COLUMN] : []),
    HOLE_SPIN_COLUMN,
    OMEGA_COLUMN,
  ];
}

/** The spin-state columns of the mode table: the Dirac sign κ, the Proca polarisation, each only when the grid has such a field. */
function stateColumns(grid: GridSpec): Column[] {
  const out: Column[] = [];
  if (grid.fields.some((f) => f.mass > 0 && f.spin === 0.5))
    out.push({
      // A label (which of the two modes), not a quantity: no unit, empty on the rows of other fields.
      name: 'kappaSign',
      unit: '',
      description: 'massive Dirac fields: the sign of the separation constant κ (+1 or −1, two modes of one j, m)',
    });
  if (grid.fields.some((f) => f.mass > 0 && f.spin === 1))
    out.push({
      name: 'polarization',
      unit: '',
      description: "massive vector fields: the polarisation ('odd', 'even-1', 'even-2'; 'monopole' at l = 0)",
    });
  return out;
}
const status: Column = {
  name: 'status',
  unit: '',
  description: "'success', or why the numbers are missing: 'not-converged' or 'invalid-input' (reason in 'message')",
};
const message: Column = {
  name: 'message',
  unit: '',
  description: 'why the row failed, with the solver diagnostics; empty on success',
};
const relError = (of: string, extra = ''): Column => ({
  name: 'relError',
  unit: '1',
  description: `estimated relative error of ${of}${extra}`,
});
const lMax: Column = { name: 'lMax', unit: '1', description: 'largest l summed' };
const modes: Column = { name: 'modes', unit: '', description: 'greybody solves' };

/** The columns of one table of a grid (the reflection columns only when the grid asks for reflection). */
export function tableColumns(grid: GridSpec, table: TableName): Column[] {
  if (table === 'modes') {
    const reflection = grid.quantities.includes('reflection');
    return [
      ...pointColumns(grid),
      L_COLUMN,
      M_COLUMN,
      ...stateColumns(grid),
      status,
      GAMMA_COLUMN,
      relError('Γ'),
      ...(reflection
        ? [
            { name: 'reflection', unit: '1', description: 'reflected fraction, from an independent solve' },
            { name: 'residual', unit: '1', description: '|Γ + reflection − 1|, a check of both solves' },
          ]
        : []),
      { name: 'steps', unit: '', description: 'integrator steps' },
      { name: 'rhsEvaluations', unit: '', description: 'right-hand-side evaluations' },
      message,
    ];
  }
  if (table === 'crossSection') {
    return [
      ...pointColumns(grid),
      status,
      { name: 'sigma', unit: 'M^2', description: 'absorption cross-section σ = (π/ω²) Σ Γ of one helicity' },
      relError('σ', ' (mode errors plus dropped l-shells)'),
      { name: 'droppedBound', unit: 'M^2', description: 'bound on the l-shells not summed' },
      lMax,
      modes,
      message,
    ];
  }
  // A species grid gives each species' rates (all its dof); a field grid, the rates per degree of freedom.
  const per = hasSpecies(grid) ? 'of the species (per degree of freedom times dof)' : 'per degree of freedom';
  return [
    ...pointColumns(grid),
    status,
    { name: 'number', unit: '1', description: `d²N/(dt dω) ${per}` },
    { name: 'energy', unit: '1/M', description: `d²E/(dt dω) ${per}` },
    { name: 'torque', unit: '1', description: `d²J/(dt dω) ${per}` },
    relError("'number'"),
    { name: 'droppedBound', unit: '1', description: "bound on the dropped part of 'number'" },
    lMax,
    modes,
    message,
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

/** Rows as a core Table with the columns of `table`: a key missing in a row is an empty cell. */
export function gridTable(grid: GridSpec, table: TableName, rows: readonly Row[]): Table {
  const columns = tableColumns(grid, table);
  return { columns, rows: rows.map((row) => columns.map((c) => row[c.name] ?? null)) };
}
