import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runGrid, validateGrid } from '@penumbra/grid';

// Scalar absorption cross-section of a Schwarzschild hole at three frequencies.
const grid = validateGrid({
  fieldSpins: [0],
  holeA: [0],
  frequencies: { values: [0.001, 0.3, 1.5] },
  tolerance: 1e-6,
  quantities: ['crossSection'],
});
const out = join(mkdtempSync(join(tmpdir(), 'penumbra-')), 'sigma');
const run = await runGrid({ grid, out, workers: 2 });
console.log(`complete: ${run.complete}; rows: ${run.summary?.rows.crossSection}; failed: ${run.summary?.failed.crossSection}`);
console.log(readFileSync(join(out, 'cross-section.csv'), 'utf8').trim());
