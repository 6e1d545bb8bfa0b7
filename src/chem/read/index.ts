/**
 * One entry point for structure text: a molfile (counts line on line 4, or a V3000 molfile) or SMILES.
 */
import type { ReadResult } from '../types.js';
import { parseMolfile, splitLines } from './molfile.js';
import { parseSmiles } from './smiles.js';
import { READ_LIMITS, structureTooLarge, textTooLong, type ReadLimits } from './limits.js';

export { READ_LIMITS, type ReadLimits } from './limits.js';

export { parseMolfile } from './molfile.js';
export { readSdRecords, streamSdRecords, type SdRecord } from './sdf.js';

export interface ReadOptions {
  format?: 'auto' | 'smiles' | 'molfile';
  /** Size caps (default READ_LIMITS); input over a cap is a reader error, not a structure. */
  limits?: ReadLimits;
}

/** true when line 4 has the shape of a V2000 counts line, or the text says V3000. */
export function looksLikeMolfile(text: string): boolean {
  if (text.includes('V3000')) return true;
  const lines = splitLines(text.length > 4000 ? text.slice(0, 4000) : text);
  if (lines.length < 4) return false;
  const c = lines[3]!;
  if (c.includes('V2000')) return true;
  // aaabbb: two right-aligned integers in the first six columns
  const a = c.slice(0, 3).trim();
  const b = c.slice(3, 6).trim();
  return a !== '' && b !== '' && /^\d+$/.test(a) && /^\d+$/.test(b);
}

export function readStructure(text: string, opts?: ReadOptions): ReadResult {
  const format = opts?.format ?? 'auto';
  const limits = opts?.limits ?? READ_LIMITS;
  const molfile = format === 'molfile' || (format === 'auto' && looksLikeMolfile(text));
  const long = textTooLong(text, molfile ? 'molfile' : 'smiles', limits);
  if (long !== null) return { ok: false, error: long };
  const read = molfile ? parseMolfile(text, { limits }) : parseSmiles(text);
  if (!read.ok) return read;
  const large = structureTooLarge(read.structure, limits);
  return large === null ? read : { ok: false, error: large };
}
