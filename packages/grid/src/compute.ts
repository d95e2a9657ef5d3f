/**
 * One grid point (spin, a, ω): every requested quantity. A solve that does
 * not converge or refuses its input is a row with that status (core's
 * `attempt` statuses) and the solver's message, so that the other rows go
 * on; any other error is a bug and stops the run. Runs inside the pool
 * workers; pure apart from the solvers it calls.
 */
import { attempt, type Attempt, type FieldSpin } from '@penumbra/core';
import { absorptionCrossSection, tryGreybody, type GreybodySolution } from '@penumbra/flux';
import { emissionSpectrum } from '@penumbra/emission';
import { clearSpheroidalCache } from '@penumbra/spheroidal';
import type { LRange, Quantity } from './grid.js';
import type { Row, RowStatus, TableName } from './schema.js';
import { explicitModes } from './tasks.js';

/** What a worker receives: the point and the grid settings, nothing bulky. */
export interface TaskMessage {
  index: number;
  /** field spin of the point (0, 1/2, 1, 2) */
  s: number;
  /** the hole's a/M */
  a: number;
  omega: number;
  l: LRange;
  tolerance: number;
  quantities: Quantity[];
}

/** The rows one grid point adds to each table. */
export interface TaskResult {
  index: number;
  rows: Partial<Record<TableName, Row[]>>;
}

/** Why a row holds no numbers. */
interface Failure {
  status: Exclude<RowStatus, 'success'>;
  message: string;
}

/** A solve's outcome as a row needs it: the solution, or the status and message of its failure. */
type Checked<S> = { status: 'success'; solution: S } | Failure;

const finite = (x: number) => Number.isFinite(x);
const succeeded = <S>(solution: S): Attempt<S> => ({ status: 'success', solution, message: 'converged' });

/** A solution is a number only if every number in it is finite; otherwise the solve did not converge. */
function checked<S>(outcome: Attempt<S>, numbers: (solution: S) => number[], what: string): Checked<S> {
  if (outcome.status !== 'success') return { status: outcome.status, message: outcome.message };
  const values = numbers(outcome.solution);
  if (values.every(finite)) return { status: 'success', solution: outcome.solution };
  return { status: 'not-converged', message: `non-finite ${what} (${values.join(', ')})` };
}

const modeNumbers = (reflection: boolean) => (r: GreybodySolution) => [
  r.gamma,
  r.relError,
  ...(reflection ? [r.reflection, r.residual] : []),
];

function modeRow(task: TaskMessage, l: number, m: number, outcome: Checked<GreybodySolution>, reflection: boolean): Row {
  const point = { spin: task.s, a: task.a, omega: task.omega, l, m };
  if (outcome.status !== 'success') {
    const row: Row = { ...point, status: outcome.status, gamma: null, relError: null };
    if (reflection) Object.assign(row, { reflection: null, residual: null });
    return Object.assign(row, { steps: null, rhsEvaluations: null, message: outcome.message });
  }
  const r = outcome.solution;
  const row: Row = { ...point, status: 'success', gamma: r.gamma, relError: r.relError };
  if (reflection) Object.assign(row, { reflection: r.reflection, residual: r.residual });
  return Object.assign(row, { steps: r.diagnostics.steps, rhsEvaluations: r.diagnostics.rhsEvaluations, message: null });
}

function solveMode(task: TaskMessage, l: number, m: number, reflection: boolean): Row {
  const problem = { hole: { a: task.a }, mode: { field: { spin: task.s as FieldSpin }, l, m }, omega: task.omega };
  return modeRow(
    task,
    l,
    m,
    checked(tryGreybody(problem, { tol: task.tolerance, reflection }), modeNumbers(reflection), 'greybody result'),
    reflection,
  );
}

/** m values of shell l, from −l to l. */
function shellMs(l: number): number[] {
  return Array.from({ length: 2 * l + 1 }, (_, i) => i - l);
}

