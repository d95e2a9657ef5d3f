/**
 * Figures of `evolve` and `spheroidal` output: the evaporation track (M, a*
 * and the Hawking temperature against time, stacked on one time axis) and
 * a spheroidal harmonic S(θ).
 */
import { kerrHole, MASS_UNITS, type MassUnit } from '@penumbra/kerr';
import { tickLabel, type Figure, type Panel } from '@penumbra/plot';
import {
  chooseScale,
  gevPerOmega,
  halfLabel,
  num,
  PlotDataError,
  scaled,
  type PlotOptions,
  type PlotResult,
} from './plotCommon.js';
import type { PlotRow } from './plotRead.js';

/** M(t), a*(t) and T_H(t) of an evaporating hole; T_H in GeV when the mass unit is known. */
export function trackFigure(all: readonly PlotRow[], options: PlotOptions, fileUnit?: string): PlotResult {
  const rows = all.filter(
    (r) => num(r, 'timeSeconds') !== undefined && num(r, 'mass') !== undefined && num(r, 'aStar') !== undefined,
  );
  if (rows.length < 2) throw new PlotDataError('a track needs two points or more');
  const unit = (MASS_UNITS as readonly string[]).includes(fileUnit ?? '') ? (fileUnit as MassUnit) : undefined;
  const t = rows.map((r) => r.timeSeconds as number);
  // T_H = κ/2π in units of 1/M: κ of a unit hole with a*, scaled by 1/M
  const temperature = (r: PlotRow) => {
    const mass = r.mass as number;
    const unitHole = kerrHole({ a: Math.min(r.aStar as number, 0.9999) }).temperature;
    return unit ? unitHole * gevPerOmega(mass, unit) : unitHole / mass;
  };
  const positive = rows.filter((r) => (r.mass as number) > 0);
  const xScale = options.xScale ?? 'linear';
  const tempScale = chooseScale(positive.map(temperature), undefined, 30);
  const panels: Panel[] = [
    {
      title: '',
      y: scaled({ title: 'M', unit: unit ?? 'file unit' }, 'linear', true),
      series: [{ name: 'M', points: rows.map((r, i) => [t[i], r.mass as number]) }],
    },
    {
      title: '',
      y: { title: 'a* = a/M', scale: 'linear', domain: [0, 1] },
      series: [{ name: 'a*', points: rows.map((r, i) => [t[i], r.aStar as number]) }],
    },
    {
      title: '',
      y: scaled({ title: 'Tₕ', unit: unit ? 'GeV' : '1/M' }, tempScale),
      series: [{ name: 'Tₕ', points: positive.map((r) => [r.timeSeconds as number, temperature(r)]) }],
    },
  ];
  const figure: Figure = {
    title: 'Evaporation track',
    subtitle:
      `M₀ = ${tickLabel(rows[0].mass as number)} ${unit ?? ''}, a*₀ = ${rows[0].aStar}; Tₕ = κ/2π, the Hawking temperature (k_B = 1); ${rows.length} points`.replace(
        '  ',
        ' ',
      ),
    x: { ...scaled({ title: 't', unit: 's' }, xScale), nice: false },
    y: { title: 'M' },
    panels,
    panelLayout: 'column',
    width: options.width ?? 560,
    height: Math.round((options.height ?? 340) / 2),
    markers: rows.length <= 60,
    legend: { visible: false },
  };
  return {
    figure,
    quantity: 'track',
    series: ['M', 'a*', 'Tₕ'],
    points: rows.length * 2 + positive.length,
    omitted: rows.length - positive.length,
    xScale,
    yScale: 'linear',
  };
}

/** S(θ) of one spheroidal harmonic. */
export function harmonicFigure(rows: readonly PlotRow[], options: PlotOptions): PlotResult {
  const points = rows
    .filter((r) => num(r, 'theta') !== undefined && num(r, 'S') !== undefined)
    .map((r) => [r.theta as number, r.S as number] as [number, number]);
  if (points.length === 0) throw new PlotDataError('no finite S(θ) values');
  const r0 = rows[0];
  const label = `s = ${halfLabel(num(r0, 'spin') ?? 0)}, l = ${halfLabel(num(r0, 'l') ?? 0)}, m = ${halfLabel(num(r0, 'm') ?? 0)}, c = aω = ${num(r0, 'c') ?? '?'}`;
  const yScale = options.yScale ?? 'linear';
  const figure: Figure = {
    title: 'Spin-weighted spheroidal harmonic S(θ)',
    subtitle: `${label}; normalised to ∫|S|² sinθ dθ = 1`,
    x: { title: 'θ', unit: 'rad', scale: options.xScale ?? 'linear', nice: false, zero: false },
    y: scaled({ title: 'S(θ)' }, yScale, true),
    series: [{ name: label, points }],
    markers: points.length <= 40,
    width: options.width ?? 560,
    height: options.height ?? 340,
  };
  return { figure, quantity: 'harmonic', series: [label], points: points.length, omitted: 0, xScale: 'linear', yScale };
}
