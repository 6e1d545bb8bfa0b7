/**
 * The review describes only registry records whose heavy-atom formula, read from the SMILES syntax alone, is
 * one a record under review can have (src/audit/review-against-index.ts). That is sound only if the syntax-only
 * formula is always among the candidates of the described structure's formula (engine.ts heavyAtomCandidates).
 * Checked on MoleculeNet structures (Wu et al., Chem. Sci. 2018, 9, 513; ../shared/data/moleculenet), every
 * 13th of them: charged, bracketed, aromatic and multi-component SMILES among them.
 */
import { describe, expect, it } from 'vitest';
import { defaultEngine, heavyAtomCandidates } from '../../src/audit/engine.js';
import { loadMoleculeNet } from '../support/moleculenet.js';
import { haveSharedData } from '../support/shared-data.js';

const have = haveSharedData('moleculenet');

describe.runIf(have)('heavy-atom formula from SMILES syntax', () => {
  it('is a candidate of the formula of the described structure, for every readable structure', async () => {
    const engine = await defaultEngine();
    const rows = loadMoleculeNet().filter((_, i) => i % 13 === 0);
    let compared = 0;
    const wrong: string[] = [];
    for (const { smiles } of rows) {
      const read = engine.readStructure(smiles, { format: 'smiles' });
      if (!read.ok) continue;
      const heavy = engine.smilesHeavyAtoms!(smiles);
      // null means "unknown": such a record is always described, so it cannot be missed
      if (heavy === null) continue;
      compared++;
      const formula = engine.formula!(read.structure);
      if (!heavyAtomCandidates(formula).includes(heavy)) wrong.push(`${smiles}: ${heavy} vs ${formula}`);
    }
    expect(wrong).toEqual([]);
    expect(compared).toBeGreaterThan(900);
  });
});
