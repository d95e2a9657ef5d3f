export { InputError, ConvergenceError, requireFinite, requireInRange, requireObject, requireKeyedObject } from './errors.js';
export { type Diagnostics, type Status, type Attempt, attempt, exactDiagnostics } from './diagnostics.js';
export { type OptionSpec, validateOptions, oneOf, isBoolean, isFunction, numberIn } from './options.js';
export {
  FIELD_SPINS,
  SPIN_WEIGHTS,
  type FieldSpin,
  type FieldSpinInput,
  type SpinWeight,
  type Field,
  type CheckedField,
  FIELD_MASS_RANGE,
  parseFieldSpin,
  parseFieldMass,
  validateField,
  requireMassless,
  isFermion,
  formatFieldSpin,
} from './field.js';
export { type Hole, MAX_SOLVER_A_RATIO, validateHole } from './hole.js';
export { type Mode, MAX_L, validateAngular, validateMode } from './mode.js';
export { TOLERANCE_RANGE, validateTolerance } from './tolerance.js';
export { MAX_GRID_POINTS, type GridSpacing, type FrequencyGrid, linearGrid, logGrid, gridValues } from './grids.js';
export {
  type LShellRule,
  type LShellSum,
  type LShellVectorSum,
  geometricTailBound,
  requireLShellReach,
  sumLShells,
  sumLShellVectors,
} from './lShells.js';
export {
  type Column,
  type Cell,
  type Table,
  headerCell,
  formatCell,
  csvField,
  csvHeader,
  csvRow,
  toCsv,
  toJsonTable,
} from './table.js';
export {
  SPIN_COLUMN,
  FIELD_MASS_COLUMN,
  HOLE_SPIN_COLUMN,
  OMEGA_COLUMN,
  L_COLUMN,
  M_COLUMN,
  GAMMA_COLUMN,
  MODE_COLUMNS,
} from './columns.js';
