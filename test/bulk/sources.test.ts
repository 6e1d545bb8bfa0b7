/**
 * Splitting bulk inputs with bounded memory: CSV/TSV fields as RFC 4180 defines them (IETF RFC 4180, section 2:
 * fields in double quotes may hold commas, line breaks and doubled quotes), a broken row that costs one record and
 * not the rest of the file, and SD records that cannot grow without bound (CTfile format spec: records end with
 * a `$$$$` line).
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readDelimitedRows, splitRow } from '../../src/bulk/delimited.js';
import { readDelimitedItems, readSdItems } from '../../src/bulk/sources.js';

const dir = mkdtempSync(join(tmpdir(), 'stereogate-sources-'));
async function all<T>(it: AsyncIterable<T>): Promise<T[]> {
  const out: T[] = [];
  for await (const x of it) out.push(x);
  return out;
}

describe('splitRow (RFC 4180 section 2)', () => {
  it('plain fields, empty fields, a trailing empty field', () => {
    expect(splitRow('aaa,bbb,ccc', ',')).toEqual({ fields: ['aaa', 'bbb', 'ccc'], open: false });
    expect(splitRow('a,,c,', ',')).toEqual({ fields: ['a', '', 'c', ''], open: false });
    expect(splitRow('a\tb', '\t')).toEqual({ fields: ['a', 'b'], open: false });
  });
  it('rule 6: quoted fields hold commas; rule 7: a quote inside is doubled', () => {
    expect(splitRow('"aaa","b,bb","c""cc"', ',')).toEqual({ fields: ['aaa', 'b,bb', 'c"cc'], open: false });
    expect(splitRow('LX-1,"C[C@H](O)CC",rac', ',').fields).toEqual(['LX-1', 'C[C@H](O)CC', 'rac']);
  });
  it('rule 6: a line break inside quotes continues the row', () => {
    const first = splitRow('LX-1,"line one', ',');
    expect(first.open).toBe(true);
    const rest = splitRow('line two",rac', ',', first.fields[1] + '\n');
    expect(rest).toEqual({ fields: ['line one\nline two', 'rac'], open: false });
  });
  it('a stray quote inside an unquoted field is text (common practice, no source: spreadsheets write it so)', () => {
    expect(splitRow('LX-2,5" vial,rac', ',').fields).toEqual(['LX-2', '5" vial', 'rac']);
  });
});

describe('delimited rows with bounded memory', () => {
  it('a molfile in a quoted cell is one row, with the line it starts on', async () => {
    const p = join(dir, 'molcell.csv');
    writeFileSync(
      p,
      'id,molfile\nLX-1,"LX-1\n  made by hand\n\n  0  0  0  0  0  0  0  0  0  0999 V2000\nM  END"\nLX-2,x\n',
    );
    const rows = await all(readDelimitedRows(p, ','));
    expect(rows.map((r) => r.line)).toEqual([1, 2, 7]);
    expect(rows[1].fields[1].split('\n')).toHaveLength(5);
    expect(rows[2].fields).toEqual(['LX-2', 'x']);
  });
  it('an unclosed quote costs one row: it is reported with its line, the rows after it are read', async () => {
    const p = join(dir, 'unclosed.csv');
    const lines = ['id,smiles,form', 'LX-1,CCO,achiral', 'LX-2,"CC(O,rac'];
    for (let i = 3; i <= 40; i++) lines.push(`LX-${i},CCN,achiral`);
    writeFileSync(p, lines.join('\n') + '\n');
    const items = await all(readDelimitedItems(p, ',', { maxLines: 5, maxChars: 1 << 20 }));
    expect(items.map((i) => i.fields?.id)).toEqual(Array.from({ length: 40 }, (_, i) => `LX-${i + 1}`));
    expect(items[1].line).toBe(3);
    // line 4 is a row of its own, so the quote is taken as stray at once (issue 10), not after 5 lines
    expect(items[1].splitProblem).toMatch(/quote opens a field on line 3 .* line 4 is a row of its own/);
    expect(items.filter((i) => i.splitProblem)).toHaveLength(1);
    expect(items[2]).toMatchObject({ line: 4, fields: { id: 'LX-3', smiles: 'CCN', form: 'achiral' } });
  });
  it('an unclosed quote near the end of the file is reported; the last rows still count', async () => {
    const p = join(dir, 'unclosed-end.csv');
    writeFileSync(p, 'id,smiles\nLX-1,"CC\nLX-2,CCC\n');
    const items = await all(readDelimitedItems(p, ','));
    expect(items.map((i) => [i.fields?.id, i.line])).toEqual([
      ['LX-1', 2],
      ['LX-2', 3],
    ]);
    expect(items[0].splitProblem).toMatch(/quote opens a field on line 2 .* line 3 is a row of its own/);
  });
  it('ragged rows, a byte-order mark, CRLF line ends, blank lines', async () => {
    const p = join(dir, 'ragged.csv');
    writeFileSync(p, '\uFEFFid,smiles\r\nLX-1,CCO\r\n\r\nLX-2,CCC,extra\r\n');
    const items = await all(readDelimitedItems(p, ','));
    expect(items.map((i) => i.fields)).toEqual([
      { id: 'LX-1', smiles: 'CCO' },
      { id: 'LX-2', smiles: 'CCC' },
    ]);
    expect(items.map((i) => i.line)).toEqual([2, 4]);
    expect(items[1].splitProblem).toMatch(/3 columns, the header 2/);
  });
});

describe('SD records with bounded memory', () => {
  it('an over-long record (no $$$$) is reported and not kept; the next record is read', async () => {
    const p = join(dir, 'long.sdf');
    const junk = Array.from({ length: 50 }, (_, i) => `junk line ${i}`).join('\n');
    writeFileSync(p, `${junk}\n$$$$\nLX-2\n\n\n  0  0  0  0  0  0  0  0  0  0999 V2000\nM  END\n$$$$\n`);
    const items = await all(readSdItems(p, { maxLines: 10, maxChars: 1 << 20 }));
    expect(items).toHaveLength(2);
    expect(items[0]).toMatchObject({ record: 1, line: 1, text: '' });
    expect(items[0].splitProblem).toMatch(/longer than 10 lines .*\(50 lines\)/);
    expect(items[1]).toMatchObject({ record: 2, line: 52 });
    expect(items[1].text?.startsWith('LX-2\n')).toBe(true);
    expect(items[1].splitProblem).toBeUndefined();
  });
});
