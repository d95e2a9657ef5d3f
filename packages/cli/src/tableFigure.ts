/**
 * The figure of a grid table, for `penumbra plot`: Γ(ω) or the reflection by
 * mode, σ(ω) or emission spectra by (s, a). Axes carry units; an axis turns
 * logarithmic when its data span two decades or more (ω: a factor 20), and
 * symmetric-log when Γ changes sign. Drawing it is @penumbra/plot's job.
 */
import { GridError, type GridTable, type Row } from '@penumbra/grid';
import { autoScale, type Figure, type ScaleType, type Series } from '@penumbra/plot';

/** The quantities `penumbra plot` draws. */
export const PLOT_QUANTITIES = ['gamma', 'reflection', 'crossSection', 'spectra', 'energySpectra'] as const;

/** One of `PLOT_QUANTITIES`. */
export type PlotQuantity = (typeof PLOT_QUANTITIES)[number];

/** What to draw from a table. */
export interface TableFigureOptions {
  /** default: gamma, else crossSection, else spectra (the first the table has) */
  quantity?: PlotQuantity;
  /** field spin to draw (gamma, reflection: default the first in the table; others: default all) */
  s?: number;
  /** hole spin parameter a/M to draw (same defaults) */
  a?: number;
  /** figure size in px (default 560 × 360) */
  width?: number;
  height?: number;
}

/** A table's figure and what went into it. */
export interface TableFigure {
  figure: Figure;
  quantity: PlotQuantity;
  /** series names, in legend order */
  series: string[];
  points: number;
  /** failed rows left out of the figure */
  omitted: number;
  xLog: boolean;
  yScale: ScaleType;
}

interface Setup {
  table: 'modes' | 'crossSection' | 'spectra';
  field: string;
  yTitle: string;
  yUnit?: string;
  title: string;
}

const SETUP: Record<PlotQuantity, Setup> = {
  gamma: {
    table: 'modes',
    field: 'gamma',
    yTitle: 'Γ (absorbed fraction of the incident flux, dimensionless)',
    title: 'Greybody factor Γ_slm(ω)',
  },
  reflection: {
    table: 'modes',
    field: 'reflection',
    yTitle: 'reflected fraction of the incident flux (dimensionless)',
    title: 'Reflection by mode',
  },
  crossSection: { table: 'crossSection', field: 'sigma', yTitle: 'σ_abs', yUnit: 'M²', title: 'Absorption cross-section σ(ω)' },
  spectra: {
    table: 'spectra',
    field: 'number',
    yTitle: 'd²N/(dt dω) per degree of freedom (dimensionless)',
    title: 'Hawking emission spectrum (number)',
  },
  energySpectra: {
    table: 'spectra',
    field: 'energy',
    yTitle: 'd²E/(dt dω) per degree of freedom',
    yUnit: '1/M',
    title: 'Hawking emission spectrum (energy)',
  },
};

const spinLabel = (s: number) => (Number.isInteger(s) ? String(s) : `${2 * s}/2`);
const distinct = (rows: Row[], key: string) => [...new Set(rows.map((r) => r[key] as number))];

/** Which plot quantities a table can draw. */
export function plotQuantities(table: GridTable): PlotQuantity[] {
  return PLOT_QUANTITIES.filter((q) => {
    const t = table.tables[SETUP[q].table];
    return t?.columns.some((c) => c.key === SETUP[q].field) ?? false;
  });
}

/** The figure of one quantity of a table; throws GridError when the table lacks it or the chosen s, a. */
export function tableFigure(table: GridTable, options: TableFigureOptions = {}): TableFigure {
  const available = plotQuantities(table);
  const quantity = options.quantity ?? available.find((q) => q !== 'reflection' && q !== 'energySpectra');
  if (!quantity || !available.includes(quantity)) {
    throw new GridError(
      [`the table has no ${quantity ?? 'plottable quantity'}; it can draw ${available.join(', ') || 'nothing'}`],
      'cannot plot',
    );
  }
  const setup = SETUP[quantity];
  let rows = table.tables[setup.table]!.rows;
  let subtitle = '';
  const problems: string[] = [];
  const perMode = setup.table === 'modes';
  if (perMode) {
    const spins = distinct(rows, 's');
    const holes = distinct(rows, 'a');
    const s = options.s ?? spins[0];
    const a = options.a ?? holes[0];
    if (!spins.includes(s)) problems.push(`field spin ${s} is not in the table (it has ${spins.join(', ')})`);
    if (!holes.includes(a)) problems.push(`a = ${a} is not in the table (it has ${holes.join(', ')})`);
    if (problems.length) throw new GridError(problems, 'cannot plot');
    rows = rows.filter((r) => r.s === s && r.a === a);
    subtitle = `s = ${spinLabel(s)}, a = ${a} M`;
  } else if (options.s !== undefined || options.a !== undefined) {
    const s = options.s,
      a = options.a;
    rows = rows.filter((r) => (s === undefined || r.s === s) && (a === undefined || r.a === a));
    if (rows.length === 0)
      throw new GridError(
        [`no rows with${s !== undefined ? ` s = ${s}` : ''}${a !== undefined ? ` a = ${a}` : ''}`],
        'cannot plot',
      );
  }
  const good = rows.filter((r) => r.status === 'ok' && typeof r[setup.field] === 'number');
  const omitted = rows.length - good.length;
  const label = (r: Row) =>
    perMode
      ? `l = ${spinLabel(r.l as number)}, m = ${spinLabel(r.m as number)}`
      : `s = ${spinLabel(r.s as number)}, a = ${r.a} M`;
  const series = seriesOf(good, label, setup.field);
  const names = series.map((s) => s.name);
  const omegas = good.map((r) => r.omega as number);
  const xLog = autoScale(omegas, 20) === 'log';
  const yScale = autoScale(good.map((r) => r[setup.field] as number));
  if (omitted) subtitle += `${subtitle ? '; ' : ''}${omitted} failed row${omitted > 1 ? 's' : ''} not drawn`;
  if (yScale === 'symlog') subtitle += `${subtitle ? '; ' : ''}symmetric-log y axis (Γ < 0: superradiant)`;

  const figure: Figure = {
    title: setup.title,
    ...(subtitle ? { subtitle } : {}),
    width: options.width ?? 560,
    height: options.height ?? 360,
    x: xLog
      ? { title: 'ω', unit: '1/M', scale: 'log', nice: false }
      : { title: 'ω', unit: '1/M', scale: 'linear', nice: false, zero: false },
    y: {
      title: setup.yTitle,
      ...(setup.yUnit ? { unit: setup.yUnit } : {}),
      scale: yScale,
      ...(yScale === 'linear' ? { zero: false } : {}),
      format: yScale === 'linear' ? '~g' : '.0e',
    },
    series,
    legend: { title: perMode ? 'mode' : 'field, hole' },
    markers: good.length / Math.max(1, names.length) <= 60,
    clip: true,
  };
  return { figure, quantity, series: names, points: good.length, omitted, xLog, yScale };
}

/** Rows grouped into series by label, in order of first appearance. */
function seriesOf(rows: Row[], label: (r: Row) => string, field: string): Series[] {
  const points = new Map<string, [number, number][]>();
  for (const r of rows) {
    const name = label(r);
    if (!points.has(name)) points.set(name, []);
    points.get(name)!.push([r.omega as number, r[field] as number]);
  }
  return [...points].map(([name, list]) => ({ name, points: list }));
}
