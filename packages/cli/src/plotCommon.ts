/**
 * What every figure of `penumbra plot` shares: the options, the result, the
 * choice of axis scales (from the data, overridable) and labels for spins,
 * species and physical units.
 */
import { autoScale, type Axis, type Figure, type ScaleType, type Series } from '@penumbra/plot';
import { massToKg, unitScales, type MassUnit } from '@penumbra/kerr';
import type { PlotRow } from './plotRead.js';

/** The quantities `penumbra plot` draws. */
export const PLOT_QUANTITIES = [
  'gamma',
  'amplification',
  'reflection',
  'crossSection',
  'spectra',
  'energySpectra',
  'track',
  'harmonic',
] as const;

/** One of `PLOT_QUANTITIES`. */
export type PlotQuantity = (typeof PLOT_QUANTITIES)[number];

/** What to draw and how. */
export interface PlotOptions {
  quantity?: PlotQuantity;
  /** field spin to draw (mode plots: default the first in the data) */
  spin?: number;
  /** the hole's a/M to draw (mode plots: default the first in the data) */
  a?: number;
  /** multipoles l to draw (default all) */
  l?: readonly number[];
  /** azimuthal numbers m to draw (default all) */
  m?: readonly number[];
  xScale?: ScaleType;
  yScale?: ScaleType;
  /** hole mass for physical axes (E in GeV, rates in s⁻¹), in `unit` */
  mass?: number;
  unit?: MassUnit;
  width?: number;
  height?: number;
}

/** A figure and what went into it, for the command's summary line. */
export interface PlotResult {
  figure: Figure;
  quantity: PlotQuantity;
  /** series names, in legend order */
  series: string[];
  points: number;
  /** rows left out: failed, or not drawable on the chosen scale */
  omitted: number;
  xScale: ScaleType;
  yScale: ScaleType;
}

/** A figure could not be drawn from the data as asked: the reasons, one line each. */
export class PlotDataError extends Error {
  override readonly name = 'PlotDataError';
}

/** `2` → `'2'`, `0.5` → `'1/2'`, `-1.5` → `'−3/2'`. */
export function halfLabel(x: number): string {
  const sign = x < 0 ? '−' : '';
  const magnitude = Math.abs(x);
  return sign + (Number.isInteger(magnitude) ? String(magnitude) : `${2 * magnitude}/2`);
}

/** The particle of a massless field of spin s. */
export function speciesName(spin: number): string {
  return (
    ({ 0: 'scalar', 0.5: 'neutrino', 1: 'photon', 2: 'graviton' } as Record<number, string>)[spin] ?? `spin ${halfLabel(spin)}`
  );
}

/** A row that holds a finished result: no status, or a successful one. */
export function succeeded(row: PlotRow): boolean {
  return row.status === undefined || row.status === null || row.status === 'success' || row.status === 'ok';
}

/** The number in a row's cell, or undefined when it is missing or not finite. */
export function num(row: PlotRow, key: string): number | undefined {
  const v = row[key];
  return typeof v === 'number' && Number.isFinite(v) ? v : undefined;
}

/** Distinct values of a numeric key, in order of first appearance. */
export function distinctValues(rows: readonly PlotRow[], key: string): number[] {
  return [...new Set(rows.map((r) => num(r, key)).filter((v): v is number => v !== undefined))];
}

/**
 * The scale of an axis: the requested one, else chosen from the data (log or
 * symmetric-log when the nonzero magnitudes span `minSpan` or more).
 */
export function chooseScale(values: readonly number[], requested: ScaleType | undefined, minSpan = 100): ScaleType {
  return requested ?? autoScale(values, minSpan);
}

/** Points a log axis cannot show (≤ 0) are left out; returns the kept series and how many points went. */
export function dropForLog(series: readonly Series[], xLog: boolean, yLog: boolean): { series: Series[]; dropped: number } {
  let dropped = 0;
  const kept = series
    .map((s) => {
      const points = s.points.filter(([x, y]) => (!xLog || x > 0) && (!yLog || y > 0));
      dropped += s.points.length - points.length;
      return { ...s, points };
    })
    .filter((s) => s.points.length > 0);
  return { series: kept, dropped };
}

/** Axis settings for a scale: linear axes keep the data's own range (no forced zero) unless `zero`. */
export function scaled(axis: Axis, scale: ScaleType, zero = false): Axis {
  return { ...axis, scale, ...(scale === 'linear' ? { zero, nice: zero } : {}) };
}

/** GeV per unit of Mω for a hole of `mass` in `unit` (E = ħω). */
export function gevPerOmega(mass: number, unit: MassUnit): number {
  return unitScales(massToKg(mass, unit)).GeV;
}

/** Seconds per unit of geometric time (GM/c³) for a hole of `mass` in `unit`. */
export function secondsPerTime(mass: number, unit: MassUnit): number {
  return unitScales(massToKg(mass, unit)).second;
}

/** `; `-joined parts that are not empty. */
export function joinNotes(...parts: (string | undefined | false)[]): string {
  return parts.filter((p): p is string => typeof p === 'string' && p !== '').join('; ');
}
