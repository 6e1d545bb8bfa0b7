/**
 * Origins in a bulk export: an origin column (`--map-origin`) names the inputs of each compound — ids of other
 * records of the same export, or SMILES — and a control column its stereocontrol. Each record is audited on its
 * own in a worker, so before the audit the export is read twice without auditing: once for the ids the origin
 * column names, once for the records holding them. Those records (at most MAX_ORIGIN_INPUTS) go to every worker,
 * and each record with an origin is audited with the chain of records its origin reaches as its registry.
 */
import type { LoadedRecord, Origin, OriginControl } from '../registry/types.js';
import { ORIGIN_CONTROLS } from '../registry/types.js';
import type { BulkMapping } from './mapping.js';
import { DEFAULT_CONTROL_COLUMN } from './mapping.js';
import { readItems, type BulkItem } from './sources.js';
import { field } from './to-record.js';
import { itemId, splitSdRecord } from './audit-item.js';

/** Records named by origins that one run looks up; past this the rest are not looked up (their ids then are findings). */
export const MAX_ORIGIN_INPUTS = 200_000;
/** Inputs in one origin cell (the record schema's limit). */
export const MAX_ORIGIN_ENTRIES = 20;
/** Records of one origin chain given to one record's audit. */
const MAX_CHAIN = 1000;

/** 'LX-1; CC(=O)O, LX-2' -> ['LX-1', 'CC(=O)O', 'LX-2']: split at ';' and ',' outside a CXSMILES |…| block. */
export function splitOriginEntries(text: string): string[] {
  const out: string[] = [];
  let cur = '';
  let bars = 0;
  for (const ch of text) {
    if (ch === '|') bars ^= 1;
    if ((ch === ';' || ch === ',') && bars === 0) {
      out.push(cur);
      cur = '';
    } else cur += ch;
  }
  out.push(cur);
  return out.map((s) => s.trim()).filter((s) => s !== '');
}

/** The origin block of one row from its origin and control columns, and what is wrong with them. */
export function originFromFields(
  fields: Record<string, string>,
  mapping: BulkMapping,
): { origin: Origin | null; problems: { message: string; path: string }[] } {
  const problems: { message: string; path: string }[] = [];
  const text = field(fields, mapping.origin)?.trim();
  if (!text) return { origin: null, problems };
  const from = splitOriginEntries(text);
  if (from.length === 0) return { origin: null, problems };
  if (from.length > MAX_ORIGIN_ENTRIES) {
    problems.push({
      message: `the origin column '${mapping.origin}' names ${from.length} inputs; at most ${MAX_ORIGIN_ENTRIES} are read`,
      path: 'origin.from',
    });
    from.length = MAX_ORIGIN_ENTRIES;
  }
  const origin: Origin = { from };
  const controlColumn = mapping.control ?? DEFAULT_CONTROL_COLUMN;
  const control = field(fields, controlColumn)?.trim().toLowerCase();
  if (control) {
    if ((ORIGIN_CONTROLS as readonly string[]).includes(control)) origin.control = control as OriginControl;
    else
      problems.push({
        message: `origin control '${control}' (column '${controlColumn}') is not one of ${ORIGIN_CONTROLS.join(', ')}`,
        path: 'origin.control',
      });
  }
  return { origin, problems };
}

function fieldsOf(item: BulkItem): Record<string, string> {
  return item.text !== undefined ? splitSdRecord(item.text).fields : (item.fields ?? {});
}

async function* everyItem(inputs: readonly string[]): AsyncGenerator<BulkItem> {
  for (const path of inputs) yield* readItems(path);
}

/** The records of the export that some origin names, read in two passes without auditing. */
export async function collectOriginInputs(
  inputs: readonly string[],
  mapping: BulkMapping,
): Promise<BulkItem[]> {
  const named = new Set<string>();
  for await (const item of everyItem(inputs)) {
    const text = field(fieldsOf(item), mapping.origin)?.trim();
    if (!text) continue;
    for (const e of splitOriginEntries(text)) if (named.size < MAX_ORIGIN_INPUTS) named.add(e);
  }
  const found: BulkItem[] = [];
  if (named.size === 0) return found;
  const seen = new Set<string>();
  for await (const item of everyItem(inputs)) {
    const id = itemId(item, mapping);
    if (named.has(id) && !seen.has(id)) {
      seen.add(id);
      found.push(item);
    }
  }
  return found;
}

/**
 * The records an origin reaches through the looked-up inputs (ids only; SMILES entries need no record), each
 * loaded through `load`, for the registry of one record's audit.
 */
export function originChain(
  origin: Origin,
  inputs: ReadonlyMap<string, BulkItem>,
  load: (item: BulkItem) => LoadedRecord,
): LoadedRecord[] {
  const out: LoadedRecord[] = [];
  const seen = new Set<string>();
  const queue = origin.from.map((s) => s.trim());
  while (queue.length > 0 && out.length < MAX_CHAIN) {
    const id = queue.shift()!;
    if (seen.has(id)) continue;
    seen.add(id);
    const item = inputs.get(id);
    if (!item) continue;
    const loaded = load(item);
    out.push(loaded);
    for (const next of loaded.record?.origin?.from ?? []) queue.push(next.trim());
  }
  return out;
}
