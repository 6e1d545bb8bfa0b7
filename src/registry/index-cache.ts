/**
 * The registry index cached on disk: one entry per record file, its row of the key index (keys.ts) filed under
 * the file's blob id (blob-ids.ts) and the blob ids of the molfiles it uses. A later run reuses an entry whose
 * blob ids still match and reads only the other files.
 *
 * The file names the stereogate version and the settings that shape the keys; any difference, a file that does
 * not parse, or an entry of the wrong shape means that part is built again: a missing, stale or damaged cache
 * only costs time, never a finding. Written to a temporary file and renamed, so a run that stops half-way leaves
 * the previous cache whole.
 */
import { mkdirSync, readFileSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { dirname } from 'node:path';
import type { IndexRow, RecordKeys } from './keys.js';
import { STEREO_FORMS, type Rotation, type StereoForm } from './types.js';

/** An index row without its place in one run's order. */
export type IndexRowData = Omit<IndexRow, 'seq'>;

export interface IndexEntry {
  /** Path relative to the registry root, forward slashes (also `row.file`). */
  file: string;
  blob: string;
  /** The molfiles the record uses (main structure and components): path relative to the root, blob id. */
  molfiles: [path: string, blob: string][];
  /** The record follows the record schema (per-record checks may look it up by id). */
  valid: boolean;
  /** Heavy-atom formula of the main structure from its SMILES syntax; null when unknown. */
  heavy: string | null;
  /** `row.keys` is computed; false: a light row (keys null until a review needs them). */
  keyed: boolean;
  row: IndexRowData;
}

/** What the keys depend on besides the files: a cache made under other settings is not used. */
export interface CacheSettings {
  version: string;
  /** Engine settings from the audit configuration. */
  axisOrthoMin: number;
}

const FORMAT = 'stereogate registry index cache';
const FORMAT_VERSION = 3;

type Stored = [
  file: string,
  blob: string,
  molfiles: [string, string][],
  valid: 0 | 1,
  heavy: string | null,
  keyed: 0 | 1,
  id: string | null,
  name: string | null,
  form: StereoForm,
  rotation: Rotation | null,
  keys: RecordKeys | null,
  lines: [number | null, number | null, number | null],
  waivers: IndexRowData['waivers'],
];

export type CacheRead =
  | { status: 'used'; entries: IndexEntry[] }
  | { status: 'missing' | 'unreadable' | 'stale'; entries: []; reason: string };

/** Reads the cache at `path`. Never throws: a missing, damaged or stale file gives no entries and says why. */
export function readIndexCache(path: string, settings: CacheSettings): CacheRead {
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch {
    return { status: 'missing', entries: [], reason: 'no cache file yet' };
  }
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch {
    return { status: 'unreadable', entries: [], reason: 'the cache file is not valid JSON' };
  }
  const top = value as Record<string, unknown> | null;
  if (!top || typeof top !== 'object' || top.format !== FORMAT || !Array.isArray(top.entries))
    return { status: 'unreadable', entries: [], reason: 'the cache file is not a stereogate index cache' };
  const was = top.settings as Partial<CacheSettings> | undefined;
  if (
    top.formatVersion !== FORMAT_VERSION ||
    !was ||
    was.version !== settings.version ||
    was.axisOrthoMin !== settings.axisOrthoMin
  )
    return {
      status: 'stale',
      entries: [],
      reason: 'the cache was made by another stereogate version or with other settings',
    };
  const entries: IndexEntry[] = [];
  for (const raw of top.entries as unknown[]) {
    const e = entryOf(raw);
    if (e) entries.push(e);
  }
  return { status: 'used', entries };
}

/** Writes the cache (temporary file, then rename). Returns the error message, or null when written. */
export function writeIndexCache(
  path: string,
  settings: CacheSettings,
  entries: readonly IndexEntry[],
): string | null {
  const tmp = `${path}.${process.pid}.tmp`;
  try {
    mkdirSync(dirname(path), { recursive: true });
    const stored = entries.map(storedOf);
    writeFileSync(
      tmp,
      `{"format":${JSON.stringify(FORMAT)},"formatVersion":${FORMAT_VERSION},` +
        `"settings":${JSON.stringify(settings)},"entries":[\n${stored.map((s) => JSON.stringify(s)).join(',\n')}\n]}\n`,
    );
    renameSync(tmp, path);
    return null;
  } catch (e) {
    rmSync(tmp, { force: true });
    return (e as Error).message;
  }
}

function storedOf(e: IndexEntry): Stored {
  const r = e.row;
  return [
    e.file,
    e.blob,
    e.molfiles,
    e.valid ? 1 : 0,
    e.heavy,
    e.keyed ? 1 : 0,
    r.id,
    r.name,
    r.form,
    r.rotation,
    r.keys,
    [r.lines.id, r.lines.structure, r.lines.rotation],
    r.waivers,
  ];
}

const isString = (v: unknown): v is string => typeof v === 'string';
const isLine = (v: unknown): v is number | null => v === null || (Number.isInteger(v) && (v as number) > 0);
const isOptNumber = (v: unknown) => v === undefined || (typeof v === 'number' && Number.isFinite(v));

function isRotation(v: unknown): v is Rotation {
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

const isOptString = (v: unknown) => v === undefined || isString(v);

/** A waiver of the registry check as the row keeps it (keys.ts): the record's fields and its place in the list. */
function isWaiver(v: unknown): boolean {
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

function isKeys(v: unknown): v is RecordKeys {
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

/** One stored entry back, or null when it is not of the stored shape (that file is then read again). */
function entryOf(raw: unknown): IndexEntry | null {
  if (!Array.isArray(raw) || raw.length !== 13) return null;
  const [file, blob, molfiles, valid, heavy, keyed, id, name, form, rotation, keys, lines, waivers] =
    raw as unknown[];
  if (!isString(file) || file === '' || !isString(blob) || !/^[0-9a-f]{40}$/.test(blob)) return null;
  if (
    !Array.isArray(molfiles) ||
    !molfiles.every((m) => Array.isArray(m) && m.length === 2 && isString(m[0]) && isString(m[1]))
  )
    return null;
  if ((valid !== 0 && valid !== 1) || (id !== null && !isString(id)) || (name !== null && !isString(name)))
    return null;
  if ((heavy !== null && !isString(heavy)) || (keyed !== 0 && keyed !== 1) || (keyed === 0 && keys !== null))
    return null;
  if (!STEREO_FORMS.includes(form as StereoForm)) return null;
  if (rotation !== null && !isRotation(rotation)) return null;
  if (keys !== null && !isKeys(keys)) return null;
  if (!Array.isArray(lines) || lines.length !== 3 || !lines.every(isLine)) return null;
  if (!Array.isArray(waivers) || !waivers.every(isWaiver)) return null;
  const [idLine, structureLine, rotationLine] = lines as [number | null, number | null, number | null];
  return {
    file,
    blob,
    molfiles: molfiles as [string, string][],
    valid: valid === 1,
    heavy: heavy as string | null,
    keyed: keyed === 1,
    row: {
      id: id as string | null,
      file,
      name: name as string | null,
      form: form as StereoForm,
      rotation: rotation as Rotation | null,
      keys: keys as RecordKeys | null,
      lines: { id: idLine, structure: structureLine, rotation: rotationLine },
      waivers: waivers as IndexRowData['waivers'],
    },
  };
}