/** The (l, m) a ConvergenceError's diagnostics name, if any: the mode the l-sum stopped at. */
function failedModeOf(outcome: Attempt<unknown>): { l: number; m: number } | undefined {
  if (outcome.status !== 'not-converged') return undefined;
  const d = outcome.error.diagnostics as unknown as Record<string, unknown>;
  return d && typeof d.l === 'number' && typeof d.m === 'number' ? { l: d.l, m: d.m } : undefined;
}

/** Every requested quantity of one grid point, each table's rows in order. */
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
  const point = { spin: task.s, a: task.a, omega: task.omega };

  if (perMode && task.l !== 'auto') {
    rows.modes = explicitModes(task.s, task.l).map(({ l, m }) => solveMode(task, l, m, reflection));
  }

  if (q.includes('crossSection') || (perMode && task.l === 'auto')) {
    // The automatic l range of the mode table is the one the cross-section sum reaches.
    const solved: GreybodySolution[] = [];
    const outcome = attempt(() =>
      absorptionCrossSection(
        { hole: { a: task.a }, field: { spin: task.s as FieldSpin }, omega: task.omega },
        {
          tol: task.tolerance,
          onMode: (r) => void solved.push(r),
        },
      ),
    );
    const cs = checked(outcome, (c) => [c.sigma, c.relError, c.diagnostics.droppedBound], 'cross-section');
    const crossRow: Row =
      cs.status !== 'success'
        ? {
            ...point,
            status: cs.status,
            sigma: null,
            relError: null,
            droppedBound: null,
            lMax: null,
            modes: solved.length,
            message: cs.message,
          }
        : {
            ...point,
            status: 'success',
            sigma: cs.solution.sigma,
            relError: cs.solution.relError,
            droppedBound: cs.solution.diagnostics.droppedBound,
            lMax: cs.solution.diagnostics.lMax,
            modes: cs.solution.diagnostics.modes,
            message: null,
          };
    if (q.includes('crossSection')) rows.crossSection = [crossRow];
    if (perMode && task.l === 'auto') {
      const modeRows: Row[] = [];
      for (const r of solved) {
        // At a = 0 the sum solves one m per shell: Γ does not depend on m there (spherical symmetry).
        const { l, m: mode } = r.mode;
        const ms = task.a === 0 ? shellMs(l) : [mode];
        for (const m of ms) {
          if (reflection) modeRows.push(solveMode(task, l, m, true));
          else modeRows.push(modeRow(task, l, m, checked(succeeded(r), modeNumbers(false), 'greybody result'), false));
        }
      }
      const failedMode = failedModeOf(outcome);
      if (failedMode && cs.status !== 'success') {
        const ms = task.a === 0 ? shellMs(failedMode.l) : [failedMode.m];
        for (const m of ms) modeRows.push(modeRow(task, failedMode.l, m, cs, reflection));
      }
      rows.modes = modeRows;
    }
  }

  if (q.includes('spectra')) {
    const outcome = attempt(() => {
      const spectrum = emissionSpectrum(
        { hole: { a: task.a }, field: { spin: task.s as FieldSpin }, grid: [task.omega] },
        { tol: task.tolerance },
      );
      return spectrum.points[0];
    });
    const checkedPoint = checked(outcome, (x) => [x.number, x.energy, x.torque, x.relError, x.droppedBound], 'spectrum');
    if (checkedPoint.status !== 'success') {
      rows.spectra = [
        {
          ...point,
          status: checkedPoint.status,
          number: null,
          energy: null,
          torque: null,
          relError: null,
          droppedBound: null,
          lMax: null,
          modes: null,
          message: checkedPoint.message,
        },
      ];
    } else {
      const p = checkedPoint.solution;
      rows.spectra = [
        {
          ...point,
          status: 'success',
          number: p.number,
          energy: p.energy,
          torque: p.torque,
          relError: p.relError,
          droppedBound: p.droppedBound,
          lMax: p.lMax,
          modes: p.modes,
          message: null,
        },
      ];
    }
  }
  return { index: task.index, rows };
}
