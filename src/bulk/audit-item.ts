/**
 * One bulk item -> one audited record (runs inside a worker, or inline). SD records: the molfile block plus data
 * fields; CSV rows: the mapped columns. Cross-record checks see only the record itself in a bulk run (the
 * registry-wide checks belong to the pull-request audit of record files).
 */
import type { AuditConfig, CheckModule } from '../checks/types.js';
import type { AuditEngine } from '../audit/engine.js';
import type { Budget } from '../chem/budget.js';
import { auditRecords } from '../audit/run.js';
import { indexRow } from '../audit/index-row.js';
import type { IndexRow } from '../registry/keys.js';
import type { RecordResult } from '../audit/types.js';
import type { ComponentFacts, StructureFacts } from '../chem/facts.js';
import type { LoadedRecord } from '../registry/types.js';
import type { BulkMapping, VocabularyResult } from './mapping.js';
import { formatOf, type BulkItem } from './sources.js';
import { field, toRecord, type ConvertedRecord } from './to-record.js';
import { originChain } from './origins.js';
import { DEFAULT_COLUMNS } from './mapping.js';

/**
 * The computed facts as a bulk output carries them: everything `describe` computes except the stereocenters and
 * stereobonds lists (views of `units`) and the SMILES of each component (the record's own structure is in the
 * input). Writing those SMILES for every record of a backlog cost about a fifth of the audit time.
 */
export type BulkFacts = Omit<StructureFacts, 'stereocenters' | 'stereobonds' | 'components'> & {
  components: Omit<ComponentFacts, 'smiles'>[];
};

export function bulkFacts(f: StructureFacts): BulkFacts {
  const { stereocenters: _c, stereobonds: _b, components, ...rest } = f;
  // fields picked one by one: reading a component's smiles would write it
  return {
    ...rest,
    components: components.map(({ index, formula, heavyAtoms, role }) => ({
      index,
      formula,
      heavyAtoms,
      role,
    })),
  };
}

export interface BulkRecordResult extends Omit<RecordResult, 'computed'> {
  computed: BulkFacts | null;
  /** Position of the record in the whole input (1-based, across all inputs): the merge order. */
  seq: number;
  origin: { source: string; record: number; line: number };
  form_word: { word: string | null; how: VocabularyResult['how'] };
  /** The record's row of the registry index (keys and claims), for the registry-wide phase and `merge`. */
  registry_row?: IndexRow;
  /** The structure as given (SMILES or molfile), kept for flagged records only (for depictions). */
  structure_text?: string;
}

/** Splits an SD record into its molfile block and its data fields (`> <NAME>` headers). */
export function splitSdRecord(text: string): {
  molfile: string;
  fields: Record<string, string>;
  problem: string | null;
} {
  const lines = text.split('\n');
  let end = lines.findIndex((l) => l.startsWith('M  END'));
  let problem: string | null = null;
  if (end < 0) {
    // V2000 without properties block still needs M  END; find the first data header instead
    end = lines.findIndex((l) => l.startsWith('>'));
    problem = 'the molfile block has no M  END line';
    if (end < 0) end = lines.length;
    else end -= 1;
  }
  const molfile = lines.slice(0, end + 1).join('\n') + '\n';
  const fields: Record<string, string> = {};
  let name: string | null = null;
  let value: string[] = [];
  const flush = () => {
    if (name !== null) fields[name] = value.join('\n').trim();
    name = null;
    value = [];
  };
  for (const l of lines.slice(end + 1)) {
    if (l.startsWith('>')) {
      flush();
      const m = /<([^>]*)>/.exec(l);
      name = m ? m[1] : l.slice(1).trim();
    } else if (name !== null) {
      if (l.trim() === '') flush();
      else value.push(l);
    }
  }
  flush();
  return { molfile, fields, problem };
}

/** Why checks across records do not run in a bulk audit (each record is audited on its own). */
export const BULK_REGISTRY_NOT_COMPARED =
  'a bulk audit checks each record of the export on its own, not against the other records; audit the ' +
  'registry as record files to compare records with one another';

/**
 * The id a bulk item is reported under, read as auditItem reads it (the mapped id field, else an SD record's
 * title line, else source#record): records stopped by the time limit or a worker crash keep their id too.
 */
export function itemId(item: BulkItem, mapping: BulkMapping): string {
  const col = mapping.id ?? DEFAULT_COLUMNS.id;
  if (item.text !== undefined) {
    const sd = splitSdRecord(item.text);
    const title = sd.molfile.split('\n', 1)[0]!.trim();
    return field(sd.fields, col)?.trim() || title || `${item.source}#${item.record}`;
  }
  return field(item.fields ?? {}, col)?.trim() || `${item.source}#${item.record}`;
}

/**
 * An id that holds a line break, or (in a CSV/TSV export) the delimiter, cannot be written back into a row or
 * matched against the registry as it stands: a finding, never silently rewritten.
 */
