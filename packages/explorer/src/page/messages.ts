/** Messages between the page and its Web Worker. */
import type { ExplorerState } from '../state.js';
import type { ViewResult } from '../views.js';

/** Page → worker: compute this state. */
export interface ComputeRequest {
  id: number;
  state: ExplorerState;
}

/** Worker → page: progress, a result with its SVG, or an error to show instead of numbers. */
export type WorkerReply =
  | { id: number; kind: 'progress'; done: number; total: number }
  | { id: number; kind: 'result'; result: Omit<ViewResult, 'figure'>; svg: string }
  | { id: number; kind: 'error'; errorName: string; message: string };
