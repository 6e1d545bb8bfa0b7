/**
 * One record file -> its row of the registry index (index-row.ts) and what the cache needs to know about it: the
 * molfiles it uses, and whether the row may be kept (not when the structure ran out of its budget, nor when a
 * molfile could not even be located: those are tried again on the next run). Runs in the index workers and,
 * for small numbers of files or an injected engine, in the main thread.
 */
import { withBudget, type Budget } from '../chem/budget.js';
import type { ReadStructure } from '../checks/types.js';
import type { IndexRowData } from '../registry/index-cache.js';
import { loadRecordFile } from '../registry/load.js';
import type { AuditEngine } from './engine.js';
import { indexRow } from './index-row.js';
import { StructureCache } from './structures.js';

export interface KeyedFile {
  row: IndexRowData;
  valid: boolean;
  /** Molfiles the record uses (main structure and components), relative to the root. */
  molfiles: string[];
  /** False: do not cache this row (see above). */
  keep: boolean;
}

const NO_STRUCTURE: ReadStructure = { structure: null, facts: null, error: null };

/** Reads, parses and keys one record file (absolute path inside the real root). Never throws. */
export function keyRecordFile(
  realRoot: string,
  abs: string,
  engine: AuditEngine | null,
  budget: Budget,
): KeyedFile {
  const loaded = loadRecordFile(realRoot, abs);
  let keep = engine !== null;
  let main = NO_STRUCTURE;
  if (engine !== null) {
    const cache = new StructureCache(engine);
    // as the audit does for a registry record: described within the per-record budget, else no keys
    try {
      main = withBudget(budget, 'the structure of a registry record', () => cache.main(loaded));
    } catch {
      keep = false;
    }
  }
  const { seq: _seq, ...row } = indexRow(loaded, main, 0);
  const molfiles: string[] = [];
  const s = loaded.sources;
  for (const source of s ? [s.main, ...s.components] : []) {
    if (source?.format !== 'molfile') continue;
    if (source.file === undefined) keep = false;
    else molfiles.push(source.file);
  }
  return { row, valid: loaded.record !== null, molfiles, keep };
}
