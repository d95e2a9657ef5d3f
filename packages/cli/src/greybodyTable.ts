/** Greybody results as JSON, as a CSV table and as text, shared by the greybody and demo commands. */
import { GAMMA_COLUMN, type Column, type Table, MODE_COLUMNS } from '@penumbra/core';
import type { GreybodySolution } from '@penumbra/flux';
import { INACCURATE_COLUMN, isInaccurate } from './accuracy.js';
import { formatError, formatNumber } from './format.js';

/** One result as the JSON object of `penumbra greybody --json`. */
export function greybodyJson(r: GreybodySolution): Record<string, unknown> {
  return {
    spin: r.mode.field.spin,
    ...(r.mode.field.mass ? { fieldMass: r.mode.field.mass } : {}),
    ...(r.polarization === undefined ? {} : { polarization: r.polarization }),
    l: r.mode.l,
    m: r.mode.m,
    ...(r.mode.kappaSign === undefined ? {} : { fieldMass: r.mode.field.mass, kappaSign: r.mode.kappaSign }),
    a: r.hole.a,
    mass: r.hole.mass,
    // the field's mass Mμ, only for a massive field (massless output is unchanged)
    ...(r.mode.field.mass === undefined ? {} : { fieldMass: r.mode.field.mass }),
    omega: r.omega,
    gamma: r.gamma,
    ...(r.log10Gamma === undefined ? {} : { log10Gamma: r.log10Gamma }),
    underflow: r.underflow,
    reflection: r.reflection,
    residual: r.residual,
    relError: r.relError,
    inaccurate: isInaccurate(r.relError),
    amplification: r.amplification,
    k: r.k,
    superradiant: r.superradiant,
    diagnostics: r.diagnostics,
  };
}

/** The CSV columns: the JSON keys above (matchRadius and rhsEvaluations from its diagnostics). */
const COLUMNS: Column[] = [
  ...MODE_COLUMNS,
  GAMMA_COLUMN,
  {
    name: 'log10Gamma',
    unit: '1',
    description: 'log10 |Γ|; carries Γ where it is below the normal double range (gamma is then 0); empty at k = 0 exactly',
  },
  { name: 'reflection', unit: '1', description: 'reflected fraction, from an independent solve' },
  { name: 'residual', unit: '1', description: '|Γ + reflection − 1|, a check of both solves' },
  { name: 'relError', unit: '1', description: 'estimated relative error of Γ' },
  { name: 'k', unit: '1/M', description: 'k = ω − mΩ_H' },
  { name: 'superradiant', unit: '', description: 'true where a boson wave is amplified (k < 0)' },
  { name: 'matchRadius', unit: 'M', description: 'radius where the horizon and far solutions are matched' },
  { name: 'rhsEvaluations', unit: '', description: 'right-hand-side evaluations' },
  INACCURATE_COLUMN,
];

/** Results as the table of `penumbra greybody --csv`. */
export function greybodyTable(results: readonly GreybodySolution[]): Table {
  return {
    columns: COLUMNS,
    rows: results.map((r) => [
      r.mode.field.spin,
      r.mode.l,
      r.mode.m,
      r.hole.a,
      r.omega,
      r.gamma,
      r.log10Gamma ?? null,
      r.reflection,
      r.residual,
      r.relError,
      r.k,
      r.superradiant,
      r.diagnostics.matchRadius,
      r.diagnostics.rhsEvaluations,
      isInaccurate(r.relError),
    ]),
  };
}

/** Results as rows of text cells, header first. */
export function greybodyTextRows(results: readonly GreybodySolution[]): string[][] {
  return [
    ['Mω', 'Γ', 'reflection', '|Γ+R−1|', 'rel. error', ''],
    ...results.map((r) => [
      formatNumber(r.omega, 6),
      formatGamma(r),
      formatNumber(r.reflection, 10),
      formatError(r.residual),
      formatError(r.relError),
      r.superradiant ? 'superradiant' : '',
    ]),
  ];
}

/** Γ as text; below the normal double range its log10 value, e.g. "−10^-330.2 (below double range)". */
export function formatGamma(r: Pick<GreybodySolution, 'gamma' | 'log10Gamma' | 'underflow' | 'superradiant'>): string {
  if (!r.underflow || r.log10Gamma === undefined) return formatNumber(r.gamma, 10);
  const sign = r.superradiant ? '−' : '';
  return `${sign}10^${r.log10Gamma.toFixed(1)} (below double range)`;
}
