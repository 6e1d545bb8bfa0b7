/** Test structures from SMILES via the project's reader; a reading error fails the test loudly. */
import { parseSmiles } from '../../../src/chem/read/smiles.js';
import type { Structure } from '../../../src/chem/types.js';

export function build(text: string): Structure {
  const r = parseSmiles(text);
  if (!r.ok) throw new Error(`test SMILES ${text} not read: ${r.error.message}`);
  return r.structure;
}
