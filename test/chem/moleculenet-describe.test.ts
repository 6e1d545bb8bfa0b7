/**
 * Robustness and internal consistency over the ~12,800 real structures of MoleculeNet (Wu et al.,
 * "MoleculeNet: a benchmark for molecular machine learning", Chem. Sci. 2018, 9, 513–530): describe() never
 * throws, its counts add up, and relating a structure to its own mirror image agrees with its chirality.
 */
import { describe as suite, expect, it } from 'vitest';
import { describe } from '../../src/chem/describe/index.js';
import { parseSmiles } from '../../src/chem/read/smiles.js';
import { relate } from '../../src/chem/relate.js';
import { mirror } from '../../src/chem/symmetry/index.js';
import { haveSharedData } from '../support/shared-data.js';
import { loadMoleculeNet } from '../support/moleculenet.js';

suite.skipIf(!haveSharedData('moleculenet'))('describe over MoleculeNet', () => {
  it('never throws and its facts are consistent', () => {
    const problems: string[] = [];
    let described = 0;
    for (const row of loadMoleculeNet()) {
      const r = parseSmiles(row.smiles);
      if (!r.ok) continue;
      const where = `${row.file}:${row.row}`;
      try {
        const f = describe(r.structure);
        described++;
        const s = f.stereoisomers;
        const c = {
          total: BigInt(s.total),
          chiral: BigInt(s.chiral),
          achiral: BigInt(s.achiral),
          pairs: BigInt(s.pairs),
          meso: BigInt(s.meso),
        };
        if (
          c.total !== c.chiral + c.achiral ||
          c.chiral !== 2n * c.pairs ||
          c.meso > c.achiral ||
          c.total < 1n
        )
          problems.push(`${where}: counts ${JSON.stringify(s)}`);
        if (f.stereocenters.length + f.stereobonds.length !== f.units.length)
          problems.push(`${where}: views`);
        if (f.undefined !== f.units.filter((u) => !u.defined).length) problems.push(`${where}: undefined`);
        if (f.meso === true && (f.chiral !== false || c.chiral === 0n)) problems.push(`${where}: meso`);
        // (a drawing the ring system forbids is judged as drawn: it can be "chiral" although no real isomer is)
        const impossible = f.remarks.some((m) => m.includes('cannot both hold'));
        if (c.chiral === 0n && f.chiral === true && !impossible)
          problems.push(`${where}: chiral with no chiral stereoisomer`);
        if (f.units.some((u) => !u.defined && u.label !== null))
          problems.push(`${where}: label on undefined unit`);
      } catch (e) {
        problems.push(`${where}: threw ${(e as Error).message}`);
      }
    }
    expect(described).toBeGreaterThan(12000);
    expect(problems.slice(0, 20)).toEqual([]);
  });

  it('relating a structure with drawn stereo to its mirror image agrees with its chirality', () => {
    const problems: string[] = [];
    for (const row of loadMoleculeNet()) {
      if (!/[@/\\]/.test(row.smiles) || row.smiles.includes('.')) continue;
      const r = parseSmiles(row.smiles);
      if (!r.ok) continue;
      const f = describe(r.structure);
      // Configurations that cannot all hold (bridgeheads): neither chiral nor achiral, nothing to compare.
      if (f.chiral === null && f.undefined === 0) continue;
      const rel = relate(r.structure, mirror(r.structure)).relation;
      const want = f.undefined > 0 ? 'same-constitution' : f.chiral ? 'enantiomers' : 'identical';
      if (rel !== want) problems.push(`${row.file}:${row.row}: ${rel}, expected ${want}`);
    }
    expect(problems.slice(0, 20)).toEqual([]);
  });
});
