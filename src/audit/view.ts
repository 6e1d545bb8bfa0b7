/**
 * The registry as the cross-record checks see it: every record that passed the schema, its main structure read
 * and described on first use, and an index by parent constitution key built on the first lookup. When the engine
 * offers a cheap formula, the index is keyed by formula (the first part of the constitution key) and only the
 * records with the asked-for formula are described. When it also offers the heavy atoms of a SMILES from its
 * syntax alone, the index is keyed by those, and only the records with the asked-for heavy atoms are read in full.
 */
import type { ReadStructure, RegistryEntry, RegistryView } from '../checks/types.js';
import type { LoadedRecord } from '../registry/types.js';
import { heavyAtomCandidates } from './engine.js';
import { sourcesOf, type StructureCache } from './structures.js';

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
  const engine = cache.engine;
  const formula = engine.formula?.bind(engine);
  const quick = formula ? engine.smilesHeavyAtoms?.bind(engine) : undefined;
  const formulaOf = new Map<RegistryEntry, string | undefined>();
  /** The formula of the main structure as read; undefined when it cannot be read. */
  const fullFormula = (e: RegistryEntry): string | undefined => {
    if (formulaOf.has(e)) return formulaOf.get(e);
    let f: string | undefined;
    const read = cache.read(sourceOf.get(e)!);
    if (read.structure) {
      try {
        f = formula!(read.structure);
      } catch {
        f =
          e.main.facts?.constitutionKey === undefined ? undefined : formulaPart(e.main.facts.constitutionKey);
      }
    }
    formulaOf.set(e, f);
    return f;
  };
  /** The keys an entry is filed under: one, or (heavy atoms read off a formula with a charge) a few. */
  const indexKeys = (e: RegistryEntry): string[] => {
    if (!formula) {
      const k = e.main.facts?.constitutionKey;
      return k === undefined ? [] : [k];
    }
    if (quick) {
      const main = sourcesOf(sourceOf.get(e)!).main;
      const fromSyntax = main?.format === 'smiles' && main.text !== null ? quick(main.text) : null;
      if (fromSyntax !== null) return [fromSyntax];
    }
    const f = fullFormula(e);
    return f === undefined ? [] : quick ? heavyAtomCandidates(f) : [f];
  };
  const lookupKeys = (key: string): string[] =>
    !formula ? [key] : !quick ? [formulaPart(key)] : heavyAtomCandidates(formulaPart(key));
  let index: Map<string, RegistryEntry[]> | null = null;
  const order = new Map<RegistryEntry, number>();
  return {
    entries,
    withConstitution(key: string): readonly RegistryEntry[] {
      // one record (a bulk item, a lone file): its facts are at hand, an index would read its structure again
      if (entries.length === 1) return entries[0]!.main.facts?.constitutionKey === key ? entries : [];
      if (index === null) {
        index = new Map();
        entries.forEach((e, i) => {
          order.set(e, i);
          for (const k of indexKeys(e)) {
            const list = index!.get(k);
            if (list) list.push(e);
            else index!.set(k, [e]);
          }
        });
      }
      const keys = lookupKeys(key);
      let hits = index.get(keys[0]!) ?? [];
      if (keys.length > 1) {
        const all = new Set(keys.flatMap((k) => index!.get(k) ?? []));
        hits = [...all].sort((a, b) => order.get(a)! - order.get(b)!);
      }
      if (!formula) return hits;
      const wanted = formulaPart(key);
      return hits.filter((e) => fullFormula(e) === wanted && e.main.facts?.constitutionKey === key);
    },
  };
}
