/**
 * SMILES reader against the OpenSMILES specification (opensmiles.org). Example strings marked "spec example"
 * are recalled from the specification (from memory); the expected values follow the rules the specification
 * states. Where a reading is only settled by a toolkit, the source is RDKit (checked with @rdkit/rdkit).
 */
import { describe, expect, it } from 'vitest';
import { parseSmiles } from '../../../src/chem/read/smiles.js';
import { IMPLICIT_H, LONE_PAIR, type Structure } from '../../../src/chem/types.js';

function ok(s: string): Structure {
  const r = parseSmiles(s);
  if (!r.ok) throw new Error(`${s}: ${r.error.code} ${r.error.message} @${r.error.at.offset}`);
  return r.structure;
}
const hs = (s: string): number[] => ok(s).atoms.map((a) => a.hCount);
const doubles = (s: string): number => ok(s).bonds.filter((b) => b.order === 2).length;

describe('atoms (OpenSMILES: atoms, organic subset, bracket atoms)', () => {
  it('fills organic-subset valences with implicit H (OpenSMILES organic subset: B3 C4 N3,5 O2 P3,5 S2,4,6 X1)', () => {
    expect(hs('CCO')).toEqual([3, 2, 1]);
    expect(hs('CS(=O)(=O)C')).toEqual([3, 0, 0, 0, 3]); // S valence 6
    expect(hs('CP(C)(C)=O')).toEqual([3, 0, 3, 3, 0]); // P valence 5
    expect(hs('FB(F)F')).toEqual([0, 0, 0, 0]);
    expect(hs('ClCBr')).toEqual([0, 2, 0]);
  });
  it('reads bracket atoms: H count, charge, isotope (spec examples [CH4], [OH-], [Cu+2], [13CH4], [2H+])', () => {
    const m = ok('[CH4]').atoms[0]!;
    expect([m.element, m.hCount, m.charge]).toEqual(['C', 4, 0]);
    expect(ok('[OH-]').atoms[0]).toMatchObject({ element: 'O', hCount: 1, charge: -1 });
    expect(ok('[OH-1]').atoms[0]).toMatchObject({ charge: -1 });
    expect(ok('[Cu+2]').atoms[0]).toMatchObject({ element: 'Cu', charge: 2, hCount: 0 });
    expect(ok('[Cu++]').atoms[0]).toMatchObject({ charge: 2 }); // deprecated doubled sign, same meaning
    expect(ok('[Ti++++]').atoms[0]).toMatchObject({ charge: 4 });
    expect(ok('[Fe--]').atoms[0]).toMatchObject({ charge: -2 });
    expect(ok('[13CH4]').atoms[0]).toMatchObject({ isotope: 13, hCount: 4 });
    expect(ok('[2H+]').atoms[0]).toMatchObject({ element: 'H', isotope: 2, charge: 1 });
    expect(ok('[238U]').atoms[0]).toMatchObject({ element: 'U', atomicNumber: 92, isotope: 238 });
  });
  it('reads the atom class as the map number (spec: [CH4:2], leading zeros allowed)', () => {
    expect(ok('[CH4:2]').atoms[0]!.mapNumber).toBe(2);
    expect(ok('[CH4:005]').atoms[0]!.mapNumber).toBe(5);
    expect(ok('C').atoms[0]!.mapNumber).toBeNull();
  });
  it('reads two-letter and aromatic bracket symbols and the wildcard', () => {
    expect(ok('[Sc]').atoms[0]!.atomicNumber).toBe(21);
    expect(ok('[se]1cccc1').atoms[0]).toMatchObject({ element: 'Se', aromatic: true });
    expect(ok('c1cc[as]cc1').atoms[3]).toMatchObject({ element: 'As', aromatic: true });
    expect(ok('*C').atoms[0]).toMatchObject({ element: '*', atomicNumber: 0, hCount: 0 });
    expect(ok('[*:1]C').atoms[0]!.mapNumber).toBe(1);
  });
  it('gives bracket atoms with missing valence a radical (common practice, RDKit does the same)', () => {
    expect(ok('[CH2]C').atoms[0]!.radical).toBe(1);
    expect(ok('[CH3]').atoms[0]!.radical).toBe(1);
    expect(ok('[CH3]C').atoms[0]!.radical).toBe(0);
    expect(ok('[CH4]').atoms[0]!.radical).toBe(0);
    expect(ok('[Na+]').atoms[0]!.radical).toBe(0);
  });
});

