/**
 * The inputs a record names in origin.from, resolved: a registered id (its structure and its declared stereo
 * form and ee) or, failing that, a SMILES read as drawn. Each input is classed by what it can contribute to the
 * product's enantiomeric composition: nothing (achiral, meso, racemic), a bias (one enantiomer, or enriched),
 * or unknown. Also: the cycle an origin may close through the registry.
 */
import type { StructureFacts } from '../chem/facts.js';
import { readStructure } from '../chem/read/index.js';
import { describe as describeStructure } from '../chem/describe/index.js';
import type { Structure } from '../chem/types.js';
import { parseDescriptors } from '../chem/descriptors.js';
import type { CompoundRecord, StereoForm } from '../registry/types.js';
import type { RegistryEntry, RegistryView } from './types.js';
import { plural } from './words.js';

export type InputStatus = 'achiral' | 'racemic' | 'enriched' | 'unknown';

export interface OriginInput {
  /** Position in origin.from. */
  index: number;
  /** The entry as written. */
  text: string;
  /** The registered id when the entry names a record, else null (a SMILES). */
  id: string | null;
  structure: Structure;
  facts: StructureFacts;
  status: InputStatus;
  /** ee in percent when known (a record's stated ee); null otherwise. */
  ee: number | null;
  /** The record's declared form; null for a SMILES. */
  form: StereoForm | null;
  /** Why the status is what it is, in words ("LX-00012 is declared racemate"). */
  why: string;
}

export type Resolved =
  | { ok: true; input: OriginInput }
  | {
      ok: false;
      index: number;
      text: string;
      problem: 'not-found' | 'unreadable' | 'no-structure';
      detail: string;
    };

/** A label for an input in messages: its id, or "input 2 (CC(=O)c1ccccc1)". */
export function inputName(i: { index: number; text: string; id: string | null }): string {
  if (i.id !== null) return i.id;
  const s = i.text.length > 40 ? `${i.text.slice(0, 37)}...` : i.text;
  return `input ${i.index + 1} (${s})`;
}

const byId = new WeakMap<RegistryView, Map<string, RegistryEntry>>();

/** The registry entry with this id (an index built once per registry view). */
export function entryById(registry: RegistryView, id: string): RegistryEntry | undefined {
  if (registry.byId) return registry.byId(id);
  let index = byId.get(registry);
  if (!index) {
    index = new Map();
    for (const e of registry.entries) if (e.id !== null && !index.has(e.id)) index.set(e.id, e);
    byId.set(registry, index);
  }
  return index.get(id);
}

/** The descriptors mark the compound racemic: rac-/rel-, (±), RS/SR (P-93.1.3), DL. */
function racemicWords(record: CompoundRecord): boolean {
  const d = record.stereo.descriptors;
  if (d === undefined || d.trim() === '') return false;
  const parsed = parseDescriptors(d);
  return (
    parsed.prefixes.length > 0 ||
    parsed.rotationSign === '±' ||
    parsed.fischer === 'DL' ||
    parsed.mode === 'racemic' ||
    parsed.mode === 'relative'
  );
}

/** The status of a registered input from its declared form, ee and structure. */
function recordStatus(record: CompoundRecord, facts: StructureFacts): { status: InputStatus; why: string } {
  const id = record.id;
  const form = record.stereo.form;
  const ee = record.stereo.ee;
  if (facts.chiral === false)
    return { status: 'achiral', why: `${id} is achiral (its structure has no enantiomer)` };
  switch (form) {
    case 'achiral':
    case 'meso':
      return { status: 'achiral', why: `${id} is declared ${form}` };
    case 'racemate':
      return { status: 'racemic', why: `${id} is declared racemate` };
    case 'single-enantiomer':
    case 'enantioenriched':
      return {
        status: 'enriched',
        why: `${id} is declared ${form}${ee !== undefined ? ` (ee ${ee}%)` : ''}`,
      };
    default:
      if (ee !== undefined && ee > 0) return { status: 'enriched', why: `${id} states ee ${ee}%` };
      if (racemicWords(record))
        return { status: 'racemic', why: `${id} is declared ${form}, racemic by its descriptors` };
      return {
        status: 'unknown',
        why: `${id} is declared ${form}, which does not say whether it is racemic or one enantiomer`,
      };
  }
}

