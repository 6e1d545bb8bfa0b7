/**
 * What `stereogate describe` says about an SD file whose first `$$$$` was lost (two molfiles run together): a
 * reader error naming the line where the second record starts, as the bulk SD reader says it (one splitter,
 * src/chem/read/sd-split.ts). Layout per the CTfile format specification ("SDfile": molfile, data fields, $$$$).
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { run } from '../../src/cli/main.js';
import { readSdRecords } from '../../src/chem/read/index.js';
import { ethanolV2000 } from '../chem/read/molfile-examples.js';
import { memoryIo } from './io.js';

/** Ethanol as an SD record (13 lines: 10 of molfile, a data field of 2 lines and a blank one), no `$$$$`. */
const rec = (id: string): string => [...ethanolV2000(id), '> <stereo_form>', 'achiral', '', ''].join('\n');

async function describeFile(text: string) {
  const file = join(mkdtempSync(join(tmpdir(), 'sg-sd-')), 'two.sdf');
  writeFileSync(file, text);
  const io = memoryIo();
  const code = await run(['describe', file], io);
  return { code, out: io.stdout.join('\n'), err: io.stderr.join('\n') };
}

describe('describe on an SD file with a lost $$$$', () => {
  it('two records run together: an error at the line where the second starts, not a description', async () => {
    const r = await describeFile(`${rec('LX-00001')}${rec('LX-00002')}$$$$\n`);
    expect(r.code).not.toBe(0);
    expect(r.err).toContain('record 1');
    expect(r.err).toContain('the record has no $$$$ line: the next record starts at line 14');
    expect(r.out).toBe('');
  });

  it('a second M  END in the data block (header and counts line lost too): an error at that line', async () => {
    const merged = rec('LX-00001').replace('\n\n', '\n') + 'M  END\n$$$$\n';
    const r = await describeFile(merged);
    expect(r.code).not.toBe(0);
    expect(r.err).toMatch(/a second "M {2}END" at line 13 .*two records merged/);
  });

  it('two molfiles run together with no $$$$ at all: the same error, not the first molfile alone', async () => {
    const r = await describeFile(
      [...ethanolV2000('LX-00001'), ...ethanolV2000('LX-00002')].join('\n') + '\n',
    );
    expect(r.code).not.toBe(0);
    expect(r.err).toContain('the record has no $$$$ line: the next record starts at line 11');
  });

  it('one molfile alone is still described as a molfile', async () => {
    const r = await describeFile(ethanolV2000('LX-00001').join('\n') + '\n');
    expect(r.code).toBe(0);
    expect(r.out).toContain('Formula: C2H6O');
    expect(r.out).not.toContain('record 1');
  });

  it('the same file with its $$$$ lines is described (record 1)', async () => {
    const r = await describeFile(`${rec('LX-00001')}$$$$\n${rec('LX-00002')}$$$$\n`);
    expect(r.code).toBe(0);
    expect(r.out).toContain('record 1');
  });

  it('the reader still returns every record: the cut one as an error, the next one read', () => {
    const got = [...readSdRecords(`${rec('LX-00001')}${rec('LX-00002')}$$$$\n${rec('LX-00003')}$$$$\n`)];
    expect(got.map((g) => [g.record, g.line, g.result.ok])).toEqual([
      [1, 1, false],
      [2, 14, true],
      [3, 28, true],
    ]);
    if (!got[0]!.result.ok)
      expect(got[0]!.result.error).toMatchObject({ code: 'sdf-missing-separator', at: { line: 14 } });
  });
});
