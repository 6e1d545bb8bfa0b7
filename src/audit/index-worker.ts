/**
 * Worker thread of the registry index build (index-build.ts): loads the engine once, then reads and keys the
 * record files it is handed.
 */
import type { Budget } from '../chem/budget.js';
import { serveWorker } from '../bulk/worker-entry.js';
import { defaultEngine, type AuditEngine } from './engine.js';
import { keyRecordFile, type KeyedFile } from './index-keys.js';

/** What every index worker gets once. */
export interface IndexWorkerSetup {
  realRoot: string;
  budget: Budget;
  axisOrthoMin: number;
}

let engine: Promise<AuditEngine> | null = null;

serveWorker<string, KeyedFile>(async (abs, data) => {
  const setup = data as IndexWorkerSetup;
  engine ??= defaultEngine({ axisOrthoMin: setup.axisOrthoMin });
  return keyRecordFile(setup.realRoot, abs, await engine, setup.budget);
});
