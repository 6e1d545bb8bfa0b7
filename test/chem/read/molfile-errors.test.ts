/**
 * Broken molfiles and SD files: errors name what is wrong and the absolute line. Layout rules from the CTfile
 * format specification (header 3 lines, counts line 4, atom block, bond block, properties ending "M  END";
 * SD records end with "$$$$"). The fuzz properties (fast-check) check that no input throws.
 */
import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseMolfile } from '../../../src/chem/read/molfile.js';
import { readSdRecords, streamSdRecords } from '../../../src/chem/read/sdf.js';
import { readStructure } from '../../../src/chem/read/index.js';
import { ALANINE_V2000 } from './molfile-examples.js';
import { haveSharedData, sharedDataPath } from '../../support/shared-data.js';

const lines = ALANINE_V2000.split('\n');
const withLine = (i: number, text: string): string =>
  [...lines.slice(0, i), text, ...lines.slice(i + 1)].join('\n');

function errorOf(text: string, firstLine?: number): { code: string; line: number | undefined } {
  const r = parseMolfile(text, { firstLine });
  if (r.ok) throw new Error('expected an error');
  return { code: r.error.code, line: r.error.at.line };
}

describe('molfile error positions', () => {
  it('bad counts line -> line 4', () => {
    expect(errorOf(withLine(3, 'six atoms, five bonds'))).toEqual({
      code: 'molfile-bad-counts-line',
      line: 4,
    });
  });
  it('non-numeric coordinate -> that atom line', () => {
    expect(errorOf(withLine(6, '    0.6220   -0.3x00    0.0000 C   0  0  0  0  0  0'))).toEqual({
      code: 'molfile-bad-coordinate',
      line: 7,
    });
  });
  it('atom line too short -> that atom line', () => {
    expect(errorOf(withLine(5, '   -0.6622'))).toEqual({ code: 'molfile-atom-line-short', line: 6 });
  });
  it('unknown element symbol -> that atom line', () => {
    expect(errorOf(withLine(8, '   -1.8622   -0.3695    0.0000 Xq  0  3  0  0  0  0'))).toEqual({
      code: 'molfile-unknown-element',
      line: 9,
    });
  });
  it('bond to a non-existent atom -> that bond line', () => {
    expect(errorOf(withLine(12, '  1  9  1  0  0  0'))).toEqual({
      code: 'molfile-bond-atom-missing',
      line: 13,
    });
  });
  it('bond type outside 1-10 -> that bond line', () => {
    expect(errorOf(withLine(13, '  2  5 12  0  0  0'))).toEqual({ code: 'molfile-bad-bond-type', line: 14 });
  });
  it('truncated in the atom block -> the first missing line', () => {
    expect(errorOf(lines.slice(0, 7).join('\n'))).toEqual({ code: 'molfile-truncated', line: 8 });
  });
  it('truncated before the counts line', () => {
    expect(errorOf(lines.slice(0, 2).join('\n')).code).toBe('molfile-truncated');
  });
  it('missing M  END -> the line after the last one', () => {
    const t = lines.filter((l) => l !== 'M  END').join('\n');
    expect(errorOf(t)).toEqual({ code: 'molfile-missing-end', line: 18 });
  });
  it('M  CHG naming a missing atom -> that line', () => {
    expect(errorOf(withLine(16, 'M  CHG  1  12   1'))).toEqual({ code: 'molfile-bad-property', line: 17 });
  });
  it('firstLine shifts every position', () => {
    expect(errorOf(withLine(12, '  1  9  1  0  0  0'), 101)).toEqual({
      code: 'molfile-bond-atom-missing',
      line: 113,
    });
  });
  it('V3000: a block that is not closed, and a bond to an atom not in the ATOM block', () => {
    const v3 = (body: string[]): string =>
      [
        '',
        '',
        '',
        '  0  0  0     0  0            999 V3000',
        'M  V30 BEGIN CTAB',
        'M  V30 COUNTS 2 1 0 0 0',
        ...body,
        'M  V30 END CTAB',
        'M  END',
      ].join('\n');
    const atoms = ['M  V30 BEGIN ATOM', 'M  V30 1 C 0 0 0 0', 'M  V30 2 O 1.2 0 0 0'];
    expect(errorOf(v3([...atoms, 'M  V30 BEGIN BOND', 'M  V30 1 1 1 2']))).toEqual({
      code: 'molfile-v3000-block-not-closed',
      line: 10,
    });
    expect(
      errorOf(v3([...atoms, 'M  V30 END ATOM', 'M  V30 BEGIN BOND', 'M  V30 1 1 1 3', 'M  V30 END BOND'])),
    ).toEqual({ code: 'molfile-bond-atom-missing', line: 12 });
    expect(errorOf(v3([...atoms, 'M  V30 END ATOM']).replace('M  END', ''))).toEqual({
      code: 'molfile-missing-end',
      line: 12,
    });
  });
});

const sd = (title: string, body: string): string => `${title}\n${body.split('\n').slice(1).join('\n')}`;

