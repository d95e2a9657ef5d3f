/**
 * Figure → Vega-Lite specification. Lines are one `line` mark told apart by
 * colour and dash together; panels are a column facet, or a concatenation
 * when they need axes of their own; a band, markers, a guide and rules are
 * extra layers under and over the lines.
 */
import type { TopLevelSpec } from 'vega-lite';
import { axisTitle, type Axis, type Figure, type Panel, type Series } from './figure.js';
import { LINEAR_LABEL_EXPR, logDomain, logTicks, symlogConstant, symlogDomain, symlogTicks, tickLabel } from './scales.js';
import { DASHES, PAIRED_COLOURS, PALETTE, PLAIN_CONFIG, REFERENCE_DASH, REPORT_CONFIG, STYLE } from './style.js';

// Built as plain objects and cast once at the end: Vega-Lite's spec types are
// unions too large for TypeScript to narrow usefully field by field.
type Spec = Record<string, unknown>;

const SCHEMA = 'https://vega.github.io/schema/vega-lite/v6.json';

/** The Vega-Lite specification of a validated figure. */
export function vegaLiteSpec(figure: Figure): TopLevelSpec {
  const spec: Spec = { $schema: SCHEMA, config: figure.style === 'report' ? REPORT_CONFIG : PLAIN_CONFIG };
  spec.background = 'white';
  spec.padding = 8;
  if (figure.title !== undefined) spec.title = figure.subtitle ? { text: figure.title, subtitle: figure.subtitle } : figure.title;
  const body = figure.series
    ? chart(figure, figure.series, figure.y, figure.y.domain, true)
    : panels(figure, figure.panels ?? []);
  return { ...spec, ...body } as unknown as TopLevelSpec;
}

function size(figure: Figure): Spec {
  return { width: figure.width ?? 560, height: figure.height ?? 360 };
}

/** One chart: the band, guide and markers under the lines, the rules over them. */
function chart(figure: Figure, series: readonly Series[], y: Axis, yDomain: Axis['domain'], xTitle: boolean): Spec {
  const lines = { data: { values: rows(figure, series) }, ...linesMark(figure, series, y, yDomain, xTitle) };
  const xs = series.flatMap((s) => s.points.map((p) => p[0]));
  const layers = [bandLayer(figure, xs), guideLayer(figure), marksLayer(figure), lines, rulesLayer(figure)].filter(
    (l): l is Spec => l !== undefined,
  );
  return layers.length === 1 ? { ...size(figure), ...lines } : { ...size(figure), layer: layers };
}

function panels(figure: Figure, list: readonly Panel[]): Spec {
  const column = figure.panelLayout === 'column';
  const ownAxes = column || list.some((p) => p.yDomain || p.y) || figure.band || figure.rules || figure.guide || figure.marks;
  const y = list.some((p) => p.yDomain || p.y) || figure.panelY === 'independent' ? 'independent' : 'shared';
  if (ownAxes) {
    const charts = list.map((p, i) => ({
      title: p.title,
      ...chart(figure, p.series, p.y ?? figure.y, p.yDomain ?? (p.y ?? figure.y).domain, !column || i === list.length - 1),
    }));
    return column
      ? { vconcat: charts, spacing: 14, resolve: { scale: { y: 'independent' }, legend: { color: 'shared' } } }
      : { hconcat: charts, resolve: { scale: { y } } };
  }
  const all = list.flatMap((p) => p.series);
  return {
    data: { values: list.flatMap((p) => rows(figure, p.series).map((row) => ({ ...row, panel: p.title }))) },
    facet: { column: { field: 'panel', type: 'nominal', title: null, sort: list.map((p) => p.title) } },
    ...(y === 'independent' ? { resolve: { scale: { y } } } : {}),
    spec: { ...size(figure), ...linesMark(figure, all, figure.y, figure.y.domain, true) },
  };
}

function allSeries(figure: Figure): Series[] {
  return figure.series ? [...figure.series] : (figure.panels ?? []).flatMap((p) => p.series);
}

/** Whether the figure's series carry colour or dash groups (else each name gets its own colour-and-dash pair). */
function grouped(figure: Figure): boolean {
  return allSeries(figure).some((s) => s.colour !== undefined || s.dash !== undefined);
}

