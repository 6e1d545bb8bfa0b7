import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { constitutionKey, equivalenceClasses, molecularFormula } from '../../../src/chem/graph/index.js';
import { build } from './build.js';
import { permute, shuffle } from './permute.js';

// Hill system (Hill, J. Am. Chem. Soc. 22 (1900) 478): C first, then H, then the rest alphabetically; without
// carbon, all alphabetically. Formulas of these compounds from memory.
describe('molecular formula (Hill order)', () => {
  it.each([
    ['toluene', 'CC1=CC=CC=C1', 'C7H8'],
    ['chloroform', 'ClC(Cl)Cl', 'CHCl3'],
    ['tartaric acid', 'OC(=O)C(O)C(O)C(=O)O', 'C4H6O6'],
    ['water', 'O', 'H2O'],
    ['ammonium chloride', '[NH4+].[Cl-]', 'ClH4N'],
    ['sodium hydrogen sulfate', 'OS(=O)(=O)[O-].[Na+]', 'HNaO4S'],
    ['acetate anion', 'CC(=O)[O-]', 'C2H3O2-'],
    ['sulfate', '[O-]S(=O)(=O)[O-]', 'O4S2-'],
    ['tetramethylammonium', 'C[N+](C)(C)C', 'C4H12N+'],
    ['explicit H atoms count as H', '[H]C([H])([H])[H]', 'CH4'],
  ])('%s', (_n, smi, formula) => {
    expect(molecularFormula(build(smi))).toBe(formula);
  });

  it('a subset of atoms (one component)', () => {
    const s = build('CC(=O)[O-].[Na+]');
    expect(molecularFormula(s, [0, 1, 2, 3])).toBe('C2H3O2-');
    expect(molecularFormula(s, [4])).toBe('Na+');
  });
});

const MOLECULES = [
  'CC(=O)OC1=CC=CC=C1C(=O)O',
  'CN1C=NC2=C1C(=O)N(C)C(=O)N2C',
  'OC1C(O)C(O)C(O)C(O)C1O',
  'CC(C)CC1=CC=C(C=C1)C(C)C(=O)O',
  'C1COCCOCCOCCOCCOCCO1',
  'NC(CC1=CC=CC=C1)C(=O)O.Cl',
  'CCCCO.CCC(C)O',
];

describe('constitution key', () => {
  it('is unchanged by renumbering atoms and reordering bonds; so is the class multiset (fast-check)', () => {
    fc.assert(
      fc.property(fc.constantFrom(...MOLECULES), fc.nat(), fc.boolean(), (smi, seed, flip) => {
        const s = build(smi);
        const t = permute(s, shuffle(s.atoms.length, seed), shuffle(s.bonds.length, seed + 7), flip);
        expect(constitutionKey(t)).toBe(constitutionKey(s));
        const sorted = (x: Int32Array) => Array.from(x).sort((p, q) => p - q);
        expect(sorted(equivalenceClasses(t))).toEqual(sorted(equivalenceClasses(s)));
      }),
      { numRuns: 150 },
    );
  });

  it('is the same for two Kekulé structures', () => {
    expect(constitutionKey(build('CC1=CC=CC=C1'))).toBe(constitutionKey(build('CC1C=CC=CC=1')));
  });

  it.each([
    ['1-butanol / 2-butanol', 'CCCCO', 'CCC(C)O'],
    ['o- / p-xylene', 'CC1=C(C)C=CC=C1', 'CC1=CC=C(C)C=C1'],
    ['pentan-2-one / pentan-3-one', 'CC(=O)CCC', 'CCC(=O)CC'],
    ['sodium acetate / acetic acid', 'CC(=O)[O-].[Na+]', 'CC(=O)O'],
    // Pairs that colour refinement alone cannot tell apart (every atom sees the same neighbourhood degrees);
    // the smallest ring size in the atom invariant separates them.
    ['decalin / bicyclopentyl', 'C1CCC2CCCCC2C1', 'C1CCC(C1)C1CCCC1'],
    ['two cyclohexanes / cyclododecane', 'C1CCCCC1.C1CCCCC1', 'C1CCCCCCCCCCC1'],
  ])('differs for different constitutions: %s', (_n, x, y) => {
    expect(constitutionKey(build(x))).not.toBe(constitutionKey(build(y)));
  });

  it('starts with the formula', () => {
    expect(constitutionKey(build('CCO')).startsWith('C2H6O/')).toBe(true);
  });
});
