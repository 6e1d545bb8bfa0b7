import { describe, expect, it } from 'vitest';
import { buildGraph, connectedComponents, ringInfo } from '../../../src/chem/graph/index.js';
import { haveSharedData, sharedDataPath } from '../../support/shared-data.js';
import { build } from './build.js';
import { fromRdkit, loadRdkit, moleculeNetSmiles } from './rdkit.js';

const sizes = (smi: string) =>
  ringInfo(build(smi))
    .rings.map((r) => r.length)
    .sort((a, b) => a - b);

describe('ring perception (SSSR sizes from memory; SSSR size = bonds - atoms + components)', () => {
  it.each([
    ['benzene', 'C1=CC=CC=C1', [6]],
    ['naphthalene', 'C1=CC=C2C=CC=CC2=C1', [6, 6]],
    ['cubane', 'C12C3C4C1C5C2C3C45', [4, 4, 4, 4, 4]],
    ['adamantane', 'C1C2CC3CC1CC(C2)C3', [6, 6, 6]],
    ['bicyclo[2.2.2]octane', 'C1CC2CCC1CC2', [6, 6]],
    ['norbornane', 'C1CC2CCC1C2', [5, 5]],
    ['spiro[4.5]decane', 'C1CCC2(CC1)CCCC2', [5, 6]],
    ['cyclopropane', 'C1CC1', [3]],
    ['hexane', 'CCCCCC', []],
    ['18-crown-6', 'C1COCCOCCOCCOCCOCCO1', [18]],
  ])('%s', (_name, smi, expected) => {
    expect(sizes(smi as string)).toEqual(expected);
  });

  it('rings are closed paths of bonded atoms', () => {
    const s = build('C1C2CC3CC1CC(C2)C3');
    const g = buildGraph(s);
    for (const r of ringInfo(s, g).rings) {
      expect(new Set(r).size).toBe(r.length);
      r.forEach((a, i) => expect(Array.from(g.nbrs[a])).toContain(r[(i + 1) % r.length]));
    }
  });

  it('smallest ring per bond and atom is exact, not read off the SSSR (bicyclo[2.2.2]octane: every bond in a 6-ring)', () => {
    const s = build('C1CC2CCC1CC2');
    const info = ringInfo(s);
    expect(info.smallestRingOfBond.every((x) => x === 6)).toBe(true);
    expect(info.smallestRingOfAtom.every((x) => x === 6)).toBe(true);
  });

  it('bonds between rings and chains are not ring bonds; spiro and fused rings form one system', () => {
    const s = build('C1CC1CC1CC12CCC2.C1CC1');
    const info = ringInfo(s);
    expect(info.bondInRing[2]).toBe(true);
    expect(info.bondInRing[3]).toBe(false); // C3-C4 chain bond (input order)
    expect(info.atomInRing[3]).toBe(false);
    expect(info.ringSystems.map((x) => x.length)).toEqual([3, 6, 3]);
    expect(info.smallestRingOfAtom[6]).toBe(3); // the spiro atom: 3- and 4-ring
  });

  it('components are ordered by smallest atom, atoms ascending', () => {
    expect(connectedComponents(build('CC.O.C(C)C'))).toEqual([[0, 1], [2], [3, 4, 5]]);
    expect(connectedComponents(build('C1.C1'))).toEqual([[0, 1]]);
  });
});

const NONMETALS = new Set([1, 5, 6, 7, 8, 9, 14, 15, 16, 17, 33, 34, 35, 52, 53]);
const NET = ['bbbp.csv', 'clintox.csv', 'sider.csv', 'tox21.csv'];

describe.skipIf(!haveSharedData('moleculenet'))(
  'ring sizes against RDKit over MoleculeNet (Wu et al., Chem. Sci. 2018)',
  () => {
    it('SSSR size counts match RDKit ring info (RDKit adds symmetry-equivalent rings to bridged systems)', async () => {
      const rd = await loadRdkit();
      let compared = 0;
      const problems: string[] = [];
      for (const file of NET) {
        const all = moleculeNetSmiles(sharedDataPath('moleculenet', file));
        for (let i = 0; i < all.length; i += 16) {
          const ref = fromRdkit(rd, all[i]);
          // Metal complexes are left out: RDKit leaves bonds to metals out of its rings (vitamin B12 differs).
          if (!ref || ref.structure.atoms.some((a) => !NONMETALS.has(a.atomicNumber))) continue;
          compared++;
          const s = ref.structure;
          const info = ringInfo(s);
          const mine = info.rings.map((r) => r.length).sort((a, b) => a - b);
          const theirs = ref.rings.map((r) => r.length).sort((a, b) => a - b);
          const cyclomatic = s.bonds.length - s.atoms.length + connectedComponents(s).length;
          const rest = [...theirs];
          const contained = mine.every((x) => {
            const at = rest.indexOf(x);
            if (at >= 0) rest.splice(at, 1);
            return at >= 0;
          });
          const ok =
            mine.length === cyclomatic &&
            contained &&
            (theirs.length === cyclomatic ? rest.length === 0 : true);
          if (!ok) problems.push(`${all[i]} mine ${mine} RDKit ${theirs}`);
        }
      }
      expect(compared).toBeGreaterThan(700);
      expect(problems).toEqual([]);
    }, 120_000);
  },
);
