/**
 * Damaged molfiles are refused with the line, never read as an empty structure that would pass as achiral
 * (issue 10). CTfile format specification: a molfile has three header lines (name, program, comment), the
 * counts line on line 4; V3000 COUNTS gives the number of atom and bond lines of the CTAB.
 */
import { describe, expect, it } from 'vitest';
import { parseMolfile } from '../../../src/chem/read/molfile.js';
import { readSdRecords } from '../../../src/chem/read/index.js';
import { readStructure } from '../../../src/chem/read/index.js';
import { ethanolV2000 } from './molfile-examples.js';

const ethanol = ethanolV2000('LX-00042');

const v3000 = [
  'LX-00043',
  '  stereogate',
  '',
  '  0  0  0     0  0            999 V3000',
  'M  V30 BEGIN CTAB',
  'M  V30 COUNTS 3 2 0 0 0',
  'M  V30 BEGIN ATOM',
  'M  V30 1 C 0 0 0 0',
  'M  V30 2 C 1.299 0.75 0 0',
  'M  V30 3 O 2.598 0 0 0',
  'M  V30 END ATOM',
  'M  V30 BEGIN BOND',
  'M  V30 1 1 1 2',
  'M  V30 2 1 2 3',
  'M  V30 END BOND',
  'M  V30 END CTAB',
  'M  END',
];

const text = (lines: string[]): string => lines.join('\n') + '\n';

describe('V2000 header and counts', () => {
  it('the intact molfile reads (3 atoms)', () => {
    const r = parseMolfile(text(ethanol));
    expect(r.ok && r.structure.atoms.length).toBe(3);
  });

  it.each([
    ['the comment line', 2, 3, 'a line'],
    ['the program line', 1, 3, 'a line'],
    ['two header lines', 1, 2, '2 lines'],
  ])('a header that lost %s: refused at the counts line', (_what, at, line, lost) => {
    const lines = [...ethanol];
    lines.splice(at, lost === '2 lines' ? 2 : 1);
    const r = parseMolfile(text(lines));
    expect(r.ok ? null : r.error).toMatchObject({ code: 'molfile-header-short', at: { line } });
    if (!r.ok) expect(r.error.message).toContain(`lost ${lost}`);
  });

  it('the same inside an SD file gives the absolute line', () => {
    const lines = [...ethanol];
    lines.splice(2, 1);
    const sd = `${text(ethanol)}$$$$\n${text(lines)}$$$$\n`;
    const recs = [...readSdRecords(sd)];
    expect(recs).toHaveLength(2);
    expect(recs[0]!.result.ok).toBe(true);
    const r = recs[1]!.result;
    expect(r.ok ? null : r.error).toMatchObject({ code: 'molfile-header-short', at: { line: 14 } });
  });

  it('0 atoms: refused at the counts line', () => {
    const r = parseMolfile(text(['empty', '', '', '  0  0  0  0  0  0  0  0  0  0999 V2000', 'M  END']));
    expect(r.ok ? null : r.error).toMatchObject({ code: 'molfile-no-atoms', at: { line: 4 } });
  });
});

describe('V3000 COUNTS against the blocks', () => {
  it('the intact block reads', () => {
    expect(parseMolfile(text(v3000)).ok).toBe(true);
  });

  it('an atom line lost: refused at the COUNTS line', () => {
    const r = parseMolfile(
      text(v3000.filter((l) => !l.startsWith('M  V30 3 O'))).replace('M  V30 2 1 2 3\n', ''),
    );
    expect(r.ok ? null : r.error).toMatchObject({ code: 'molfile-counts-mismatch', at: { line: 6 } });
  });

  it('a bond line lost: refused', () => {
    const r = parseMolfile(text(v3000.filter((l) => l !== 'M  V30 2 1 2 3')));
    expect(r.ok ? null : r.error).toMatchObject({ code: 'molfile-counts-mismatch' });
  });

  it('no ATOM block at all (COUNTS 0 0): refused as no atoms', () => {
    const lines = v3000.slice(0, 5).concat(['M  V30 COUNTS 0 0 0 0 0', 'M  V30 END CTAB', 'M  END']);
    const r = parseMolfile(text(lines));
    expect(r.ok ? null : r.error).toMatchObject({ code: 'molfile-no-atoms', at: { line: 6 } });
  });

  it('through readStructure (the record path) too', () => {
    const r = readStructure(text(v3000).replace('COUNTS 3 2', 'COUNTS 5 2'), { format: 'molfile' });
    expect(r.ok).toBe(false);
  });
});
