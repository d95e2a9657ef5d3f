/**
 * Figures of quantities summed over modes: the absorption cross-section σ(ω)
 * with its low- and high-frequency limits drawn as reference lines, and the
 * Hawking emission spectra per species on log axes, in GeV and s⁻¹ where a
 * hole mass is known.
 */
import { tickLabel, type Figure, type Rule, type Series } from '@penumbra/plot';
import {
  chooseScale,
  dropForLog,
  gevPerOmega,
  halfLabel,
  joinNotes,
  num,
  PlotDataError,
  scaled,
  secondsPerTime,
  speciesName,
  succeeded,
  type PlotOptions,
  type PlotResult,
} from './plotCommon.js';
import type { PlotRow } from './plotRead.js';

/** Rows of the chosen spin and a (when given), grouped into series by (spin, a). */
function seriesBy(rows: readonly PlotRow[], point: (r: PlotRow) => [number, number] | undefined): Series[] {
  const groups = new Map<string, [number, number][]>();
  for (const r of rows) {
    const p = point(r);
    if (!p) continue;
    const spin = num(r, 'spin');
    const a = num(r, 'a');
    // species and field-mass columns (grids of massive fields or species) name series of their own
    const species = typeof r.species === 'string' && r.species !== '' ? r.species : undefined;
    const mass = num(r, 'fieldMass');
    const name = joinNotes(
      spin !== undefined && (species ? `${species} (s = ${halfLabel(spin)})` : `s = ${halfLabel(spin)} (${speciesName(spin)})`),
      !species && mass !== undefined && mass !== 0 && `Mμ = ${mass}`,
      a !== undefined && `a = ${a} M`,
    ).replaceAll('; ', ', ');
    const key = name || 'computed (give --spin, --a to name it)';
    if (!groups.has(key)) groups.set(key, []);
    groups.get(key)!.push(p);
  }
  return [...groups].map(([name, points]) => ({ name, points: points.sort((p, q) => p[0] - q[0]) }));
}

function select(all: readonly PlotRow[], options: PlotOptions): PlotRow[] {
  // files without spin or a columns (cross-section, emission --csv) take them from --spin and --a
  const rows = all.map((r) => ({
    ...r,
    ...(r.spin === undefined && options.spin !== undefined ? { spin: options.spin } : {}),
    ...(r.a === undefined && options.a !== undefined ? { a: options.a } : {}),
  }));
  const chosen = rows.filter(
    (r) => (options.spin === undefined || r.spin === options.spin) && (options.a === undefined || r.a === options.a),
  );
  if (chosen.length === 0)
    throw new PlotDataError(
      `no rows with${options.spin !== undefined ? ` s = ${options.spin}` : ''}${options.a !== undefined ? ` a = ${options.a}` : ''}`,
    );
  return chosen;
}

function result(figure: Figure, quantity: PlotResult['quantity'], series: Series[], omitted: number): PlotResult {
  return {
    figure,
    quantity,
    series: series.map((s) => s.name),
    points: series.reduce((n, s) => n + s.points.length, 0),
    omitted,
    xScale: figure.x.scale ?? 'linear',
    yScale: figure.y.scale ?? 'linear',
  };
}

/**
 * σ(ω) in M² on a linear axis from zero (the approach to 27πM² stays
 * visible), with 27πM² (geometric-optics capture, a = 0), and the ω → 0
 * limits 16πM² (s = 0, the horizon area) and 2πM² (s = 1/2) where those
 * spins are drawn.
 */
export function crossSectionFigure(all: readonly PlotRow[], options: PlotOptions): PlotResult {
  const rows = select(all, options);
  const good = rows.filter((r) => succeeded(r) && num(r, 'sigma') !== undefined && num(r, 'omega') !== undefined);
  const toX = options.mass !== undefined ? gevPerOmega(options.mass, options.unit ?? 'g') : 1;
  const series = seriesBy(good, (r) => [(r.omega as number) * toX, r.sigma as number]);
  const xScale = chooseScale(
    good.map((r) => (r.omega as number) * toX),
    options.xScale,
    20,
  );
  const yScale = options.yScale ?? 'linear';
  const kept = dropForLog(series, xScale === 'log', yScale === 'log');
  const spins = new Set(good.map((r) => r.spin));
  const rules: Rule[] = [{ y: 27 * Math.PI, label: '27πM²  (capture cross-section, a = 0)' }];
  if (spins.has(0)) rules.push({ y: 16 * Math.PI, label: '16πM² = horizon area  (s = 0, ω → 0, a = 0)' });
  if (spins.has(0.5)) rules.push({ y: 2 * Math.PI, label: '2πM²  (s = 1/2, ω → 0, a = 0)' });
  const omitted = rows.length - good.length + kept.dropped;
  const physical = options.mass !== undefined;
  const figure: Figure = {
    title: 'Absorption cross-section σ(ω)',
    subtitle: joinNotes(
      'one helicity, summed over l and m',
      physical && `M = ${tickLabel(options.mass!)} ${options.unit ?? 'g'}`,
      omitted > 0 && `${omitted} rows not drawn`,
    ),
    width: options.width ?? 560,
    height: options.height ?? 340,
    x: { ...scaled(physical ? { title: 'E = ħω', unit: 'GeV' } : { title: 'ω', unit: '1/M' }, xScale), nice: false },
    y: scaled({ title: 'σ', unit: 'M²' }, yScale, true),
    series: kept.series,
    legend: { title: 'field, hole' },
    markers: kept.series.length <= 6 && good.length / Math.max(1, kept.series.length) <= 40,
    rules,
  };
  return result(figure, 'crossSection', kept.series, omitted);
}

