/**
 * A review of some records (a pull request) against the registry's key index instead of every record loaded:
 * the records under review are loaded and audited in full; the rest of the registry is known by its rows of the
 * index (index-build.ts, cached by blob id), and a per-record check that looks a record up by id (an origin
 * input) gets that one record read from disk. Only records with the heavy-atom formula of a record under review
 * are described for their keys (index-keys.ts); no lookup can reach the others. The findings are those of the
 * review over the loaded registry: the rows a lookup reaches are the same, in the same order, and so are the
 * duplicate-id problems and the lookups by id (test/audit/review-against-index.test.ts compares the two).
 */
import { join } from 'node:path';
import { withBudget, type Budget } from '../chem/budget.js';
import type { AuditConfig, CheckModule, RegistryEntry, RegistryView } from '../checks/types.js';
import { findRecordFiles, relativeTo } from '../registry/files.js';
import { gitRecordFiles } from '../registry/git-files.js';
import { entryRow, type IndexEntry, type IndexRowData } from '../registry/index-cache.js';
import { loadRecordFile, markDuplicateIds, refusedRecord } from '../registry/load.js';
import { bareRow } from '../registry/keys.js';
import type { LoadedRecord } from '../registry/types.js';
import { heavyAtomCandidates, type AuditEngine } from './engine.js';
import { RecordIndex } from './index-build.js';
import { indexRow } from './index-row.js';
import { auditRecords } from './run.js';
import { selectRecords, type SelectableRecord } from './select.js';
import { StructureCache } from './structures.js';
import type { AuditResult } from './types.js';
import { entryOf } from './view.js';

export interface IndexReviewOptions {
  /** Real path of the registry root. */
  realRoot: string;
  paths: readonly string[];
  config: AuditConfig;
  checks: readonly CheckModule[];
  engine: AuditEngine;
  /** `engine` is the default engine for the config (see index-build.ts). */
  defaultEngine: boolean;
  budget: Budget;
  /** Cache file of the index, or null for none. */
  indexCache: string | null;
  /** Where the line about the index goes (the action's log); default nowhere. */
  log?: (line: string) => void;
  /** Workers for keying (index-build.ts); default by the number of files. */
  workers?: number;
}

const NO_STRUCTURE = { structure: null, facts: null, error: null };
/** The row a record that is no partner of the records under review stands as: the phase only counts it. */
const NO_PARTNER: IndexRowData = bareRow('', null);

/** A record file as selection sees it: from the index, or refused (a link out of the registry). */
type Stub = SelectableRecord & { at: number | null; refused: string | null };

/**
 * Reviews the records `paths` names against the index. Null when the review is not one: a record folder is
 * missing (the loaded audit says so), or `paths` name every record (a full audit).
 */
export async function reviewAgainstIndex(o: IndexReviewOptions): Promise<AuditResult | null> {
  // in a git work tree git lists the record files with their blob ids; else (or when git's listing cannot
  // say what the walk would find) the folders are walked
  const listed = await gitRecordFiles(o.realRoot, o.config.recordDirs);
  const gitIds = Promise.resolve(listed.ids);
  let found = listed.found;
  if (found === null) {
    const walked = findRecordFiles(o.realRoot, o.config.recordDirs);
    if (walked.missingDirs.length > 0) return null;
    found = { files: walked.files.map((abs) => relativeTo(o.realRoot, abs)), refused: walked.refused };
  }
  const refused = found.refused.map((r): Stub => ({ file: r.file, at: null, refused: r.message }));
  const files = found.files;
  const absOf = (at: number) => join(o.realRoot, files[at]!);

  const index = await RecordIndex.open({
    realRoot: o.realRoot,
    files,
    recordDirs: o.config.recordDirs,
    engine: o.engine,
    defaultEngine: o.defaultEngine,
    axisOrthoMin: o.config.axisOrthoMin,
    budget: o.budget,
    cachePath: o.indexCache,
    gitIds,
    ...(o.workers === undefined ? {} : { workers: o.workers }),
  });
  const entries = index.entries;
  // entries are replaced as they are keyed: a stub holds the place of its entry
  const stubs: Stub[] = entries.map((entry, at) =>
    entry.molfiles.length === 0
      ? { file: entry.file, at, refused: null }
      : {
          file: entry.file,
          sources: { main: null, components: entry.molfiles.map(([file]) => ({ file })) },
          at,
          refused: null,
        },
  );
  stubs.push(...refused);
  stubs.sort((a, b) => (a.file < b.file ? -1 : a.file > b.file ? 1 : 0));
  const sel = selectRecords(stubs, o.realRoot, o.paths);
  if (sel.selected.size === stubs.length) {
    o.log?.(index.save());
    return null;
  }

  const audited = new Map<string, LoadedRecord>();
  for (const s of stubs) {
    if (!sel.selected.has(s)) continue;
    audited.set(
      s.file,
      s.refused !== null
        ? refusedRecord({ file: s.file, message: s.refused })
        : loadRecordFile(o.realRoot, absOf(s.at!)),
    );
  }
  const toAudit = [...audited.values()];
  const structures = new StructureCache(o.engine);
  // only a record with the heavy-atom formula of a record under review can be its duplicate or enantiomer
  const wanted = partnerFormulas(toAudit, structures, o.budget);
  const partner = (e: IndexEntry) =>
    !audited.has(e.file) && (wanted === null || e.heavy === null || wanted.has(e.heavy));
  await index.keyFully(partner);
  o.log?.(index.save());
  markDuplicateIdsAgainst(toAudit, entries, audited);
  const view = indexView(entries, audited, structures, (at) => loadRecordFile(o.realRoot, absOf(at)));
  const result = auditRecords(toAudit, {
    checks: o.checks,
    config: o.config,
    engine: o.engine,
    budget: o.budget,
    view,
    // a record that is no partner stands as a row without keys: its formula differs from every record under
    // review, so no lookup reaches it (its row is neither parsed from the cache nor read)
    otherRows: function* () {
      for (const s of stubs) {
        if (audited.has(s.file)) continue;
        if (s.at === null)
          yield indexRow(refusedRecord({ file: s.file, message: s.refused! }), NO_STRUCTURE, 0);
        else {
          const e = entries[s.at]!;
          yield (partner(e) && entryRow(e)) || NO_PARTNER;
        }
      }
    },
  });
  if (sel.unmatched.length > 0) result.unmatched = sel.unmatched;
  return result;
}

