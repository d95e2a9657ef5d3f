/**
 * `penumbra emission --content LIST`: totals over species with per-species
 * rows, and primary spectra per species, for a hole of physical mass (text,
 * JSON and CSV; units in the CSV headers). The table of primary spectra
 * (species, E [GeV], d²N/dtdE [GeV^-1 s^-1]) is the input of a user's own
 * hadronisation code; secondary spectra are out of scope (docs/emission.md).
 */
import { FIELD_MASS_COLUMN, SPIN_COLUMN, type Column, type Table } from '@penumbra/core';
import {
  contentSpectra,
  contentTotals,
  toPhysicalRates,
  type ContentSpectra,
  type ContentTotals,
  type SpeciesSpec,
} from '@penumbra/emission';
import type { MassUnit } from '@penumbra/kerr';
import { INACCURATE_COLUMN, isInaccurate, warnInaccurate } from './accuracy.js';
import type { CliIO } from './command.js';
import { formatError, formatNumber, formatTable } from './format.js';
import { writeOutput, type OutputFormat } from './output.js';

/** What the content mode needs from the command line. */
export interface ContentRequest {
  a: number;
  mass: number;
  unit: MassUnit;
  content: SpeciesSpec[];
  tol: number;
  confinementScaleGeV?: number;
  /** particle energies for the spectra, GeV */
  energiesGeV?: number[];
}

/** One species row in physical units, as JSON has it (the CSV columns are its keys). */
interface SpeciesRow {
  species: string;
  spin: number;
  dof: number;
  massGeV: number;
  fieldMass: number;
  status: string;
  numberRatePerSecond: number;
  powerGeVPerSecond: number;
  torqueHbarPerSecond: number;
  relError: number;
  inaccurate: boolean;
}

const TOTALS_COLUMNS: Column[] = [
  { name: 'species', unit: '', description: 'species name, or total' },
  SPIN_COLUMN,
  { name: 'dof', unit: '1', description: 'degrees of freedom' },
  { name: 'massGeV', unit: 'GeV', description: 'rest mass' },
  FIELD_MASS_COLUMN,
  {
    name: 'status',
    unit: '',
    description: 'solved, massless-limit, boltzmann-negligible (bound in the error) or confinement (not emitted)',
  },
  { name: 'numberRatePerSecond', unit: 's^-1', description: 'dN/dt, all degrees of freedom' },
  { name: 'powerGeVPerSecond', unit: 'GeV s^-1', description: 'dE/dt, all degrees of freedom' },
  { name: 'torqueHbarPerSecond', unit: 'hbar s^-1', description: 'dJ/dt, all degrees of freedom' },
  { name: 'relError', unit: '1', description: 'estimated relative error of the power (absolute bound / value where 0)' },
  INACCURATE_COLUMN,
];

const SPECTRA_COLUMNS: Column[] = [
  { name: 'species', unit: '', description: 'species name' },
  { name: 'energyGeV', unit: 'GeV', description: 'particle energy E' },
  { name: 'perGeVPerSecond', unit: 'GeV^-1 s^-1', description: 'primary d²N/(dt dE), all degrees of freedom' },
  { name: 'relError', unit: '1', description: 'estimated relative error' },
  INACCURATE_COLUMN,
];

function speciesRows(r: ContentTotals, mass: number, unit: MassUnit): SpeciesRow[] {
  const phys = (x: { numberRate: number; power: number; torque: number }) => toPhysicalRates(x, mass, unit, r.hole.mass);
  const rows = r.species.map((s): SpeciesRow => {
    const p = phys(s);
    const relError = s.power !== 0 ? s.errors.power / Math.abs(s.power) : 0;
    return {
      species: s.name,
      spin: s.spin,
      dof: s.dof,
      massGeV: s.massGeV,
      fieldMass: s.fieldMass,
      status: s.status,
      numberRatePerSecond: p.numberRatePerSecond,
      powerGeVPerSecond: p.powerGeVPerSecond,
      torqueHbarPerSecond: p.torqueHbarPerSecond,
      relError,
      inaccurate: isInaccurate(relError),
    };
  });
  const t = phys({ numberRate: r.numberRate.value, power: r.power.value, torque: r.torque.value });
  rows.push({
    species: 'total',
    spin: Number.NaN,
    dof: r.species.reduce((n, s) => n + (s.status === 'confinement' ? 0 : s.dof), 0),
    massGeV: Number.NaN,
    fieldMass: Number.NaN,
    status: '',
    numberRatePerSecond: t.numberRatePerSecond,
    powerGeVPerSecond: t.powerGeVPerSecond,
    torqueHbarPerSecond: t.torqueHbarPerSecond,
    relError: r.power.relError,
    inaccurate: isInaccurate(r.power.relError),
  });
  return rows;
}

const cells = (row: SpeciesRow) =>
  TOTALS_COLUMNS.map((c) => {
    const v = row[c.name as keyof SpeciesRow];
    return typeof v === 'number' && Number.isNaN(v) ? null : v;
  });