/**
 * Emission spectra per degree of freedom on log axes: d²N/(dt dω) against
 * Mω, or, with a hole mass (given, or in the file's energyGeV column),
 * d²N/(dt dE) in GeV⁻¹ s⁻¹ against E in GeV. `energy` draws the power
 * spectrum d²E/(dt dω) (E d²N/(dt dE) in s⁻¹ with a mass).
 */
export function spectrumFigure(
  all: readonly PlotRow[],
  energy: boolean,
  options: PlotOptions,
  fileMass?: { mass?: number; unit?: string },
): PlotResult {
  const rows = select(all, options);
  const field = energy ? 'energy' : 'number';
  const good = rows.filter((r) => succeeded(r) && num(r, field) !== undefined && num(r, 'omega') !== undefined);
  const fromFile =
    options.mass === undefined && good.every((r) => num(r, 'energyGeV') !== undefined && num(r, 'perGeVPerSecond') !== undefined);
  const mass =
    options.mass !== undefined
      ? { mass: options.mass, unit: options.unit ?? 'g' }
      : fileMass?.mass !== undefined
        ? fileMass
        : undefined;
  const physical = options.mass !== undefined || (fromFile && good.length > 0);
  const gev = options.mass !== undefined ? gevPerOmega(options.mass, options.unit ?? 'g') : 0;
  const seconds = options.mass !== undefined ? secondsPerTime(options.mass, options.unit ?? 'g') : 0;
  const point = (r: PlotRow): [number, number] => {
    const omega = r.omega as number;
    if (!physical) return [omega, r[field] as number];
    // d²N/(dt dE) = N̂/(t_M E_M); E d²N/(dt dE) = N̂ ω / t_M (per second)
    const E = options.mass !== undefined ? omega * gev : (r.energyGeV as number);
    const perGeV = options.mass !== undefined ? (r.number as number) / (seconds * gev) : (r.perGeVPerSecond as number);
    return energy ? [E, E * perGeV] : [E, perGeV];
  };
  const series = seriesBy(good, point);
  const xs = series.flatMap((s) => s.points.map((p) => p[0]));
  const ys = series.flatMap((s) => s.points.map((p) => p[1]));
  const xScale = options.xScale ?? (xs.every((x) => x > 0) ? 'log' : chooseScale(xs, undefined, 20));
  const yScale = options.yScale ?? (ys.every((y) => y > 0) ? 'log' : chooseScale(ys, undefined));
  const kept = dropForLog(series, xScale === 'log', yScale === 'log');
  const omitted = rows.length - good.length + kept.dropped;
  const yAxis = physical
    ? energy
      ? { title: 'E d²N/(dt dE)', unit: 's⁻¹' }
      : { title: 'd²N/(dt dE)', unit: 'GeV⁻¹ s⁻¹' }
    : energy
      ? { title: 'd²E/(dt dω)', unit: '1/M' }
      : { title: 'd²N/(dt dω)' };
  const figure: Figure = {
    title: energy ? 'Hawking power spectrum' : 'Hawking emission spectrum',
    subtitle: joinNotes(
      'per degree of freedom (one helicity of one species)',
      physical && mass && `M = ${tickLabel(mass.mass!)} ${mass.unit ?? ''}`.trim(),
      !physical && 'geometric units (M = 1); give --mass for GeV and s⁻¹',
      omitted > 0 && `${omitted} rows not drawn (failed, or ≤ 0 on a log axis)`,
    ),
    width: options.width ?? 560,
    height: options.height ?? 340,
    x: { ...scaled(physical ? { title: 'E = ħω', unit: 'GeV' } : { title: 'ω', unit: '1/M' }, xScale), nice: false },
    y: scaled(yAxis, yScale),
    series: kept.series,
    legend: { title: 'species, hole' },
    markers: kept.series.length <= 6 && good.length / Math.max(1, kept.series.length) <= 40,
  };
  return result(figure, energy ? 'energySpectra' : 'spectra', kept.series, omitted);
}
