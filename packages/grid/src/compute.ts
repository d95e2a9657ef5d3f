/**
 * One grid point (s, a, ω): every requested quantity, each failure caught and
 * kept as a failed row with its diagnostics so that the other rows go on.
 * Runs inside the pool workers; pure apart from the solvers it calls.
 */
import type { FieldSpin } from '@penumbra/core';
import { absorptionCrossSection, greybody, type GreybodySolution } from '@penumbra/flux';
import { emissionSpectrum } from '@penumbra/emission';
import { clearSpheroidalCache } from '@penumbra/spheroidal';
import type { LRange, Quantity } from './grid.js';
import type { Row, TableName } from './schema.js';
import { explicitModes } from './tasks.js';

/** What a worker receives: the point and the grid settings, nothing bulky. */
export interface TaskMessage {
  index: number;
  s: number;
  a: number;
  omega: number;
  l: LRange;
  tolerance: number;
  quantities: Quantity[];
}

export interface TaskResult {
  index: number;
  rows: Partial<Record<TableName, Row[]>>;
}

interface Failure {
  failure: string;
  diagnostics?: Record<string, unknown>;
}

function describeFailure(error: unknown): Failure {
  if (error instanceof Error) {
    const diagnostics = (error as { diagnostics?: unknown }).diagnostics;
    const out: Failure = { failure: `${error.name}: ${error.message}` };
    if (typeof diagnostics === 'object' && diagnostics !== null) out.diagnostics = diagnostics as Record<string, unknown>;
    return out;
  }
  return { failure: String(error) };
}

const finite = (x: number) => Number.isFinite(x);

function modeRow(task: TaskMessage, l: number, m: number, r: GreybodySolution, reflection: boolean): Row {
  const row: Row = { s: task.s, a: task.a, omega: task.omega, l, m, status: 'ok', gamma: r.gamma, relError: r.relError };
  if (reflection) {
    row.reflection = r.reflection;
    row.residual = r.residual;
  }
  row.steps = r.diagnostics.steps;
  row.rhsEvaluations = r.diagnostics.rhsEvaluations;
  row.failure = null;
  return row;
}

function failedModeRow(task: TaskMessage, l: number, m: number, reflection: boolean, f: Failure): Row {
  const row: Row = { s: task.s, a: task.a, omega: task.omega, l, m, status: 'failed', gamma: null, relError: null };
  if (reflection) {
    row.reflection = null;
    row.residual = null;
  }
  row.steps = null;
  row.rhsEvaluations = null;
  row.failure = f.failure;
  return row;
}

/** A result is a number only if every number in it is finite. */
function checkedMode(r: GreybodySolution, reflection: boolean): GreybodySolution {
  const values = [r.gamma, r.relError, ...(reflection ? [r.reflection, r.residual] : [])];
  if (!values.every(finite)) throw new Error(`non-finite result (gamma ${r.gamma}, relError ${r.relError}, reflection ${r.reflection})`);
  return r;
}

function solveMode(task: TaskMessage, l: number, m: number, reflection: boolean): Row {
  try {
    const r = greybody({ hole: { a: task.a }, mode: { field: { spin: task.s as FieldSpin }, l, m }, omega: task.omega }, { tol: task.tolerance, reflection });
    return modeRow(task, l, m, checkedMode(r, reflection), reflection);
  } catch (error) {
    return failedModeRow(task, l, m, reflection, describeFailure(error));
  }
}

/** m values of shell l, from −l to l. */
function shellMs(l: number): number[] {
  return Array.from({ length: 2 * l + 1 }, (_, i) => i - l);
}

export function computeTask(task: TaskMessage): TaskResult {
  // The eigenvalue solver warm-starts from the last point it solved; which point
  // that was depends on how tasks were spread over workers, and the warm start
  // moves the last digits. A cold start per task makes every result independent
  // of worker count and order.
  clearSpheroidalCache();
  const q = task.quantities;
  const perMode = q.includes('gamma') || q.includes('reflection');
  const reflection = q.includes('reflection');
  const rows: TaskResult['rows'] = {};
  const point = { s: task.s, a: task.a, omega: task.omega };

  if (perMode && task.l !== 'auto') {
    rows.modes = explicitModes(task.s, task.l).map(({ l, m }) => solveMode(task, l, m, reflection));
  }

  if (q.includes('crossSection') || (perMode && task.l === 'auto')) {
    // The automatic l range of the mode table is the one the cross-section sum reaches.
    const solved: GreybodySolution[] = [];
    let crossRow: Row;
    let failedMode: { l: number; m: number; failure: Failure } | undefined;
    try {
      const cs = absorptionCrossSection({ hole: { a: task.a }, field: { spin: task.s as FieldSpin }, omega: task.omega }, {
        tol: task.tolerance,
        onMode: (r) => void solved.push(r),
      });
      const { droppedBound, lMax, modes } = cs.diagnostics;
      if (![cs.sigma, cs.relError, droppedBound].every(finite)) throw new Error(`non-finite cross-section ${cs.sigma}`);
      crossRow = { ...point, status: 'ok', sigma: cs.sigma, relError: cs.relError, droppedBound, lMax, modes, failure: null };
    } catch (error) {
      const f = describeFailure(error);
      crossRow = { ...point, status: 'failed', sigma: null, relError: null, droppedBound: null, lMax: null, modes: solved.length, failure: f.failure };
      const d = f.diagnostics;
      if (d && typeof d.l === 'number' && typeof d.m === 'number') failedMode = { l: d.l, m: d.m, failure: f };
    }
    if (q.includes('crossSection')) rows.crossSection = [crossRow];
    if (perMode && task.l === 'auto') {
      const modeRows: Row[] = [];
      for (const r of solved) {
        // At a = 0 the sum solves one m per shell: Γ does not depend on m there (spherical symmetry).
        const { l, m: mode } = r.mode;
        const ms = task.a === 0 ? shellMs(l) : [mode];
        for (const m of ms) {
          if (reflection) modeRows.push(solveMode(task, l, m, true));
          else {
            try {
              modeRows.push(modeRow(task, l, m, checkedMode(r, false), false));
            } catch (error) {
              modeRows.push(failedModeRow(task, l, m, false, describeFailure(error)));
            }
          }
        }
      }
      if (failedMode) {
        const ms = task.a === 0 ? shellMs(failedMode.l) : [failedMode.m];
        for (const m of ms) modeRows.push(failedModeRow(task, failedMode.l, m, reflection, failedMode.failure));
      }
      rows.modes = modeRows;
    }
  }

  if (q.includes('spectra')) {
    try {
      const spectrum = emissionSpectrum({ hole: { a: task.a }, field: { spin: task.s as FieldSpin }, grid: [task.omega] }, { tol: task.tolerance });
      const p = spectrum.points[0];
      if (![p.number, p.energy, p.torque, p.relError, p.droppedBound].every(finite)) throw new Error(`non-finite spectrum ${p.number}`);
      rows.spectra = [{
        ...point, status: 'ok', number: p.number, energy: p.energy, torque: p.torque, relError: p.relError,
        droppedBound: p.droppedBound, lMax: p.lMax, modes: p.modes, failure: null,
      }];
    } catch (error) {
      const f = describeFailure(error);
      rows.spectra = [{
        ...point, status: 'failed', number: null, energy: null, torque: null, relError: null,
        droppedBound: null, lMax: null, modes: null, failure: f.failure,
      }];
    }
  }
  return { index: task.index, rows };
}
