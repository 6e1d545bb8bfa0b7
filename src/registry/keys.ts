/**
 * Per-record keys for the registry-wide checks: what one record contributes to the registry index, computed once
 * while the record is audited, small enough to keep for every record of a large registry (or to write into a
 * shard's output) and compared by equality only.
 *
 * - constitution: the engine's constitution key (formula + hash of the refined atom classes).
 * - stereo: the drawing kind (as drawn / racemic AND group / relative OR group) and, for every stereo unit, its
 *   canonical constitutional class with its CIP descriptor, sorted. CIP descriptors do not depend on the atom
 *   order (IUPAC 2013, P-92.1), and the classes are canonical ranks, so the same stereoisomer drawn in any atom
 *   order gets the same key.
 * - mirror: the stereo key of the mirror image (R<->S, M<->P; r/s, m/p, E/Z are kept: P-92.1.4, reflection
 *   invariance of pseudoasymmetric and cis/trans descriptors), so enantiomers find each other by one lookup.
 * - exact: the key names exactly one stereoisomer when every unit is defined and labelled, no two units share a
 *   class (else several pairings of descriptors to equivalent units share one key, as in the inositols), and no
 *   descriptor rests on Rule 5 alone (e/z, which reflection may change). An inexact key is only a candidate
 *   filter: the record keeps its structure text and candidate pairs are confirmed by the engine's relate().
 * Undefined units leave the stereoisomer open: such a record gets no stereo key and is never called identical to
 * or the enantiomer of another (as relate() says: "undefined stereo leaves the relation open").
 */
import type { CipLabel, StructureFacts } from '../chem/facts.js';
import type { Rotation, StereoForm, Waiver } from './types.js';

export type DrawingKind = 'as-drawn' | 'racemic' | 'relative';

export interface RecordKeys {
  constitution: string;
  kind: DrawingKind;
  /** Null when undefined units leave the stereoisomer open. */
  stereo: string | null;
  mirror: string | null;
  /** facts.chiral of the drawing. */
  chiral: boolean | null;
  exact: boolean;
  /** The structure as given, kept only for inexact keys (relate() confirms candidates from it). */
  text?: { format: 'smiles' | 'molfile'; text: string };
}

/** One record as the registry-wide checks see it: its keys and the claims they compare. */
export interface IndexRow {
  /** Position in the audit's order (1-based): "later" means a higher seq. */
  seq: number;
  id: string | null;
  file: string;
  name: string | null;
  form: StereoForm;
  rotation: Rotation | null;
  /** Null when the record has no readable, describable structure (or failed the schema). */
  keys: RecordKeys | null;
  /** Lines of the fields the findings point at (record files); bulk records use their row's line. */
  lines: { id: number | null; structure: number | null; rotation: number | null };
  /** The record's waivers of the registry-wide check (complete or not), with their places in its list. */
  waivers: (Waiver & { index: number })[];
}

/** The row of a record known by its file and id only: no keys, form unknown (the phase counts it, no more). */
export function bareRow(file: string, id: string | null): Omit<IndexRow, 'seq'> {
  return {
    id,
    file,
    name: null,
    form: 'unknown',
    rotation: null,
    keys: null,
    lines: { id: null, structure: null, rotation: null },
    waivers: [],
  };
}

/**
 * What the drawing stands for: one stereoisomer as drawn, the drawn one and its mirror image together (AND
 * groups), or one of the two, unknown which (OR groups / no chiral flag). Drawings of different kinds are
 * different substances even when the drawn configurations coincide, so they are not compared.
 */
export function drawingKind(f: StructureFacts): DrawingKind {
  const m = f.enhanced.meaning;
  if (m === 'racemic' || m === 'mixture') return 'racemic';
  if (m === 'relative') return 'relative';
  return 'as-drawn';
}

const MIRRORED: Partial<Record<CipLabel, CipLabel>> = { R: 'S', S: 'R', M: 'P', P: 'M' };

export function recordKeys(f: StructureFacts, text: RecordKeys['text'] | null): RecordKeys {
  const kind = drawingKind(f);
  const base = { constitution: f.constitutionKey, kind, chiral: f.chiral };
  if (f.units.some((u) => !u.defined)) return { ...base, stereo: null, mirror: null, exact: false };
  let exact = true;
  const seen = new Set<string>();
  const own: string[] = [];
  const mirrored: string[] = [];
  for (const u of f.units) {
    if (seen.has(u.classKey) || u.label === null || u.label === 'e' || u.label === 'z') exact = false;
    seen.add(u.classKey);
    // e/z may change under reflection and an unlabelled unit says nothing: written alike on both sides, so the
    // inexact key still finds every candidate
    const label = u.label === null ? '?' : u.label === 'e' || u.label === 'z' ? 'ez' : u.label;
    own.push(`${u.classKey}=${label}`);
    mirrored.push(`${u.classKey}=${(u.label && MIRRORED[u.label]) ?? label}`);
  }
  own.sort();
  mirrored.sort();
  const keys: RecordKeys = {
    ...base,
    stereo: `${kind}|${own.join(';')}`,
    mirror: `${kind}|${mirrored.join(';')}`,
    exact,
  };
  if (!exact && text) keys.text = text;
  return keys;
}
