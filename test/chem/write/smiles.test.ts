/**
 * SMILES writer. References: RDKit (@rdkit/rdkit) canonical SMILES for "same molecule, same stereo";
 * the OpenSMILES specification for syntax (bracket atoms, ring-closure digits, %nn); our own reader for allenes,
 * which RDKit does not keep (checked: RDKit writes CC=[C@]=CC as CC=C=CC).
 */
import fc from 'fast-check';
import { beforeAll, describe, expect, it } from 'vitest';
import type { MainModule } from '@rdkit/rdkit';
import { parseSmiles } from '../../../src/chem/read/smiles.js';
import { writeSmiles, writeSmilesWithOrder } from '../../../src/chem/write/smiles.js';
import { IMPLICIT_H, type Structure } from '../../../src/chem/types.js';
import { loadRDKit, rdkitCanonical } from '../read/smiles-rdkit-helper.js';
import { stereoDifferences } from './stereo-same.js';

function read(s: string): Structure {
  const r = parseSmiles(s);
  if (!r.ok) throw new Error(`${s}: ${r.error.code} ${r.error.message}`);
  return r.structure;
}

const STEREO_SET = [
  'N[C@@H](C)C(=O)O',
  'C[S@](=O)c1ccccc1',
  'C[P@@](c1ccccc1)CC',
  'O[C@H]1CC[C@@H](N)CC1',
  'C[C@@]12CC[C@H]3[C@@H](CC=C4C[C@@H](O)CC[C@]34C)[C@@H]1CC[C@@H]2O',
  'F/C=C/C=C\\Cl',
  'C/C=C/C(=C\\C)/C',
  'C1CCCC/C=C/CCCCC1',
  'OC(=O)/C=C\\C(=O)O',
  'C[C@H](O)/C=C/[C@@H](C)Cl',
  '[2H][C@](F)(Cl)Br',
  'C[N@+]1(CC)CCCC1',
  'F[C@]1(Cl)CCCC1Br',
];

describe('writeSmiles output syntax (OpenSMILES)', () => {
  it('writes organic-subset atoms bare and the rest in brackets', () => {
    expect(writeSmiles(read('CCO'))).toBe('CCO');
    expect(writeSmiles(read('[NH4+].[Cl-]'))).toBe('[NH4+].[Cl-]');
    // a neutral N with bond-order sum 4 and one H (valence 5, allowed with a double bond): bare `N` would read
    // back as a neutral N with four bonds, which the reader refuses; so it is written [NH] (OpenSMILES syntax)
    const pentavalent = writeSmiles(read('C=[NH]=C'));
    expect(pentavalent).toContain('[NH]');
    expect(parseSmiles(pentavalent).ok).toBe(true);
    expect(writeSmiles(read('[13CH4]'))).toBe('[13CH4]');
    expect(writeSmiles(read('[CH3:7]C'))).toBe('[CH3:7]C');
    expect(writeSmiles(read('[Cu+2]'))).toBe('[Cu+2]');
    expect(writeSmiles(read('[CH2]C'))).toBe('[CH2]C');
    expect(writeSmiles(read('[H][H]'))).toBe('[H][H]');
    expect(writeSmiles(read('*C'))).toBe('*C');
    expect(writeSmiles(read('[*H]C'))).toBe('[*H]C');
  });
  it('writes the Kekulé form with explicit double bonds', () => {
    expect(writeSmiles(read('c1ccccc1'))).toBe('C1=CC=CC=C1');
    expect(writeSmiles(read('c1cc[nH]c1'))).toBe('C=1C=CNC1');
  });
  it('reuses the lowest free ring digit and switches to %nn past 9 open rings', () => {
    expect(writeSmiles(read('C%11CC%11C%12CC%12'))).toBe('C1CC1C1CC1');
    // atom 0 bonded to each atom of the chain 1..11: ten ring bonds open at once at atom 0
    const fan = read('C' + 'C'.repeat(11));
    for (let k = 2; k <= 11; k++) fan.bonds.push({ a: 0, b: k, order: 1, aromatic: false, wedge: null });
    for (const a of fan.atoms) a.hCount = 0;
    // the hub is a metal, so the reader's valence check (organic elements only) accepts eleven bonds
    Object.assign(fan.atoms[0]!, { element: 'Fe', atomicNumber: 26 });
    const w = writeSmiles(fan);
    expect(w).toContain('%10');
    const back = read(w);
    expect(back.bonds).toHaveLength(fan.bonds.length);
    expect(back.atoms[0]!.hCount).toBe(0);
  });
  it('writes stereo groups as a CXSMILES block renumbered to the output order', () => {
    const s = read('C[C@H](O)[C@@H](C)O |&1:1,o1:3|');
    expect(writeSmiles(s)).toBe('C[C@H](O)[C@@H](C)O |&1:1,o1:3|');
    const rev = writeSmilesWithOrder(s, { order: [5, 4, 3, 2, 1, 0] });
    expect(rev.smiles).toBe('O[C@H](C)[C@@H](O)C |&1:3,o1:1|');
    expect(rev.atomOrder).toEqual([5, 3, 4, 1, 2, 0]);
    expect(writeSmiles(s, { stereo: false })).toBe('CC(O)C(C)O');
  });
});

