/**
 * Impossible valences of neutral nitrogen are read errors (issues 10 and 11): four bonds (`CN(C)(C)C`), five
 * single bonds, `[NH4]` bonded to a metal. Legitimate forms still read: ammonium with its charge, pentavalent
 * N drawn with a double bond (nitro, as the OpenSMILES organic subset N 3,5 allows), and an N coordinated to a
 * metal by a bond drawn as single (ammine on platinum, imidazole N on cobalt). Reference: RDKit MinimalLib
 * (@rdkit/rdkit), asked at test time which of these it reads; nitro is the one deliberate difference (RDKit
 * refuses neutral pentavalent N and rewrites it as [N+](=O)[O-], OpenSMILES lists N 3,5).
 */
import { beforeAll, describe, expect, it } from 'vitest';
import type { MainModule } from '@rdkit/rdkit';
import { parseMolfile } from '../../../src/chem/read/molfile.js';
import { parseSmiles } from '../../../src/chem/read/smiles.js';
import { loadRDKit, rdkitCanonical } from './smiles-rdkit-helper.js';

describe('neutral nitrogen: accept and refuse as RDKit does (RDKit MinimalLib)', () => {
  let rd: MainModule;
  beforeAll(async () => {
    rd = await loadRDKit();
  });
  it.each([
    'CN(C)(C)C',
    'C=N(C)C',
    'N(C)(C)(C)(C)C',
    '[NH4][Pt]',
    '[NH4][Pt]([NH4])(Cl)Cl',
    '[NH3][Pt]([NH3])(Cl)Cl',
    'C1=CN([Co])C=N1',
    'C[N+](C)(C)C',
    '[NH4+]',
    'c1ccncc1',
    'c1cc[nH]c1',
  ])('%s', (s) => {
    const rdkitReads = rdkitCanonical(rd, s) !== null;
    const r = parseSmiles(s);
    expect(r.ok, r.ok ? s : `${s}: ${r.error.message}`).toBe(rdkitReads);
    if (!r.ok) {
      expect(r.error.code).toBe('smiles-valence');
      expect(r.error.message).toContain('neutral nitrogen');
    }
  });

  it('nitro written pentavalent reads (OpenSMILES organic subset: N 3,5)', () => {
    expect(parseSmiles('CN(=O)=O').ok).toBe(true);
    expect(parseSmiles('C[N+](=O)[O-]').ok).toBe(true);
  });

  it('the error points at the nitrogen and says what would be right', () => {
    const r = parseSmiles('CCN(C)(C)C');
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.error.at.offset).toBe(2);
    expect(r.error.message).toMatch(/neutral nitrogen with 4 bonds.*\[N\+\]/);
    const m = parseSmiles('[NH4][Pt]');
    expect(m.ok ? '' : m.error.message).toContain('4 of them to hydrogen besides its bond to a metal');
  });
});

describe('neutral nitrogen in a molfile (CTfile format specification, V2000 atom and bond blocks)', () => {
  // tetramethylammonium drawn without its charge: N on line 5 (the first atom line)
  const molfile = (chargeCode: number): string =>
    [
      'LX-00077',
      '  stereogate',
      '',
      '  5  4  0  0  0  0  0  0  0  0999 V2000',
      `    0.0000    0.0000    0.0000 N   0  ${chargeCode}  0  0  0  0  0  0  0  0  0  0`,
      '    1.0000    0.0000    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0',
      '   -1.0000    0.0000    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0',
      '    0.0000    1.0000    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0',
      '    0.0000   -1.0000    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0',
      '  1  2  1  0',
      '  1  3  1  0',
      '  1  4  1  0',
      '  1  5  1  0',
      'M  END',
      '',
    ].join('\n');

  it('four bonds on a neutral N: a reader error on its atom line', () => {
    const r = parseMolfile(molfile(0));
    expect(r.ok ? null : r.error).toMatchObject({ code: 'molfile-valence', at: { line: 5 } });
  });

  it('the same with charge code 3 (+1) reads', () => {
    expect(parseMolfile(molfile(3)).ok).toBe(true);
  });
});
