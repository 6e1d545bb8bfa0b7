/**
 * Loads a registry from disk: every record file under the record folders, parsed with positions, validated,
 * checked for duplicate ids, with the text of each structure fetched (molfiles safely, inside the root).
 */
import { realpathSync } from 'node:fs';
import { dirname } from 'node:path';
import { findRecordFiles, readTextFile, relativeTo, resolveInside } from './files.js';
import { parseRecordText } from './parse.js';
import { NO_POSITIONS, lineOf } from './positions.js';
import type { LoadedRecord, StructureSource } from './types.js';

export interface RegistryLoad {
  /** Real path of the registry root. */
  root: string;
  /** One per record file, sorted by path. */
  records: LoadedRecord[];
  /** Record folders named in the config that do not exist. */
  missingDirs: string[];
}

export function loadRegistry(root: string, options: { recordDirs: readonly string[] }): RegistryLoad {
  const realRoot = realpathSync(root);
  const found = findRecordFiles(realRoot, options.recordDirs);
  const records: LoadedRecord[] = found.files.map((abs) => loadRecordFile(realRoot, abs));
  for (const r of found.refused) records.push(refusedRecord(r));
  records.sort((a, b) => (a.file < b.file ? -1 : a.file > b.file ? 1 : 0));
  markDuplicateIds(records);
  return { root: realRoot, records, missingDirs: found.missingDirs };
}

/** A record file seen but refused (a link out of the registry): a record with that problem. */
export function refusedRecord(r: { file: string; message: string }): LoadedRecord {
  return {
    file: r.file,
    id: null,
    record: null,
    positions: NO_POSITIONS,
    problems: [{ path: '', line: null, code: 'unreadable-file', message: `the record file ${r.message}` }],
    origin: { kind: 'file' },
  };
}

/**
 * Loads one record file (absolute path inside the real root). Never throws: a fault while reading one file
 * becomes that record's problem, so the other records are still audited.
 */
export function loadRecordFile(realRoot: string, abs: string): LoadedRecord {
  try {
    return loadRecordFileOrThrow(realRoot, abs);
  } catch (e) {
    return {
      file: relativeTo(realRoot, abs),
      id: null,
      record: null,
      positions: NO_POSITIONS,
      problems: [
        {
          path: '',
          line: null,
          code: 'internal-error',
          message: `the record file could not be read because of an internal error in stereogate (${(e as Error)?.message ?? String(e)}); please report it with the file`,
        },
      ],
      origin: { kind: 'file' },
    };
  }
}

function loadRecordFileOrThrow(realRoot: string, abs: string): LoadedRecord {
  const file = relativeTo(realRoot, abs);
  const read = readTextFile(abs);
  if (!read.ok) {
    return {
      file,
      id: null,
      record: null,
      positions: NO_POSITIONS,
      problems: [{ path: '', line: null, code: 'unreadable-file', message: `the record file ${read.error}` }],
      origin: { kind: 'file' },
    };
  }
  const parsed = parseRecordText(read.text);
  const loaded: LoadedRecord = {
    file,
    id: parsed.id,
    record: parsed.record,
    positions: parsed.positions,
    problems: parsed.problems,
    origin: { kind: 'file' },
  };
  // A file that did not parse has nothing to read structures from; the audit then runs no check on it.
  if (asObject(parsed.value)) loaded.sources = structureSources(realRoot, dirname(abs), parsed.value);
  return loaded;
}

function asObject(v: unknown): Record<string, unknown> | null {
  return v !== null && typeof v === 'object' && !Array.isArray(v) ? (v as Record<string, unknown>) : null;
}

/** One structure reference ({smiles} or {molfile}) -> its text. Null when the reference names neither. */
export function sourceOf(
  ref: Record<string, unknown> | null,
  field: string,
  fetchMolfile: (path: string) => Pick<StructureSource, 'text' | 'file' | 'error'>,
): StructureSource | null {
  if (!ref) return null;
  if (typeof ref.smiles === 'string' && typeof ref.molfile !== 'string') {
    return { field, format: 'smiles', text: ref.smiles };
  }
  if (typeof ref.molfile === 'string' && typeof ref.smiles !== 'string') {
    return { field, format: 'molfile', ...fetchMolfile(ref.molfile) };
  }
  return null;
}

function structureSources(
  realRoot: string,
  recordDir: string,
  value: unknown,
): NonNullable<LoadedRecord['sources']> {
  const fetchMolfile = (path: string): Pick<StructureSource, 'text' | 'file' | 'error'> => {
    const where = resolveInside(realRoot, recordDir, path);
    if (!where.ok) return { text: null, error: `molfile ${where.error}` };
    const read = readTextFile(where.abs);
    if (!read.ok) return { text: null, file: where.rel, error: `molfile '${path}' ${read.error}` };
    return { text: read.text, file: where.rel };
  };
  const top = asObject(value);
  const main = sourceOf(asObject(top?.structure), 'structure', fetchMolfile);
  const comps = asObject(top?.stereo)?.components;
  const components: StructureSource[] = [];
  if (Array.isArray(comps)) {
    // over the schema's limit the record fails the schema; its components are not read (that is the bound)
    comps.slice(0, MAX_COMPONENTS_READ).forEach((c, i) => {
      const s = sourceOf(asObject(c), `stereo.components.${i}`, fetchMolfile);
      components.push(
        s ?? { field: `stereo.components.${i}`, format: 'smiles', text: null, error: 'no structure given' },
      );
    });
  }
  return { main, components };
}

/** Components of one record that are read (record.schema.json allows 50; more is a schema problem). */
export const MAX_COMPONENTS_READ = 50;

/** A duplicate id is a problem on every record that carries it. */
export function markDuplicateIds(records: LoadedRecord[]): void {
  const problems = duplicateIdProblems(
    records.flatMap((r) =>
      r.id === null ? [] : [{ id: r.id, file: r.file, line: lineOf(r.positions, 'id') }],
    ),
  );
  if (problems.size === 0) return;
  for (const r of records) {
    const p = problems.get(r.file);
    if (p) r.problems.push(p);
  }
}

/**
 * The duplicate-id problem of each record (by file) whose id another record uses too; `records` in the audit's
 * order, each with the line of its id.
 */
export function duplicateIdProblems(
  records: readonly { id: string; file: string; line: number | null }[],
): Map<string, LoadedRecord['problems'][number]> {
  const byId = new Map<string, { file: string; line: number | null }[]>();
  for (const r of records) {
    const list = byId.get(r.id);
    if (list) list.push(r);
    else byId.set(r.id, [r]);
  }
  const out = new Map<string, LoadedRecord['problems'][number]>();
  for (const [id, list] of byId) {
    if (list.length < 2) continue;
    for (const r of list) {
      const others = list
        .filter((o) => o !== r)
        .map((o) => (o.line === null ? o.file : `${o.file} line ${o.line}`));
      out.set(r.file, {
        path: 'id',
        line: r.line,
        code: 'duplicate-id',
        message: `id: '${id}' is also used by ${others.join(', ')}; every record needs its own id`,
      });
    }
  }
  return out;
}
