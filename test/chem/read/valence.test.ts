/**
 * Impossible valences are read errors. Sources: the OpenSMILES specification (organic subset: B 3; C 4; N 3,5;
 * O 2; P 3,5; S 2,4,6; halogens 1 — an atom above its highest normal valence is not a normal organic-subset
 * atom); RDKit MinimalLib (npm @rdkit/rdkit) as the reference for which SMILES a chemistry toolkit refuses;
 * CTfile format specification (V2000 atom block starts on line 5, one line per atom).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import type { MainModule } from '@rdkit/rdkit';
import { parseMolfile } from '../../../src/chem/read/molfile.js';
import { parseSmiles } from '../../../src/chem/read/smiles.js';
import { maxValence, valenceProblem } from '../../../src/chem/read/valence.js';
import { loadRDKit, rdkitCanonical } from './smiles-rdkit-helper.js';

describe('SMILES: atoms above their highest valence (OpenSMILES organic subset)', () => {
  it('a carbon with six bonds is an error at the offset of that carbon', () => {
    const r = parseSmiles('CC(C)(C)(C)(C)C');
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.error.code).toBe('smiles-valence');
    expect(r.error.at.offset).toBe(1); // the second character is the six-bonded C
    expect(r.error.message).toContain('carbon with 6 bonds (at most 4)');
  });

  it('a bracket carbon whose H pushes it over 4 is an error, not an ignored chirality mark', () => {
    const r = parseSmiles('C[C@H](F)(Cl)(Br)I');
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.error.code).toBe('smiles-valence');
    expect(r.error.at.offset).toBe(1); // '[' of [C@H]
    expect(r.error.message).toContain('6 bonds, 1 of them to hydrogen (at most 4)');
  });

  it('the offset points at the offending atom even late in the string', () => {
    const s = 'OCC(=O)NC=C(C)(C)C';
    const r = parseSmiles(s);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error.at.offset).toBe(s.indexOf('C(C)(C)C')); // C= ... with 5
  });

  it('charge is taken into account: N+ up to 4, O+ up to 3, C+/C- up to 3, B- up to 4', () => {
    // The isoelectronic-neighbour rule (N+ like C, O+ like N, B- like C, C- like N), common practice, no source
    expect(maxValence(7, 1)).toBe(4);
    expect(maxValence(8, 1)).toBe(3);
    expect(maxValence(6, 1)).toBe(3);
    expect(maxValence(6, -1)).toBe(3);
    expect(maxValence(5, -1)).toBe(4);
    expect(maxValence(26, 0)).toBeNull(); // metals: no check
    expect(valenceProblem(7, 1, 5, 0)).toContain('nitrogen of charge +1 with 5 bonds (at most 4)');
  });

  it('leaves hypervalent S, P, I and charged species alone', () => {
    for (const s of [
      'CS(=O)(=O)C',
      'FS(F)(F)(F)(F)F',
      'F[P-](F)(F)(F)(F)F',
      'IC1=CC=CC=C1',
      'O=I(=O)c1ccccc1',
    ])
      expect(parseSmiles(s).ok, s).toBe(true);
  });
});

describe('SMILES valence check agrees with RDKit on accept/refuse (RDKit MinimalLib)', () => {
  let rd: MainModule;
  beforeAll(async () => {
    rd = await loadRDKit();
  });
  // Each case is decided by RDKit at test time, not hard-coded: we must accept what RDKit accepts and refuse
  // what it refuses (neutral five-valent N is left out: OpenSMILES allows it, RDKit does not).
  const cases = [
    'CC(C)(C)(C)(C)C',
    'C[C@H](F)(Cl)(Br)I',
    'C=C(C)(C)C',
    'C[N+](C)(C)C',
    'C=[N+](C)(C)C',
    'C[O+](C)C',
    'C[O+](C)(C)C',
    'C[B-](C)(C)C',
    'CB(C)(C)C',
    'C[CH3+]',
    'C[CH2+]',
    'C[CH2-]',
    '[C-]#[N+]C',
    'FF(F)F',
    'FCl(F)F',
    'F[Cl+](F)(F)F',
    'OCl(=O)(=O)=O',
    'OBr(=O)(=O)=O',
    'FS(F)(F)(F)(F)F',
    'FS(F)(F)(F)(F)(F)F',
    'FP(F)(F)(F)F',
    'FP(F)(F)(F)(F)F',
    'C[Se](C)(C)(C)(C)C',
    'c1ccccc1',
    'O=[O+]C',
    'C[N-]C',
    'C=[N-]',
    '[Fe](C)(C)(C)(C)(C)(C)C',
  ];
  it.each(cases)('%s', (s) => {
    const rdkitReads = rdkitCanonical(rd, s) !== null;
    const r = parseSmiles(s);
    expect(r.ok, r.ok ? s : `${s}: ${r.error.message}`).toBe(rdkitReads);
    if (!r.ok) expect(r.error.code).toBe('smiles-valence');
  });
});

describe('molfile: atoms above their highest valence (CTfile format specification)', () => {
  const block = (centre: string, charge: number, ligands: number): string => {
    const p = (n: number, w: number): string => String(n).padStart(w);
    const ccc = charge === 0 ? 0 : 4 - charge; // CTfile charge code: 3 = +1, 5 = -1
    const lines = [
      'pentavalent',
      '  test',
      '',
      `${p(ligands + 1, 3)}${p(ligands, 3)}  0  0  0  0  0  0  0  0999 V2000`,
    ];
    const atomLine = (x: number, y: number, s: string, c: number): string =>
      `${x.toFixed(4).padStart(10)}${y.toFixed(4).padStart(10)}    0.0000 ${s.padEnd(3)} 0${p(c, 3)}  0  0  0  0  0  0  0  0  0  0`;
    lines.push(atomLine(0, 0, 'C', 0));
    lines.push(atomLine(1, 0, centre, ccc));
    for (let i = 1; i < ligands; i++) {
      const a = (2 * Math.PI * i) / ligands;
      lines.push(atomLine(1 + Math.cos(a), Math.sin(a), 'C', 0));
    }
    lines.push(`${p(1, 3)}${p(2, 3)}  1  0  0  0  0`);
    for (let i = 1; i < ligands; i++) lines.push(`${p(2, 3)}${p(i + 2, 3)}  1  0  0  0  0`);
    lines.push('M  END');
    return lines.join('\n') + '\n';
  };

  it('a carbon with five bonds is an error on that atom line (line 6: the second atom)', () => {
    const r = parseMolfile(block('C', 0, 5));
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.error.code).toBe('molfile-valence');
    expect(r.error.at.line).toBe(6);
    expect(r.error.message).toContain('carbon with 5 bonds (at most 4)');
  });

  it('the same atom with four bonds reads; N+ with four reads, N+ with five does not', () => {
    expect(parseMolfile(block('C', 0, 4)).ok).toBe(true);
    expect(parseMolfile(block('N', 1, 4)).ok).toBe(true);
    const r = parseMolfile(block('N', 1, 5));
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error.message).toContain('nitrogen of charge +1 with 5 bonds (at most 4)');
  });

  it('V3000: an oxygen with three bonds and no charge is an error on its atom line (CTfile V3000 atom block)', () => {
    const v3000 = (charge: string): string =>
      [
        'trivalent oxygen',
        '  test',
        '',
        '  0  0  0     0  0            999 V3000',
        'M  V30 BEGIN CTAB',
        'M  V30 COUNTS 4 3 0 0 0',
        'M  V30 BEGIN ATOM',
        `M  V30 1 O 0 0 0 0${charge}`,
        'M  V30 2 C 1 0 0 0',
        'M  V30 3 C -0.5 0.87 0 0',
        'M  V30 4 C -0.5 -0.87 0 0',
        'M  V30 END ATOM',
        'M  V30 BEGIN BOND',
        'M  V30 1 1 1 2',
        'M  V30 2 1 1 3',
        'M  V30 3 1 1 4',
        'M  V30 END BOND',
        'M  V30 END CTAB',
        'M  END',
      ].join('\n') + '\n';
    const r = parseMolfile(v3000(''));
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.error.code).toBe('molfile-valence');
    expect(r.error.at.line).toBe(8);
    expect(r.error.message).toContain('oxygen with 3 bonds (at most 2)');
    expect(parseMolfile(v3000(' CHG=1')).ok).toBe(true); // trimethyloxonium: O+ takes 3
  });

  it('RDKit refuses the same five-bonded carbon molblock (RDKit MinimalLib)', async () => {
    const rd = await loadRDKit();
    const m = rd.get_mol(block('C', 0, 5));
    const reads = m !== null && m.is_valid();
    m?.delete();
    expect(reads).toBe(parseMolfile(block('C', 0, 5)).ok);
  });
});
