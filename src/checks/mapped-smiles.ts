/**
 * The fix for descriptors that could only be compared as counts: the record's structure written with atom-map
 * numbers on its stereo units, for the chemist to paste back with each map number changed to the locant the name
 * gives that atom. A SMILES is kept as the chemist wrote it (only the mapped atoms change: `C` becomes `[CH3:1]`,
 * `[C@@H]` becomes `[C@@H:2]`); a molfile is written out as SMILES. The map numbers are the atom numbers (1-based,
 * in the order the atoms are written, explicit hydrogen atoms counted), so the finding can say which atom is which.
 */
import { readStructure, writeSmiles } from '../chem/index.js';
import { parseSmilesGraph } from '../chem/read/smiles-parse.js';
import type { Structure } from '../chem/types.js';
import type { StructureSource } from '../registry/types.js';

export interface MappedStructure {
  /** SMILES with the atom-map numbers on the given atoms. */
  smiles: string;
  /** How the map numbers relate to the record's own atom numbering, in words. */
  numbering: string;
}

const TWO_LETTER = new Set(['Cl', 'Br']);

/** Inserts `:n` (n = atom number) on each atom of `atoms` in the written SMILES; null when that is not possible. */
function mapInText(text: string, structure: Structure, atoms: ReadonlySet<number>): string | null {
  let start = 0;
  while (start < text.length && /\s/.test(text[start]!)) start++;
  let g;
  try {
    g = parseSmilesGraph(text, start);
  } catch {
    return null;
  }
  if ('error' in g || g.atoms.length !== structure.atoms.length) return null;
  const byNumber = new Map(structure.atoms.map((a) => [a.inputNumber, a]));
  const edits: { at: number; end: number; text: string }[] = [];
  for (let i = 0; i < g.atoms.length; i++) {
    const n = i + 1;
    if (!atoms.has(n)) continue;
    const raw = g.atoms[i]!;
    const at = raw.offset;
    if (text[at] === '[') {
      const close = text.indexOf(']', at);
      if (close < 0) return null;
      const inner = text.slice(at + 1, close).replace(/:\d+$/, '');
      edits.push({ at, end: close + 1, text: `[${inner}:${n}]` });
    } else {
      const token = TWO_LETTER.has(text.slice(at, at + 2)) ? text.slice(at, at + 2) : text[at]!;
      const h = byNumber.get(n)?.hCount ?? 0;
      edits.push({ at, end: at + token.length, text: `[${token}${h > 0 ? `H${h > 1 ? h : ''}` : ''}:${n}]` });
    }
  }
  let out = text;
  for (const e of edits.sort((a, b) => b.at - a.at)) out = out.slice(0, e.at) + e.text + out.slice(e.end);
  return out.trim();
}

/** The structure with atom maps on `atoms` (input numbers), or null when it cannot be written. */
export function withAtomMaps(
  structure: Structure | null,
  source: StructureSource | null | undefined,
  atoms: readonly number[],
): MappedStructure | null {
  if (!structure) return null;
  const wanted = new Set(atoms);
  if (source?.format === 'smiles' && source.text) {
    const mapped = mapInText(source.text, structure, wanted);
    // the result must read back as the same atoms: checked, never assumed
    if (mapped !== null && readsBack(mapped, structure.atoms.length)) {
      return {
        smiles: mapped,
        numbering:
          'each map number is the atom number in your SMILES (atoms counted from 1 in the order written, ' +
          'explicit hydrogen atoms counted)',
      };
    }
  }
  let smiles: string;
  try {
    smiles = writeSmiles({
      ...structure,
      atoms: structure.atoms.map((a) => ({
        ...a,
        mapNumber: wanted.has(a.inputNumber) ? a.inputNumber : null,
      })),
    });
  } catch {
    return null;
  }
  if (!readsBack(smiles, structure.atoms.length)) return null;
  return {
    smiles,
    numbering:
      source?.format === 'molfile'
        ? "each map number is the atom's number in the molfile atom block"
        : 'each map number is the atom number in your structure (atoms counted from 1 in the order written)',
  };
}

function readsBack(smiles: string, atoms: number): boolean {
  const r = readStructure(smiles, { format: 'smiles' });
  return r.ok && r.structure.atoms.length === atoms;
}
