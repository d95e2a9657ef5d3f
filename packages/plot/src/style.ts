/**
 * penumbra's look: its colours, dash patterns and Vega-Lite configs. Lines
 * are told apart by colour and dash together, so that figures survive
 * grey-scale printing and a colour-blind reader.
 */

/** Line colours, in the order series take them: ten hues of similar weight, the first nine used for ungrouped series. */
export const PALETTE = [
  '#1f5fa8',
  '#d9472b',
  '#2a9a59',
  '#8e4bb3',
  '#d99a00',
  '#17a2b8',
  '#b23a78',
  '#7a5c2e',
  '#5b8def',
  '#555555',
] as const;

/** Dash patterns (px on, px off, …); the first is solid. */
export const DASHES: readonly (readonly number[])[] = [
  [1, 0],
  [8, 3],
  [2, 2.5],
  [10, 3, 2, 3],
  [4, 4],
  [12, 3, 2, 3, 2, 3],
];

/** Colours per dash pattern for ungrouped series: series i takes colour i mod 9 and dash ⌊i/9⌋, so 54 series differ. */
export const PAIRED_COLOURS = 9;

/** The dash of reference lines and guides. */
export const REFERENCE_DASH = [5, 4];

/** Colours of the decorations. */
export const STYLE = {
  lineWidth: 1.8,
  band: '#fbe3b8',
  bandText: '#8a5a00',
  marker: '#8a5a00',
  guide: '#777',
  rule: '#444',
} as const;

/** penumbra's own look: left-aligned title close to the chart, light grid, dark frame. */
export const PLAIN_CONFIG = {
  font: 'DejaVu Sans, Helvetica, Arial, sans-serif',
  title: { anchor: 'start', fontSize: 14, fontWeight: 'bold', subtitleFontSize: 11, subtitleColor: '#555', offset: 6 },
  axis: {
    labelFontSize: 11,
    titleFontSize: 12,
    titleFontWeight: 'normal',
    gridColor: '#e8e8e8',
    domainColor: '#333',
    tickColor: '#333',
    labelColor: '#222',
    titleColor: '#111',
  },
  legend: {
    labelFontSize: 11,
    titleFontSize: 11,
    titleFontWeight: 'normal',
    symbolStrokeWidth: 2,
    symbolSize: 260,
    labelLimit: 360,
  },
  header: { labelFontSize: 12 },
  view: { stroke: '#333' },
  concat: { spacing: 14 },
};

/** The validation report's look: larger type, lighter grid, darker frame. */
export const REPORT_CONFIG = {
  font: 'Helvetica, Arial, sans-serif',
  axis: { labelFontSize: 11, titleFontSize: 12, grid: true, gridOpacity: 0.4 },
  legend: { labelFontSize: 11, titleFontSize: 11, labelLimit: 520 },
  title: { fontSize: 13 },
  view: { stroke: '#888' },
};
