/**
 * The helpers every command is built from, for the CLI's tests (import from
 * '@penumbra/cli/internal'); commands import them from their modules directly.
 */
export {
  type OptionsConfig,
  type ParsedOptions,
  type NumberConstraints,
  type ParsedRange,
  parseOptions,
  requireOption,
  parseNumber,
  parseNumberList,
  parseHoleA,
  parseFieldSpin,
  parseRange,
  parseMassUnit,
  parseModeNumber,
  parseMassOption,
  parseNameList,
  closest,
  type MassOption,
  type MassValues,
  GEOMETRIC_UNIT,
} from './options.js';
export { parseContentList } from './contentOption.js';
export { ACCURACY_LIMIT, INACCURATE_COLUMN, type Estimated, isInaccurate, warnInaccurate } from './accuracy.js';
export { type LimitName, limitsHelp } from './limits.js';
export {
  type OutputFormat,
  type Output,
  JSON_OPTION,
  OUTPUT_OPTIONS,
  outputFormat,
  writeOutput,
  writeJson,
  writeCsv,
} from './output.js';
export { formatNumber, formatError, formatTable } from './format.js';
export { progressReporter } from './progress.js';
export { greybodyJson, greybodyTable, greybodyTextRows } from './greybodyTable.js';
export {
  type Estimate,
  type Totals,
  type PhysicalTotals,
  type SpectrumRow,
  totalsTable,
  spectrumTable,
} from './emissionOutput.js';
export { plotFigure, drawableQuantities } from './plotFigure.js';
export { readPlotData, dataKind, type PlotData, type PlotRow, type DataKind } from './plotRead.js';
export { PLOT_QUANTITIES, type PlotQuantity, type PlotOptions, type PlotResult } from './plotCommon.js';
export { parseCsvRows } from './csvRead.js';
export { spectrumTextRows } from './emissionOutput.js';
