/**
 * The full folder audit through the worker pool on awkward runs: a registry with no record file at all, a record
 * file deleted after the folder was listed, a report path that is a folder. Records out == records in, the same
 * report as the in-thread audit, and a usage-level exit (2) naming the file rather than a crash. Ordinary
 * structures (ethanol, L-alanine), invented claims.
 */
import { existsSync, mkdirSync, readFileSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { DEFAULT_CONFIG } from '../../src/audit/config.js';
import { CHECKS } from '../../src/checks/index.js';
import { runFolderAudit } from '../../src/bulk/folder-run.js';
import type { FolderRecord } from '../../src/bulk/record-file-audit.js';
import { listRecordFiles, readRecordFolder } from '../../src/bulk/record-files.js';
import { run } from '../../src/cli/main.js';
import { memoryIo } from '../cli/io.js';
import { recordYaml, tmpRegistry, type TmpRegistry } from '../registry/tmp-registry.js';

let reg: TmpRegistry | null = null;
afterEach(() => {
  reg?.remove();
  reg = null;
});

const cli = async (args: string[]) => {
  const io = memoryIo();
  const code = await run(['audit', '--progress', 'none', ...args], io);
  return { code, out: io.stdout.join('\n'), err: io.stderr.join('\n') };
};

describe('pooled folder audit: awkward runs', () => {
  it('a registry with no record file: --workers 2 prints what the in-thread audit prints, in every format', async () => {
    reg = tmpRegistry({ 'stereogate.config.yml': 'recordDirs: [compounds]\n' });
    mkdirSync(join(reg.root, 'compounds'));
    for (const format of ['text', 'json', 'markdown', 'sarif']) {
      const pooled = await cli(['--root', reg.root, '--workers', '2', '--format', format]);
      const inThread = await cli(['--root', reg.root, '--workers', '0', '--format', format]);
      expect(pooled.code).toBe(0);
      expect(pooled.out).toBe(inThread.out);
      // every report carries the caution, once (house rule; SARIF also ends each rule's help with it, since a
      // code-scanning alert shows nothing else of the run)
      if (format !== 'sarif')
        expect(pooled.out.split('The responsible chemist must confirm')).toHaveLength(2);
    }
  }, 60_000);

  it('a record file deleted after the listing comes out, in its place, with a finding at its file', async () => {
    reg = tmpRegistry({
      'compounds/a.yml': recordYaml('LX-00001', 'achiral', '', 'CCO'),
      'compounds/b.yml': recordYaml('LX-00002', 'achiral', '', 'CCO'),
      'compounds/c.yml': recordYaml('LX-00003', 'single-enantiomer', '', 'C[C@H](N)C(=O)O'),
    });
    const list = listRecordFiles(reg.root, ['compounds']);
    rmSync(join(reg.root, 'compounds/a.yml')); // gone before the ids are read
    const folder = readRecordFolder(reg.root, list);
    rmSync(join(reg.root, 'compounds/b.yml')); // gone before a worker loads it
    const out: FolderRecord[] = [];
    const result = await runFolderAudit({
      folder,
      config: { ...DEFAULT_CONFIG },
      budget: { timeMs: 20_000, memoryMb: 1024 },
      workers: 2,
      json: false,
      progress: 'none',
      onRecord: (r) => void out.push(r),
      checks: CHECKS,
      batchSize: 1,
    });
    expect(result.summary.records).toBe(3);
    expect(out.map((r) => r.result.file)).toEqual(['a', 'b', 'c'].map((x) => `compounds/${x}.yml`));
    for (const r of out.slice(0, 2)) {
      expect(r.result.findings.map((f) => `${f.check}/${f.messageId}`)).toEqual([
        'record-schema/unreadable-file',
      ]);
      expect(r.result.findings[0]!.message).toMatch(/cannot be read \(ENOENT\)/);
    }
    expect(out[2]!.result.passed.length).toBeGreaterThan(0);
  }, 60_000);

  it('--workers above the number of record files starts one worker per file, not more', async () => {
    reg = tmpRegistry({
      'compounds/a.yml': recordYaml('LX-00001', 'achiral', '', 'CCO'),
      'compounds/b.yml': recordYaml('LX-00002', 'achiral', '', 'CCCO'),
    });
    const folder = readRecordFolder(reg.root, listRecordFiles(reg.root, ['compounds']));
    let window = -1;
    const result = await runFolderAudit({
      folder,
      config: { ...DEFAULT_CONFIG },
      budget: { timeMs: 20_000, memoryMb: 1024 },
      workers: 64,
      json: false,
      progress: 'none',
      onRecord: () => undefined,
      checks: CHECKS,
      batchSize: 1,
      onPoolStats: (s) => (window = s.window),
    });
    expect(result.summary.records).toBe(2);
    // the pool's window is 4 batches per worker (src/bulk/pool.ts): 2 workers of batches of 1 give 8, 64 would 256
    expect(window).toBe(8);
  }, 60_000);

  it('a report path that is a folder: exit 2 naming it, before any record is audited', async () => {
    reg = tmpRegistry({ 'compounds/a.yml': recordYaml('LX-00001', 'achiral', '', 'CCO') });
    const folder = join(reg.root, 'out');
    mkdirSync(folder);
    const r = await cli(['--root', reg.root, '--workers', '2', '--output', folder]);
    expect(r.code).toBe(2);
    expect(r.err).toContain(`cannot write the report to ${folder}: it is a folder`);
  }, 60_000);
});

describe('audit options given where they do nothing', () => {
  it('--workers and --progress with paths, --index-cache without: named on standard error, the audit runs', async () => {
    reg = tmpRegistry({ 'compounds/a.yml': recordYaml('LX-00001', 'achiral', '', 'CCO') });
    const withPaths = await cli(['--root', reg.root, 'compounds/a.yml', '--workers', '2']);
    expect(withPaths.code).toBe(0);
    expect(withPaths.out).toMatch(/1 record audited/);
    expect(withPaths.err.split('\n')).toEqual([
      'stereogate: --workers applies to the audit of every record (no paths): ignored with paths',
      'stereogate: --progress applies to the audit of every record (no paths): ignored with paths',
    ]);
    const cache = join(reg.root, 'keys.json');
    const whole = await cli(['--root', reg.root, '--index-cache', cache]);
    expect(whole.code).toBe(0);
    expect(whole.err).toBe('stereogate: --index-cache applies with paths only: ignored');
    const quiet = memoryIo();
    expect(await run(['audit', '--root', reg.root, 'compounds/a.yml'], quiet)).toBe(0);
    expect(quiet.stderr).toEqual([]);
  }, 60_000);
});

describe('audit --index-cache: a path that is not a cache', () => {
  it('a folder, a device or a record file is refused (exit 2, named, the file untouched); a new path is written', async () => {
    reg = tmpRegistry({
      'compounds/a.yml': recordYaml('LX-00001', 'achiral', '', 'CCO'),
      'compounds/b.yml': recordYaml('LX-00002', 'achiral', '', 'CCCO'),
    });
    const record = join(reg.root, 'compounds/b.yml');
    const before = readFileSync(record, 'utf8');
    const review = (cache: string) => cli(['--root', reg!.root, 'compounds/a.yml', '--index-cache', cache]);
    const asRecord = await review(record);
    expect(asRecord.code).toBe(2);
    expect(asRecord.err).toContain(
      `cannot keep the index cache in ${record}: the file there is not a stereogate index cache, and the run would replace it`,
    );
    expect(readFileSync(record, 'utf8')).toBe(before);
    const folder = join(reg.root, 'compounds');
    expect((await review(folder)).err).toContain(`cannot keep the index cache in ${folder}: it is a folder`);
    // a device would be read without end (common practice, no source: /dev/zero is such a file on Linux)
    if (existsSync('/dev/zero'))
      expect((await review('/dev/zero')).err).toContain('/dev/zero: it is not a regular file');
    const fresh = join(reg.root, 'cache', 'index.json');
    const cold = await review(fresh);
    expect(cold.code).toBe(0);
    expect(cold.err).toContain(`cache written to ${fresh}`);
    const warm = await review(fresh);
    expect(warm.code).toBe(0);
    expect(warm.err).toMatch(/[1-9]\d* from the cache/);
  }, 60_000);
});
