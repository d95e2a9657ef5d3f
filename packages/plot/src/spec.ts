/**
 * Figure → Vega-Lite specification. Lines are one `line` mark coloured by
 * series name (and dashed by `dash`); panels are a column facet, or a
 * horizontal concatenation when they need axes of their own; a band, a guide
 * and rules are extra layers under and over the lines.
 */
import type { TopLevelSpec } from 'vega-lite';
import { axisTitle, type Axis, type Figure, type Panel, type Series } from './figure.js';
import { smallestMagnitude, symlogTicks } from './scales.js';

// Built as plain objects and cast once at the end: Vega-Lite's spec types are
// unions too large for TypeScript to narrow usefully field by field.
type Spec = Record<string, unknown>;

const SCHEMA = 'https://vega.github.io/schema/vega-lite/v6.json';

/** The validation report's look: larger type, lighter grid, darker frame. */
const REPORT_CONFIG = {
  font: 'Helvetica, Arial, sans-serif',
  axis: { labelFontSize: 11, titleFontSize: 12, grid: true, gridOpacity: 0.4 },
  legend: { labelFontSize: 11, titleFontSize: 11, labelLimit: 520 },
  title: { fontSize: 13 },
  view: { stroke: '#888' },
};

const BAND_COLOUR = '#f4d9a6';
const GUIDE_COLOUR = '#777';
const RULE_COLOUR = '#444';
const REFERENCE_DASH = [4, 3];

/** The Vega-Lite specification of a validated figure. */
export function vegaLiteSpec(figure: Figure): TopLevelSpec {
  const spec: Spec = { $schema: SCHEMA };
  if (figure.style === 'report') spec.config = REPORT_CONFIG;
  spec.background = 'white';
  if (figure.title !== undefined) spec.title = figure.subtitle ? { text: figure.title, subtitle: figure.subtitle } : figure.title;
  const body = figure.series ? chart(figure, figure.series, figure.y.domain) : panels(figure, figure.panels ?? []);
  return { ...spec, ...body } as unknown as TopLevelSpec;
}

function size(figure: Figure): Spec {
  return { width: figure.width ?? 560, height: figure.height ?? 360 };
}

/** One chart: the lines, with the band and guide under them and the rules over them. */
function chart(figure: Figure, series: readonly Series[], yDomain: readonly [number, number] | undefined): Spec {
  const lines = { data: { values: rows(figure, series) }, ...linesMark(figure, allSeries(figure), yDomain) };
  const layers = [bandLayer(figure), guideLayer(figure), lines, rulesLayer(figure)].filter((l): l is Spec => l !== undefined);
  return layers.length === 1 ? { ...size(figure), ...lines } : { ...size(figure), layer: layers };
}

function panels(figure: Figure, list: readonly Panel[]): Spec {
  const ownAxes = list.some((p) => p.yDomain) || figure.band || figure.rules || figure.guide;
  const y = list.some((p) => p.yDomain) || figure.panelY === 'independent' ? 'independent' : 'shared';
  if (ownAxes) {
    return {
      hconcat: list.map((p) => ({ title: p.title, ...chart(figure, p.series, p.yDomain ?? figure.y.domain) })),
      resolve: { scale: { y } },
    };
  }
  return {
    data: { values: list.flatMap((p) => rows(figure, p.series).map((row) => ({ ...row, panel: p.title }))) },
    facet: { column: { field: 'panel', type: 'nominal', title: null, sort: list.map((p) => p.title) } },
    ...(y === 'independent' ? { resolve: { scale: { y } } } : {}),
    spec: { ...size(figure), ...linesMark(figure, allSeries(figure), figure.y.domain) },
  };
}

function allSeries(figure: Figure): Series[] {
  return figure.series ? [...figure.series] : (figure.panels ?? []).flatMap((p) => p.series);
}

function rows(figure: Figure, series: readonly Series[]): Spec[] {
  const given = figure.join === 'given';
  return series.flatMap((s) =>
    s.points.map(([x, y], i) => ({
      x,
      y,
      series: s.name,
      ...(s.dash !== undefined ? { dash: s.dash } : {}),
      ...(given ? { order: i } : {}),
    })),
  );
}