describe('bonds, branches, rings, components (OpenSMILES)', () => {
  it('reads bond orders - = # $ (spec example of a quadruple bond between Rh atoms)', () => {
    expect(ok('C=C').bonds[0]!.order).toBe(2);
    expect(ok('C#N').bonds[0]!.order).toBe(3);
    expect(ok('[Rh-](Cl)(Cl)(Cl)(Cl)$[Rh-](Cl)(Cl)(Cl)Cl').bonds[4]!.order).toBe(4);
  });
  it('reads ring closures, ring-bond orders on either end, reuse of numbers and %nn (spec examples)', () => {
    expect(ok('C1CCCCC1').bonds).toHaveLength(6);
    for (const s of ['C=1CCCCC1', 'C1CCCCC=1', 'C=1CCCCC=1']) expect(doubles(s)).toBe(1); // cyclohexene
    expect(ok('C1CCCCC1C1CCCCC1').bonds).toHaveLength(13); // bicyclohexyl, ring number reused
    expect(ok('C12(CCCCC1)CCCCC2').atoms[0]!.hCount).toBe(0); // spiro
    expect(ok('C%10CCCCC%10').bonds).toHaveLength(6);
    expect(ok('C%(123)CC%(123)').bonds).toHaveLength(3);
  });
  it('keeps dot-disconnected parts in one structure; a ring bond may cross a dot (spec: C1.C1 is ethane)', () => {
    const salt = ok('[Na+].[Cl-]');
    expect(salt.atoms).toHaveLength(2);
    expect(salt.bonds).toHaveLength(0);
    const e = ok('C1.C1');
    expect(e.bonds).toHaveLength(1);
    expect(e.atoms.map((a) => a.hCount)).toEqual([3, 3]);
  });
  it('numbers atoms in written order, counting [H] atoms and not bracket H (Hanson et al. 2018 numbering)', () => {
    const s = ok('[H][C@@]([2H])(F)Cl');
    expect(s.atoms.map((a) => `${a.inputNumber}${a.element}`)).toEqual(['1H', '2C', '3H', '4F', '5Cl']);
    expect(ok('[C@@H](F)(Cl)Br').atoms.map((a) => a.inputNumber)).toEqual([1, 2, 3, 4]);
  });
  it('reads a title after whitespace and an empty title as null', () => {
    expect(ok('CCO ethanol').title).toBe('ethanol');
    expect(ok('CCO\tLX-00001 ethanol').title).toBe('LX-00001 ethanol');
    expect(ok('CCO').title).toBeNull();
  });
});

describe('aromaticity and kekulization (OpenSMILES aromaticity; RDKit reads the same H counts)', () => {
  it('kekulizes benzene, naphthalene, pyridine, pyrrole, furan, thiophene', () => {
    expect(doubles('c1ccccc1')).toBe(3);
    expect(doubles('c1ccc2ccccc2c1')).toBe(5);
    expect(hs('n1ccccc1')).toEqual([0, 1, 1, 1, 1, 1]);
    expect(hs('c1cc[nH]c1')).toEqual([1, 1, 1, 1, 1]);
    expect(doubles('o1cccc1')).toBe(2);
    expect(doubles('c1ccsc1')).toBe(2);
  });
  it('handles odd-membered fused systems that need the blossom step (azulene, indolizine)', () => {
    const az = ok('c1cc2cccccc2c1');
    expect(az.bonds.filter((b) => b.order === 2)).toHaveLength(5);
    expect(az.atoms.map((a) => a.hCount)).toEqual([1, 1, 0, 1, 1, 1, 1, 1, 0, 1]);
    expect(doubles('c1ccn2cccc2c1')).toBe(4);
  });
  it('respects charges and exocyclic double bonds (pyridinium N-oxide, tropylium, 2-pyridone)', () => {
    expect(doubles('[O-][n+]1ccccc1')).toBe(3);
    expect(doubles('[cH+]1cccccc1')).toBe(3);
    expect(doubles('[cH-]1cccc1')).toBe(2);
    expect(hs('O=c1cccc[nH]1')).toEqual([0, 0, 1, 1, 1, 1, 1]);
  });
  it('keeps aromatic flags and makes a non-ring link between aromatic atoms single (biphenyl)', () => {
    const s = ok('c1ccccc1c1ccccc1');
    expect(s.atoms.every((a) => a.aromatic)).toBe(true);
    expect(s.bonds[6]).toMatchObject({ a: 5, b: 6, order: 1, aromatic: false });
    expect(s.bonds.filter((b) => b.aromatic)).toHaveLength(12);
  });
  it("reports an aromatic system that cannot be kekulized, naming the atom (like RDKit's can't kekulize)", () => {
    const r = parseSmiles('c1ccnc1');
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.error.code).toBe('smiles-kekulize');
      expect(r.error.message).toMatch(/atom \d/);
    }
    expect(parseSmiles('Cc').ok).toBe(false);
  });
});

