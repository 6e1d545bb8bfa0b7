import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { atomInvariants, equivalenceClasses } from '../../../src/chem/graph/index.js';
import { build } from './build.js';
import { permute, shuffle } from './permute.js';

const classCount = (smi: string, element?: string) => {
  const s = build(smi);
  const c = equivalenceClasses(s);
  return new Set(Array.from(c).filter((_, i) => !element || s.atoms[i].element === element)).size;
};

// Counts of symmetry-distinct atoms as read off the structural formulas (from memory; they match the number of
// distinct 13C NMR signals listed for these compounds in spectroscopy handbooks).
describe('constitutional equivalence classes', () => {
  it.each([
    ['toluene', 'CC1=CC=CC=C1', 'C', 5],
    ['benzene', 'C1=CC=CC=C1', 'C', 1],
    ['naphthalene', 'C1=CC=C2C=CC=CC2=C1', 'C', 3],
    ['p-xylene', 'CC1=CC=C(C)C=C1', 'C', 3],
    ['m-xylene', 'CC1=CC(C)=CC=C1', 'C', 5],
    ['o-xylene', 'CC1=C(C)C=CC=C1', 'C', 4],
    ['cyclohexanol', 'OC1CCCCC1', 'C', 4],
    ['2-methylbutane', 'CC(C)CC', 'C', 4],
    ['neopentane', 'CC(C)(C)C', 'C', 2],
    ['adamantane', 'C1C2CC3CC1CC(C2)C3', 'C', 2],
    ['cubane', 'C12C3C4C1C5C2C3C45', 'C', 1],
    ['1,4-dioxane', 'C1COCCO1', 'C', 1],
    ['acetic acid (both O differ)', 'CC(=O)O', 'O', 2],
  ])('%s has %s %s classes', (_name, smi, el, expected) => {
    expect(classCount(smi as string, el as string)).toBe(expected);
  });

  it('the two Kekulé structures of toluene give the same classes', () => {
    const a = equivalenceClasses(build('CC1=CC=CC=C1'));
    const b = equivalenceClasses(build('CC1C=CC=CC=1'));
    expect(Array.from(a)).toEqual(Array.from(b));
  });

  it('extra colours split classes (a label on one ortho carbon)', () => {
    const s = build('CC1=CC=CC=C1');
    const extra = s.atoms.map((_, i) => (i === 2 ? 1 : 0));
    expect(new Set(equivalenceClasses(s, { extra })).size).toBe(7);
  });

  it('charge, isotope and hydrogen count are part of the invariant', () => {
    const inv = (smi: string) => atomInvariants(build(smi))[0];
    expect(inv('[13CH4]')).not.toBe(inv('C'));
    expect(inv('[NH4+]')).not.toBe(inv('[NH3]'));
    expect(inv('[CH3]')).not.toBe(inv('C'));
  });
});

const MOLECULES = [
  'CC1=CC=CC=C1',
  'OC1C(O)C(O)C(O)C(O)C1O',
  'C12C3C4C1C5C2C3C45',
  'CC(C)(C)C1=CC=C(O)C=C1',
  'CN1C=NC2=C1C(=O)N(C)C(=O)N2C',
  'OC(=O)C(O)C(O)C(=O)O',
  'C1CC2CCC1CC2',
  'CC(=O)OC1=CC=CC=C1C(=O)O',
  'NC(CC1=CC=CC=C1)C(=O)O.Cl',
  'C1COCCOCCOCCOCCOCCO1',
];

describe('property: renumbering atoms changes no class (fast-check)', () => {
  it('the class of atom i in A equals that of its image in the renumbered copy', () => {
    fc.assert(
      fc.property(fc.constantFrom(...MOLECULES), fc.nat(), fc.boolean(), (smi, seed, flip) => {
        const s = build(smi);
        const perm = shuffle(s.atoms.length, seed);
        const t = permute(s, perm, shuffle(s.bonds.length, seed ^ 0x5bd1e995), flip);
        const ca = equivalenceClasses(s);
        const cb = equivalenceClasses(t);
        for (let i = 0; i < s.atoms.length; i++) expect(cb[perm[i]]).toBe(ca[i]);
      }),
      { numRuns: 200 },
    );
  });
});
