/**
 * Bulk exports never swallow records (issue 10): an SD file with lost `$$$$` lines still gives one record per
 * molfile, each merge point reported; a stray quote at the start of a CSV/TSV field does not merge rows; a lone
 * CR inside a field does not split a row; an id holding the delimiter or a line break is a finding. Records read
 * always equal records reported. SD layout: CTfile format specification ("SDfile"); CSV quoting: RFC 4180.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readItems } from '../../src/bulk/sources.js';
import { ethanolV2000 } from '../chem/read/molfile-examples.js';
import { auditExport } from './inline-audit.js';

const dir = mkdtempSync(join(tmpdir(), 'stereogate-loss-'));

// ethanol as an SD record with its declared form (the $$$$ line is left to each test)
const mol = (id: string): string => [...ethanolV2000(id), '> <stereo_form>', 'achiral', '', ''].join('\n');

async function items(name: string, text: string) {
  const p = join(dir, name);
  writeFileSync(p, text);
  const out = [];
  for await (const it of readItems(p)) out.push(it);
  return out;
}

const audit = (name: string, text: string) => auditExport(join(dir, name), text);

describe('SD files with lost $$$$ lines', () => {
  it('300 records, every tenth $$$$ lost: 300 records reported, 30 of them told their $$$$ is missing', async () => {
    let text = '';
    for (let i = 1; i <= 300; i++)
      text += mol(`LX-${String(i).padStart(5, '0')}`) + (i % 10 === 3 ? '' : '$$$$\n');
    const { run, records } = await audit('lost.sdf', text);
    expect(run.trailer.summary.records).toBe(300);
    expect(new Set(records.map((r) => r.id)).size).toBe(300);
    const told = records.filter((r) => r.findings.some((f) => f.message.includes('has no $$$$ line')));
    expect(told.map((r) => r.id).slice(0, 3)).toEqual(['LX-00003', 'LX-00013', 'LX-00023']);
    expect(told).toHaveLength(30);
  });

  it('no $$$$ at all: every record found, each with the line where the next starts', async () => {
    const got = await items('none.sdf', [1, 2, 3, 4, 5].map((i) => mol(`LX-${i}`)).join(''));
    expect(got.map((i) => i.line)).toEqual([1, 14, 27, 40, 53]);
    expect(got[0]!.splitProblem).toContain('next record starts at line 14');
    expect(got[4]!.splitProblem).toContain('last record has no $$$$');
  });

  it('a second M  END inside the data block (header and counts line lost too) is a finding', async () => {
    const broken = mol('LX-1').replace('\n\n', '\n') + 'M  END\n> <stereo_form>\nachiral\n\n$$$$\n';
    const got = await items('second-end.sdf', broken + mol('LX-2') + '$$$$\n');
    expect(got).toHaveLength(2);
    expect(got[0]!.splitProblem).toMatch(/second "M {2}END" at line \d+/);
    expect(got[1]!.splitProblem).toBeUndefined();
  });

  it('a data value that happens to look like a counts line does not split the record', async () => {
    const odd = mol('LX-1').replace('achiral\n', 'achiral\n  3  2  0  0  0  0  0  0  0  0999 V2000\n');
    const got = await items('value.sdf', `${odd}$$$$\n${mol('LX-2')}$$$$\n`);
    expect(got).toHaveLength(2);
    expect(got.every((i) => i.splitProblem === undefined)).toBe(true);
  });
});

describe('CSV and TSV rows', () => {
  it('a stray quote at the start of a field: 2 rows in, 2 out, the first with a finding', async () => {
    const { run, records } = await audit(
      'stray.csv',
      'id,smiles,stereo_form\nLX-1,"CCO,achiral\nLX-2,CC,achiral\n',
    );
    expect(run.trailer.summary.records).toBe(2);
    expect(records.map((r) => r.id)).toEqual(['LX-1', 'LX-2']);
    expect(records[0]!.findings.some((f) => f.message.includes('quote opens a field on line 2'))).toBe(true);
  });

  it('a stray quote closed by a later row does not merge the rows (TSV too)', async () => {
    const csv = await items('stray2.csv', 'id,smiles,stereo_form\nLX-1,"CCO,achiral\nLX-2,CC,"achiral"\n');
    expect(csv.map((i) => i.fields?.id)).toEqual(['LX-1', 'LX-2']);
    expect(csv[1]!.fields?.stereo_form).toBe('achiral');
    const tsv = await items('stray.tsv', 'id\tsmiles\tstereo_form\nLX-1\t"CCO\tachiral\nLX-2\tCC\tachiral\n');
    expect(tsv.map((i) => i.fields?.id)).toEqual(['LX-1', 'LX-2']);
  });

  it('a genuine multi-line quoted field (a molfile in a cell) is still one field', async () => {
    const cell = mol('LX-1').split('\n').slice(0, 10).join('\n');
    const got = await items('cell.csv', `id,molfile,stereo_form\nLX-1,"${cell}",achiral\nLX-2,CC,achiral\n`);
    expect(got.map((i) => i.fields?.id)).toEqual(['LX-1', 'LX-2']);
    expect(got[0]!.fields?.molfile).toBe(cell);
    expect(got[0]!.splitProblem).toBeUndefined();
  });

  it('a quote left open over lines that are no rows is still reported at the end of the file', async () => {
    const got = await items('open.csv', 'id,smiles\nLX-1,"CC\nmore text\n');
    // the open row is given up at the end of the file and the lines after its first are read again as rows
    expect(got.map((i) => i.line)).toEqual([2, 3]);
    expect(got[0]!.splitProblem).toMatch(/does not close before the end of the file/);
  });

  it('a lone CR inside a field does not split the row; CR-only files still read line by line', async () => {
    const lone = await items('lone.csv', 'id,smiles,stereo_form\nLX-1,CC\rO,achiral\nLX-2,CC,achiral\n');
    expect(lone.map((i) => i.fields?.id)).toEqual(['LX-1', 'LX-2']);
    expect(lone[0]!.fields?.smiles).toBe('CC\rO');
    const cr = await items('cr.csv', 'id,smiles\rLX-1,CCO\rLX-2,CC\r');
    expect(cr.map((i) => [i.fields?.id, i.line])).toEqual([
      ['LX-1', 2],
      ['LX-2', 3],
    ]);
  });

  it('an id holding the delimiter or a line break is a finding on the id', async () => {
    const { records } = await audit(
      'ids.csv',
      'id,smiles,stereo_form\n"LX-1,2",CCO,achiral\n"LX\n3",CC,achiral\nLX-4,CC,achiral\n',
    );
    expect(records).toHaveLength(3);
    const idFindings = records.map((r) => r.findings.filter((f) => f.field === 'id').map((f) => f.message));
    expect(idFindings[0]![0]).toContain('holds a comma');
    expect(idFindings[1]![0]).toContain('holds a line break');
    expect(idFindings[2]).toEqual([]);
    const tsv = await audit('ids.tsv', 'id\tsmiles\tstereo_form\n"LX-1\t2"\tCCO\tachiral\n');
    expect(tsv.records[0]!.findings.some((f) => f.message.includes('holds a tab'))).toBe(true);
  });
});