export function idShapeProblem(id: string, item: BulkItem): string | null {
  if (/[\r\n]/.test(id)) return `the id ${JSON.stringify(id.slice(0, 60))} holds a line break`;
  const format = formatOf(item.source);
  if (item.fields !== undefined && format === 'csv' && id.includes(','))
    return `the id ${JSON.stringify(id.slice(0, 60))} holds a comma, the delimiter of this CSV file`;
  if (item.fields !== undefined && format === 'tsv' && id.includes('\t'))
    return `the id ${JSON.stringify(id.slice(0, 60))} holds a tab, the delimiter of this TSV file`;
  return null;
}

export interface ItemContext {
  mapping: BulkMapping;
  vocabulary: (word: string | undefined) => VocabularyResult;
  checks: readonly CheckModule[];
  config: AuditConfig;
  engine: AuditEngine;
  /** Per-record limits (default: the audit's RECORD_BUDGET). */
  budget?: Budget;
  /** Records of the export that origins name, by id (bulk runs with an origin column). */
  originInputs?: ReadonlyMap<string, BulkItem>;
  /**
   * Why the registry-wide checks do not run in this run (one shard of a split run), or null when the main thread
   * runs them over every record's keys (registry_row) as the results stream past. Undefined: not run, the bulk
   * reason (a caller that audits items on their own).
   */
  registryNotRun?: string | null;
}

/** One bulk item as a loaded record (no structure read yet), with its conversion. */
function loadItem(item: BulkItem, ctx: ItemContext): { loaded: LoadedRecord; conv: ConvertedRecord } {
  let fields: Record<string, string>;
  let molfile: string | null = null;
  const problems: LoadedRecord['problems'] = [];
  if (item.text !== undefined) {
    const sd = splitSdRecord(item.text);
    fields = sd.fields;
    molfile = sd.molfile;
    if (sd.problem) problems.push({ message: sd.problem, path: 'structure', line: item.line });
  } else {
    fields = item.fields ?? {};
  }
  if (item.splitProblem) problems.push({ message: item.splitProblem, path: '', line: item.line });
  const title = molfile !== null ? molfile.split('\n', 1)[0].trim() : '';
  const fallbackId = title || `${item.source}#${item.record}`;
  const conv = toRecord(fields, fallbackId, ctx.mapping, ctx.vocabulary, molfile);
  for (const p of conv.problems) problems.push({ message: p.message, path: p.path, line: item.line });
  const idProblem = idShapeProblem(conv.record.id, item);
  if (idProblem !== null) problems.push({ message: idProblem, path: 'id', line: item.line });
  const loaded: LoadedRecord = {
    file: item.source,
    id: conv.record.id,
    record: conv.record,
    positions: { get: () => ({ line: item.line, column: 1 }) },
    problems,
    origin: { kind: 'bulk', source: item.source, record: item.record, line: item.line },
    sources: {
      main:
        conv.structureText === null
          ? null
          : { field: 'structure', format: molfile !== null ? 'molfile' : 'smiles', text: conv.structureText },
      components: [],
    },
  };
  return { loaded, conv };
}

export function auditItem(item: BulkItem & { seq: number }, ctx: ItemContext): BulkRecordResult {
  const { loaded, conv } = loadItem(item, ctx);
  // a record with an origin gets the records its origin names (looked up in the export before the run)
  const origin = conv.record.origin;
  const registry =
    origin && ctx.originInputs
      ? [loaded, ...originChain(origin, ctx.originInputs, (it) => loadItem(it, ctx).loaded)]
      : undefined;
  const result = auditRecords([loaded], {
    checks: ctx.checks,
    config: ctx.config,
    engine: ctx.engine,
    registry,
    registryIncomplete: BULK_REGISTRY_NOT_COMPARED,
    budget: ctx.budget,
    registryPhase: false,
  }).records[0];
  delete result.notApplicable; // listed only by the text report's --verbose, which bulk outputs do not have
  if (ctx.registryNotRun !== undefined && result.notRun) {
    const wide = new Set(ctx.checks.filter((c) => c.scope === 'registry').map((c) => c.id));
    result.notRun = result.notRun.flatMap((n) =>
      !wide.has(n.check) || n.reason !== BULK_REGISTRY_NOT_COMPARED
        ? [n]
        : ctx.registryNotRun === null
          ? []
          : [{ check: n.check, reason: ctx.registryNotRun! }],
    );
  }
  const out: BulkRecordResult = {
    ...result,
    computed: result.computed ? bulkFacts(result.computed) : null,
    seq: item.seq,
    origin: { source: item.source, record: item.record, line: item.line },
    form_word: { word: conv.formWord, how: conv.formHow },
  };
  if (ctx.registryNotRun !== undefined)
    out.registry_row = indexRow(loaded, { structure: null, facts: result.computed, error: null }, item.seq);
  if (conv.structureText !== null && result.findings.some((f) => !f.waived))
    out.structure_text = conv.structureText;
  return out;
}
