/**
 * The explorer page: a form whose fields are the URL's query, a worker that
 * computes, and the answer as a figure, a table and downloads. Every number
 * on the page comes from the same library functions a script would call.
 */
import { headerCell, toCsv, toJsonTable } from '@penumbra/core';
import { formatState, parseState, VIEW_DEFAULTS, type ExplorerState, type ViewName } from '../state.js';
import { printNumber, shortNumber, type ViewResult } from '../views.js';
import type { ComputeRequest, WorkerReply } from './messages.js';

const $ = <T extends HTMLElement>(id: string): T => document.getElementById(id) as T;
const FIELDS = ['view', 'a', 'mass', 'unit', 'spin', 'mu', 'l', 'm', 'from', 'to', 'count', 'spacing', 'species', 'tol'] as const;

let worker: Worker | undefined;
let requestId = 0;
let last: { state: ExplorerState; result: Omit<ViewResult, 'figure'>; svg: string } | undefined;
let pending: ExplorerState | undefined;

function newWorker(): Worker {
  const w = new Worker(new URL('./worker.js', import.meta.url), { type: 'module' });
  w.onmessage = (event: MessageEvent<WorkerReply>) => onReply(event.data);
  return w;
}

/** Form fields → query string (kept verbatim, so the error names what the user typed). */
function formQuery(): string {
  const params = new URLSearchParams();
  for (const name of FIELDS) {
    const el = $<HTMLInputElement | HTMLSelectElement>(`f-${name}`);
    if (el.value.trim() !== '' || name === 'view') params.set(name, el.value.trim());
  }
  return params.toString();
}

function fillForm(s: ExplorerState): void {
  const values: Record<(typeof FIELDS)[number], string> = {
    view: s.view,
    a: shortNumber(s.aStar),
    mass: shortNumber(s.mass),
    unit: s.unit,
    spin: s.spin === 0.5 ? '1/2' : String(s.spin),
    mu: shortNumber(s.fieldMass),
    l: s.l.join(','),
    m: s.m === 'all' ? 'all' : s.m.join(','),
    from: shortNumber(s.from),
    to: shortNumber(s.to),
    count: String(s.count),
    spacing: s.spacing,
    species: s.species.join(','),
    tol: shortNumber(s.tol),
  };
  for (const name of FIELDS) $<HTMLInputElement | HTMLSelectElement>(`f-${name}`).value = values[name];
  showFieldsOf(s.view);
}

/** Show only the fields the chosen view uses. */
function showFieldsOf(view: ViewName): void {
  const used: Record<ViewName, string[]> = {
    greybody: ['a', 'spin', 'mu', 'l', 'm', 'from', 'to', 'count', 'spacing', 'tol'],
    'cross-section': ['a', 'spin', 'mu', 'from', 'to', 'count', 'spacing', 'tol'],
    spectrum: ['a', 'mass', 'unit', 'species', 'from', 'to', 'count', 'spacing', 'tol'],
    evolution: ['a', 'mass', 'unit'],
  };
  for (const el of document.querySelectorAll<HTMLElement>('[data-field]')) {
    el.hidden = !used[view].includes(el.dataset.field ?? '');
  }
}

function setStatus(text: string, kind: 'idle' | 'busy' | 'error'): void {
  const status = $('status');
  status.textContent = text;
  status.className = kind;
}

function clearResult(): void {
  last = undefined;
  $('figure').innerHTML = '';
  $('summary').innerHTML = '';
  $('table').innerHTML = '';
  $('downloads').hidden = true;
}

function compute(): void {
  let state: ExplorerState;
  try {
    state = parseState(formQuery());
  } catch (error) {
    clearResult();
    setStatus((error as Error).message, 'error');
    return;
  }
  history.replaceState(null, '', `?${formatState(state)}`);
  cancel(false);
  worker = newWorker();
  const request: ComputeRequest = { id: ++requestId, state };
  pending = state;
  worker.postMessage(request);
  setStatus('computing…', 'busy');
  $<HTMLProgressElement>('progress').value = 0;
  $('progress').hidden = false;
  $<HTMLButtonElement>('cancel').disabled = false;
}

/** Cancelling terminates the worker: a solve in progress stops at once. */
function cancel(report = true): void {
  worker?.terminate();
  worker = undefined;
  $('progress').hidden = true;
  $<HTMLButtonElement>('cancel').disabled = true;
  if (report) setStatus('cancelled', 'idle');
}

function onReply(reply: WorkerReply): void {
  if (reply.id !== requestId) return;
  if (reply.kind === 'progress') {
    const bar = $<HTMLProgressElement>('progress');
    bar.max = reply.total;
    bar.value = reply.done;
    setStatus(`computing… ${reply.done}/${reply.total}`, 'busy');
    return;
  }
  cancel(false);
  if (reply.kind === 'error') {
    clearResult();
    setStatus(`${reply.errorName}: ${reply.message}`, 'error');
    return;
  }
  last = { state: pending as ExplorerState, result: reply.result, svg: reply.svg };
  showResult(reply.result, reply.svg);
  setStatus(`done: ${reply.result.rows.length} rows`, 'idle');
}

function showResult(result: Omit<ViewResult, 'figure'>, svg: string): void {
  $('figure').innerHTML = svg;
  const summary = $('summary');
  summary.innerHTML = '';
  for (const line of result.summary) {
    const li = document.createElement('li');
    li.textContent = line;
    summary.append(li);
  }
  const table = document.createElement('table');
  const head = table.createTHead().insertRow();
  for (const c of result.columns) {
    const th = document.createElement('th');
    th.textContent = headerCell(c);
    th.title = c.description ?? '';
    head.append(th);
  }
  const body = table.createTBody();
  for (const row of result.rows) {
    const tr = body.insertRow();
    for (const v of row) tr.insertCell().textContent = printNumber(v);
  }
  $('table').replaceChildren(table);
  $('downloads').hidden = false;
}

function download(kind: 'csv' | 'json' | 'svg'): void {
  if (!last) return;
  const name = `penumbra-${last.state.view}`;
  const { columns, rows } = last.result;
  const text =
    kind === 'csv'
      ? toCsv({ columns, rows })
      : kind === 'json'
        ? `${JSON.stringify({ view: last.state.view, query: formatState(last.state), ...toJsonTable({ columns, rows }) }, null, 1)}\n`
        : last.svg;
  const type = kind === 'csv' ? 'text/csv' : kind === 'json' ? 'application/json' : 'image/svg+xml';
  const a = document.createElement('a');
  a.href = URL.createObjectURL(new Blob([text], { type }));
  a.download = `${name}.${kind}`;
  a.click();
  URL.revokeObjectURL(a.href);
}

function start(): void {
  let state: ExplorerState;
  try {
    state = parseState(location.search);
  } catch (error) {
    state = VIEW_DEFAULTS.greybody;
    setStatus(`${(error as Error).message}; showing the defaults`, 'error');
  }
  fillForm(state);
  $<HTMLSelectElement>('f-view').onchange = () => {
    fillForm(VIEW_DEFAULTS[$<HTMLSelectElement>('f-view').value as ViewName]);
    clearResult();
  };
  $('form').onsubmit = (event) => {
    event.preventDefault();
    compute();
  };
  $('cancel').onclick = () => cancel();
  for (const kind of ['csv', 'json', 'svg'] as const) $(`download-${kind}`).onclick = () => download(kind);
  if (location.search.length > 1) compute();
}

start();
