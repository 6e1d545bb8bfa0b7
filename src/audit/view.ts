/**
 * The registry as the cross-record checks see it: every record that passed the schema, its main structure read
 * and described on first use, and an index by parent constitution key built on the first lookup.
 */
import type { ReadStructure, RegistryEntry, RegistryView } from '../checks/types.js';
import type { LoadedRecord } from '../registry/types.js';
import type { StructureCache } from './structures.js';

export function buildRegistryView(
  records: readonly LoadedRecord[],
  cache: StructureCache,
  underReview: (r: LoadedRecord) => boolean,
): RegistryView {
  const entries: RegistryEntry[] = [];
  for (const loaded of records) {
    const record = loaded.record;
    if (record === null) continue;
    entries.push({
      id: loaded.id,
      file: loaded.file,
      record,
      get main(): ReadStructure {
        return cache.main(loaded);
      },
      underReview: underReview(loaded),
    });
  }
  let index: Map<string, RegistryEntry[]> | null = null;
  return {
    entries,
    withConstitution(key: string): readonly RegistryEntry[] {
      if (index === null) {
        index = new Map();
        for (const e of entries) {
          const k = e.main.facts?.constitutionKey;
          if (k === undefined) continue;
          const list = index.get(k);
          if (list) list.push(e);
          else index.set(k, [e]);
        }
      }
      return index.get(key) ?? [];
    },
  };
}
