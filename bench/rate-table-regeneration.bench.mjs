// The shipped massive rate table regenerated from nothing (no reused node), timed, and compared node
// by node with the shipped one: the regeneration cost the table's budget is about (under an hour on
// two workers, with the Page table), and a check that the shipped numbers are reproduced within
// their stated errors by one run of today's solver.
//   npx tsc -b && node bench/rate-table-regeneration.bench.mjs [--from DIR]
// --from DIR: compare (and report the time of) a run already made into DIR (its massiveRateTableData.ts
// and log.txt), instead of running the generator (about 20 minutes on two idle cores).
// The seconds recorded in the shipped module add node times measured across several generations,
// some on a loaded machine; this bench measures one run.
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { SHIPPED_MASSIVE_RATE_TABLE, SHIPPED_PAGE_TABLE } from '@penumbra/emission/internal';
import { benchDir, writeResult } from './lib.mjs';

const args = process.argv.slice(2);
const from = args.includes('--from') ? args[args.indexOf('--from') + 1] : undefined;
const dir = from ?? mkdtempSync(join(os.tmpdir(), 'penumbra-rate-table-'));
const load = os.loadavg()[0];
let wallSeconds;
if (from === undefined) {
  const t0 = performance.now();
  const run = spawnSync(process.execPath, ['packages/emission/scripts/make-massive-rate-table.mjs'], {
    cwd: join(benchDir, '..'),
    env: {
      ...process.env,
      MASSIVE_TABLE_OUT: join(dir, 'massiveRateTableData.ts'),
      MASSIVE_TABLE_PARTIAL: join(dir, 'partial.jsonl'),
    },
    stdio: ['ignore', 'inherit', 'inherit'],
  });
  wallSeconds = (performance.now() - t0) / 1000;
  if (run.status !== 0) throw new Error(`the generator exited with ${run.status}`);
}
// the module as plain JavaScript (its one type annotation and type import removed)
const source = readFileSync(join(dir, 'massiveRateTableData.ts'), 'utf8')
  .replace(/: MassiveRateTable & \{[^}]*\}/, '')
  .replace(/^import type .*$/m, '');
const jsPath = join(dir, 'regenerated.mjs');
writeFileSync(jsPath, source);
const fresh = (await import(pathToFileURL(jsPath).href)).SHIPPED_MASSIVE_RATE_TABLE;
const shipped = SHIPPED_MASSIVE_RATE_TABLE;

// every node value: the difference against the sum of both stated errors (must be ≤ 1)
let values = 0;
let over = 0;
let worstRel = 0;
let worstOfErrors = 0;
let where = '';
shipped.spins.forEach((s, i) => {
  const f = fresh.spins[i];
  for (const q of ['powerRatio', 'torqueRatio']) {
    s[q].forEach((row, r) => {
      row.forEach((x, c) => {
        const y = f[q][r][c];
        const d = Math.abs(x - y);
        const err = s[`${q}Error`][r][c] + f[`${q}Error`][r][c];
        const ofErrors = err > 0 ? d / err : d > 0 ? Number.POSITIVE_INFINITY : 0;
        values++;
        if (ofErrors > 1) over++;
        worstRel = Math.max(worstRel, d / Math.abs(x));
        if (ofErrors > worstOfErrors) {
          worstOfErrors = ofErrors;
          where = `spin ${s.spin} ${q} Mμ = ${s.fieldMass[r]} a* = ${s.aStar[c].toFixed(4)}`;
        }
      });
    });
  }
});
const seconds = wallSeconds ?? fresh.seconds;
const total = seconds + SHIPPED_PAGE_TABLE.seconds;
console.log(
  `massive rate table from nothing: ${seconds.toFixed(0)} s ${wallSeconds === undefined ? '(as the run recorded it)' : 'wall'} on 2 workers, ${fresh.gammaCalls} greybody solves, load average ${load.toFixed(1)} before; with the Page table (${SHIPPED_PAGE_TABLE.seconds.toFixed(0)} s) ${total.toFixed(0)} s = ${(total / 3600).toFixed(2)} × the one-hour budget`,
);
console.log(
  `against the shipped table: ${values} node values, ${over} differ by more than the sum of both stated errors; worst ${worstOfErrors.toFixed(3)} of it (${where}); worst relative difference ${worstRel.toExponential(2)}`,
);
writeResult('rate-table-regeneration', {
  machine: { cores: os.cpus().length, load },
  seconds,
  measured: wallSeconds === undefined ? 'recorded by the run' : 'wall',
  pageSeconds: SHIPPED_PAGE_TABLE.seconds,
  ratioToHour: total / 3600,
  gammaCalls: fresh.gammaCalls,
  values,
  overStatedErrors: over,
  worstOfStatedErrors: worstOfErrors,
  worstAt: where,
  worstRelative: worstRel,
});
