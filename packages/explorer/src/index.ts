export { buildExplorer, EXPLORER_FILES } from './build.js';
export { serveExplorer, type ExplorerServer } from './serve.js';
export {
  VIEWS,
  type ViewName,
  HOLE_MASS_UNITS,
  type HoleMassUnit,
  type ExplorerState,
  VIEW_DEFAULTS,
  parseState,
  formatState,
} from './state.js';
export {
  type ViewResult,
  type ProgressCallback,
  PRINTED_DIGITS,
  printNumber,
  shortNumber,
  greybodyView,
  crossSectionView,
  spectrumView,
  evolutionView,
  computeView,
} from './views.js';
