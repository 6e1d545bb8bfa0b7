/**
 * Size caps on structure input (issue 10): SMILES length, atoms per structure, components per structure; each
 * over-cap input is a reader error naming the cap, found before the expensive steps (a molfile's atom count is
 * refused at its counts line, before the atom block is read). The caps themselves are common practice, no
 * source (registries hold compounds of a few hundred atoms).
 */
import { describe, expect, it } from 'vitest';
import { READ_LIMITS, readStructure, type ReadLimits } from '../../../src/chem/read/index.js';

const small: ReadLimits = { maxSmilesChars: 100, maxMolfileChars: 2000, maxAtoms: 10, maxComponents: 3 };

describe('SMILES caps', () => {
  it('a SMILES over the length cap is refused without being parsed', () => {
    const r = readStructure('C'.repeat(101), { format: 'smiles', limits: small });
    expect(r.ok ? null : r.error).toMatchObject({ code: 'smiles-too-long' });
    if (!r.ok) expect(r.error.message).toContain('101 characters long, over the limit of 100');
    expect(readStructure('C'.repeat(100), { format: 'smiles', limits: { ...small, maxAtoms: 200 } }).ok).toBe(
      true,
    );
  });

  it('the default cap refuses a 7.9 MB SMILES at once', () => {
    const huge = 'C'.repeat(7_900_000);
    const r = readStructure(huge, { format: 'smiles' });
    expect(r.ok ? null : r.error.code).toBe('smiles-too-long');
  });

  it('atoms over the cap: refused', () => {
    const r = readStructure('CCCCCCCCCCC', { format: 'smiles', limits: small });
    expect(r.ok ? null : r.error).toMatchObject({ code: 'too-many-atoms' });
  });

  it('components over the cap: refused, with the count', () => {
    const r = readStructure('CCO.O.O.O', { format: 'smiles', limits: small });
    expect(r.ok ? null : r.error).toMatchObject({ code: 'too-many-components' });
    if (!r.ok) expect(r.error.message).toContain('4 separate components');
    expect(readStructure('CCO.O.O', { format: 'smiles', limits: small }).ok).toBe(true);
  });

  it('2,000 dot-joined copies of alanine are refused by the default component cap', () => {
    const s = Array(2000).fill('C[C@H](N)C(=O)O').join('.');
    const r = readStructure(s, { format: 'smiles', limits: { ...READ_LIMITS, maxSmilesChars: 100_000 } });
    expect(r.ok ? null : r.error.code).toBe('too-many-atoms');
    const r2 = readStructure(Array(60).fill('C[C@H](N)C(=O)O').join('.'), { format: 'smiles' });
    expect(r2.ok ? null : r2.error.code).toBe('too-many-components');
  });
});

describe('molfile caps (CTfile format specification: atom count in columns 1-3 of the counts line)', () => {
  it('V2000: an atom count over the cap is refused at the counts line, the atom block is not read', () => {
    // the counts line claims 50 atoms but no atom line follows: only the cap can answer before line 5
    const t = 'big\n  stereogate\n\n 50  0  0  0  0  0  0  0  0  0999 V2000\nM  END\n';
    const r = readStructure(t, { format: 'molfile', limits: small });
    expect(r.ok ? null : r.error).toMatchObject({ code: 'too-many-atoms', at: { line: 4 } });
  });

  it('V3000: COUNTS over the cap is refused at its line', () => {
    const t = [
      'big',
      '  stereogate',
      '',
      '  0  0  0     0  0            999 V3000',
      'M  V30 BEGIN CTAB',
      'M  V30 COUNTS 50000 0 0 0 0',
      'M  V30 END CTAB',
      'M  END',
      '',
    ].join('\n');
    const r = readStructure(t, { format: 'molfile' });
    expect(r.ok ? null : r.error).toMatchObject({ code: 'too-many-atoms', at: { line: 6 } });
  });

  it('a molfile text over the length cap is refused', () => {
    const t = `x\n\n\n  1  0  0  0  0  0  0  0  0  0999 V2000\n${' '.repeat(3000)}\nM  END\n`;
    const r = readStructure(t, { format: 'molfile', limits: small });
    expect(r.ok ? null : r.error.code).toBe('molfile-too-long');
  });
});
