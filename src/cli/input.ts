/**
 * A structure argument: a file (molfile, SD file — first record — or a file whose first line is a SMILES), `-`
 * for standard input, or else the argument itself as SMILES.
 */
import { readSdRecords, readStructure } from '../chem/index.js';
import { looksLikeMolfile } from '../chem/read/index.js';
import type { ReadError, Structure } from '../chem/index.js';
import type { Io } from './command.js';

export type Loaded =
  | { ok: true; structure: Structure; source: string; warnings: ReadError[] }
  | {
      ok: false;
      message: string;
      /** The argument names a file that does not exist (exit 2). */ missingFile?: boolean;
    };

/** File-name endings that mark an argument as a path, never SMILES. */
const FILE_ENDING = /\.(mol|sdf|sd|smi|smiles|mol2|txt)$/i;

export function loadStructure(arg: string, io: Io): Loaded {
  let text = arg;
  let source = 'SMILES argument';
  if (arg === '-') {
    text = io.readStdin();
    source = 'standard input';
  } else if (io.isFile(arg)) {
    try {
      text = io.readFile(arg);
    } catch (e) {
      return { ok: false, message: `cannot read ${arg}: ${(e as Error).message}` };
    }
    source = arg;
  } else if (FILE_ENDING.test(arg)) {
    return { ok: false, message: `file not found: ${arg}`, missingFile: true };
  }
  // An SD file: a $$$$ line, or text after the molfile's M  END (data fields, or a second molfile whose $$$$ was
  // lost, which the SD reader reports at its line instead of reading the first molfile alone).
  if (/\n\$\$\$\$\s*(\n|$)/.test(text) || /^M {2}END[^\n]*\n[\s\S]*\S/m.test(text)) {
    const first = readSdRecords(text).next().value;
    if (!first) return { ok: false, message: `${source}: no SD record found` };
    if (!first.result.ok)
      return { ok: false, message: `${source}, record 1: ${describeError(first.result.error)}` };
    return {
      ok: true,
      structure: first.result.structure,
      source: `${source} (record 1)`,
      warnings: first.result.warnings,
    };
  }
  const isSmilesFile = source !== 'SMILES argument' && !looksLikeMolfile(text);
  const body = isSmilesFile ? (text.split(/\r?\n/).find((l) => l.trim() !== '') ?? '') : text;
  const r = readStructure(body, { format: 'auto' });
  // A path-like argument: '/' also occurs in SMILES bond symbols, so only when it is not valid SMILES either and
  // holds none of the characters of SMILES bonds, branches, brackets and rings; else the SMILES error comes first.
  if (!r.ok && source === 'SMILES argument' && arg.includes('/') && !arg.includes('\n')) {
    if (/[=#()[\]@%\\]/.test(arg)) {
      return { ok: false, message: `${source}: ${describeError(r.error)} (no file of that name either)` };
    }
    return {
      ok: false,
      message: `file not found: ${arg} (and not valid SMILES: ${describeError(r.error)})`,
      missingFile: true,
    };
  }
  if (!r.ok) return { ok: false, message: `${source}: ${describeError(r.error)}` };
  return { ok: true, structure: r.structure, source, warnings: r.warnings };
}

export function describeError(e: ReadError): string {
  const at =
    e.at.line !== undefined
      ? ` (line ${e.at.line})`
      : e.at.offset !== undefined
        ? ` (character ${e.at.offset + 1})`
        : '';
  return `${e.message}${at} [${e.code}]`;
}
