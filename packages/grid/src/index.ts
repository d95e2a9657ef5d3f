export {
  QUANTITIES,
  type Quantity,
  type LRange,
  type GridSpec,
  DEFAULT_TOLERANCE,
  DEFAULT_CHUNK_SIZE,
  MAX_GRID_L,
  MAX_TASKS,
  GridError,
  validateGrid,
  canonicalGridJson,
  gridHash,
} from './grid.js';
export type { GridField, GridSpecies, HoleMass } from './fields.js';
export {
  type GridTask,
  type GridChunk,
  type ShardSpec,
  gridTasks,
  gridChunks,
  taskCost,
  parseShard,
  shardChunks,
} from './tasks.js';
export { type Row, type RowStatus, type TableName, TABLE_NAMES, TABLE_FILES, tableColumns, gridTables } from './schema.js';
export { type TaskMessage, type TaskResult, computeTask } from './compute.js';
export {
  type FailureNote,
  type TableSummary,
  type AssembledTables,
  type TableFile,
  assembleTables,
  readTableFile,
} from './tables.js';
export { type Progress, type RunOptions, type RunSummary, defaultWorkers, runProblems, runGrid } from './run.js';
export { type MergeSummary, mergeRuns } from './merge.js';
export { formatDuration, formatProgress, progressPrinter } from './progress.js';
export { type GridFlags, hasGridFlags, gridFromFlags } from './flags.js';
// The view of a table that `penumbra plot` draws, and the atomic write it uses.
export { type GridTable, readTable } from './plotView.js';
export { writeFileAtomic } from './files.js';
