/**
 * The page's Web Worker: every computation runs here so the page stays
 * responsive; cancelling is terminating this worker. Progress is posted at
 * most every 100 ms.
 */
import { renderSvg } from '@penumbra/plot';
import { computeView } from '../views.js';
import type { ComputeRequest, WorkerReply } from './messages.js';

// A dedicated worker's global scope, typed by hand: the package compiles with the DOM library only.
const scope = self as unknown as {
  onmessage: ((event: MessageEvent<ComputeRequest>) => void) | null;
  postMessage(reply: WorkerReply): void;
};

scope.onmessage = async (event) => {
  const { id, state } = event.data;
  let last = 0;
  try {
    const { figure, ...result } = computeView(state, (done, total) => {
      const now = Date.now();
      if (now - last < 100 && done < total) return;
      last = now;
      scope.postMessage({ id, kind: 'progress', done, total });
    });
    const svg = await renderSvg(figure);
    scope.postMessage({ id, kind: 'result', result, svg });
  } catch (error) {
    const e = error instanceof Error ? error : new Error(String(error));
    scope.postMessage({ id, kind: 'error', errorName: e.name, message: e.message });
  }
};
