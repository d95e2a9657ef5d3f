/**
 * Internals of @penumbra/grid that its tests, benchmarks and the CLI reach
 * for; not part of the public API (import from '@penumbra/grid/internal').
 */
export { modeLs, hasFieldMasses, hasSpecies } from './grid.js';
export { fieldLs, firstL, modeStates, speciesFieldMass, type ModeState } from './fields.js';
export { explicitModes, estimatedSumModes } from './tasks.js';
export { gridTable } from './schema.js';
export { writeFileAtomic, removeStaleTemporaries } from './files.js';
export {
  GRID_FILE,
  CHUNK_DIR,
  type ChunkFile,
  gridFileText,
  readGridFile,
  outputDirProblems,
  initOutputDir,
  chunkFileName,
  chunkText,
  writeChunk,
  readChunk,
  inspectChunk,
  chunkPath,
  type ChunkRead,
} from './store.js';
export { TABLE_JSON, tableCsv, writeTables } from './tables.js';
export { WORKER_FILE, taskMessage, runFileName } from './run.js';
export { plotView } from './plotView.js';