function spectraTable(s: ContentSpectra): Table {
  const rows = s.species.flatMap((sp) =>
    s.energiesGeV.map((e, i) => [sp.name, e, sp.perGeVPerSecond[i], sp.relError[i], isInaccurate(sp.relError[i])]),
  );
  return { columns: SPECTRA_COLUMNS, rows };
}

function text(req: ContentRequest, r: ContentTotals, rows: SpeciesRow[], spectra?: ContentSpectra): string {
  const head =
    `Hawking emission of a ${formatNumber(req.mass, 4)} ${req.unit} hole, a = ${req.a} M: T_H = ${formatNumber(r.diagnostics.temperatureGeV ?? Number.NaN, 4)} GeV, ` +
    `confinement scale ${r.diagnostics.confinementScaleGeV} GeV\n`;
  const table = formatTable([
    ['species', 'dof', 'mass [GeV]', 'Mμ', 'status', 'dN/dt [s^-1]', 'dE/dt [GeV s^-1]', 'rel. error'],
    ...rows.map((x) => [
      x.species,
      Number.isNaN(x.dof) ? '' : String(x.dof),
      Number.isNaN(x.massGeV) ? '' : formatNumber(x.massGeV, 6),
      Number.isNaN(x.fieldMass) ? '' : formatNumber(x.fieldMass, 4),
      x.status,
      formatNumber(x.numberRatePerSecond, 5),
      formatNumber(x.powerGeVPerSecond, 5),
      formatError(x.relError),
    ]),
  ]);
  const approx = r.approximations.length > 0 ? `approximation: ${r.approximations.join('; ')}\n` : '';
  let out = `${head}${table}\n${approx}`;
  if (spectra) {
    out += '\nPrimary spectra d²N/(dt dE) [GeV^-1 s^-1], all degrees of freedom (secondary spectra: not computed)\n';
    out += formatTable([
      ['E [GeV]', ...spectra.species.map((s) => s.name)],
      ...spectra.energiesGeV.map((e, i) => [
        formatNumber(e, 5),
        ...spectra.species.map((s) => formatNumber(s.perGeVPerSecond[i], 4)),
      ]),
    ]);
    out += '\n';
  }
  return out;
}

/** Run the content mode: totals, spectra if energies were given, written in the chosen format. */
export function runContentEmission(req: ContentRequest, io: CliIO, format: OutputFormat): void {
  const hole = { a: req.a };
  const physicalMass = { value: req.mass, unit: req.unit };
  const common = req.confinementScaleGeV === undefined ? {} : { confinementScaleGeV: req.confinementScaleGeV };
  const totals = contentTotals(
    { hole, content: req.content, physicalMass },
    { tol: req.tol, ...common, onSpin: (_s, done) => io.stderr(`emission: ${done} per-dof solve(s) done\n`) },
  );
  const spectra = req.energiesGeV
    ? contentSpectra(
        { hole, content: req.content, physicalMass, energiesGeV: req.energiesGeV },
        { tol: Math.max(req.tol, 1e-6), ...common },
      )
    : undefined;
  const rows = speciesRows(totals, req.mass, req.unit);
  warnInaccurate(io, [
    ...rows.map((r) => ({ what: `power of ${r.species}`, relError: r.relError })),
    ...(spectra?.species ?? []).flatMap((s) =>
      s.relError.map((e, i) => ({ what: `${s.name} spectrum at ${spectra!.energiesGeV[i]} GeV`, relError: e })),
    ),
  ]);
  writeOutput(io, format, {
    text: () => text(req, totals, rows, spectra),
    json: () => ({
      a: req.a,
      mass: req.mass,
      unit: req.unit,
      temperatureGeV: totals.diagnostics.temperatureGeV,
      confinementScaleGeV: totals.diagnostics.confinementScaleGeV,
      units:
        'numberRatePerSecond s^-1, powerGeVPerSecond GeV s^-1, torqueHbarPerSecond hbar s^-1, all degrees of freedom of each species',
      species: rows.slice(0, -1),
      total: rows[rows.length - 1],
      approximations: totals.approximations,
      diagnostics: totals.diagnostics,
      ...(spectra
        ? {
            spectra: {
              units: 'energyGeV GeV, perGeVPerSecond GeV^-1 s^-1 (primary d²N/dtdE, all degrees of freedom)',
              energyGeV: spectra.energiesGeV,
              species: spectra.species.map((s) => ({
                species: s.name,
                emitted: s.emitted,
                perGeVPerSecond: s.perGeVPerSecond,
                relError: s.relError,
                ...(s.approximation ? { approximation: s.approximation } : {}),
              })),
            },
          }
        : {}),
    }),
    csv: () => (spectra ? spectraTable(spectra) : { columns: TOTALS_COLUMNS, rows: rows.map(cells) }),
  });
}
