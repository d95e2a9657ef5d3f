/** Shared formatting of greybody results for the greybody and demo commands. */
import type { GreybodySolution } from '@penumbra/flux';
import { formatNumber } from './options.js';

export function greybodyJson(r: GreybodySolution): Record<string, unknown> {
  return {
    spin: r.mode.field.spin,
    l: r.mode.l,
    m: r.mode.m,
    a: r.hole.a,
    mass: r.hole.mass,
    omega: r.omega,
    gamma: r.gamma,
    reflection: r.reflection,
    residual: r.residual,
    relError: r.relError,
    amplification: r.amplification,
    k: r.k,
    superradiant: r.superradiant,
    diagnostics: r.diagnostics,
  };
}

export const CSV_HEADER =
  'spin,l,m,a [M],omega [1/M],gamma [1],reflection [1],residual [1],rel_error [1],k [1/M],superradiant,match_radius [M],rhs_evaluations';

export function greybodyCsvRow(r: GreybodySolution): string {
  return [
    r.mode.field.spin, r.mode.l, r.mode.m, r.hole.a, r.omega, r.gamma, r.reflection, r.residual, r.relError, r.k, r.superradiant,
    r.diagnostics.matchRadius, r.diagnostics.rhsEvaluations,
  ].join(',');
}

export function greybodyTextRows(results: readonly GreybodySolution[]): string[][] {
  return [
    ['Mω', 'Γ', 'reflection', '|Γ+R−1|', 'rel. error', ''],
    ...results.map((r) => [
      formatNumber(r.omega, 6),
      formatNumber(r.gamma, 10),
      formatNumber(r.reflection, 10),
      r.residual.toExponential(1),
      r.relError.toExponential(1),
      r.superradiant ? 'superradiant' : '',
    ]),
  ];
}
