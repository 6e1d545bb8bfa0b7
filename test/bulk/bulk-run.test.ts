/**
 * The bulk audit end to end: CSV and SD inputs through worker threads, results in input order, bad records as
 * findings with their position, shards merged into exactly the output of a single run. The structures are
 * ordinary textbook molecules; the claims attached to them are invented for the test.
 */
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { Molecule } from 'openchemlib';
import { DEFAULT_CONFIG } from '../../src/audit/config.js';
import { runBulkAudit } from '../../src/bulk/run.js';
import { mergeShards } from '../../src/bulk/merge.js';
import { jsonWriter, jsonlWriter } from '../../src/bulk/writers.js';
import { readSdItems } from '../../src/bulk/sources.js';

const dir = mkdtempSync(join(tmpdir(), 'stereogate-bulk-'));
const csv = join(dir, 'legacy.csv');
writeFileSync(
  csv,
  [
    'REG_NO,SMILES,STEREO,EE',
    'LX-1,C[C@H](O)CC,rac,',
    'LX-2,OC(=O)[C@@H](O)[C@@H](O)C(=O)O,racemic,', // meso-tartaric acid (2R,3S): achiral, cannot be a racemate
    'LX-3,CCO,achiral,',
    'LX-4,C1CC1(,single enantiomer,', // broken SMILES
    'LX-5,C[C@H](N)C(=O)O,enantiopure,99.5', // L-alanine
    'LX-6,CC(O)CC,chiral,', // a word no one can map
    'LX-7,c1ccccc1,achiral,',
    'LX-8,C[C@@H](O)CC,abs,98',
  ].join('\n') + '\n',
);
const sd = join(dir, 'legacy.sdf');
const molecules: [string, string, string][] = [
  ['LX-101', 'C[C@H](O)CC', 'racemic'],
  ['LX-102', 'OC(=O)[C@@H](O)[C@H](O)C(=O)O', 'single enantiomer'],
  ['LX-103', 'CC(C)C', 'achiral'],
];
writeFileSync(
  sd,
  molecules
    .map(
      ([id, smi, form]) =>
        `${Molecule.fromSmiles(smi)
          .toMolfile()
          .replace(/^[^\n]*/, id)}\n> <FORM>\n${form}\n\n$$$$\n`,
    )
    .join('') +
    // a broken record in the middle of the file, then one more good record
    'LX-104\n  broken\n\n  3  2  0  0  0  0  0  0  0  0999 V2000\n    0.0 x\nM  END\n> <FORM>\nrac\n\n$$$$\n' +
    `${Molecule.fromSmiles('C[C@@H](N)C(=O)O')
      .toMolfile()
      .replace(/^[^\n]*/, 'LX-105')}\n> <FORM>\nabs\n\n$$$$\n`,
);
const config = { ...DEFAULT_CONFIG };

async function runTo(
  file: string,
  inputs: string[],
  mapping: object,
  workers: number,
  shard: { index: number; count: number } | null = null,
) {
  const run = await runBulkAudit({
    inputs,
    mapping,
    config,
    workers,
    shard,
    progress: 'none',
    writers: [jsonlWriter(file), jsonWriter(file + '.json')],
  });
  return run.trailer;
}
const csvMapping = { id: 'REG_NO', structure: 'SMILES', form: 'STEREO', ee: 'EE' };