describe('tetrahedral stereo ligand order (OpenSMILES chirality)', () => {
  it('orders ligands: preceding atom, implicit H, ring closures, branches/following atoms', () => {
    expect(ok('N[C@@H](C)C(=O)O').stereo[0]).toEqual({
      kind: 'tetrahedral',
      centre: 1,
      ligands: [0, IMPLICIT_H, 2, 3],
      winding: '@@',
    });
    // a leading atom has no preceding atom: its H comes first
    expect(ok('[C@@H](N)(C)C(=O)O').stereo[0]).toMatchObject({ ligands: [IMPLICIT_H, 1, 2, 3] });
    // F0 C1 ring-1 Cl2 C3 C4 C5 C6(closes 1) Br7: the ring partner C6 follows F, then Cl, then C3
    expect(ok('F[C@]1(Cl)CCCC1Br').stereo[0]).toMatchObject({ centre: 1, ligands: [0, 6, 2, 3] });
    // ring digits in the order they appear: C0 opens 1 then 2
    expect(ok('[C@]12(F)CCC1.C2').stereo[0]).toMatchObject({ centre: 0, ligands: [4, 5, 1, 2] });
  });
  it('reads @TH1/@TH2 as @/@@ and ignores @SP/@TB/@OH with a warning (not an error)', () => {
    expect(ok('F[C@TH1](Cl)(Br)I').stereo[0]).toMatchObject({ winding: '@' });
    expect(ok('F[C@TH2](Cl)(Br)I').stereo[0]).toMatchObject({ winding: '@@' });
    const r = parseSmiles('F[Pt@SP1](Cl)(Br)I');
    expect(r.ok && r.structure.stereo.length === 0 && r.warnings[0]!.code).toBe('smiles-stereo-unsupported');
  });
  it('puts the lone pair of a three-connected S or P second, as RDKit reads it', () => {
    expect(ok('C[S@](=O)c1ccccc1').stereo[0]).toMatchObject({
      centre: 1,
      ligands: [0, LONE_PAIR, 2, 3],
      winding: '@',
    });
    // A leading atom: OpenSMILES says nothing about lone pairs; RDKit reads [S@](C)(=O)c1ccccc1 as the same
    // molecule as C[S@](=O)c1ccccc1 (checked with @rdkit/rdkit), so the lone pair is not put first.
    expect(ok('[S@](C)(=O)c1ccccc1').stereo[0]).toMatchObject({
      centre: 0,
      ligands: [1, LONE_PAIR, 2, 3],
      winding: '@',
    });
    expect(ok('[P@](C)(CC)c1ccccc1').stereo[0]).toMatchObject({ centre: 0, ligands: [1, LONE_PAIR, 2, 4] });
  });
  it('keeps marks on atoms with 3-4 ligands and warns on fewer', () => {
    expect(ok('C[C@H](C)C').stereo).toHaveLength(1); // not a stereocentre, but perception decides that
    const r = parseSmiles('C[C@H]');
    expect(r.ok && r.structure.stereo.length === 0 && r.warnings[0]!.code).toBe('smiles-stereo-ignored');
  });
});

