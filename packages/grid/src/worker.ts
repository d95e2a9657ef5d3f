/** Pool worker: computes one grid point per call (loaded by piscina from dist/worker.js). */
import { computeTask, type TaskMessage, type TaskResult } from './compute.js';

/** Computes one grid point (the piscina task). */
export default function runTask(task: TaskMessage): TaskResult {
  return computeTask(task);
}
