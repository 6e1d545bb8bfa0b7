/**
 * The shape checks of what the index cache (index-cache.ts) keeps of a row: a stored value of the wrong shape is
 * not used (that file is read again), never trusted.
 */
import type { IndexRow, RecordKeys } from './keys.js';
import { STEREO_FORMS, type Rotation, type StereoForm } from './types.js';

export const isString = (v: unknown): v is string => typeof v === 'string';
export const isLine = (v: unknown): v is number | null =>
  v === null || (Number.isInteger(v) && (v as number) > 0);
const isOptNumber = (v: unknown) => v === undefined || (typeof v === 'number' && Number.isFinite(v));
const isOptString = (v: unknown) => v === undefined || isString(v);

export function isRotation(v: unknown): v is Rotation {
  if (!v || typeof v !== 'object' || Array.isArray(v)) return false;
  const r = v as Record<string, unknown>;
  return (
    typeof r.value === 'number' &&
    Number.isFinite(r.value) &&
    isOptNumber(r.wavelength_nm) &&
    isOptNumber(r.temperature_c) &&
    isOptNumber(r.concentration) &&
    (r.solvent === undefined || isString(r.solvent))
  );
}

/** A waiver of the registry check as the row keeps it (keys.ts): the record's fields and its place in the list. */
export function isWaiver(v: unknown): boolean {
  if (!v || typeof v !== 'object' || Array.isArray(v)) return false;
  const w = v as Record<string, unknown>;
  return (
    isString(w.check) &&
    Number.isInteger(w.index) &&
    (w.index as number) >= 0 &&
    isOptString(w.message_id) &&
    isOptString(w.other_record) &&
    isOptString(w.reason) &&
    isOptString(w.approved_by)
  );
}

export function isKeys(v: unknown): v is RecordKeys {
  if (!v || typeof v !== 'object' || Array.isArray(v)) return false;
  const k = v as Record<string, unknown>;
  const text = k.text as Record<string, unknown> | undefined;
  return (
    isString(k.constitution) &&
    (k.kind === 'as-drawn' || k.kind === 'racemic' || k.kind === 'relative') &&
    (k.stereo === null || isString(k.stereo)) &&
    (k.mirror === null || isString(k.mirror)) &&
    (k.stereo === null) === (k.mirror === null) &&
    (k.chiral === null || typeof k.chiral === 'boolean') &&
    typeof k.exact === 'boolean' &&
    (text === undefined ||
      (!!text &&
        typeof text === 'object' &&
        (text.format === 'smiles' || text.format === 'molfile') &&
        isString(text.text)))
  );
}

/** What a row keeps besides its id, file and id line (stored as one JSON array). */
export type StoredRest = [
  name: string | null,
  form: StereoForm,
  rotation: Rotation | null,
  keys: RecordKeys | null,
  structureLine: number | null,
  rotationLine: number | null,
  waivers: IndexRow['waivers'],
];

export function restOf(r: Omit<IndexRow, 'seq'>): StoredRest {
  return [r.name, r.form, r.rotation, r.keys, r.lines.structure, r.lines.rotation, r.waivers];
}

/** The row back from its stored rest, or null when the text is not of the stored shape. */
export function rowFromRest(
  text: string,
  file: string,
  id: string | null,
  idLine: number | null,
): Omit<IndexRow, 'seq'> | null {
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch {
    return null;
  }
  if (!Array.isArray(raw) || raw.length !== 7) return null;
  const [name, form, rotation, keys, structureLine, rotationLine, waivers] = raw as unknown[];
  if (name !== null && !isString(name)) return null;
  if (!STEREO_FORMS.includes(form as StereoForm)) return null;
  if (rotation !== null && !isRotation(rotation)) return null;
  if (keys !== null && !isKeys(keys)) return null;
  if (!isLine(structureLine) || !isLine(rotationLine)) return null;
  if (!Array.isArray(waivers) || !waivers.every(isWaiver)) return null;
  return {
    id,
    file,
    name,
    form: form as StereoForm,
    rotation: rotation as Rotation | null,
    keys: keys as RecordKeys | null,
    lines: { id: idLine, structure: structureLine, rotation: rotationLine },
    waivers: waivers as IndexRow['waivers'],
  };
}
