/**
 * Figures of single modes: Γ(ω), the amplification −Γ where a boson wave is
 * superradiant, and the reflected fraction. Colour tells m and dash tells l,
 * so every (l, m) differs; the superradiant band 0 < ω < mΩₕ is shaded and
 * each mΩₕ marked. At a = 0 every m of an l gives the same curve, so one is
 * drawn per l.
 */
import { kerrHole } from '@penumbra/kerr';
import { tickLabel, type Figure, type Marker, type Series } from '@penumbra/plot';
import {
  chooseScale,
  distinctValues,
  dropForLog,
  gevPerOmega,
  halfLabel,
  joinNotes,
  num,
  PlotDataError,
  scaled,
  succeeded,
  type PlotOptions,
  type PlotResult,
} from './plotCommon.js';
import type { PlotRow } from './plotRead.js';

type ModeQuantity = 'gamma' | 'amplification' | 'reflection';

const Y_AXIS: Record<ModeQuantity, { title: string; heading: string; meaning: string }> = {
  gamma: { title: 'Γₛₗₘ', heading: 'Greybody factor Γₛₗₘ(ω)', meaning: 'Γ = absorbed fraction of the incident flux' },
  amplification: {
    title: '−Γₛₗₘ',
    heading: 'Superradiant amplification −Γₛₗₘ(ω)',
    meaning: '−Γ = reflected excess over the incident flux, where Γ < 0',
  },
  reflection: { title: 'Rₛₗₘ', heading: 'Reflection Rₛₗₘ(ω)', meaning: 'R = reflected fraction of the incident flux' },
};

/** The figure of one mode quantity for one field spin and one hole. */
export function modeFigure(all: readonly PlotRow[], quantity: ModeQuantity, options: PlotOptions): PlotResult {
  const spins = distinctValues(all, 'spin');
  const holes = distinctValues(all, 'a');
  const spin = options.spin ?? spins[0];
  const a = options.a ?? holes[0];
  const problems: string[] = [];
  if (!spins.includes(spin)) problems.push(`field spin ${spin} is not in the data (it has ${spins.join(', ')})`);
  if (!holes.includes(a)) problems.push(`a = ${a} is not in the data (it has ${holes.join(', ')})`);
  let rows = all.filter((r) => r.spin === spin && r.a === a);
  if (options.l) rows = rows.filter((r) => options.l!.includes(r.l as number));
  if (options.m) rows = rows.filter((r) => options.m!.includes(r.m as number));
  if (!problems.length && rows.length === 0)
    problems.push(
      `no rows with l in {${options.l?.join(', ') ?? 'any'}} and m in {${options.m?.join(', ') ?? 'any'}} (the data has l = ${distinctValues(all, 'l').join(', ')}, m = ${distinctValues(all, 'm').join(', ')})`,
    );
  if (problems.length) throw new PlotDataError(problems.join('; '));
  // a grid of massive fields or species holds several fields of one spin (species, Mμ, κ sign, polarisation):
  // one figure draws one of them and says so, rather than joining their Γ into one curve
  const variants = distinctStrings(rows.map(fieldVariant));
  if (variants.length > 1) rows = rows.filter((r) => fieldVariant(r) === variants[0]);
  const variantNote =
    variants[0] !== '' &&
    `${variants[0]}${variants.length > 1 ? ` (${variants.length - 1} other field${variants.length > 2 ? 's' : ''} of this spin in the data not drawn)` : ''}`;

  const field = quantity === 'reflection' ? 'reflection' : 'gamma';
  const good = rows.filter((r) => succeeded(r) && num(r, field) !== undefined && num(r, 'omega') !== undefined);
  let omitted = rows.length - good.length;
  const boson = Number.isInteger(spin);
  const omegaH = kerrHole({ a }).omegaH;
  const toX = options.mass !== undefined ? gevPerOmega(options.mass, options.unit ?? 'g') : 1;
  const value = (r: PlotRow) => (quantity === 'amplification' ? -(r[field] as number) : (r[field] as number));
  const drawn = quantity === 'amplification' ? good.filter((r) => value(r) > 0) : good;
  if (drawn.length === 0)
    throw new PlotDataError(
      quantity === 'amplification'
        ? `no superradiant rows (Γ < 0) for s = ${halfLabel(spin)}, a = ${a}: amplification needs a boson mode with 0 < ω < mΩₕ`
        : `no finished rows to draw`,
    );

  // at a = 0 the m of an l share one curve: draw the first m of each l
  const collapse = a === 0 && new Set(drawn.map((r) => r.m)).size > 1;
  const series = collapse ? collapsedSeries(drawn, value, toX) : groupedSeries(drawn, value, toX);
  const xs = drawn.map((r) => (r.omega as number) * toX);
  const xScale = chooseScale(xs, options.xScale, 20);
  const yScale = chooseScale(drawn.map(value), options.yScale ?? (quantity === 'amplification' ? 'linear' : undefined));
  const kept = dropForLog(series, xScale === 'log', yScale === 'log');
  omitted += kept.dropped;
  const xRange: [number, number] = [Math.min(...xs), Math.max(...xs)];

  // superradiance: 0 < ω < mΩₕ for the modes drawn with mΩₕ > 0 (bosons only amplify)
  const ms = distinctValues(drawn, 'm').filter((m) => m * omegaH > 0);
  const edges = ms.map((m) => ({ m, x: m * omegaH * toX }));
  const marks: Marker[] = edges
    .filter((e) => e.x >= xRange[0] && e.x <= xRange[1])
    .map((e) => ({ x: e.x, label: `${e.m === 1 ? '' : halfLabel(e.m)}Ωₕ` }));
  const bandEdge = Math.max(0, ...edges.map((e) => e.x));
  const band: [number, number] | undefined =
    boson && bandEdge > xRange[0] && bandEdge > 0
      ? [xScale === 'log' ? Math.min(xRange[0], bandEdge) / 2 : 0, bandEdge]
      : undefined;

  const physical = options.mass !== undefined;
  const figure: Figure = {
    title: Y_AXIS[quantity].heading,
    subtitle: joinNotes(
      `s = ${halfLabel(spin)}, a = ${a} M, Ωₕ = ${Number(omegaH.toPrecision(4))}/M`,
      variantNote,
      Y_AXIS[quantity].meaning,
      physical && `M = ${tickLabel(options.mass!)} ${options.unit ?? 'g'}`,
      collapse && 'a = 0: every m of an l gives the same Γ, one curve per l',
      band && 'shaded: 0 < ω < mΩₕ',
      omitted > 0 && `${omitted} row${omitted > 1 ? 's' : ''} not drawn (failed, or ≤ 0 on a log axis)`,
    ),
    width: options.width ?? 560,
    height: options.height ?? 340,
    x: {
      ...scaled(physical ? { title: 'E = ħω', unit: 'GeV' } : { title: 'ω', unit: '1/M' }, xScale),
      domain: xRange[0] < xRange[1] ? xRange : undefined,
      nice: false,
    },
    y: scaled({ title: Y_AXIS[quantity].title }, yScale, quantity === 'amplification'),
    series: kept.series,
    legend: collapse
      ? { title: 'multipole' }
      : {
          title: 'm',
          dashTitle: 'l',
          colours: distinctValues(drawn, 'm')
            .sort((p, q) => p - q)
            .map((m) => `m = ${halfLabel(m)}`),
          dashes: distinctValues(drawn, 'l')
            .sort((p, q) => p - q)
            .map((l) => `l = ${halfLabel(l)}`),
        },
    markers: kept.series.length <= 6 && drawn.length / Math.max(1, kept.series.length) <= 40,
    clip: true,
    ...(band ? { band, bandLabel: 'superradiant' } : {}),
    ...(marks.length ? { marks } : {}),
  };
  if (figure.x.domain === undefined) delete (figure.x as { domain?: unknown }).domain;
  return {
    figure,
    quantity,
    series: kept.series.map((s) => s.name),
    points: kept.series.reduce((n, s) => n + s.points.length, 0),
    omitted,
    xScale,
    yScale,
  };
}