/** The status of an input given as SMILES, as drawn. */
function drawnStatus(facts: StructureFacts, name: string): { status: InputStatus; why: string } {
  if (facts.chiral === false) return { status: 'achiral', why: `${name} is achiral as drawn` };
  if (facts.enhanced.meaning === 'racemic')
    return { status: 'racemic', why: `${name} is drawn racemic (AND group)` };
  if (facts.undefined > 0 || facts.chiral === null)
    return {
      status: 'unknown',
      why: `${name} is drawn without the configuration of ${plural(facts.undefined, 'stereo unit')}, so it may be racemic or one enantiomer`,
    };
  if (facts.enhanced.meaning === 'relative')
    return {
      status: 'enriched',
      why: `${name} is drawn as one enantiomer of unknown absolute configuration`,
    };
  return { status: 'enriched', why: `${name} is drawn as one enantiomer` };
}

const ID_SHAPE = /^[A-Za-z]{1,10}[-_ ]?\d{1,12}$/;

export function resolveInput(text: string, index: number, registry: RegistryView): Resolved {
  const entry = entryById(registry, text.trim());
  if (entry) {
    const main = entry.main;
    if (!main.structure || !main.facts)
      return {
        ok: false,
        index,
        text,
        problem: 'no-structure',
        detail: main.error?.message ?? 'its structure could not be read',
      };
    const { status, why } = recordStatus(entry.record, main.facts);
    return {
      ok: true,
      input: {
        index,
        text,
        id: entry.id,
        structure: main.structure,
        facts: main.facts,
        status,
        ee: entry.record.stereo.ee ?? null,
        form: entry.record.stereo.form,
        why,
      },
    };
  }
  const read = readStructure(text, { format: 'smiles' });
  if (!read.ok) {
    const looksLikeId = ID_SHAPE.test(text.trim());
    return {
      ok: false,
      index,
      text,
      problem: looksLikeId ? 'not-found' : 'unreadable',
      detail: `${read.error.message}${read.error.at.offset !== undefined ? ` (character ${read.error.at.offset + 1})` : ''}`,
    };
  }
  let facts: StructureFacts;
  try {
    facts = describeStructure(read.structure);
  } catch (e) {
    return { ok: false, index, text, problem: 'unreadable', detail: (e as Error).message };
  }
  const partial = { index, text, id: null };
  const { status, why } = drawnStatus(facts, inputName(partial));
  return {
    ok: true,
    input: { ...partial, structure: read.structure, facts, status, ee: null, form: null, why },
  };
}

const MAX_WALK = 10_000;

/**
 * The cycle through origin.from ids that leads back to `start`, as the list of ids (start first and last), or
 * null. Walks at most MAX_WALK records.
 */
export function originCycle(start: string, registry: RegistryView): string[] | null {
  const parent = new Map<string, string>();
  const queue: string[] = [start];
  let walked = 0;
  while (queue.length > 0 && walked < MAX_WALK) {
    const id = queue.shift()!;
    walked++;
    const from = entryById(registry, id)?.record.origin?.from ?? [];
    for (const raw of from) {
      const next = raw.trim();
      if (next === start) {
        const path = [start];
        for (let x: string | undefined = id; x !== undefined && x !== start; x = parent.get(x)) path.push(x);
        path.push(start);
        return path.reverse();
      }
      if (parent.has(next) || !entryById(registry, next)) continue;
      parent.set(next, id);
      queue.push(next);
    }
  }
  return null;
}
