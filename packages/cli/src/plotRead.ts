/**
 * What `penumbra plot` reads: any CSV or JSON file a penumbra command wrote,
 * or a table directory. Every input becomes rows keyed by the column names
 * the commands share (spin, a, l, m, omega, gamma, sigma, number, …), sorted
 * into the kinds of data a figure is drawn from.
 */
import { existsSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import type { Cell } from '@penumbra/core';
import { csvUnits, parseCsvRows } from './csvRead.js';
import { tableShapeProblem } from './tableShape.js';

/** One row of plot data, keyed by column name. */
export type PlotRow = Record<string, Cell>;

/** The kinds of data a figure can be drawn from. */
export type DataKind = 'modes' | 'crossSection' | 'spectra' | 'track' | 'harmonic';

/** Rows of one kind, with what the file says about all of them. */
export interface PlotData {
  kind: DataKind;
  rows: PlotRow[];
  /** the hole mass and its unit, where the file gives physical units */
  mass?: number;
  unit?: string;
}

/** Which keys make each kind, checked in this order. */
const KIND_KEYS: readonly [DataKind, readonly string[]][] = [
  ['modes', ['omega', 'l', 'm']],
  ['crossSection', ['omega', 'sigma']],
  ['spectra', ['omega', 'number']],
  ['track', ['timeSeconds', 'mass', 'aStar']],
  ['harmonic', ['theta', 'S']],
];

const isRecord = (x: unknown): x is Record<string, unknown> => typeof x === 'object' && x !== null && !Array.isArray(x);

/** The kind of a set of rows, from the keys of its first row. */
export function dataKind(rows: readonly PlotRow[]): DataKind | undefined {
  if (rows.length === 0) return undefined;
  const keys = new Set(Object.keys(rows[0]));
  return KIND_KEYS.find(([, needed]) => needed.every((k) => keys.has(k)))?.[0];
}

/** Read a file or table directory; throws Error with a one-line reason when nothing in it can be drawn. */
export function readPlotData(path: string): PlotData[] {
  let file = path;
  if (statSync(path).isDirectory()) {
    file = join(path, 'table.json');
    if (!existsSync(file)) throw new Error(`${path} is a directory without table.json`);
  }
  const text = readFileSync(file, 'utf8');
  const trimmed = text.trimStart();
  const found = trimmed.startsWith('{') || trimmed.startsWith('[') ? fromJson(parseJson(text)) : fromCsv(text);
  if (found.length === 0) throw new Error(nothingToDraw(text));
  return found;
}

function parseJson(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch (error) {
    throw new Error(`not valid JSON (${(error as Error).message})`);
  }
}

function fromCsv(text: string): PlotData[] {
  const rows = parseCsvRows(text);
  const kind = dataKind(rows);
  if (!kind) return [];
  // the track names its mass unit in the header (mass [g]); other physical columns carry GeV and s⁻¹ themselves
  const unit = kind === 'track' ? csvUnits(text).mass : undefined;
  return [{ kind, rows, ...(unit ? { unit } : {}) }];
}

/** The rows in any JSON document a penumbra command writes. */
function fromJson(value: unknown): PlotData[] {
  if (Array.isArray(value)) return withKind(value.filter(isRecord).map(flatRow));
  if (!isRecord(value)) return [];
  if ('tables' in value) {
    const shape = tableShapeProblem(value);
    if (shape) throw new Error(`not a well-formed penumbra table (${shape})`);
    if (!isRecord(value.tables)) return [];
    return Object.values(value.tables).flatMap((t) =>
      isRecord(t) && Array.isArray(t.rows) ? withKind(t.rows.filter(isRecord).map(flatRow)) : [],
    );
  }
  const shared = { spin: value.spin, a: value.a };
  if (Array.isArray(value.spectrum)) {
    const unit = typeof value.unit === 'string' ? value.unit : undefined;
    const mass = typeof value.mass === 'number' ? value.mass : undefined;
    return withKind(
      value.spectrum.filter(isRecord).map((r) => flatRow({ ...shared, ...r })),
      mass,
      unit,
    );
  }
  if (Array.isArray(value.track)) {
    const unit = typeof value.unit === 'string' ? value.unit : undefined;
    return withKind(value.track.filter(isRecord).map(flatRow), undefined, unit);
  }
  if (isRecord(value.S) && Array.isArray(value.S.theta) && Array.isArray(value.S.S)) {
    const { theta, S } = value.S as { theta: unknown[]; S: unknown[] };
    const rows = theta.map((t, i) => ({ spin: value.spin, l: value.l, m: value.m, c: value.c, theta: t, S: S[i] }));
    return withKind(rows.map(flatRow));
  }
  if (Array.isArray(value.greybody)) return withKind(value.greybody.filter(isRecord).map(flatRow));
  return withKind([flatRow(value)]);
}

function withKind(rows: PlotRow[], mass?: number, unit?: string): PlotData[] {
  const kind = dataKind(rows);
  if (!kind) return [];
  return [{ kind, rows, ...(mass !== undefined ? { mass } : {}), ...(unit !== undefined ? { unit } : {}) }];
}

/** Keep the scalar cells of a JSON row (nested diagnostics are not drawn). */
function flatRow(record: Record<string, unknown>): PlotRow {
  const row: PlotRow = {};
  for (const [key, v] of Object.entries(record)) {
    if (typeof v === 'number' || typeof v === 'string' || typeof v === 'boolean' || v === null) row[key] = v;
  }
  return row;
}

/** Why a file that parsed holds nothing to draw, naming what it does hold. */
function nothingToDraw(text: string): string {
  const start = text.trimStart();
  if (start.startsWith('{') || start.startsWith('[')) {
    const value = JSON.parse(text) as unknown;
    const keys = isRecord(value) ? Object.keys(value).slice(0, 6).join(', ') : 'an empty list';
    return `holds single values (${keys}), not a series over ω, θ or time; plot draws greybody, cross-section, emission --omega, evolve, spheroidal --theta and table output`;
  }
  const header = start.split(/\r?\n/, 1)[0];
  return `its columns (${header.slice(0, 80)}) hold no series over ω, θ or time; plot draws greybody, cross-section, emission --omega, evolve and table output`;
}