/** One series per (l, m): colour by m (ordered by m), dash by l. */
function groupedSeries(rows: readonly PlotRow[], value: (r: PlotRow) => number, toX: number): Series[] {
  const byMode = new Map<string, { l: number; m: number; points: [number, number][] }>();
  for (const r of rows) {
    const l = r.l as number;
    const m = r.m as number;
    const key = `${l},${m}`;
    if (!byMode.has(key)) byMode.set(key, { l, m, points: [] });
    byMode.get(key)!.points.push([(r.omega as number) * toX, value(r)]);
  }
  return [...byMode.values()]
    .sort((p, q) => p.m - q.m || p.l - q.l)
    .map(({ l, m, points }) => ({
      name: `l = ${halfLabel(l)}, m = ${halfLabel(m)}`,
      colour: `m = ${halfLabel(m)}`,
      dash: `l = ${halfLabel(l)}`,
      points,
    }));
}

/** One series per l (a = 0: the first m of each l stands for all). */
function collapsedSeries(rows: readonly PlotRow[], value: (r: PlotRow) => number, toX: number): Series[] {
  const byL = new Map<number, { m: number; points: [number, number][] }>();
  for (const r of rows) {
    const l = r.l as number;
    if (!byL.has(l)) byL.set(l, { m: r.m as number, points: [] });
    const entry = byL.get(l)!;
    if (r.m === entry.m) entry.points.push([(r.omega as number) * toX, value(r)]);
  }
  return [...byL].sort(([p], [q]) => p - q).map(([l, { points }]) => ({ name: `l = ${halfLabel(l)} (every m)`, points }));
}

/** The field a mode row belongs to beyond its spin: species, Mμ, κ sign, polarisation ('' for a massless field of a plain grid). */
function fieldVariant(r: PlotRow): string {
  const parts: string[] = [];
  if (typeof r.species === 'string' && r.species !== '') parts.push(r.species);
  if (typeof r.fieldMass === 'number' && r.fieldMass !== 0) parts.push(`Mμ = ${r.fieldMass}`);
  if (r.kappaSign !== undefined && r.kappaSign !== null && r.kappaSign !== '')
    parts.push(`κ sign ${Number(r.kappaSign) > 0 ? '+' : '−'}`);
  if (typeof r.polarization === 'string' && r.polarization !== '') parts.push(`${r.polarization} polarisation`);
  return parts.join(', ');
}

function distinctStrings(values: readonly string[]): string[] {
  return [...new Set(values)];
}
