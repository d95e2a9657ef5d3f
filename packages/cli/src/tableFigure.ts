/**
 * Figures from a grid table, rendered to SVG in Node by Vega-Lite → Vega
 * (no browser): Γ(ω) or the reflection by mode, σ(ω) or emission spectra by
 * (s, a). Axes carry units; an axis switches to logarithmic when its data
 * span two decades or more (symmetric-log when Γ changes sign).
 */
import * as vega from 'vega';
import { compile, type TopLevelSpec } from 'vega-lite';
import { GridError } from './grid.js';
import type { GridTable } from './store.js';
import type { Row } from './schema.js';

export const PLOT_QUANTITIES = ['gamma', 'reflection', 'crossSection', 'spectra', 'energySpectra'] as const;
export type PlotQuantity = (typeof PLOT_QUANTITIES)[number];

export interface PlotOptions {
  quantity?: PlotQuantity;
  /** field spin to draw (gamma, reflection; default the first in the table) */
  s?: number;
  /** hole spin to draw (gamma, reflection; default the first in the table) */
  a?: number;
  width?: number;
  height?: number;
}

export interface PlotResult {
  svg: string;
  quantity: PlotQuantity;
  series: string[];
  points: number;
  /** failed rows left out of the figure */
  omitted: number;
  xLog: boolean;
  yScale: 'linear' | 'log' | 'symlog';
}

interface Setup {
  table: 'modes' | 'crossSection' | 'spectra';
  field: string;
  yTitle: string;
  title: string;
}

const SETUP: Record<PlotQuantity, Setup> = {
  gamma: { table: 'modes', field: 'gamma', yTitle: 'Γ (absorbed fraction of the incident flux, dimensionless)', title: 'Greybody factor Γ_slm(ω)' },
  reflection: { table: 'modes', field: 'reflection', yTitle: 'reflected fraction of the incident flux (dimensionless)', title: 'Reflection by mode' },
  crossSection: { table: 'crossSection', field: 'sigma', yTitle: 'σ_abs [M²]', title: 'Absorption cross-section σ(ω)' },
  spectra: { table: 'spectra', field: 'number', yTitle: 'd²N/(dt dω) per degree of freedom (dimensionless)', title: 'Hawking emission spectrum (number)' },
  energySpectra: { table: 'spectra', field: 'energy', yTitle: 'd²E/(dt dω) per degree of freedom [1/M]', title: 'Hawking emission spectrum (energy)' },
};

const spinLabel = (s: number) => (Number.isInteger(s) ? String(s) : `${2 * s}/2`);
const distinct = (rows: Row[], key: string) => [...new Set(rows.map((r) => r[key] as number))];

/** Which plot quantities a table can draw. */
export function plotQuantities(table: GridTable): PlotQuantity[] {
  return PLOT_QUANTITIES.filter((q) => {
    const t = table.tables[SETUP[q].table];
    return t !== undefined && t.columns.some((c) => c.key === SETUP[q].field);
  });
}

function scaleFor(values: number[]): 'linear' | 'log' | 'symlog' {
  const magnitudes = values.map(Math.abs).filter((v) => v > 0);
  if (magnitudes.length < 2) return 'linear';
  const span = Math.max(...magnitudes) / Math.min(...magnitudes);
  if (span < 100) return 'linear';
  return values.every((v) => v > 0) ? 'log' : 'symlog';
}

/** Powers of ten (with sign) across the data, at most about a dozen: symlog axes get no useful ticks of their own. */
function symlogTicks(values: number[]): number[] {
  const magnitudes = values.map(Math.abs).filter((v) => v > 0);
  const low = Math.floor(Math.log10(Math.min(...magnitudes)));
  const high = Math.ceil(Math.log10(Math.max(...magnitudes)));
  const step = Math.max(1, Math.ceil((high - low + 1) / 6));
  const ticks: number[] = [0];
  for (let k = high; k >= low; k -= step) {
    const p = 10 ** k;
    if (values.some((v) => v >= p / 10)) ticks.push(p);
    if (values.some((v) => v <= -p / 10)) ticks.push(-p);
  }
  return ticks.sort((x, y) => x - y);
}

