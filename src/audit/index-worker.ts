/**
 * Worker thread of the registry index (index-build.ts): loads the engine once, then reads (and, when asked,
 * keys) the record files it is handed.
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

/** One file: its absolute path, and whether its keys are wanted (else a light row). */
export interface IndexWorkerItem {
  abs: string;
  full: boolean;
}

let engine: Promise<AuditEngine> | null = null;

serveWorker<IndexWorkerItem, KeyedFile>(async (item, data) => {
  const setup = data as IndexWorkerSetup;
  engine ??= defaultEngine({ axisOrthoMin: setup.axisOrthoMin });
  return keyRecordFile(setup.realRoot, item.abs, await engine, setup.budget, item.full);
});
