/**
 * One bulk row / SD record -> our CompoundRecord, through the mapping. Problems (missing structure, a form word
 * not understood, a number that is not a number) are collected with the record's position; nothing is guessed.
 */
import type { CompoundRecord, StereoForm } from '../registry/types.js';
import type { BulkMapping, VocabularyResult } from './mapping.js';
import { DEFAULT_COLUMNS } from './mapping.js';
import { originFromFields } from './origins.js';

export interface ConvertedRecord {
  record: CompoundRecord;
  /** The structure text: SMILES, or a molfile block. */
  structureText: string | null;
  /** The raw form word and how it was understood (for the vocabulary tally). */
  formWord: string | null;
  formHow: VocabularyResult['how'];
  problems: { message: string; path: string }[];
}

/** Look a field up by the mapped name, then case-insensitively. */
export function field(fields: Record<string, string>, name: string | undefined): string | undefined {
  if (!name) return undefined;
  if (name in fields) return fields[name];
  const lower = name.toLowerCase();
  for (const k of Object.keys(fields)) if (k.toLowerCase() === lower) return fields[k];
  return undefined;
}

/** "99.5", "99.5 %", "99,5" -> 99.5; null when not a number. */
export function parseNumber(text: string): number | null {
  const t = text
    .trim()
    .replace(/%$/, '')
    .trim()
    .replace(/^\+/, '')
    .replace(/[\u2212\u2013]/g, '-')
    .replace(/,(?=\d+$)/, '.');
  if (!/^-?\d+(\.\d+)?$/.test(t)) return null;
  return Number(t);
}

/** "+12.3", "−5.1 (c 1.0, CHCl3)", "[α]D −5.1" -> the signed number before any bracket; null otherwise. */
export function parseRotation(text: string): number | null {
  const t = text
    .replace(/\[α\]\s*\S*/u, '')
    .replace(/\(.*$/, '')
    .trim();
  return parseNumber(t.replace(/°$/, ''));
}

export function toRecord(
  fields: Record<string, string>,
  fallbackId: string,
  mapping: BulkMapping,
  vocabulary: (word: string | undefined) => VocabularyResult,
  molfileText: string | null,
): ConvertedRecord {
  const col = {
    ...DEFAULT_COLUMNS,
    ...Object.fromEntries(Object.entries(mapping).filter(([, v]) => typeof v === 'string')),
  };
  const problems: ConvertedRecord['problems'] = [];
  const idText = field(fields, col.id)?.trim();
  const id = idText && idText !== '' ? idText : fallbackId;

  let structureText: string | null = molfileText;
  if (structureText === null) {
    const s = field(fields, col.structure);
    if (s === undefined)
      problems.push({ message: `no structure column '${col.structure}' in this row`, path: 'structure' });
    else if (s.trim() === '')
      problems.push({ message: `the structure column '${col.structure}' is empty`, path: 'structure' });
    else structureText = s.trim();
  }

  const formWordRaw = field(fields, col.form);
  const understood = vocabulary(formWordRaw);
  let form: StereoForm = 'unknown';
  if (understood.form) form = understood.form;
  else if (understood.how === 'not-understood')
    problems.push({
      message: `stereo form '${formWordRaw}' (field '${col.form}') is not a word stereogate knows; add it to the mapping vocabulary`,
      path: 'stereo.form',
    });

  const record: CompoundRecord = { id, structure: {}, stereo: { form } };
  if (structureText !== null && molfileText === null) record.structure.smiles = structureText;
  if (molfileText !== null) record.structure.molfile = '(embedded molfile)';
  const name = field(fields, col.name)?.trim();
  if (name) record.name = name;
  const descriptors = field(fields, col.descriptors)?.trim();
  if (descriptors) record.stereo.descriptors = descriptors;
  const ratio = field(fields, col.ratio)?.trim();
  if (ratio) record.stereo.ratio = ratio;
  const ee = field(fields, col.ee)?.trim();
  if (ee) {
    const v = parseNumber(ee);
    if (v === null || v < 0 || v > 100)
      problems.push({ message: `ee '${ee}' is not a percentage between 0 and 100`, path: 'stereo.ee' });
    else record.stereo.ee = v;
  }
  const rot = field(fields, col.rotation)?.trim();
  if (rot) {
    const v = parseRotation(rot);
    if (v === null)
      problems.push({
        message: `rotation '${rot}' has no number stereogate can read`,
        path: 'stereo.rotation',
      });
    else record.stereo.rotation = { value: v };
  }
  if (mapping.origin) {
    const o = originFromFields(fields, mapping);
    if (o.origin) record.origin = o.origin;
    problems.push(...o.problems);
  }
  return { record, structureText, formWord: formWordRaw?.trim() || null, formHow: understood.how, problems };
}
