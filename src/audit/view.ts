/**
 * The registry as per-record checks see it (lookups by id): every record that passed the schema, its main
 * structure read and described on first use. Duplicates and enantiomers are not looked up here but in the key
 * index of the registry-wide phase (registry-phase.ts).
 */
import type { ReadStructure, RegistryEntry, RegistryView } from '../checks/types.js';
import type { LoadedRecord } from '../registry/types.js';
import type { StructureCache } from './structures.js';

export function entryOf(
  loaded: LoadedRecord,
  cache: StructureCache,
  underReview: boolean,
): RegistryEntry | null {
  const record = loaded.record;
  if (record === null) return null;
  return {
    id: loaded.id,
    file: loaded.file,
    record,
    get main(): ReadStructure {
      return cache.main(loaded);
    },
    underReview,
  };
}

export function buildRegistryView(
  records: readonly LoadedRecord[],
  cache: StructureCache,
  underReview: (r: LoadedRecord) => boolean,
): RegistryView {
  const entries: RegistryEntry[] = [];
  for (const loaded of records) {
    const e = entryOf(loaded, cache, underReview(loaded));
    if (e) entries.push(e);
  }
  return { entries };
}

/**
 * A view that reads records only when asked: `load(id)` finds and loads the record with that id (a streamed
 * audit's worker holds one record at a time; it may hand back `own`); `ids()` lists the ids of every record that
 * passed the schema without loading them; `all()` loads every record, for a check that walks them all.
 */
export function lazyRegistryView(
  own: LoadedRecord,
  cache: StructureCache,
  load: (id: string) => LoadedRecord | null,
  all: () => readonly LoadedRecord[],
  ids?: () => readonly string[],
): RegistryView {
  const seen = new Map<string, RegistryEntry | undefined>();
  let entries: RegistryEntry[] | null = null;
  const view: RegistryView = {
    get entries(): readonly RegistryEntry[] {
      entries ??= all().flatMap((l) => entryOf(l, cache, l.file === own.file) ?? []);
      return entries;
    },
    byId(id: string): RegistryEntry | undefined {
      if (!seen.has(id)) {
        const l = load(id);
        seen.set(id, l ? (entryOf(l, cache, l.file === own.file) ?? undefined) : undefined);
      }
      return seen.get(id);
    },
  };
  if (ids) view.ids = ids;
  return view;
}