describe('bulk audit', () => {
  it('splits SD files into records with their start lines, a broken record included', async () => {
    const items = [];
    for await (const it of readSdItems(sd)) items.push(it);
    expect(items.map((i) => i.record)).toEqual([1, 2, 3, 4, 5]);
    expect(items[0].line).toBe(1);
    expect(items[3].text).toContain('LX-104');
  });

  it('audits a CSV export in input order, each bad record a finding with its line', async () => {
    const out = join(dir, 'csv.jsonl');
    const trailer = await runTo(out, [csv], csvMapping, 2);
    const lines = readFileSync(out, 'utf8')
      .trim()
      .split('\n')
      .map((l) => JSON.parse(l));
    const recs = lines.filter((l) => l.kind === 'record');
    expect(recs.map((r) => r.id)).toEqual(['LX-1', 'LX-2', 'LX-3', 'LX-4', 'LX-5', 'LX-6', 'LX-7', 'LX-8']);
    expect(recs.map((r) => r.origin.line)).toEqual([2, 3, 4, 5, 6, 7, 8, 9]);
    const checksOf = (id: string) =>
      recs.find((r) => r.id === id).findings.map((f: { check: string }) => f.check);
    expect(checksOf('LX-2')).toContain('form-matches-structure');
    expect(checksOf('LX-4')).toContain('structure-readable');
    expect(
      recs
        .find((r) => r.id === 'LX-4')
        .findings.find((f: { check: string }) => f.check === 'structure-readable').line,
    ).toBe(5);
    expect(checksOf('LX-6')).toContain('record-schema'); // the form word 'chiral' is not guessed
    expect(trailer.vocabulary.notUnderstood).toEqual([['chiral', 1]]);
    expect(trailer.vocabulary.mapped.map(([w]) => w)).toEqual([
      'abs',
      'enantiopure',
      'rac',
      'racemic',
      'single enantiomer',
    ]);
    expect(lines.at(-1).kind).toBe('summary');
    expect(trailer.summary.records).toBe(8);
  });

  it('renders the JSON Lines text only when an output wants it (the tally is always there)', async () => {
    const seen: { jsonl: string; findings: number }[] = [];
    const run = async (writers: Parameters<typeof runBulkAudit>[0]['writers']) => {
      seen.length = 0;
      await runBulkAudit({
        inputs: [csv],
        mapping: csvMapping,
        config,
        workers: 1,
        progress: 'none',
        writers,
        onRecord: (r) => seen.push({ jsonl: r.jsonl, findings: r.tally.findings.length }),
      });
      return seen.map((x) => ({ ...x }));
    };
    const bare = await run([]);
    expect(bare).toHaveLength(8);
    expect(bare.every((r) => r.jsonl === '')).toBe(true);
    const withJsonl = await run([jsonlWriter(join(dir, 'wants.jsonl'))]);
    expect(withJsonl.every((r) => r.jsonl.startsWith('{"kind":"record",'))).toBe(true);
    expect(withJsonl.map((r) => r.findings)).toEqual(bare.map((r) => r.findings));
  });

  it('audits an SD file; the broken record does not stop the run', async () => {
    const out = join(dir, 'sd.jsonl');
    const trailer = await runTo(out, [sd], { form: 'FORM' }, 1);
    const recs = readFileSync(out, 'utf8')
      .trim()
      .split('\n')
      .map((l) => JSON.parse(l))
      .filter((l) => l.kind === 'record');
    expect(recs.map((r) => r.id)).toEqual(['LX-101', 'LX-102', 'LX-103', 'LX-104', 'LX-105']);
    expect(recs[3].findings.map((f: { check: string }) => f.check)).toContain('structure-readable');
    expect(recs[4].findings.filter((f: { severity: string }) => f.severity === 'error')).toEqual([]);
    expect(trailer.summary.records).toBe(5);
  });

  it('gives the same output with workers as in one thread, and shards merge into exactly a single run', async () => {
    const single = join(dir, 'single.jsonl');
    await runTo(single, [csv, sd], { ...csvMapping, form: 'STEREO' }, 0);
    const two = join(dir, 'two.jsonl');
    await runTo(two, [csv, sd], { ...csvMapping, form: 'STEREO' }, 2);
    expect(readFileSync(two, 'utf8')).toBe(readFileSync(single, 'utf8'));
    const s1 = join(dir, 's1.jsonl');
    const s2 = join(dir, 's2.jsonl');
    const s3 = join(dir, 's3.jsonl');
    await runTo(s1, [csv, sd], { ...csvMapping, form: 'STEREO' }, 1, { index: 1, count: 3 });
    await runTo(s2, [csv, sd], { ...csvMapping, form: 'STEREO' }, 1, { index: 2, count: 3 });
    await runTo(s3, [csv, sd], { ...csvMapping, form: 'STEREO' }, 1, { index: 3, count: 3 });
    const merged = join(dir, 'merged.jsonl');
    await mergeShards([s3, s1, s2], [jsonlWriter(merged), jsonWriter(merged + '.json')]);
    expect(readFileSync(merged, 'utf8')).toBe(readFileSync(single, 'utf8'));
    expect(readFileSync(merged + '.json', 'utf8')).toBe(readFileSync(single + '.json', 'utf8'));
    await expect(mergeShards([s1, s2], [])).rejects.toThrow(/shard 3\/3 missing/);
  });
});
