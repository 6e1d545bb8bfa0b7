/** Shared helpers for the stereo-engine tests: read a SMILES or fail loudly. */
import { parseSmiles } from '../../src/chem/read/smiles.js';
import type { Structure } from '../../src/chem/types.js';

export function smiles(text: string): Structure {
  const r = parseSmiles(text);
  if (!r.ok) throw new Error(`test SMILES did not parse: ${text}: ${r.error.message}`);
  return r.structure;
}
