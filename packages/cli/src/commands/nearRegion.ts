import { type Column, type Table, MODE_COLUMNS } from '@penumbra/core';
import { compareNearRegion, type NearRegionComparison } from '@penumbra/near-region';
import type { Command } from '../command.js';
import { formatError, formatNumber, formatTable } from '../format.js';
import { parseOptions } from '../options.js';
import { MODE_HELP, MODE_OPTIONS, parseModeArguments } from '../modeArguments.js';
import { OUTPUT_OPTIONS, outputFormat, writeOutput } from '../output.js';
import { progressReporter } from '../progress.js';

/** `penumbra near-region`. */
export const command: Command = {
  name: 'near-region',
  summary: 'two-temperature (near-region) form of Γ for one mode: T_L, T_R, c_L, c_R, weights, and its ratio to the exact Γ',
  usage: `Usage: penumbra near-region --spin S --l L --m M --a A --omega W|START:STOP:COUNT [options]

Geometric units: the hole mass is 1, ω is Mω, a is a/M. The near-region form
needs 0 < a/M ≤ 0.9999: T_L and T_R diverge at a = 0, and a < 0 is the mirror
image of (|a|, −m). Derivation and validity map: docs/near-region.md.

Options:
  ${MODE_HELP}
  --a A        the hole's spin parameter a/M, 0 < a/M ≤ 0.9999
  --omega W    frequency Mω in [1e-5, 30], or a grid START:STOP:COUNT
  --log        space a frequency grid geometrically
  --tol T      requested relative accuracy of the exact Γ (default 1e-8, 1e-12 … 1e-2)
  --json       JSON: one object (keys TL, TR, cL, cR, omegaL, omegaR, hL, hR,
               gammaNearRegion, gamma, ratio, ...), or an array for a grid
  --csv        CSV with units in the header
  -h, --help   this text

Examples:
  penumbra near-region --spin 0 --l 1 --m 1 --a 0.5 --omega 1e-3
  penumbra near-region --spin 2 --l 2 --m 2 --a 0.9 --omega 1e-4:0.3:12 --log --csv
`,
  run(argv, io) {
    const { values } = parseOptions(argv, {
      ...MODE_OPTIONS,
      ...OUTPUT_OPTIONS,
    });
    const format = outputFormat(values);
    const { spin, l, m, a, grid, omegaText, tol } = parseModeArguments(values);
    const results: NearRegionComparison[] = [];
    const progress = progressReporter(io, 'near-region: frequencies done', grid.count);
    for (const [i, omega] of grid.values.entries()) {
      results.push(compareNearRegion({ hole: { a }, mode: { field: { spin }, l, m }, omega }, { tol }));
      progress(i + 1);
    }
    const single = grid.count === 1 && !omegaText.includes(':');
    writeOutput(io, format, {
      json: () => (single ? comparisonJson(results[0]) : results.map(comparisonJson)),
      csv: () => comparisonTable(results),
      text: () => comparisonText(results, { spin, l, m, a }),
    });
    return 0;
  },
};

/** One result as the JSON object of `penumbra near-region --json`. */
function comparisonJson(r: NearRegionComparison): Record<string, unknown> {
  return {
    spin: r.mode.field.spin,
    l: r.mode.l,
    m: r.mode.m,
    a: r.hole.a,
    mass: r.hole.mass,
    omega: r.omega,
    TL: r.TL,
    TR: r.TR,
    cL: r.cL,
    cR: r.cR,
    omegaL: r.omegaL,
    omegaR: r.omegaR,
    hL: r.hL,
    hR: r.hR,
    thermalFactor: r.thermalFactor,
    gammaNearRegion: r.gammaNearRegion,
    ...(r.log10GammaNearRegion === undefined ? {} : { log10GammaNearRegion: r.log10GammaNearRegion }),
    gamma: r.gamma,
    ...(r.log10Gamma === undefined ? {} : { log10Gamma: r.log10Gamma }),
    ratio: r.ratio,
    k: r.k,
    relError: r.relError,
    cardyEntropy: r.cardyEntropy,
    entropy: r.entropy,
    diagnostics: r.diagnostics,
  };
}

const COLUMNS: Column[] = [
  ...MODE_COLUMNS,
  { name: 'TL', unit: '1', description: 'left temperature (r+ + r−)/(4πa)' },
  { name: 'TR', unit: '1', description: 'right temperature (r+ − r−)/(4πa)' },
  { name: 'cL', unit: '1', description: 'left central charge 12J' },
  { name: 'cR', unit: '1', description: 'right central charge 12J' },
  { name: 'omegaL', unit: '1', description: 'left frequency 2M²ω/a' },
  { name: 'omegaR', unit: '1', description: 'right frequency 2M²ω/a − m' },
  { name: 'hL', unit: '1', description: 'left conformal weight l + 1 − s' },
  { name: 'hR', unit: '1', description: 'right conformal weight l + 1' },
  { name: 'gammaNearRegion', unit: '1', description: 'near-region (two-temperature) form of Γ' },
  { name: 'gamma', unit: '1', description: 'exact greybody factor Γ' },
  { name: 'ratio', unit: '1', description: 'Γ_near / Γ (empty at k = 0 exactly)' },
  { name: 'relError', unit: '1', description: 'estimated relative error of the exact Γ' },
];

/** Results as the table of `penumbra near-region --csv`. */
function comparisonTable(results: readonly NearRegionComparison[]): Table {
  return {
    columns: COLUMNS,
    rows: results.map((r) => [
      r.mode.field.spin,
      r.mode.l,
      r.mode.m,
      r.hole.a,
      r.omega,
      r.TL,
      r.TR,
      r.cL,
      r.cR,
      r.omegaL,
      r.omegaR,
      r.hL,
      r.hR,
      r.gammaNearRegion,
      r.gamma,
      Number.isNaN(r.ratio) ? null : r.ratio,
      r.relError,
    ]),
  };
}

function comparisonText(
  results: readonly NearRegionComparison[],
  mode: { spin: number; l: number; m: number; a: number },
): string {
  const first = results[0];
  const header =
    `near-region form against the exact Γ, s = ${mode.spin}, l = ${mode.l}, m = ${mode.m}, a = ${mode.a} M\n` +
    `  T_L = ${formatNumber(first.TL)}, T_R = ${formatNumber(first.TR)}, c_L = c_R = ${formatNumber(first.cL)} (12J)\n` +
    `  conformal weights (h_L, h_R) = (${first.hL}, ${first.hR}); Boltzmann factor through ${first.thermalFactor}\n` +
    `  Cardy entropy ${formatNumber(first.cardyEntropy)} = A/4 = ${formatNumber(first.entropy)}\n`;
  const rows = [
    ['Mω', 'ω_L', 'ω_R', 'Γ_near', 'Γ', 'Γ_near/Γ', 'rel. error'],
    ...results.map((r) => [
      formatNumber(r.omega, 6),
      formatNumber(r.omegaL, 8),
      formatNumber(r.omegaR, 8),
      formatGamma(r.gammaNearRegion, r.log10GammaNearRegion),
      formatGamma(r.gamma, r.log10Gamma),
      Number.isNaN(r.ratio) ? 'undefined (k = 0)' : formatNumber(r.ratio, 8),
      formatError(r.relError),
    ]),
  ];
  return header + formatTable(rows);
}

/** Γ for people; below the double range, its power of ten. */
function formatGamma(value: number, log10: number | undefined): string {
  if (value === 0 && log10 !== undefined) return `10^${log10.toFixed(3)}`;
  return formatNumber(value, 8);
}