/** Vega numbers clip paths with a process-wide counter; renumber per figure so equal inputs give equal bytes. */
function renumberIds(svg: string): string {
  const ids = new Map<string, string>();
  return svg.replace(/\bclip\d+\b/g, (id) => {
    if (!ids.has(id)) ids.set(id, `clip${ids.size + 1}`);
    return ids.get(id)!;
  });
}

export async function plotTable(table: GridTable, options: PlotOptions = {}): Promise<PlotResult> {
  const available = plotQuantities(table);
  const quantity = options.quantity ?? available.find((q) => q !== 'reflection' && q !== 'energySpectra');
  if (!quantity || !available.includes(quantity)) {
    throw new GridError([`the table has no ${quantity ?? 'plottable quantity'}; it can draw ${available.join(', ') || 'nothing'}`], 'cannot plot');
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
    const s = options.s, a = options.a;
    rows = rows.filter((r) => (s === undefined || r.s === s) && (a === undefined || r.a === a));
    if (rows.length === 0) throw new GridError([`no rows with${s !== undefined ? ` s = ${s}` : ''}${a !== undefined ? ` a = ${a}` : ''}`], 'cannot plot');
  }
  const good = rows.filter((r) => r.status === 'ok' && typeof r[setup.field] === 'number');
  const omitted = rows.length - good.length;
  const label = (r: Row) => (perMode
    ? `l = ${spinLabel(r.l as number)}, m = ${spinLabel(r.m as number)}`
    : `s = ${spinLabel(r.s as number)}, a = ${r.a} M`);
  const values = good.map((r) => ({ omega: r.omega as number, y: r[setup.field] as number, series: label(r) }));
  const series = [...new Set(values.map((v) => v.series))];
  const omegas = values.map((v) => v.omega);
  const xLog = omegas.length > 1 && Math.max(...omegas) / Math.min(...omegas) >= 20;
  const yScale = scaleFor(values.map((v) => v.y));
  const smallest = Math.min(...values.map((v) => Math.abs(v.y)).filter((v) => v > 0));
  if (omitted) subtitle += `${subtitle ? '; ' : ''}${omitted} failed row${omitted > 1 ? 's' : ''} not drawn`;
  if (yScale === 'symlog') subtitle += `${subtitle ? '; ' : ''}symmetric-log y axis (Γ < 0: superradiant)`;

  const spec: TopLevelSpec = {
    $schema: 'https://vega.github.io/schema/vega-lite/v6.json',
    width: options.width ?? 560,
    height: options.height ?? 360,
    background: 'white',
    title: { text: setup.title, subtitle: subtitle || undefined },
    data: { values },
    mark: { type: 'line', point: values.length / Math.max(1, series.length) <= 60, clip: true },
    encoding: {
      x: { field: 'omega', type: 'quantitative', title: 'ω [1/M]', scale: xLog ? { type: 'log', nice: false } : { type: 'linear', nice: false, zero: false } },
      y: {
        field: 'y', type: 'quantitative', title: setup.yTitle,
        scale: yScale === 'symlog' ? { type: 'symlog', constant: smallest } : yScale === 'log' ? { type: 'log' } : { type: 'linear', zero: false },
        axis: { format: yScale === 'linear' ? '~g' : '.0e', ...(yScale === 'symlog' ? { values: symlogTicks(values.map((v) => v.y)) } : {}) },
      },
      color: { field: 'series', type: 'nominal', title: perMode ? 'mode' : 'field, hole', sort: series },
      order: { field: 'omega', type: 'quantitative' },
    },
  };
  const view = new vega.View(vega.parse(compile(spec).spec), { renderer: 'none' });
  try {
    const svg = renumberIds(await view.toSVG());
    return { svg, quantity, series, points: values.length, omitted, xLog, yScale };
  } finally {
    view.finalize();
  }
}
