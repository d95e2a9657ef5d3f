export {
  SCALE_TYPES,
  PLOT_STYLES,
  type ScaleType,
  type PlotStyle,
  type Axis,
  type Point,
  type Series,
  type Panel,
  type Rule,
  type Marker,
  type Legend,
  type Figure,
  axisTitle,
} from './figure.js';
export { autoScale, tickLabel } from './scales.js';
export { validateFigure } from './validate.js';
export { renderSvg } from './render.js';
