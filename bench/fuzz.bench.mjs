// The hostile-input fuzz at more runs than CI: the library fuzz (test/fuzz-library.test.ts)
// and the CLI fuzz (packages/cli/test/fuzz.test.ts) at the same fixed seed with every run
// count multiplied by PENUMBRA_FUZZ_SCALE (default here 5), printing the calls per outcome
// class: finite result / InputError / ConvergenceError / other (other must be 0).
// Usage: npm run build && node bench/fuzz.bench.mjs [SCALE]
import { spawnSync } from 'node:child_process';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const scale = process.argv[2] ?? '5';

function run(label, file, pattern) {
  const t0 = Date.now();
  const r = spawnSync('npx', ['vitest', 'run', file], {
    cwd: root,
    env: { ...process.env, PENUMBRA_FUZZ_SCALE: scale },
    encoding: 'utf8',
    maxBuffer: 64 * 1024 * 1024,
  });
  const out = `${r.stdout}\n${r.stderr}`;
  const line = out.split('\n').find((l) => l.includes(pattern));
  const counts = line ? JSON.parse(line.slice(line.indexOf('{'))) : undefined;
  const summary =
    out
      .split('\n')
      .find((l) => /Tests\s+\d/.test(l))
      ?.trim() ?? '(no summary)';
  const seconds = ((Date.now() - t0) / 1000).toFixed(0);
  if (!counts) {
    console.log(`${label}: no outcome line (vitest exit ${r.status}); ${summary}`);
    return;
  }
  const total = Object.values(counts).reduce((a, b) => a + b, 0);
  const share = Object.entries(counts)
    .map(([k, v]) => `${k} ${v} (${((100 * v) / total).toFixed(1)} %)`)
    .join(', ');
  console.log(`${label} at ${scale}× the CI runs: ${total} calls: ${share}; vitest ${summary}, ${seconds} s`);
}

console.log('outcome classes: finite result | InputError (CLI exit 2) | ConvergenceError (CLI exit 3) | other (must be 0)');
run('library fuzz', 'test/fuzz-library.test.ts', 'library fuzz outcomes:');
run('CLI fuzz', 'packages/cli/test/fuzz.test.ts', 'cli fuzz outcomes:');