function rows(figure: Figure, series: readonly Series[]): Spec[] {
  const given = figure.join === 'given';
  return series.flatMap((s) =>
    s.points.map(([x, y], i) => ({
      x,
      y,
      series: s.name,
      colour: s.colour ?? s.name,
      ...(s.dash !== undefined ? { dash: s.dash } : {}),
      ...(given ? { order: i } : {}),
    })),
  );
}

function distinct(values: readonly (string | undefined)[]): string[] {
  return [...new Set(values.filter((v): v is string => v !== undefined))];
}

/** The line mark and its encoding; scales and legends cover every series of the figure, so panels agree. */
function linesMark(figure: Figure, series: readonly Series[], y: Axis, yDomain: Axis['domain'], xTitle: boolean): Spec {
  const mark: Spec = { type: 'line', strokeWidth: figure.lineWidth ?? STYLE.lineWidth };
  if (figure.markers !== undefined && figure.markers !== false)
    mark.point = figure.markers === true ? { size: 18 } : { size: figure.markers };
  if (figure.clip) mark.clip = true;
  const every = allSeries(figure);
  const xs = every.flatMap((s) => s.points.map((p) => p[0]));
  const ys = series.flatMap((s) => s.points.map((p) => p[1]));
  // legend symbols are short strokes in the line's colour and dash, also where points are drawn
  const legendPlace = { symbolType: 'stroke', ...(figure.legend?.position === 'bottom' ? { orient: 'bottom', columns: 1 } : {}) };
  const hidden = figure.legend?.visible === false;
  const encoding: Spec = {
    x: position('x', figure.x, xs, figure.x.domain, xTitle),
    y: position('y', y, ys, yDomain, true),
  };
  if (grouped(figure)) {
    encoding.color = {
      field: 'colour',
      type: 'nominal',
      title: figure.legend?.title ?? null,
      sort: distinct([...(figure.legend?.colours ?? []), ...every.map((s) => s.colour ?? s.name)]),
      scale: { range: [...PALETTE] },
      legend: hidden ? null : { ...legendPlace, symbolDash: [1, 0] },
    };
    if (every.some((s) => s.dash !== undefined))
      encoding.strokeDash = {
        field: 'dash',
        type: 'nominal',
        title: figure.legend?.dashTitle ?? null,
        sort: distinct([...(figure.legend?.dashes ?? []), ...every.map((s) => s.dash)]),
        scale: { range: DASHES.map((d) => [...d]) },
        legend: hidden ? null : { ...legendPlace, encode: { symbols: { update: { stroke: { value: '#333' } } } } },
      };
  } else {
    // one legend: colour and dash on the same field; series i takes colour i mod 9 and dash ⌊i/9⌋
    const names = distinct(every.map((s) => s.name));
    const colours = names.map((_, i) => PALETTE[i % PAIRED_COLOURS]);
    const dashes = names.map((_, i) => [...DASHES[Math.floor(i / PAIRED_COLOURS) % DASHES.length]]);
    const title = figure.legend?.title ?? null;
    const legend = { legend: hidden ? null : legendPlace };
    encoding.color = { field: 'series', type: 'nominal', title, sort: names, scale: { range: colours }, ...legend };
    encoding.strokeDash = { field: 'series', type: 'nominal', title, sort: names, scale: { range: dashes }, ...legend };
  }
  if (figure.join === 'given') encoding.order = { field: 'order', type: 'quantitative' };
  return { mark, encoding };
}

