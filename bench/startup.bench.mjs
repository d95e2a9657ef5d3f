// Start-up cost of the penumbra executable: CPU time (user + system) of a whole
// `node packages/cli/bin/penumbra.js ...` process, median of 15 runs, beside a
// bare `node -e 0`. CPU time, not wall time, so other load on the machine
// barely moves it. Each child's CPU time comes from bash's `times` builtin
// (getrusage of the finished children, millisecond resolution). Run after
// `npm run build`; writes bench/results/startup.txt.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { cpus } from 'node:os';
import { join } from 'node:path';
import { benchDir, median, today } from './lib.mjs';

const root = join(benchDir, '..');
const cliPackage = JSON.parse(readFileSync(join(root, 'packages', 'cli', 'package.json'), 'utf8'));
const bin = join('packages', 'cli', cliPackage.bin.penumbra);
const runs = 15;

if (!existsSync(join(root, 'packages', 'cli', 'dist', 'main.js'))) {
  console.error('bench/startup: packages/cli/dist is missing; run `npm run build` first');
  process.exit(1);
}

const cases = [
  { label: 'node -e 0 (baseline)', args: ['-e', '0'] },
  { label: `node ${bin} --version`, args: [bin, '--version'] },
  { label: `node ${bin} kerr --a 0.5 --json`, args: [bin, 'kerr', '--a', '0.5', '--json'] },
];

const quote = (arg) => `'${arg.replaceAll("'", "'\\''")}'`;

/** CPU milliseconds (user + system) of one run of `node ...args`, and its wall milliseconds. */
function measure(args) {
  const script = `${quote(process.execPath)} ${args.map(quote).join(' ')} >/dev/null || exit 90; times`;
  const t0 = performance.now();
  const result = spawnSync('bash', ['-c', script], { cwd: root, encoding: 'utf8' });
  const wallMs = performance.now() - t0;
  if (result.status !== 0) throw new Error(`node ${args.join(' ')} failed (status ${result.status}): ${result.stderr}`);
  // `times` prints two lines, the shell's and its children's: "0m0.041s 0m0.008s".
  const children = result.stdout.trim().split('\n').at(-1);
  const [user, system] = [...children.matchAll(/(\d+)m([\d.]+)s/g)].map((m) => Number(m[1]) * 60e3 + Number(m[2]) * 1e3);
  return { cpuMs: user + system, wallMs };
}

// Round-robin over the cases so that a slow spell of the machine hits all of them alike.
const samples = cases.map(() => ({ cpu: [], wall: [] }));
measure(cases[0].args); // warm the file cache
for (let i = 0; i < runs; i++) {
  cases.forEach((c, j) => {
    const { cpuMs, wallMs } = measure(c.args);
    samples[j].cpu.push(cpuMs);
    samples[j].wall.push(wallMs);
  });
}

const baseline = median(samples[0].cpu);
const rows = cases.map((c, j) => {
  const cpu = median(samples[j].cpu);
  return [c.label, cpu.toFixed(0), (cpu / baseline).toFixed(2), median(samples[j].wall).toFixed(0)];
});
const header = ['command', 'CPU ms (median)', '× node -e 0', 'wall ms (median)'];
const width = header.map((h, k) => Math.max(h.length, ...rows.map((r) => r[k].length)));
const line = (r) => r.map((cell, k) => (k === 0 ? cell.padEnd(width[k]) : cell.padStart(width[k]))).join('  ');

const report = [
  `penumbra start-up, ${today()}: CPU time (user + system) of the whole process, median of ${runs} runs`,
  `node ${process.version}, ${cpus()[0]?.model ?? 'unknown CPU'} × ${cpus().length}`,
  '',
  line(header),
  ...rows.map(line),
  '',
].join('\n');

mkdirSync(join(benchDir, 'results'), { recursive: true });
const out = join(benchDir, 'results', 'startup.txt');
writeFileSync(out, report);
process.stdout.write(report);
console.log(`wrote ${out}`);
