/**
 * One record file -> its row of the registry index (index-row.ts) and what the cache needs to know about it.
 *
 * Two depths. A light row (`full` false) reads and parses the file but does not describe the structure: it has
 * everything but the keys, plus the heavy-atom formula of a SMILES from its syntax alone (engine.ts
 * `smilesHeavyAtoms`), which rules the record out as a partner of any structure with another formula. A full row
 * also has the keys (the structure read and described within the per-record budget, as the audit does). A review
 * describes only the records whose heavy-atom formula it may need (review-against-index.ts), so a cold index
 * costs a read per record, not a description.
 *
 * A row may not be kept in the cache when its structure ran out of its budget or a molfile could not even be
 * located: those are tried again on the next run. Runs in the index workers and in the main thread.
 */
import { withBudget, type Budget } from '../chem/budget.js';
import type { ReadStructure } from '../checks/types.js';
import type { IndexRowData } from '../registry/index-cache.js';
import { loadRecordFile } from '../registry/load.js';
import type { AuditEngine } from './engine.js';
import { indexRow } from './index-row.js';
import { StructureCache, sourcesOf } from './structures.js';

export interface KeyedFile {
  row: IndexRowData;
  valid: boolean;
  /** Molfiles the record uses (main structure and components), relative to the root. */
  molfiles: string[];
  /** Heavy-atom formula of the main structure from its SMILES syntax; null when unknown (always a candidate). */
  heavy: string | null;
  /** The row's keys are computed (a full row, or a record that can have none). */
  keyed: boolean;
  /** False: do not cache this row (see above). */
  keep: boolean;
}

const NO_STRUCTURE: ReadStructure = { structure: null, facts: null, error: null };

/**
 * Reads, parses and (when `full`) keys one record file (absolute path inside the real root). A null engine gives
 * a row without keys that is not kept (a worker that timed out on the file). Never throws.
 */
export function keyRecordFile(
  realRoot: string,
  abs: string,
  engine: AuditEngine | null,
  budget: Budget,
  full: boolean,
): KeyedFile {
  const loaded = loadRecordFile(realRoot, abs);
  const source = loaded.record === null ? null : sourcesOf(loaded).main;
  // no record of the schema or no structure text: no keys, whatever the depth
  const keyless = source === null || source.text === null;
  let keep = engine !== null;
  let main = NO_STRUCTURE;
  let heavy: string | null = null;
  if (engine !== null && source?.format === 'smiles' && source.text !== null)
    heavy = engine.smilesHeavyAtoms?.(source.text) ?? null;
  if (engine !== null && full && !keyless) {
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
  for (const src of s ? [s.main, ...s.components] : []) {
    if (src?.format !== 'molfile') continue;
    if (src.file === undefined) keep = false;
    else molfiles.push(src.file);
  }
  return { row, valid: loaded.record !== null, molfiles, heavy, keyed: keyless || full, keep };
}
