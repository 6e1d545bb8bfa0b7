/**
 * Reads and describes the structures of a record, once per record (cached), turning reader errors and engine
 * failures into `ReadStructure.error` instead of exceptions.
 */
import type { ReadStructure } from '../checks/types.js';
import type { LoadedRecord, StructureSource } from '../registry/types.js';
import type { AuditEngine } from './engine.js';
import { BudgetExceeded } from '../chem/budget.js';

export interface RecordStructures {
  main: ReadStructure;
  components: ReadStructure[];
}

const NOTHING: ReadStructure = Object.freeze({
  structure: null,
  facts: null,
  error: {
    message: 'the record gives no structure (structure.smiles or structure.molfile)',
    line: null,
    offset: null,
  },
});

function failed(
  message: string,
  line: number | null = null,
  offset: number | null = null,
  code?: string,
): ReadStructure {
  return { structure: null, facts: null, error: { message, line, offset, ...(code ? { code } : {}) } };
}

/** A structure read but not yet described: the structure, or why it could not be read. */
export type ReadOnly = { structure: ReadStructure['structure']; failure: ReadStructure | null };

/** Reads one structure source without describing it; never throws. */
export function readOnly(source: StructureSource | null, engine: AuditEngine): ReadOnly {
  if (source === null) return { structure: null, failure: NOTHING };
  if (source.text === null)
    return { structure: null, failure: failed(source.error ?? 'the structure could not be read') };
  let read;
  try {
    read = engine.readStructure(source.text, { format: source.format });
  } catch (e) {
    if (e instanceof BudgetExceeded) throw e; // the record's budget: its caller makes the finding
    const what = source.format === 'smiles' ? 'SMILES' : 'molfile';
    return {
      structure: null,
      failure: failed(`internal error while reading the ${what}: ${(e as Error).message}`),
    };
  }
  if (!read.ok) {
    const what = source.format === 'smiles' ? 'SMILES' : source.file ? `molfile ${source.file}` : 'molfile';
    return {
      structure: null,
      failure: failed(
        `${what}: ${read.error.message}`,
        read.error.at.line ?? null,
        read.error.at.offset ?? null,
        read.error.code,
      ),
    };
  }
  return { structure: read.structure, failure: null };
}

/** Describes a read structure; an engine failure becomes the error of the result. */
export function describeRead(read: ReadOnly, engine: AuditEngine): ReadStructure {
  if (read.failure || read.structure === null) return read.failure ?? NOTHING;
  try {
    return { structure: read.structure, facts: engine.describe(read.structure), error: null };
  } catch (e) {
    if (e instanceof BudgetExceeded) throw e; // not cached: the structure is tried again for another record
    return {
      structure: read.structure,
      facts: null,
      error: {
        message: `internal error while describing the structure: ${(e as Error).message}`,
        line: null,
        offset: null,
      },
    };
  }
}

/** Reads and describes one structure source; never throws. */
export function readSource(source: StructureSource | null, engine: AuditEngine): ReadStructure {
  return describeRead(readOnly(source, engine), engine);
}

/** The sources of a record: as the loader fetched them, else SMILES straight from the record. */
export function sourcesOf(loaded: LoadedRecord): NonNullable<LoadedRecord['sources']> {
  if (loaded.sources) return loaded.sources;
  const rec = loaded.record;
  const one = (
    ref: { smiles?: string; molfile?: string } | undefined,
    field: string,
  ): StructureSource | null => {
    if (!ref) return null;
    if (typeof ref.smiles === 'string') return { field, format: 'smiles', text: ref.smiles };
    if (typeof ref.molfile === 'string') {
      return {
        field,
        format: 'molfile',
        text: null,
        error: `molfile '${ref.molfile}' was not fetched (no file context)`,
      };
    }
    return null;
  };
  const components = (rec?.stereo.components ?? []).map(
    (c, i) =>
      one(c, `stereo.components.${i}`) ?? {
        field: `stereo.components.${i}`,
        format: 'smiles' as const,
        text: null,
        error: 'no structure given',
      },
  );
  return { main: one(rec?.structure, 'structure'), components };
}

/** Reads and describes every structure of a record once; later calls return the same objects. */
export class StructureCache {
  private readonly reads = new WeakMap<LoadedRecord, ReadOnly>();
  private readonly mains = new WeakMap<LoadedRecord, ReadStructure>();
  private readonly comps = new WeakMap<LoadedRecord, ReadStructure[]>();

  constructor(readonly engine: AuditEngine) {}

  /** The main structure, read but not described (cheap; for pre-filtering the registry index). */
  read(loaded: LoadedRecord): ReadOnly {
    let r = this.reads.get(loaded);
    if (!r) {
      r = readOnly(sourcesOf(loaded).main, this.engine);
      this.reads.set(loaded, r);
    }
    return r;
  }

  main(loaded: LoadedRecord): ReadStructure {
    let m = this.mains.get(loaded);
    if (!m) {
      m = describeRead(this.read(loaded), this.engine);
      this.mains.set(loaded, m);
    }
    return m;
  }

  components(loaded: LoadedRecord): ReadStructure[] {
    let c = this.comps.get(loaded);
    if (!c) {
      c = sourcesOf(loaded).components.map((s) => readSource(s, this.engine));
      this.comps.set(loaded, c);
    }
    return c;
  }

  all(loaded: LoadedRecord): RecordStructures {
    return { main: this.main(loaded), components: this.components(loaded) };
  }
}
