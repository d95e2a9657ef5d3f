import { InputError } from '@penumbra/core';
/**
 * The figure model: named series of (x, y) points on two axes with titles,
 * units and scales, drawn as lines in one chart or in panels side by side.
 * It says what to draw, not how: the Vega-Lite specification behind it stays
 * inside this package.
 */

/** Axis scales: linear, logarithmic (data > 0), or symmetric-log (linear near zero, logarithmic beyond; for data of both signs spanning decades). */
export const SCALE_TYPES = ['linear', 'log', 'symlog'] as const;

/** One of `SCALE_TYPES`. */
export type ScaleType = (typeof SCALE_TYPES)[number];

/** Looks: `'plain'` is penumbra's own look (light grid, left-aligned title, small margins); `'report'` has larger fonts, a lighter grid and a darker frame (the validation report's figures). */
export const PLOT_STYLES = ['plain', 'report'] as const;

/** One of `PLOT_STYLES`. */
export type PlotStyle = (typeof PLOT_STYLES)[number];

/** An axis: what it measures, in which unit, on which scale. */
export interface Axis {
  /** the quantity, e.g. `'ω'` or `'σ / M²'` */
  readonly title: string;
  /** unit, written after the title in brackets (`'ω'` with `'1/M'` → `'ω [1/M]'`); omit it for dimensionless quantities or a unit already in the title */
  readonly unit?: string;
  /** default `'linear'` */
  readonly scale?: ScaleType;
  /** fixed [min, max] instead of the data's range */
  readonly domain?: readonly [number, number];
  /** whether a linear axis reaches to zero (default true, as in Vega-Lite) */
  readonly zero?: boolean;
  /** whether the ends are rounded to nice numbers (default true) */
  readonly nice?: boolean;
  /** tick-label format in d3-format notation, e.g. `'~g'` or `'.0e'` (default Vega's) */
  readonly format?: string;
  /** explicit tick values (default Vega's; a symmetric-log axis gets signed powers of ten) */
  readonly ticks?: readonly number[];
  /** width of the linear part of a symmetric-log axis (default: the smallest nonzero |value| drawn on it) */
  readonly symlogConstant?: number;
}

/** A point (x, y). */
export type Point = readonly [x: number, y: number];

/** One line of a chart. */
export interface Series {
  /** the series' name: its legend entry when no series has `colour` or `dash` (each name then gets its own colour and dash pair) */
  readonly name: string;
  /** the points, joined in order of x unless the figure says `join: 'given'` */
  readonly points: readonly Point[];
  /** colour group (e.g. `'m = 2'`): series with equal groups share a colour, listed in the colour legend (default: the name) */
  readonly colour?: string;
  /** dash group (e.g. `'l = 3'`), drawn as a dash pattern with a legend of its own */
  readonly dash?: string;
}

/** One panel of a figure with several side by side. */
export interface Panel {
  /** the panel's heading, e.g. `'a = 0.99'` */
  readonly title: string;
  /** the panel's lines */
  readonly series: readonly Series[];
  /** this panel's own vertical axis (title, unit, scale), instead of the figure's */
  readonly y?: Axis;
  /** this panel's own y range (panels with one are drawn as separate charts with their own y axes) */
  readonly yDomain?: readonly [number, number];
}

/** A horizontal reference line with a label (dashed, grey). */
export interface Rule {
  /** height on the y axis */
  readonly y: number;
  /** text written just above the line, at the left */
  readonly label: string;
}

/** A vertical reference line with a label, e.g. the superradiant edge mΩ_H. */
export interface Marker {
  /** position on the x axis */
  readonly x: number;
  /** text written beside the line, at the top */
  readonly label: string;
}

/** The legends of the series: one for colour, one for dash (when series carry `dash`). */
export interface Legend {
  /** colour legend title (default none) */
  readonly title?: string;
  /** dash legend title (default none) */
  readonly dashTitle?: string;
  /** order of the colour groups in their legend (default: order of first appearance) */
  readonly colours?: readonly string[];
  /** `'right'` (default) or `'bottom'` (one entry per row, for long names) */
  readonly position?: 'right' | 'bottom';
  /** `false` draws no legend (e.g. one line per panel, named by its axis) */
  readonly visible?: boolean;
  /** order of the dash groups in their legend (default: order of first appearance) */
  readonly dashes?: readonly string[];
}

/**
 * A figure: one chart (`series`) or panels side by side (`panels`), sharing
 * axes, legend and decorations. Panels that differ only in their series are
 * drawn as one faceted chart with the axes drawn once; otherwise (a panel
 * with its own y domain, or a band, rules or a guide) each panel is a chart
 * with its own axes.
 */
export interface Figure {
  /** the figure's title (default none) */
  readonly title?: string;
  /** second title line (ignored without `title`) */
  readonly subtitle?: string;
  /** the horizontal axis */
  readonly x: Axis;
  /** the vertical axis (shared by all panels unless `panelY` or a panel's `yDomain` says otherwise) */
  readonly y: Axis;
  /** the lines of a one-chart figure (exactly one of `series`, `panels`) */
  readonly series?: readonly Series[];
  /** the panels of a figure with several charts */
  readonly panels?: readonly Panel[];
  /** `'row'` (default): panels left to right; `'column'`: stacked top to bottom, sharing the x axis */
  readonly panelLayout?: 'row' | 'column';
  /** `'shared'` (default): one y scale for every panel; `'independent'`: each panel fits its own data */
  readonly panelY?: 'shared' | 'independent';
  readonly legend?: Legend;
  /** markers at the points: `true`, or a marker area in px² (default none) */
  readonly markers?: boolean | number;
  /** line width in px (default Vega's, 2) */
  readonly lineWidth?: number;
  /** `'x'` (default): each line joins its points by increasing x; `'given'`: in the order given */
  readonly join?: 'x' | 'given';
  /** clip lines and markers to the plotting area (for fixed domains) */
  readonly clip?: boolean;
  /** shaded x range [from, to], e.g. a frequency band */
  readonly band?: readonly [number, number];
  /** text written in the band, at the top */
  readonly bandLabel?: string;
  /** vertical reference lines with labels */
  readonly marks?: readonly Marker[];
  /** horizontal reference lines with labels */
  readonly rules?: readonly Rule[];
  /** a dashed grey reference curve outside the legend, e.g. y = x */
  readonly guide?: readonly Point[];
  /** width of one chart or panel in px (default 560) */
  readonly width?: number;
  /** height of one chart or panel in px (default 360) */
  readonly height?: number;
  /** default `'plain'` */
  readonly style?: PlotStyle;
}

/** An axis title with its unit: `'ω [1/M]'`. */
export function axisTitle(axis: Pick<Axis, 'title' | 'unit'>): string {
  if (typeof axis !== 'object' || axis === null) throw new InputError('axis', 'an axis { title, unit? }', axis);
  if (typeof axis.title !== 'string') throw new InputError('axis.title', 'a string', axis.title);
  if (axis.unit !== undefined && typeof axis.unit !== 'string') throw new InputError('axis.unit', 'a string', axis.unit);
  return axis.unit ? `${axis.title} [${axis.unit}]` : axis.title;
}
