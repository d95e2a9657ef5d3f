#!/usr/bin/env node
// Makes the example figures in docs/figures/ with the penumbra CLI: each figure
// is one `penumbra plot` of one command's output, drawn as SVG and rendered
// to PNG with resvg. Run from the repository root after `npm run build`
// (about two minutes on two cores): node scripts/figures.mjs
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Resvg } from '@resvg/resvg-js';

const root = new URL('..', import.meta.url).pathname;
const out = join(root, 'docs', 'figures');
const work = mkdtempSync(join(tmpdir(), 'penumbra-figures-'));
const penumbra = (...args) => {
  console.log(`penumbra ${args.join(' ')}`);
  return execFileSync(process.execPath, [join(root, 'packages/cli/bin/penumbra.js'), ...args], {
    encoding: 'utf8',
    stdio: ['ignore', 'pipe', 'inherit'],
    maxBuffer: 1 << 28,
  });
};
const saved = (name, text) => {
  const file = join(work, name);
  writeFileSync(file, text);
  return file;
};
const figure = (name, input, ...options) => {
  const svg = join(out, `${name}.svg`);
  penumbra('plot', input, ...options, '--out', svg);
  const png = new Resvg(readFileSync(svg, 'utf8'), { fitTo: { mode: 'zoom', value: 1.5 } }).render().asPng();
  writeFileSync(join(out, `${name}.png`), png);
};

try {
  // superradiance of the s = 2, l = 2 modes of a fast hole
  const sr = join(work, 'superradiance');
  penumbra('table', '--spins', '2', '--a', '0.99', '--omega', '0.4:0.9:100', '--l', '2:2', '--out', sr, '--quiet');
  figure('gamma-s2-l2-a0.99', sr);
  figure('amplification-s2-l2m2-a0.99', sr, '--quantity', 'amplification', '--m', '2');
  // 24 modes of the photon field
  const photon = join(work, 'photon');
  penumbra('table', '--spins', '1', '--a', '0.7', '--omega', '0.05:1.6:32', '--l', '1:4', '--out', photon, '--quiet');
  figure('gamma-s1-l1to4-a0.7', photon);
  // absorption cross-section of a massless scalar, with its limits
  figure(
    'cross-section-s0-a0',
    saved('sigma.csv', penumbra('cross-section', '--spin', '0', '--a', '0', '--omega', '0.02:2:40', '--log', '--csv')),
    '--spin',
    '0',
    '--a',
    '0',
  );
  // emission spectra per species of a 10¹⁵ g hole, in GeV
  const spectra = join(work, 'spectra');
  penumbra(
    'table',
    '--spins',
    '0,1/2,1,2',
    '--a',
    '0.7',
    '--omega',
    '0.02:2:30',
    '--spacing',
    'log',
    '--quantities',
    'spectra',
    '--out',
    spectra,
    '--quiet',
  );
  figure('spectra-a0.7-1e15g', spectra, '--mass', '1e15', '--unit', 'g');
  // the evaporation track of the same hole
  figure(
    'evaporation-a0.99-1e15g',
    saved('track.json', penumbra('evolve', '--a', '0.99', '--mass', '1e15', '--unit', 'g', '--json')),
  );
} finally {
  rmSync(work, { recursive: true, force: true });
}
