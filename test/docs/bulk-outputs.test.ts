/**
 * docs/bulk.md's Outputs table says what a person finds in the files: the top-level keys of --json, in order, and
 * the header of --csv, as a bulk audit of a two-row export writes them. Ordinary structures (ethanol, L-alanine).
 */
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { run } from '../../src/cli/main.js';
import { memoryIo } from '../cli/io.js';

const doc = readFileSync('docs/bulk.md', 'utf8');
const cell = (option: string): string => {
  const row = doc.split('\n').find((l) => l.startsWith(`| \`${option} FILE\``));
  expect(row, `docs/bulk.md row for ${option}`).toBeDefined();
  return row!;
};
const dir = mkdtempSync(join(tmpdir(), 'stereogate-bulk-doc-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('docs/bulk.md outputs', () => {
  it('--json keys and the --csv header are the ones a run writes', async () => {
    const csv = join(dir, 'export.csv');
    writeFileSync(
      csv,
      'id,smiles,stereo_form\nLX-00001,CCO,achiral\nLX-00002,C[C@H](N)C(=O)O,single-enantiomer\n',
    );
    const [json, table] = [join(dir, 'out.json'), join(dir, 'out.csv')];
    const io = memoryIo();
    await run(['audit', csv, '--progress', 'none', '--workers', '0', '--json', json, '--csv', table], io);
    const keys = Object.keys(JSON.parse(readFileSync(json, 'utf8')) as object);
    const documented = [...cell('--json').matchAll(/"(\w+)":/g)].map((m) => m[1]);
    expect(documented).toEqual(keys);
    const header = readFileSync(table, 'utf8').split('\n')[0]!;
    expect(cell('--csv')).toContain(`\`${header.split(',').join(', ')}\``);
  }, 60_000);
});