describe('double-bond and allene stereo (OpenSMILES cis/trans and extended tetrahedral)', () => {
  const db = (s: string) => ok(s).stereo.filter((e) => e.kind === 'double-bond');
  it('reads / and \\ on both sides (spec: F/C=C/F and C(\\F)=C/F trans, F/C=C\\F cis)', () => {
    expect(db('F/C=C/F')).toEqual([{ kind: 'double-bond', ends: [1, 2], refs: [0, 3], relation: 'trans' }]);
    expect(db('F\\C=C\\F')[0]!.relation).toBe('trans');
    expect(db('F/C=C\\F')[0]!.relation).toBe('cis');
    expect(db('C(\\F)=C/F')[0]).toMatchObject({ ends: [0, 2], refs: [1, 3], relation: 'trans' });
    expect(db('C(/F)=C/F')[0]!.relation).toBe('cis');
  });
  it('reads marks on ring-closure bonds from the end where they are written (RDKit: F/C=C/1.F1 trans, F/C=C1.F/1 cis)', () => {
    expect(db('F/C=C/1.F1')[0]!.relation).toBe('trans');
    expect(db('F/C=C1.F/1')[0]!.relation).toBe('cis');
    expect(db('F/C=C\\1.F1')[0]!.relation).toBe('cis');
  });
  it('shares one directional bond between the double bonds of a diene', () => {
    expect(db('C/C=C/C=C/C').map((e) => e.relation)).toEqual(['trans', 'trans']);
    expect(db('C/C=C\\C=C/C').map((e) => e.relation)).toEqual(['cis', 'cis']);
  });
  it('reads an odd cumulene between its terminal atoms', () => {
    expect(db('F/C=C=C=C/F')).toEqual([
      { kind: 'double-bond', ends: [1, 4], refs: [0, 5], relation: 'trans' },
    ]);
  });
  it('warns on marks that put both substituents on one side', () => {
    const r = parseSmiles('F/C(\\Cl)=C/F');
    expect(r.ok && r.structure.stereo.length === 0 && r.warnings[0]!.code).toBe(
      'smiles-conflicting-bond-direction',
    );
  });
  it('reads allenes as axial stereo: ends, near/near/far/far ligands (spec example NC(Br)=[C@]=C(O)C)', () => {
    expect(ok('NC(Br)=[C@]=C(O)C').stereo).toEqual([
      { kind: 'axial', subtype: 'allene', ends: [1, 4], ligands: [0, 2, 5, 6], winding: '@' },
    ]);
    expect(ok('OC(=O)C=C=[C@@]=C=CC').stereo[0]).toMatchObject({ ends: [3, 7] }); // even cumulene, central atom
    const off = parseSmiles('CC=C=[C@]=CC'); // three double bonds: no central atom, the mark is misplaced
    expect(off.ok && off.structure.stereo.length === 0 && off.warnings[0]!.code).toBe(
      'smiles-stereo-ignored',
    );
    expect(ok('CC=[C@AL2]=CC').stereo[0]).toMatchObject({
      ends: [1, 3],
      ligands: [0, IMPLICIT_H, IMPLICIT_H, 4],
      winding: '@@',
    });
  });
  it('agrees with the CIP validation suite helicity of two simple allenes (Hanson et al. 2018, VS079 M, VS144 P)', () => {
    // Helicity rule (IUPAC 2013 P-93.5.7.1, from memory): look along the axis from the near end; turning from
    // the higher-ranked near substituent to the higher-ranked far one clockwise is P. With ligands
    // [a, b, c, d] written '@', turning anticlockwise from a reaches d (worked out from the tetrahedral picture).
    const helicity = (s: string, nearHigh: number, farHigh: number): 'M' | 'P' => {
      const ax = ok(s).stereo[0]!;
      if (ax.kind !== 'axial') throw new Error('not axial');
      const [a, , , d] = ax.ligands;
      let anticlockwise = (nearHigh === a) === (farHigh === d);
      if (ax.winding === '@@') anticlockwise = !anticlockwise;
      return anticlockwise ? 'M' : 'P';
    };
    expect(helicity('ClC=[C@]=CCl', 0, 4)).toBe('M'); // Cl > H at both ends
    expect(helicity('NC(=[C@]=C(C)O)Br', 6, 5)).toBe('P'); // Br > N near, O > C far
  });
});

describe('errors carry a code and a 0-based offset', () => {
  const cases: [string, string, number][] = [
    ['', 'smiles-empty', 0],
    ['C1CC', 'smiles-unclosed-ring', 1],
    ['C11', 'smiles-ring-bond-to-self', 2],
    ['C12CCCCC12', 'smiles-duplicate-bond', 9],
    ['C(C', 'smiles-unmatched-parenthesis', 1],
    ['CC)C', 'smiles-unmatched-parenthesis', 2],
    ['(C)C', 'smiles-unmatched-parenthesis', 0],
    ['C()C', 'smiles-empty-branch', 1],
    ['[Xy]', 'smiles-unknown-element', 1],
    ['C[Cx]', 'smiles-unknown-element', 2],
    ['[C', 'smiles-bad-bracket-atom', 0],
    ['C[C@X]', 'smiles-bad-bracket-atom', 4],
    ['[C:]', 'smiles-bad-bracket-atom', 2],
    ['CC=', 'smiles-dangling-bond', 2],
    ['C=.C', 'smiles-dangling-bond', 1],
    ['=C', 'smiles-dangling-bond', 0],
    ['C==C', 'smiles-dangling-bond', 2],
    ['C^C', 'smiles-illegal-character', 1],
    ['C=1CCCCC#1', 'smiles-conflicting-ring-bond', 9],
    ['C/1CCC/1', 'smiles-conflicting-ring-bond', 7],
    ['.C', 'smiles-empty-component', 0],
    ['C..C', 'smiles-empty-component', 2],
    ['1CC', 'smiles-dangling-ring-bond', 0],
    ['C%1C', 'smiles-bad-ring-number', 1],
    ['c1cccc1', 'smiles-kekulize', 5],
  ];
  it.each(cases)('%j -> %s at %i', (smi, code, offset) => {
    const r = parseSmiles(smi);
    expect(r.ok).toBe(false);
    if (!r.ok) expect([r.error.code, r.error.at.offset]).toEqual([code, offset]);
  });
  it('reads a doubled backslash (an escaped string) as one with a warning, as RDKit does', () => {
    const r = parseSmiles('F/C=C\\\\F');
    expect(r.ok && r.warnings.map((w) => w.code)).toEqual(['smiles-doubled-backslash']);
    expect(r.ok && r.structure.stereo[0]).toMatchObject({ relation: 'cis' });
  });
});