function distinct(values: readonly (string | undefined)[]): string[] {
  return [...new Set(values.filter((v): v is string => v !== undefined))];
}

/** The line mark and its encoding; `series` are every series of the figure, so that scales and legends cover all panels. */
function linesMark(figure: Figure, series: readonly Series[], yDomain: readonly [number, number] | undefined): Spec {
  const mark: Spec = { type: 'line' };
  if (figure.markers !== undefined && figure.markers !== false)
    mark.point = figure.markers === true ? true : { size: figure.markers };
  if (figure.clip) mark.clip = true;
  if (figure.lineWidth !== undefined) mark.strokeWidth = figure.lineWidth;
  const xs = series.flatMap((s) => s.points.map((p) => p[0]));
  const ys = series.flatMap((s) => s.points.map((p) => p[1]));
  const encoding: Spec = {
    x: position('x', figure.x, xs, figure.x.domain),
    y: position('y', figure.y, ys, yDomain),
    color: {
      field: 'series',
      type: 'nominal',
      title: figure.legend?.title ?? null,
      sort: distinct(series.map((s) => s.name)),
      ...(figure.legend?.position === 'bottom' ? { legend: { orient: 'bottom', columns: 1 } } : {}),
    },
  };
  const dashes = distinct([...(figure.legend?.dashes ?? []), ...series.map((s) => s.dash)]);
  if (series.some((s) => s.dash !== undefined))
    encoding.strokeDash = { field: 'dash', type: 'nominal', title: null, sort: dashes };
  if (figure.join === 'given') encoding.order = { field: 'order', type: 'quantitative' };
  return { mark, encoding };
}

function position(field: 'x' | 'y', axis: Axis, values: readonly number[], domain: readonly [number, number] | undefined): Spec {
  const type = axis.scale ?? 'linear';
  const scale: Spec = { type };
  if (domain) scale.domain = [...domain];
  if (type === 'linear' && axis.zero !== undefined) scale.zero = axis.zero;
  if (axis.nice !== undefined) scale.nice = axis.nice;
  if (type === 'symlog') scale.constant = axis.symlogConstant ?? smallestMagnitude(values);
  const guide: Spec = {};
  if (axis.format !== undefined) guide.format = axis.format;
  const ticks = axis.ticks ?? (type === 'symlog' ? symlogTicks(values) : undefined);
  if (ticks) guide.values = [...ticks];
  return { field, type: 'quantitative', title: axisTitle(axis), scale, ...(Object.keys(guide).length ? { axis: guide } : {}) };
}

function bandLayer(figure: Figure): Spec | undefined {
  if (!figure.band) return undefined;
  const [from, to] = figure.band;
  return {
    data: { values: [{ from, to }] },
    mark: { type: 'rect', color: BAND_COLOUR, opacity: 0.5 },
    encoding: { x: { field: 'from', type: 'quantitative' }, x2: { field: 'to' } },
  };
}

function guideLayer(figure: Figure): Spec | undefined {
  if (!figure.guide) return undefined;
  return {
    data: { values: figure.guide.map(([x, y]) => ({ x, y })) },
    mark: { type: 'line', strokeDash: REFERENCE_DASH, color: GUIDE_COLOUR },
    encoding: { x: { field: 'x', type: 'quantitative' }, y: { field: 'y', type: 'quantitative' } },
  };
}

function rulesLayer(figure: Figure): Spec | undefined {
  if (!figure.rules) return undefined;
  const y = { field: 'y', type: 'quantitative' };
  return {
    data: { values: figure.rules.map((r) => ({ y: r.y, label: r.label })) },
    layer: [
      { mark: { type: 'rule', strokeDash: REFERENCE_DASH, color: RULE_COLOUR }, encoding: { y } },
      {
        mark: { type: 'text', align: 'left', dx: 4, dy: -6, color: RULE_COLOUR, fontSize: 10 },
        encoding: { y, x: { value: 4 }, text: { field: 'label' } },
      },
    ],
  };
}
