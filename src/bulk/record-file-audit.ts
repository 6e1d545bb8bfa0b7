/**
 * One record file -> its audited result, inside a worker of the streamed folder audit (or inline). The record is
 * loaded and audited exactly as the in-memory audit does it (auditRecords), with a registry view that loads the
 * records it names by id on demand; the registry-wide checks are left to the main thread, which gets the record's
 * row of the key index. The computed facts stay here: the main thread gets them as report text (one line for
 * the text and Markdown checklists, JSON text for the JSON report), so a result crosses as a few small values.
 */
import { join } from 'node:path';
import { defaultEngine, type AuditEngine } from '../audit/engine.js';
import { budgetFinding, TIME_LIMIT_ID } from '../audit/findings.js';
import { indexRow } from '../audit/index-row.js';
import { auditRecords } from '../audit/run.js';
import { StructureCache } from '../audit/structures.js';
import type { RecordResult } from '../audit/types.js';
import { lazyRegistryView } from '../audit/view.js';
import type { AuditConfig, CheckModule } from '../checks/types.js';
import { withBudget, type Budget } from '../chem/budget.js';
import { computedText } from '../report/checklist.js';
import { bareRow, type IndexRow } from '../registry/keys.js';
import { loadRecordFile } from '../registry/load.js';
import { NO_POSITIONS } from '../registry/positions.js';
import type { LoadedRecord } from '../registry/types.js';
import type { FolderLookup, RecordFileItem } from './record-files.js';

/** Sent once to every worker of a folder audit (structured-cloneable). */
export interface FolderSetup {
  kind: 'record-files';
  config: AuditConfig;
  lookup: FolderLookup;
  budget: Budget;
  /** Whether the main thread writes a JSON report (then each record's facts come back as JSON text). */
  json: boolean;
}

/**
 * One audited record as the main thread gets it: the result without its facts (`computed` is null) plus the
 * facts as report text, and the record's row of the key index for the registry-wide phase.
 */
export interface FolderRecord {
  seq: number;
  result: RecordResult;
  /** computedText of the facts: the line the text and Markdown checklists show. */
  computedLine: string | null;
  /** JSON.stringify(facts, null, 2), or null (no facts, or no JSON report asked for). */
  computedJson: string | null;
  row: IndexRow;
}

export interface FolderContext {
  setup: FolderSetup;
  checks: readonly CheckModule[];
  engine: AuditEngine;
}

export async function makeFolderContext(
  setup: FolderSetup,
  checks?: readonly CheckModule[],
): Promise<FolderContext> {
  const [list, engine] = await Promise.all([
    checks ?? import('../checks/index.js').then((m) => m.CHECKS),
    defaultEngine({ axisOrthoMin: setup.config.axisOrthoMin }),
  ]);
  return { setup, checks: list, engine };
}

/** A record file as loadRegistry loads it, duplicate-id problem included. */
function loadItem(item: RecordFileItem, lookup: FolderLookup): LoadedRecord {
  if (item.refused !== undefined) return refusedRecord(item.file, item.refused);
  const loaded = loadRecordFile(lookup.root, join(lookup.root, item.file));
  const duplicate = lookup.duplicates.get(item.file);
  if (duplicate) loaded.problems.push({ ...duplicate });
  return loaded;
}

export function refusedRecord(file: string, message: string): LoadedRecord {
  return {
    file,
    id: null,
    record: null,
    positions: NO_POSITIONS,
    problems: [{ path: '', line: null, code: 'unreadable-file', message: `the record file ${message}` }],
    origin: { kind: 'file' },
  };
}

/** The ids of the records that pass the schema, listed once per folder when a check asks. */
const idLists = new WeakMap<FolderLookup, string[]>();

function idsOf(lookup: FolderLookup): string[] {
  let ids = idLists.get(lookup);
  if (!ids) idLists.set(lookup, (ids = [...lookup.byId.keys()]));
  return ids;
}

export function auditRecordFile(item: RecordFileItem, ctx: FolderContext): FolderRecord {
  const { lookup, config, budget } = ctx.setup;
  const loaded = loadItem(item, lookup);
  const cache = new StructureCache(ctx.engine);
  const load = (id: string): LoadedRecord | null => {
    const file = lookup.byId.get(id);
    if (file === undefined) return null;
    return file === loaded.file ? loaded : loadItem({ seq: 0, file }, lookup);
  };
  // every record, for a check that walks them all (none of the built-in checks does: they look up by id)
  const all = () => [...lookup.byId.keys()].flatMap((id) => load(id) ?? []);
  const view = lazyRegistryView(loaded, cache, load, all, () => idsOf(lookup));
  const result = auditRecords([loaded], {
    checks: ctx.checks,
    config,
    engine: ctx.engine,
    budget,
    view,
    registryPhase: false,
  }).records[0]!;
  const facts = result.computed;
  // a record stopped by its limit has no facts in its result; its keys are read as the in-memory audit reads
  // them (the structure alone, within the same limit)
  const keysFrom =
    facts === null && result.findings.some((f) => f.check === TIME_LIMIT_ID)
      ? mainWithin(loaded, new StructureCache(ctx.engine), budget)
      : { structure: null, facts, error: null };
  const row = indexRow(loaded, keysFrom, item.seq);
  result.computed = null;
  return {
    seq: item.seq,
    result,
    computedLine: computedText(facts),
    computedJson: facts && ctx.setup.json ? JSON.stringify(facts, null, 2) : null,
    row,
  };
}

function mainWithin(loaded: LoadedRecord, cache: StructureCache, budget: Budget) {
  try {
    return withBudget(budget, 'the structure of a registry record', () => cache.main(loaded));
  } catch {
    return { structure: null, facts: null, error: null };
  }
}

/**
 * The result of a record file whose audit the pool stopped (no progress within the time limit) or whose worker
 * died: one record-time-limit finding at the file, so that no record is lost.
 */
export function stoppedRecordFile(
  item: RecordFileItem,
  id: string | null,
  limitMs: number,
  crashed: string | null,
): FolderRecord {
  const loaded: LoadedRecord = { ...refusedRecord(item.file, ''), id, problems: [] };
  const finding = budgetFinding(loaded, 'time', limitMs);
  if (crashed !== null) {
    finding.messageId = 'worker-crashed';
    finding.message =
      `The audit of this record crashed its worker (${crashed}); it was not audited, and the run went on. ` +
      'Audit it on its own (stereogate audit with its path), or simplify the structure.';
    finding.data = { kind: 'crash', limit: limitMs };
  }
  return {
    seq: item.seq,
    result: {
      id,
      file: item.file,
      computed: null,
      findings: [finding],
      passed: [],
      notRun: [],
      declared: { form: null, descriptors: null },
    },
    computedLine: null,
    computedJson: null,
    row: { seq: item.seq, ...bareRow(item.file, id) },
  };
}