function position(field: 'x' | 'y', axis: Axis, values: readonly number[], domain: Axis['domain'], withTitle: boolean): Spec {
  const type = axis.scale ?? 'linear';
  const scale: Spec = { type };
  const guide: Spec = {};
  let ticks = axis.ticks ? [...axis.ticks] : undefined;
  let chosen = domain ? ([...domain] as [number, number]) : undefined;
  if (type === 'symlog') {
    const constant = axis.symlogConstant ?? symlogConstant(values);
    chosen ??= symlogDomain(values);
    ticks ??= symlogTicks(values, chosen, constant);
    scale.constant = constant;
    scale.nice = false;
  } else if (type === 'log') {
    if (!chosen) {
      const positive = values.filter((v) => v > 0);
      chosen = axis.nice === false && positive.length ? [Math.min(...positive), Math.max(...positive)] : logDomain(values);
    }
    ticks ??= logTicks(chosen[0], chosen[1]);
    scale.nice = false;
  } else {
    if (axis.zero !== undefined) scale.zero = axis.zero;
    if (axis.nice !== undefined) scale.nice = axis.nice;
  }
  if (chosen && values.length) scale.domain = chosen;
  if (ticks) guide.values = ticks;
  if (axis.format !== undefined) guide.format = axis.format;
  else if (ticks && type !== 'linear') guide.labelExpr = labelExpression(ticks);
  else if (type === 'linear') guide.labelExpr = LINEAR_LABEL_EXPR;
  if (type !== 'linear') guide.labelOverlap = false;
  return {
    field,
    type: 'quantitative',
    title: withTitle ? axisTitle(axis) : null,
    scale,
    axis: guide,
  };
}

/** A Vega expression giving each explicit tick its label from `tickLabel` (Vega's own formats have no superscripts). */
function labelExpression(ticks: readonly number[]): string {
  return ticks.reduceRight(
    (rest, t) => `datum.value === ${t} ? ${JSON.stringify(tickLabel(t)).replace(/'/g, "\\'")} : ${rest}`,
    'datum.label',
  );
}

function bandLayer(figure: Figure, xs: readonly number[]): Spec | undefined {
  if (!figure.band) return undefined;
  const [from, to] = figure.band;
  const layers: Spec[] = [
    {
      mark: { type: 'rect', color: STYLE.band, opacity: 0.55, clip: true },
      encoding: { x: { field: 'from', type: 'quantitative' }, x2: { field: 'to' } },
    },
  ];
  if (figure.bandLabel) {
    // inside the band, against its right edge, at the bottom: clear of the marker labels at the top
    const right = xs.length ? Math.min(to, Math.max(...xs)) : to;
    layers.push({
      mark: { type: 'text', align: 'right', baseline: 'bottom', dx: -4, dy: -3, color: STYLE.bandText, fontSize: 10 },
      encoding: {
        x: { datum: right, type: 'quantitative' },
        y: { value: figure.height ?? 360 },
        text: { value: figure.bandLabel },
      },
    });
  }
  return { data: { values: [{ from, to }] }, layer: layers };
}

function marksLayer(figure: Figure): Spec | undefined {
  if (!figure.marks?.length) return undefined;
  const x = { field: 'x', type: 'quantitative' };
  return {
    data: { values: figure.marks.map((m) => ({ x: m.x, label: m.label })) },
    layer: [
      { mark: { type: 'rule', color: STYLE.marker, strokeWidth: 1.2, clip: true }, encoding: { x } },
      {
        mark: { type: 'text', align: 'left', baseline: 'top', dx: 3, dy: 3, color: STYLE.marker, fontSize: 10, clip: true },
        encoding: { x, y: { value: 0 }, text: { field: 'label' } },
      },
    ],
  };
}

function guideLayer(figure: Figure): Spec | undefined {
  if (!figure.guide) return undefined;
  return {
    data: { values: figure.guide.map(([x, y]) => ({ x, y })) },
    mark: { type: 'line', strokeDash: REFERENCE_DASH, color: STYLE.guide },
    encoding: { x: { field: 'x', type: 'quantitative' }, y: { field: 'y', type: 'quantitative' } },
  };
}

function rulesLayer(figure: Figure): Spec | undefined {
  if (!figure.rules) return undefined;
  const y = { field: 'y', type: 'quantitative' };
  return {
    data: { values: figure.rules.map((r) => ({ y: r.y, label: r.label })) },
    layer: [
      { mark: { type: 'rule', strokeDash: REFERENCE_DASH, color: STYLE.rule, clip: true }, encoding: { y } },
      {
        mark: { type: 'text', align: 'left', dx: 4, dy: -6, color: STYLE.rule, fontSize: 10, clip: true },
        encoding: { y, x: { value: 0 }, text: { field: 'label' } },
      },
    ],
  };
}