describe('SD files', () => {
  const good = ALANINE_V2000.trimEnd();
  const broken = withLine(12, '  1  9  1  0  0  0').trimEnd();
  const text =
    [
      sd('first', good) + '\n> <ID>\nLX-00001\n\n> <NOTE>\nline one\nline two\n\n$$$$',
      sd('second', broken) + '\n> <ID>\nLX-00002\n\n$$$$',
      sd('third', good) + '\n>  <ID>  (3)\nLX-00003\n\n$$$$',
    ].join('\n') + '\n';

  it('a broken record in the middle gives an error at its absolute line; the records around it are read', () => {
    const recs = [...readSdRecords(text)];
    expect(recs.map((r) => [r.record, r.line, r.result.ok])).toEqual([
      [1, 1, true],
      [2, 27, false],
      [3, 49, true],
    ]);
    const r2 = recs[1]!.result;
    if (r2.ok) throw new Error('unreachable');
    expect(r2.error).toMatchObject({ code: 'molfile-bond-atom-missing', at: { line: 27 + 12, record: 2 } });
    const r1 = recs[0]!.result;
    const r3 = recs[2]!.result;
    if (!r1.ok || !r3.ok) throw new Error('unreachable');
    expect(r1.structure.properties).toEqual({ ID: 'LX-00001', NOTE: 'line one\nline two' });
    expect(r3.structure.properties).toEqual({ ID: 'LX-00003' });
    expect(r3.structure.title).toBe('third');
  });

  it('the streaming reader gives the same records from an async line source (CRLF tolerated)', async () => {
    async function* src(): AsyncGenerator<string> {
      for (const l of text.replace(/\n$/, '').split('\n')) yield l + '\r';
    }
    const got = [];
    for await (const r of streamSdRecords(src())) got.push(r);
    expect(got).toEqual([...readSdRecords(text)]);
  });

  it('the streaming reader yields a record before its source ends (one record held at a time)', async () => {
    let served = 0;
    async function* endless(): AsyncGenerator<string> {
      for (;;) {
        for (const l of (sd('LX', good) + '\n$$$$').split('\n')) {
          served++;
          yield l;
        }
      }
    }
    const it = streamSdRecords(endless());
    const first = await it.next();
    const second = await it.next();
    await it.return(undefined);
    expect(first.value).toMatchObject({ record: 1, line: 1, result: { ok: true } });
    expect(second.value).toMatchObject({ record: 2, line: 20 });
    expect(served).toBeLessThan(60);
  });

  it('a record without M  END reports it at the data-field line and the next record is still read', () => {
    // the emptied M  END line stays as a blank line 18; the data header is line 19
    const t = sd('a', good).replace('M  END', '') + '\n> <ID>\nX\n\n$$$$\n' + sd('b', good) + '\n$$$$\n';
    const recs = [...readSdRecords(t)];
    expect(recs).toHaveLength(2);
    expect(recs[0]!.result.ok).toBe(false);
    if (!recs[0]!.result.ok)
      expect(recs[0]!.result.error).toMatchObject({ code: 'molfile-missing-end', at: { line: 19 } });
    expect(recs[1]!.result.ok).toBe(true);
  });
});

describe('no input makes the readers throw (fast-check)', () => {
  const seeds = [ALANINE_V2000];
  if (haveSharedData('cip-validation-suite')) {
    for (const f of ['compounds_2d.sdf', 'compounds_3d.sdf']) {
      const recs = readFileSync(sharedDataPath('cip-validation-suite', f), 'utf8').split('$$$$\n');
      seeds.push(recs[22]!, recs[62]!, recs[78]!, recs[163]!);
    }
  }
  const check = (t: string): void => {
    const r = parseMolfile(t);
    if (!r.ok) expect(typeof r.error.at.line).toBe('number');
    for (const x of readSdRecords(t)) expect(typeof x.result.ok).toBe('boolean');
    readStructure(t);
  };
  it('truncations of valid molfiles', () => {
    fc.assert(
      fc.property(fc.constantFrom(...seeds), fc.double({ min: 0, max: 1, noNaN: true }), (t, f) => {
        check(t.slice(0, Math.floor(t.length * f)));
      }),
      { numRuns: 600 },
    );
  });
  it('random character changes of valid molfiles', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...seeds),
        fc.array(
          fc.tuple(
            fc.double({ min: 0, max: 1, noNaN: true }),
            fc.constantFrom(...' 0123456789-.+VMABCNOSHX$>\n\r\t\u0000é'),
          ),
          { minLength: 1, maxLength: 8 },
        ),
        (t, edits) => {
          const chars = [...t];
          for (const [f, c] of edits) chars[Math.floor(f * (chars.length - 1))] = c;
          check(chars.join(''));
        },
      ),
      { numRuns: 1500 },
    );
  });
  it('random line deletions and duplications', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...seeds),
        fc.array(fc.tuple(fc.nat(), fc.boolean()), { minLength: 1, maxLength: 4 }),
        (t, ops) => {
          const ls = t.split('\n');
          for (const [i, dup] of ops) {
            const k = i % ls.length;
            if (dup) ls.splice(k, 0, ls[k]!);
            else ls.splice(k, 1);
          }
          check(ls.join('\n'));
        },
      ),
      { numRuns: 800 },
    );
  });
});
