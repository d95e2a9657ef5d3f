/**
 * One grid point (field, a, ω): every requested quantity. A solve that does
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
import { firstL, modeStates, type ModeState } from './fields.js';

/** What a worker receives: the point and the grid settings, nothing bulky. */
export interface TaskMessage {
  index: number;
  /** field spin of the point (0, 1/2, 1, 2) */
  s: number;
  /** field mass Mμ (units of 1/M); present only when the grid's rows carry it (absent: massless) */
  fieldMass?: number;
  /** the species of a species grid: its rows carry the name and dof, its spectra are weighted by dof */
  species?: { name: string; dof: number };
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

/** The columns that name a grid point, in column order: species and dof, spin, field mass only where the grid has them. */
function pointOf(task: TaskMessage): Row {
  const point: Row = task.species ? { species: task.species.name, dof: task.species.dof } : {};
  point.spin = task.s;
  if (task.fieldMass !== undefined) point.fieldMass = task.fieldMass;
  return Object.assign(point, { a: task.a, omega: task.omega });
}

function modeRow(
  task: TaskMessage,
  l: number,
  m: number,
  state: ModeState,
  outcome: Checked<GreybodySolution>,
  reflection: boolean,
): Row {
  const point = { ...pointOf(task), l, m, ...state };
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

/** The field of a task as the solvers take it: the mass key only for a massive field (massless solves unchanged). */
function fieldOf(task: TaskMessage): { spin: FieldSpin; mass?: number } {
  const mass = task.fieldMass ?? 0;
  return mass > 0 ? { spin: task.s as FieldSpin, mass } : { spin: task.s as FieldSpin };
}

function solveMode(task: TaskMessage, l: number, m: number, state: ModeState, reflection: boolean): Row {
  const { polarization, kappaSign } = state;
  const problem = {
    hole: { a: task.a },
    mode: { field: fieldOf(task), l, m, ...(kappaSign ? { kappaSign } : {}) },
    omega: task.omega,
  };
  const options = { tol: task.tolerance, reflection, ...(polarization ? { polarization } : {}) };
  return modeRow(
    task,
    l,
    m,
    state,
    checked(tryGreybody(problem, options), modeNumbers(reflection), 'greybody result'),
    reflection,
  );
}

/** The spin state of a solved mode: its κ sign or polarisation, as the mode table lists it. */
function stateOf(r: GreybodySolution): ModeState {
  if (r.mode.kappaSign !== undefined) return { kappaSign: r.mode.kappaSign };
  if (r.polarization !== undefined) return { polarization: r.polarization };
  return {};
}

/**
 * ω ≤ μ: no wave of a massive field reaches infinity (the modes are bound), so
 * the point has no greybody factor, cross-section or emission. A failure
 * rather than zeros, so that a table never reads as if it had been computed.
 */
function belowThreshold(task: TaskMessage): Failure | undefined {
  const mu = task.fieldMass ?? 0;
  if (!(mu > 0 && task.omega <= mu)) return undefined;
  return {
    status: 'invalid-input',
    message: `Mω = ${task.omega} ≤ Mμ = ${mu}: below the field's mass threshold no wave reaches infinity (the modes are bound states), so no greybody factor, cross-section or emission exists`,
  };
}

/** Failed rows of the modes of the first l-shell, for a point whose automatic l-sum failed before solving any mode. */
function firstShellRows(task: TaskMessage, failure: Failure, reflection: boolean): Row[] {
  const field = { spin: task.s as FieldSpin, mass: task.fieldMass ?? 0 };
  const l = firstL(field);
  return shellMs(l).flatMap((m) => modeStates(field, l).map((state) => modeRow(task, l, m, state, failure, reflection)));
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
  const point = pointOf(task);
  const below = belowThreshold(task);
  if (below) return { index: task.index, rows: belowThresholdRows(task, below) };

  if (perMode && task.l !== 'auto') {
    rows.modes = explicitModes(task.s, task.l, task.fieldMass).map(({ l, m, ...state }) =>
      solveMode(task, l, m, state, reflection),
    );
  }

  if (q.includes('crossSection') || (perMode && task.l === 'auto')) {
    // The automatic l range of the mode table is the one the cross-section sum reaches.
    const solved: GreybodySolution[] = [];
    const outcome = attempt(() =>
      absorptionCrossSection(
        { hole: { a: task.a }, field: fieldOf(task), omega: task.omega },
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
      // At a = 0 the sum solves one m per shell: Γ does not depend on m there (spherical symmetry).
      // A shell's solves come state by state for each m; the table lists them m by m, each m's states in turn.
      const byShell = new Map<number, GreybodySolution[]>();
      for (const r of solved) byShell.set(r.mode.l, [...(byShell.get(r.mode.l) ?? []), r]);
      for (const [l, shell] of byShell) {
        const ms = task.a === 0 ? shellMs(l) : [...new Set(shell.map((r) => r.mode.m))];
        for (const m of ms) {
          for (const r of task.a === 0 ? shell : shell.filter((x) => x.mode.m === m)) {
            const state = stateOf(r);
            if (reflection) modeRows.push(solveMode(task, l, m, state, true));
            else modeRows.push(modeRow(task, l, m, state, checked(succeeded(r), modeNumbers(false), 'greybody result'), false));
          }
        }
      }
      const failedMode = failedModeOf(outcome);
      if (failedMode && cs.status !== 'success') {
        const ms = task.a === 0 ? shellMs(failedMode.l) : [failedMode.m];
        for (const m of ms) modeRows.push(modeRow(task, failedMode.l, m, {}, cs, reflection));
      } else if (cs.status !== 'success' && solved.length === 0) {
        // Refused before any mode (e.g. a massive vector on a spinning hole): the first shell's modes carry the reason.
        modeRows.push(...firstShellRows(task, cs, reflection));
      }
      rows.modes = modeRows;
    }
  }

  if (q.includes('spectra')) {
    const outcome = attempt(() => {
      const spectrum = emissionSpectrum(
        { hole: { a: task.a }, field: fieldOf(task), grid: [task.omega] },
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
      // A species grid gives the species' rates: per degree of freedom times its dof.
      const dof = task.species?.dof ?? 1;
      const weighted = (x: number) => (task.species ? dof * x : x);
      const p = checkedPoint.solution;
      rows.spectra = [
        {
          ...point,
          status: 'success',
          number: weighted(p.number),
          energy: weighted(p.energy),
          torque: weighted(p.torque),
          relError: p.relError,
          droppedBound: weighted(p.droppedBound),
          lMax: p.lMax,
          modes: p.modes,
          message: null,
        },
      ];
    }
  }
  return { index: task.index, rows };
}

/** The rows of a point below its field's mass threshold: every table's rows failed with the reason. */
function belowThresholdRows(task: TaskMessage, failure: Failure): TaskResult['rows'] {
  const q = task.quantities;
  const reflection = q.includes('reflection');
  const rows: TaskResult['rows'] = {};
  const point = pointOf(task);
  if (q.includes('gamma') || reflection) {
    rows.modes =
      task.l === 'auto'
        ? firstShellRows(task, failure, reflection)
        : explicitModes(task.s, task.l, task.fieldMass).map(({ l, m, ...state }) =>
            modeRow(task, l, m, state, failure, reflection),
          );
  }
  if (q.includes('crossSection')) {
    rows.crossSection = [
      {
        ...point,
        status: failure.status,
        sigma: null,
        relError: null,
        droppedBound: null,
        lMax: null,
        modes: 0,
        message: failure.message,
      },
    ];
  }
  if (q.includes('spectra')) {
    rows.spectra = [
      {
        ...point,
        status: failure.status,
        number: null,
        energy: null,
        torque: null,
        relError: null,
        droppedBound: null,
        lMax: null,
        modes: null,
        message: failure.message,
      },
    ];
  }
  return rows;
}