/**
 * The heavy-atom formulas a partner of the records under review may have (engine.ts heavyAtomCandidates of each
 * one's formula), or null when one of them could not be described within its budget (then every record is).
 */
function partnerFormulas(
  records: readonly LoadedRecord[],
  structures: StructureCache,
  budget: Budget,
): Set<string> | null {
  const formulas = new Set<string>();
  for (const r of records) {
    if (r.record === null) continue;
    let facts;
    try {
      facts = withBudget(budget, 'the structure of a record under review', () => structures.main(r)).facts;
    } catch {
      return null;
    }
    if (facts) for (const f of heavyAtomCandidates(facts.constitutionKey.split('/')[0]!)) formulas.add(f);
  }
  return formulas;
}

/**
 * The duplicate-id problems of the records under review, as loading the whole registry gives them: the other
 * records with the same id stand in as their rows (file and line of the id).
 */
function markDuplicateIdsAgainst(
  toAudit: LoadedRecord[],
  entries: readonly IndexEntry[],
  audited: ReadonlyMap<string, LoadedRecord>,
): void {
  const ids = new Set(toAudit.flatMap((r) => (r.id === null ? [] : [r.id])));
  if (ids.size === 0) return;
  const group: LoadedRecord[] = [];
  for (const e of entries) {
    const own = audited.get(e.file);
    if (own) {
      if (own.id !== null && ids.has(own.id)) group.push(own);
      continue;
    }
    const { id, idLine } = e;
    if (id === null || !ids.has(id)) continue;
    group.push({
      file: e.file,
      id,
      record: null,
      positions: {
        get: (p) => (p === 'id' && idLine !== null ? { line: idLine, column: 1 } : undefined),
      },
      problems: [],
      origin: { kind: 'file' },
    });
  }
  markDuplicateIds(group);
}

/**
 * The registry as per-record checks see it, over the index: a lookup by id reads that one record (the first
 * record of the schema with that id, in file order, as the loaded view finds it); the ids come from the index;
 * every entry is read only if a check walks them all.
 */
function indexView(
  entries: readonly IndexEntry[],
  audited: ReadonlyMap<string, LoadedRecord>,
  cache: StructureCache,
  load: (at: number) => LoadedRecord,
): RegistryView {
  // built at the first lookup by id (most reviews make none)
  let firstById: Map<string, number> | null = null;
  const firstAt = (id: string) => {
    if (firstById === null) {
      const map = new Map<string, number>();
      entries.forEach((e, at) => {
        if (e.valid && e.id !== null && !map.has(e.id)) map.set(e.id, at);
      });
      firstById = map;
    }
    return firstById.get(id);
  };
  const entryAt = (at: number): RegistryEntry | null => {
    const file = entries[at]!.file;
    return entryOf(audited.get(file) ?? load(at), cache, audited.has(file));
  };
  const seen = new Map<string, RegistryEntry | undefined>();
  let all: RegistryEntry[] | null = null;
  return {
    get entries(): readonly RegistryEntry[] {
      all ??= entries.flatMap((e, at) => (e.valid ? (entryAt(at) ?? []) : []));
      return all;
    },
    byId(id: string): RegistryEntry | undefined {
      if (!seen.has(id)) {
        const at = firstAt(id);
        seen.set(id, at === undefined ? undefined : (entryAt(at) ?? undefined));
      }
      return seen.get(id);
    },
    ids: () => entries.flatMap((e) => (e.valid && e.id !== null ? [e.id] : [])),
  };
}
