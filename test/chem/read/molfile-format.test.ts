/**
 * Molfile V2000/V3000 features, on hand-written files that follow the CTfile format specification (BIOVIA,
 * "CTfile Formats"; the alanine example there is rewritten from memory). Configurations are checked against
 * RDKit (npm @rdkit/rdkit): RDKit-canonical(writeSmiles(our structure)) == RDKit-canonical(the molblock).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { parseMolfile } from '../../../src/chem/read/molfile.js';
import { readStructure } from '../../../src/chem/read/index.js';
import { writeSmiles } from '../../../src/chem/write/smiles.js';
import { rdkit, type Rd } from './molfile-rdkit.js';
import { ALANINE_V2000, ok } from './molfile-examples.js';

const ALANINE_V3000 = `L-Alanine (13C), V3000
  -ISIS-  01119511002D

  0  0  0     0  0            999 V3000
M  V30 BEGIN CTAB
M  V30 COUNTS 6 5 0 0 1
M  V30 BEGIN ATOM
M  V30 1 C -0.6622 0.5342 0 0 CFG=2
M  V30 2 C 0.6220 -0.3000 0 0
M  V30 3 C -0.7207 2.0817 0 0 MASS=13
M  V30 4 N -1.8622 -0.3695 0 0 -
M  V30 CHG=1
M  V30 5 O 0.6220 -1.8037 0 0
M  V30 6 O 1.9464 0.4244 0 0 CHG=-1
M  V30 END ATOM
M  V30 BEGIN BOND
M  V30 1 1 1 2
M  V30 2 1 1 3 CFG=1
M  V30 3 1 1 4
M  V30 4 2 2 5
M  V30 5 1 2 6
M  V30 END BOND
M  V30 END CTAB
M  END
`;

describe('V2000 (CTfile format specification)', () => {
  let RD: Rd;
  beforeAll(async () => {
    RD = await rdkit();
  });
  const canon = (smiles: string): string => {
    const m = RD.get_mol(smiles)!;
    m.remove_hs_in_place();
    const s = m.get_smiles();
    m.delete();
    return s;
  };

  it('reads title, chiral flag, M  CHG charges, M  ISO isotope, implicit H and the wedge of the alanine example', () => {
    const s = ok(parseMolfile(ALANINE_V2000));
    expect(s.title).toBe('L-Alanine (13C)');
    expect(s.chiralFlag).toBe(true);
    expect(s.dimension).toBe(2);
    expect(s.atoms.map((a) => a.charge)).toEqual([0, 0, 0, 1, 0, -1]);
    expect(s.atoms[2]!.isotope).toBe(13);
    // N+ has valence 4 (three H), the methyl carbon three H, the centre one H (OpenSMILES valence rule)
    expect(s.atoms.map((a) => a.hCount)).toEqual([1, 0, 3, 3, 0, 0]);
    expect(s.bonds[1]!.wedge).toBe('up');
    expect(s.stereo).toHaveLength(1);
    // L-alanine is (S)-2-aminopropanoic acid (IUPAC name, from memory); RDKit agrees on the drawing.
    expect(canon(writeSmiles(s))).toBe(canon(ALANINE_V2000));
    expect(canon(writeSmiles(s))).toBe(canon('[13CH3][C@H]([NH3+])C(=O)[O-]'));
  });

  it('reads the same alanine from the V3000 form (CHG=, MASS=, CFG=, continuation line)', () => {
    const s2 = ok(parseMolfile(ALANINE_V2000));
    const s3 = ok(parseMolfile(ALANINE_V3000));
    expect(s3.chiralFlag).toBe(true);
    expect(s3.atoms).toEqual(s2.atoms);
    expect(s3.bonds).toEqual(s2.bonds);
    expect(s3.stereo).toEqual(s2.stereo);
  });

  it('atom-block charge codes (ccc: 1 = +3 ... 7 = -3, 4 = doublet radical) when there is no M  CHG line', () => {
    const lines = ['', '', '', '  7  0  0  0  0  0  0  0  0  0999 V2000'];
    for (const code of [0, 1, 2, 3, 4, 5, 6]) {
      lines.push(`    ${code}.0000    0.0000    0.0000 C   0  ${code}  0  0  0  0  0  0  0  0  0  0`);
    }
    lines.push('M  END');
    const s = ok(parseMolfile(lines.join('\n')));
    expect(s.atoms.map((a) => a.charge)).toEqual([0, 3, 2, 1, 0, -1, -2]);
    expect(s.atoms.map((a) => a.radical)).toEqual([0, 0, 0, 0, 1, 0, 0]);
    expect(s.dimension).toBe(2);
  });

  it('M  RAD: doublet (2) takes one hydrogen, triplet (3) two (methyl radical CH3, methylene CH2)', () => {
    const t = `radicals\n\n\n  2  0  0  0  0  0  0  0  0  0999 V2000
    0.0000    0.0000    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0
    2.0000    0.0000    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0
M  RAD  2   1   2   2   3
M  END`;
    const s = ok(parseMolfile(t));
    expect(s.atoms.map((a) => [a.radical, a.hCount])).toEqual([
      [1, 3],
      [2, 2],
    ]);
  });

  it('M  CHG supersedes atom-block charges (CTfile spec: property lines supersede the atom block)', () => {
    const t = `\n\n\n  2  1  0  0  0  0  0  0  0  0999 V2000
    0.0000    0.0000    0.0000 N   0  3  0  0  0  0  0  0  0  0  0  0
    1.0000    0.0000    0.0000 O   0  5  0  0  0  0  0  0  0  0  0  0
  1  2  1  0  0  0  0
M  CHG  1   2  -1
M  END`;
    const s = ok(parseMolfile(t));
    expect(s.atoms.map((a) => a.charge)).toEqual([0, -1]);
  });

  it('R#, A, Q, L, * and M  ALS atoms become wildcards; D and T become hydrogen isotopes; atom maps', () => {
    const syms = ['R#', 'A', 'Q', 'L', '*', 'C', 'D', 'T'];
    const lines = ['', '', '', `  ${syms.length}  0  0  0  0  0  0  0  0  0999 V2000`];
    syms.forEach((sym, i) => {
      lines.push(
        `    ${i}.0000    0.0000    0.0000 ${sym.padEnd(3)} 0${'  0'.repeat(8)}${String(i + 1).padStart(3)}  0  0`,
      );
    });
    lines.push('M  ALS   6  2 F C   N   ', 'M  END');
    const s = ok(parseMolfile(lines.join('\n')));
    expect(s.atoms.map((a) => a.element)).toEqual(['*', '*', '*', '*', '*', '*', 'H', 'H']);
    expect(s.atoms.map((a) => a.isotope)).toEqual([null, null, null, null, null, null, 2, 3]);
    expect(s.atoms.map((a) => a.mapNumber)).toEqual([1, 2, 3, 4, 5, 6, 7, 8]);
    expect(s.atoms.map((a) => a.hCount)).toEqual([0, 0, 0, 0, 0, 0, 0, 0]);
  });

  it('A  alias lines consume their text line; V  lines are skipped', () => {
    const t = `\n\n\n  1  0  0  0  0  0  0  0  0  0999 V2000
    0.0000    0.0000    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0
A    1
M  END looks like an end but is alias text
V    1 some value
M  END`;
    const s = ok(parseMolfile(t));
    expect(s.atoms).toHaveLength(1);
  });

  it('aromatic bond type 4 is kekulized (benzene, pyridine, pyrrole with open N-H, indole) and RDKit agrees', () => {
    const ring = (els: string[], extra = ''): string => {
      const n = els.length;
      const lines = [
        '',
        '',
        '',
        `${String(n).padStart(3)}${String(n).padStart(3)}  0  0  0  0  0  0  0  0999 V2000`,
      ];
      els.forEach((e, i) => {
        const x = Math.cos((2 * Math.PI * i) / n)
          .toFixed(4)
          .padStart(10);
        const y = Math.sin((2 * Math.PI * i) / n)
          .toFixed(4)
          .padStart(10);
        lines.push(`${x}${y}    0.0000 ${e.padEnd(3)} 0  0  0  0  0  0  0  0  0  0  0  0`);
      });
      for (let i = 0; i < n; i++)
        lines.push(`${String(i + 1).padStart(3)}${String(((i + 1) % n) + 1).padStart(3)}  4  0  0  0  0`);
      return lines.join('\n') + extra + '\nM  END\n';
    };
    for (const [els, ref] of [
      [['C', 'C', 'C', 'C', 'C', 'C'], 'c1ccccc1'],
      [['N', 'C', 'C', 'C', 'C', 'C'], 'n1ccccc1'],
      [['N', 'C', 'C', 'C', 'C'], 'c1cc[nH]c1'],
      [['S', 'C', 'C', 'C', 'C'], 'c1ccsc1'],
    ] as [string[], string][]) {
      const s = ok(parseMolfile(ring(els)));
      expect(s.atoms.every((a) => a.aromatic)).toBe(true);
      expect(s.bonds.every((b) => b.aromatic)).toBe(true);
      expect(canon(writeSmiles(s))).toBe(canon(ref));
    }
    // five carbons alone cannot alternate: an error, not a guess
    const bad = parseMolfile(ring(['C', 'C', 'C', 'C', 'C']));
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.error.code).toBe('molfile-kekulize-failed');
  });

  it('explicit valence field (vvv, 15 = zero) overrides the implicit-hydrogen rule', () => {
    const t = `\n\n\n  2  0  0  0  0  0  0  0  0  0999 V2000
    0.0000    0.0000    0.0000 C   0  0  0  0  0 15  0  0  0  0  0  0
    1.0000    0.0000    0.0000 N   0  0  0  0  0  2  0  0  0  0  0  0
M  END`;
    const s = ok(parseMolfile(t));
    expect(s.atoms.map((a) => a.hCount)).toEqual([0, 2]);
  });

  it('dimension: 0 when all coordinates are zero, 3 when a z is non-zero', () => {
    const mk = (z: string): string => `\n\n\n  2  1  0  0  0  0  0  0  0  0999 V2000
    0.0000    0.0000    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0
    0.0000    0.0000    ${z} O   0  0  0  0  0  0  0  0  0  0  0  0
  1  2  1  0  0  0  0
M  END`;
    expect(ok(parseMolfile(mk('0.0000'))).dimension).toBe(0);
    expect(ok(parseMolfile(mk('1.4000'))).dimension).toBe(3);
  });

  it('readStructure picks the molfile reader by the counts line and SMILES otherwise', () => {
    expect(ok(readStructure(ALANINE_V2000)).atoms).toHaveLength(6);
    expect(ok(readStructure(ALANINE_V3000)).atoms).toHaveLength(6);
    expect(ok(readStructure('C[C@H](N)C(=O)O')).dimension).toBe(0);
  });
});

describe('V3000 atom types and counts (CTfile format specification, V3000 atom block)', () => {
  it('atom lists, NOT lists and quoted pseudo-atoms... become wildcards; a COUNTS mismatch is an error', () => {
    const t = [
      '',
      '',
      '',
      '  0  0  0     0  0            999 V3000',
      'M  V30 BEGIN CTAB',
      'M  V30 COUNTS 4 2 0 0 1',
      'M  V30 BEGIN ATOM',
      'M  V30 1 [C,N] 0 0 0 0',
      'M  V30 2 NOT [O,S] 1.5 0 0 0',
      'M  V30 3 "R#" 3 0 0 0',
      'M  V30 4 Cl 4.5 0 0 7',
      'M  V30 END ATOM',
      'M  V30 BEGIN BOND',
      'M  V30 1 1 1 2',
      'M  V30 END BOND',
      'M  V30 END CTAB',
      'M  END',
    ].join('\n');
    // COUNTS 4 2 with one bond line: a lost line, refused with the COUNTS line (issue 10)
    const bad = parseMolfile(t);
    expect(bad.ok ? null : bad.error).toMatchObject({ code: 'molfile-counts-mismatch', at: { line: 6 } });
    const r = parseMolfile(t.replace('COUNTS 4 2', 'COUNTS 4 1'));
    if (!r.ok) throw new Error(r.error.message);
    expect(r.structure.atoms.map((a) => a.element)).toEqual(['*', '*', '*', 'Cl']);
    expect(r.structure.atoms[3]!.mapNumber).toBe(7);
    expect(r.structure.chiralFlag).toBe(true);
    expect(r.warnings.map((w) => w.code)).toEqual([]);
  });
});

describe('V3000 enhanced stereo collections (CTfile format specification, "Stereo collections")', () => {
  const t = `two centres
  test

  0  0  0     0  0            999 V3000
M  V30 BEGIN CTAB
M  V30 COUNTS 7 6 0 0 0
M  V30 BEGIN ATOM
M  V30 1 C 0 0 0 0
M  V30 2 C 1.3 0.75 0 0 RAD=2
M  V30 3 Cl 1.3 2.25 0 0
M  V30 4 C 2.6 0 0 0
M  V30 5 C 3.9 0.75 0 0
M  V30 6 Br 3.9 2.25 0 0
M  V30 7 C 5.2 0 0 0
M  V30 END ATOM
M  V30 BEGIN BOND
M  V30 1 1 1 2
M  V30 2 1 2 3 CFG=1
M  V30 3 1 2 4
M  V30 4 1 4 5
M  V30 5 1 5 6 CFG=3
M  V30 6 1 5 7
M  V30 END BOND
M  V30 BEGIN SGROUP
M  V30 1 SUP 1 ATOMS=(1 7) LABEL=Me
M  V30 END SGROUP
M  V30 BEGIN COLLECTION
M  V30 MDLV30/STEABS ATOMS=(1 2)
M  V30 MDLV30/STERAC1 ATOMS=(1 5)
M  V30 MDLV30/STEREL2 ATOMS=(0)
M  V30 MDLV30/HILITE ATOMS=(1 1)
M  V30 END COLLECTION
M  V30 END CTAB
M  END
`;
  it('STEABS -> abs, STERACn -> and n, STERELn -> or n (atom indices 0-based); other collections ignored; SGROUP skipped', () => {
    const s = ok(parseMolfile(t));
    expect(s.groups).toEqual([
      { type: 'abs', id: 0, atoms: [1] },
      { type: 'and', id: 1, atoms: [4] },
      { type: 'or', id: 2, atoms: [] },
    ]);
    expect(s.chiralFlag).toBe(false);
    expect(s.atoms[1]!.radical).toBe(1);
    expect(s.bonds.map((b) => b.wedge)).toEqual([null, 'up', null, null, 'down', null]);
  });
});
