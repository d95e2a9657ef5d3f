/**
 * Checking a figure before drawing it: unknown keys, non-finite points and
 * values a logarithmic axis cannot show are InputErrors naming the key, not
 * a silently wrong picture.
 */
import { InputError, isBoolean, numberIn, oneOf, requireObject, validateOptions, type OptionSpec } from '@penumbra/core';
import {
  PLOT_STYLES,
  SCALE_TYPES,
  type Axis,
  type Figure,
  type Legend,
  type Marker,
  type Panel,
  type Point,
  type Rule,
  type Series,
} from './figure.js';

type Check<T> = (value: unknown, parameter: string) => T;

const text: Check<string> = (value, parameter) => {
  if (typeof value !== 'string') throw new InputError(parameter, 'a string', value);
  return value;
};

const finite: Check<number> = (value, parameter) => {
  if (typeof value !== 'number' || !Number.isFinite(value)) throw new InputError(parameter, 'a finite number', value);
  return value;
};

function list<T>(item: Check<T>): Check<readonly T[]> {
  return (value, parameter) => {
    if (!Array.isArray(value)) throw new InputError(parameter, 'an array', value);
    return value.map((v, i) => item(v, `${parameter}[${i}]`));
  };
}

const point: Check<Point> = (value, parameter) => {
  if (!Array.isArray(value) || value.length !== 2) throw new InputError(parameter, 'a point [x, y]', value);
  return [finite(value[0], `${parameter}[0]`), finite(value[1], `${parameter}[1]`)];
};

const range: Check<readonly [number, number]> = (value, parameter) => {
  const [from, to] = point(value, parameter);
  if (!(from < to)) throw new InputError(parameter, 'a range [from, to] with from < to', value);
  return [from, to];
};

function object<O extends object>(spec: OptionSpec<O>, required: readonly (keyof O & string)[]): Check<O> {
  return (value, parameter) => {
    requireObject(parameter, value, `an object with keys ${Object.keys(spec).join(', ')}`);
    // validateOptions names a bad key by itself; prefix it with where the object sits in the figure
    const located = Object.fromEntries(
      Object.entries(spec).map(([key, check]) => [key, (v: unknown) => (check as Check<unknown>)(v, `${parameter}.${key}`)]),
    ) as unknown as OptionSpec<O>;
    const checked = validateOptions<O>(value, located, parameter);
    for (const key of required) {
      if (checked[key] === undefined) throw new InputError(`${parameter}.${key}`, 'a value (required)', undefined);
    }
    return checked as O;
  };
}

const size = numberIn(1, 10_000);

const axis = object<Axis>(
  {
    title: text,
    unit: text,
    scale: oneOf(SCALE_TYPES),
    domain: range,
    zero: isBoolean,
    nice: isBoolean,
    format: text,
    ticks: list(finite),
    symlogConstant: numberIn(Number.MIN_VALUE, Number.MAX_VALUE),
  },
  ['title'],
);
const series = object<Series>({ name: text, points: list(point), colour: text, dash: text }, ['name', 'points']);
const panel = object<Panel>({ title: text, series: list(series), y: axis, yDomain: range }, ['title', 'series']);
const marker = object<Marker>({ x: finite, label: text }, ['x', 'label']);
const rule = object<Rule>({ y: finite, label: text }, ['y', 'label']);
const legend = object<Legend>(
  {
    title: text,
    dashTitle: text,
    colours: list(text),
    visible: isBoolean,
    position: oneOf(['right', 'bottom'] as const),
    dashes: list(text),
  },
  [],
);

const figureSpec: OptionSpec<Figure> = {
  title: text,
  subtitle: text,
  x: axis,
  y: axis,
  series: list(series),
  panels: list(panel),
  panelY: oneOf(['shared', 'independent'] as const),
  panelLayout: oneOf(['row', 'column'] as const),
  legend,
  markers: (value, parameter) => (typeof value === 'boolean' ? value : size(value, parameter)),
  lineWidth: numberIn(0.1, 100),
  join: oneOf(['x', 'given'] as const),
  clip: isBoolean,
  band: range,
  bandLabel: text,
  marks: list(marker),
  rules: list(rule),
  guide: list(point),
  width: size,
  height: size,
  style: oneOf(PLOT_STYLES),
};

/** Check a figure (see `Figure`) and return a clean copy; throws InputError naming the first bad key. */
export function validateFigure(value: unknown, parameter = 'figure'): Figure {
  if (typeof parameter !== 'string') throw new InputError('parameter', 'a string', parameter);
  const figure = object<Figure>(figureSpec, ['x', 'y'])(value, parameter);
  if ((figure.series === undefined) === (figure.panels === undefined)) {
    throw new InputError(
      `${parameter}.series`,
      'exactly one of series (one chart) and panels (several)',
      figure.series ?? figure.panels,
    );
  }
  if (figure.panels?.length === 0) throw new InputError(`${parameter}.panels`, 'at least one panel', figure.panels);
  checkLogAxis(figure, 'x', parameter);
  checkLogAxis(figure, 'y', parameter);
  return figure;
}

/** A log axis shows positive values only: every point, domain end, band edge, rule and guide point on it must be > 0. */
function checkLogAxis(figure: Figure, which: 'x' | 'y', parameter: string): void {
  const panelLog = which === 'y' && (figure.panels ?? []).some((p) => p.y?.scale === 'log');
  if (figure[which].scale !== 'log' && !panelLog) return;
  const index = which === 'x' ? 0 : 1;
  const allowed = `values > 0 on a log ${which} axis`;
  const check = (v: number, where: string) => {
    if (!(v > 0)) throw new InputError(where, allowed, v);
  };
  if (figure[which].scale === 'log') checkFigureLevel(figure, which, parameter, check);
  const seriesLists = figure.series
    ? [{ series: figure.series, at: `${parameter}.series` }]
    : (figure.panels ?? [])
        .map((p, i) => ({
          series: p.series,
          at: `${parameter}.panels[${i}].series`,
          log: (p.y ?? figure[which]).scale === 'log',
        }))
        .filter((p) => which === 'x' || p.log);
  for (const { series: lines, at } of seriesLists) {
    for (const [i, line] of lines.entries())
      for (const [j, p] of line.points.entries()) check(p[index], `${at}[${i}].points[${j}][${index}]`);
  }
}

/** The figure-level values on a log axis: domain, guide, band, markers, rules. */
function checkFigureLevel(figure: Figure, which: 'x' | 'y', parameter: string, check: (v: number, where: string) => void): void {
  const index = which === 'x' ? 0 : 1;
  for (const [i, v] of (figure[which].domain ?? []).entries()) check(v, `${parameter}.${which}.domain[${i}]`);
  for (const [j, p] of (figure.guide ?? []).entries()) check(p[index], `${parameter}.guide[${j}][${index}]`);
  if (which === 'x') {
    for (const [i, v] of (figure.band ?? []).entries()) check(v, `${parameter}.band[${i}]`);
    for (const [i, m] of (figure.marks ?? []).entries()) check(m.x, `${parameter}.marks[${i}].x`);
  }
  if (which === 'y') {
    for (const [i, r] of (figure.rules ?? []).entries()) check(r.y, `${parameter}.rules[${i}].y`);
    for (const [i, p] of (figure.panels ?? []).entries())
      for (const [k, v] of (p.yDomain ?? []).entries()) check(v, `${parameter}.panels[${i}].yDomain[${k}]`);
  }
}