describe('writeSmiles stereo against RDKit', () => {
  let rd: MainModule;
  beforeAll(async () => {
    rd = await loadRDKit();
  });

  it('gives the same RDKit canonical SMILES for the input order and for any atom order', () => {
    const cases = fc.record({
      smi: fc.constantFrom(...STEREO_SET),
      keys: fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 40, maxLength: 40 }),
    });
    fc.assert(
      fc.property(cases, ({ smi, keys }) => {
        const s = read(smi);
        const order = s.atoms.map((_, i) => i).sort((x, y) => keys[x]! - keys[y]!);
        const ref = rdkitCanonical(rd, smi);
        expect(ref).not.toBeNull();
        expect(rdkitCanonical(rd, writeSmiles(s))).toBe(ref);
        expect(rdkitCanonical(rd, writeSmiles(s, { order }))).toBe(ref);
      }),
      { numRuns: 300 },
    );
  });

  it('writes RDKit-equivalent CXSMILES groups in another order (RDKit get_cxsmiles)', () => {
    const smi = 'C[C@H](O)[C@@H](C)[C@H](F)Cl |a:5,&1:1,o2:3|';
    const cx = (x: string): string => {
      const m = rd.get_mol(x)!;
      try {
        return m.get_cxsmiles();
      } finally {
        m.delete();
      }
    };
    const s = read(smi);
    expect(cx(writeSmiles(s, { order: s.atoms.map((_, i) => s.atoms.length - 1 - i) }))).toBe(cx(smi));
  });

  it('drops the stereo marks when asked (RDKit sees the flat molecule)', () => {
    const s = read('N[C@@H](C)C(=O)O');
    expect(rdkitCanonical(rd, writeSmiles(s, { stereo: false }))).toBe(rdkitCanonical(rd, 'NC(C)C(=O)O'));
  });
});

describe('writeSmiles stereo against our reader (allenes, cumulenes, implicit-H references)', () => {
  const ALLENES = [
    'NC(Br)=[C@]=C(O)C',
    'CC=[C@@]=CC',
    'ClC=[C@]=CCl',
    'OC(=O)C=C=[C@@]=C=CC',
    'C[C@H](O)C=[C@]=CC',
  ];
  it('keeps every configuration in any atom order', () => {
    const cases = fc.record({
      smi: fc.constantFrom(...ALLENES, ...STEREO_SET, 'F/C=C=C=C/F'),
      keys: fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { minLength: 40, maxLength: 40 }),
    });
    fc.assert(
      fc.property(cases, ({ smi, keys }) => {
        const s = read(smi);
        const order = s.atoms.map((_, i) => i).sort((x, y) => keys[x]! - keys[y]!);
        const w = writeSmilesWithOrder(s, { order });
        expect(stereoDifferences(s, read(w.smiles), w.atomOrder)).toEqual([]);
      }),
      { numRuns: 400 },
    );
  });
  it('writes a double bond whose reference is an implicit H through the other substituent', () => {
    const s = read('FC(Cl)=CBr');
    s.stereo.push({ kind: 'double-bond', ends: [1, 3], refs: [IMPLICIT_H, 4], relation: 'cis' });
    s.stereo[0] = { kind: 'double-bond', ends: [1, 3], refs: [0, 4], relation: 'trans' };
    s.stereo.pop();
    const w = writeSmilesWithOrder(s);
    expect(stereoDifferences(s, read(w.smiles), w.atomOrder)).toEqual([]);
    const t = read('ClC=CBr');
    t.stereo.push({ kind: 'double-bond', ends: [1, 2], refs: [IMPLICIT_H, 3], relation: 'cis' });
    const back = read(writeSmiles(t));
    // cis to the H of C1 = trans to Cl
    expect(back.stereo).toEqual([{ kind: 'double-bond', ends: [1, 2], refs: [0, 3], relation: 'trans' }]);
  });
  it('does not mark bonds next to an unspecified double bond when another substituent can carry the mark', () => {
    // F0 C1(=C2 C3) C4(C5)=C6(C7) C8(Cl9)=C10 C11: C4=C6 stays unspecified; the stored references (C4, C6)
    // would put marks on both sides of it, so the writer must go through F0 and Cl9 instead.
    const s = read('FC(=CC)C(C)=C(C)C(Cl)=CC');
    s.stereo.push({ kind: 'double-bond', ends: [1, 2], refs: [4, 3], relation: 'trans' });
    s.stereo.push({ kind: 'double-bond', ends: [8, 10], refs: [6, 11], relation: 'cis' });
    const w = writeSmilesWithOrder(s);
    const back = read(w.smiles);
    expect(back.stereo).toHaveLength(2);
    expect(stereoDifferences(s, back, w.atomOrder)).toEqual([]);
  });
});
