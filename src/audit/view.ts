/**
 * The registry as the cross-record checks see it: every record that passed the schema, its main structure read
 * and described on first use, and an index by parent constitution key built on the first lookup. When the engine
 * offers a cheap formula, the index is keyed by formula (the first part of the constitution key) and only the
 * records with the asked-for formula are described.
 */
import type { ReadStructure, RegistryEntry, RegistryView } from '../checks/types.js';
import type { LoadedRecord } from '../registry/types.js';
import type { StructureCache } from './structures.js';

function formulaPart(key: string): string {
  const cut = key.lastIndexOf('/');
  return cut < 0 ? key : key.slice(0, cut);
}

export function buildRegistryView(
  records: readonly LoadedRecord[],
  cache: StructureCache,
  underReview: (r: LoadedRecord) => boolean,
): RegistryView {
  const entries: RegistryEntry[] = [];
  const sourceOf = new Map<RegistryEntry, LoadedRecord>();
  for (const loaded of records) {
    const record = loaded.record;
    if (record === null) continue;
    const entry: RegistryEntry = {
      id: loaded.id,
      file: loaded.file,
      record,
      get main(): ReadStructure {
        return cache.main(loaded);
      },
      underReview: underReview(loaded),
    };
    entries.push(entry);
    sourceOf.set(entry, loaded);
  }
  const formula = cache.engine.formula?.bind(cache.engine);
  let index: Map<string, RegistryEntry[]> | null = null;
  const indexKey = (e: RegistryEntry): string | undefined => {
    if (!formula) return e.main.facts?.constitutionKey;
    const read = cache.read(sourceOf.get(e)!);
    if (!read.structure) return undefined;
    try {
      return formula(read.structure);
    } catch {
      return e.main.facts?.constitutionKey === undefined
        ? undefined
        : formulaPart(e.main.facts.constitutionKey);
    }
  };
  return {
    entries,
    withConstitution(key: string): readonly RegistryEntry[] {
      if (index === null) {
        index = new Map();
        for (const e of entries) {
          const k = indexKey(e);
          if (k === undefined) continue;
          const list = index.get(k);
          if (list) list.push(e);
          else index.set(k, [e]);
        }
      }
      const hits = index.get(formula ? formulaPart(key) : key) ?? [];
      return formula ? hits.filter((e) => e.main.facts?.constitutionKey === key) : hits;
    },
  };
}
