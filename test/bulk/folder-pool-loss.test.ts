/**
 * Records out == records in for the full folder audit through the worker pool: a record file that does not
 * parse, is not text, names a molfile outside the registry, runs over its time limit, never finishes, or kills
 * its worker still comes out, in its place, with a finding at its file; every other record is audited. And the
 * audit command's exit codes through the pool: 1 findings, 0 with --fail-on never, 2 usage errors and a report
 * file that cannot be written. Real engine; ordinary structures (alanine, ethanol), invented claims.
 */
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { DEFAULT_CONFIG } from '../../src/audit/config.js';
import { CHECKS } from '../../src/checks/index.js';
import { runFolderAudit } from '../../src/bulk/folder-run.js';
import type { FolderRecord } from '../../src/bulk/record-file-audit.js';
import { listRecordFiles, readRecordFolder } from '../../src/bulk/record-files.js';
import { run } from '../../src/cli/main.js';
import { tmpRegistry, type TmpRegistry } from '../registry/tmp-registry.js';
import { memoryIo } from '../cli/io.js';

let reg: TmpRegistry | null = null;
afterEach(() => {
  reg?.remove();
  reg = null;
});

const rec = (id: string, smiles: string, form = 'single-enantiomer') =>
  `id: ${id}\nstructure:\n  smiles: "${smiles}"\nstereo:\n  form: ${form}\n`;
// 45 copies of L-alanine: under the component cap, but seconds of symmetry work (as test/audit/record-limits)
const heavy = Array(45).fill('C[C@H](N)C(=O)O').join('.');

async function audit(root: string, timeMs: number, script?: URL): Promise<FolderRecord[]> {
  const folder = readRecordFolder(root, listRecordFiles(root, ['compounds']));
  const out: FolderRecord[] = [];
  const result = await runFolderAudit({
    folder,
    config: { ...DEFAULT_CONFIG },
    budget: { timeMs, memoryMb: 1024 },
    workers: 2,
    json: false,
    progress: 'none',
    onRecord: (r) => void out.push(r),
    checks: CHECKS,
    script,
    batchSize: 2,
  });
  expect(result.summary.records).toBe(folder.items.length);
  expect(result.registry?.records).toBe(folder.items.length);
  return out;
}

const byFile = (records: FolderRecord[]) =>
  new Map(records.map((r) => [r.result.file, r.result.findings.map((f) => `${f.check}/${f.messageId}`)]));

describe('pooled folder audit: records out == records in', () => {
  it('broken files and a record over its time limit each come out with a finding at the file', async () => {
    reg = tmpRegistry({
      'compounds/a.yml': rec('LX-00001', 'C[C@H](N)C(=O)O'),
      'compounds/b.yml': 'id: LX-00002\nstereo:\n  form: [achiral\n',
      'compounds/c.yml': Buffer.from([0x69, 0x64, 0x3a, 0x20, 0xff, 0x00, 0x0a]),
      'compounds/d.yml':
        'id: LX-00004\nstructure:\n  molfile: "../../outside.mol"\nstereo:\n  form: achiral\n',
      'compounds/e.yml': rec('LX-00005', heavy),
      'compounds/f.yml': rec('LX-00006', 'CCO', 'achiral'),
    });
    const out = await audit(reg.root, 150);
    expect(out.map((r) => r.result.file)).toEqual(
      ['a', 'b', 'c', 'd', 'e', 'f'].map((x) => `compounds/${x}.yml`),
    );
    const found = byFile(out);
    expect(found.get('compounds/b.yml')).toEqual(['record-schema/yaml-syntax']);
    expect(found.get('compounds/c.yml')).toEqual(['record-schema/unreadable-file']);
    expect(found.get('compounds/d.yml')).toEqual(['structure-readable/structure-source-refused']);
    expect(found.get('compounds/e.yml')).toEqual(['record-time-limit/time-limit-exceeded']);
    const e = out[4]!.result;
    expect(e.id).toBe('LX-00005');
    expect(e.findings[0]!.line).toBe(2); // the structure line, as the in-memory audit points at it
    expect(out[5]!.result.passed.map((p) => p.check)).toContain('form-matches-structure');
  }, 120_000);

  it('a record that kills its worker or never finishes comes out with its file and id; the rest is audited', async () => {
    reg = tmpRegistry({
      'compounds/a.yml': rec('LX-00001', 'C[C@H](N)C(=O)O'),
      'compounds/crash.yml': rec('LX-00002', 'CCO', 'achiral'),
      'compounds/m.yml': rec('LX-00003', 'CCO', 'achiral'),
      'compounds/stall.yml': rec('LX-00004', 'CCO', 'achiral'),
      'compounds/z.yml': rec('LX-00005', 'C[C@@H](N)C(=O)O'),
    });
    const script = new URL('./workers/fragile-record-worker.ts', import.meta.url);
    const out = await audit(reg.root, 200, script);
    expect(out.map((r) => [r.result.file, r.result.id])).toEqual([
      ['compounds/a.yml', 'LX-00001'],
      ['compounds/crash.yml', 'LX-00002'],
      ['compounds/m.yml', 'LX-00003'],
      ['compounds/stall.yml', 'LX-00004'],
      ['compounds/z.yml', 'LX-00005'],
    ]);
    const found = byFile(out);
    expect(found.get('compounds/crash.yml')).toEqual(['record-time-limit/worker-crashed']);
    expect(found.get('compounds/stall.yml')).toEqual(['record-time-limit/time-limit-exceeded']);
    for (const f of ['compounds/a.yml', 'compounds/m.yml', 'compounds/z.yml'])
      expect(out.find((r) => r.result.file === f)!.result.passed.length).toBeGreaterThan(0);
  }, 120_000);
});

describe('audit command through the pool: exit codes', () => {
  const cli = async (args: string[]) => {
    const io = memoryIo();
    const code = await run(['audit', '--progress', 'none', ...args], io);
    return { code, out: io.stdout.join(''), err: io.stderr.join('') };
  };

  it('1 with open errors, 0 with --fail-on never; the JSON report file holds every record', async () => {
    reg = tmpRegistry({
      'compounds/a.yml': rec('LX-00001', 'CCO', 'meso'),
      'compounds/b.yml': rec('LX-00002', 'CCO', 'achiral'),
    });
    const report = join(reg.root, 'report.json');
    const failing = await cli(['--root', reg.root, '--workers', '1', '--format', 'json', '--output', report]);
    expect(failing.code).toBe(1);
    const json = JSON.parse(readFileSync(report, 'utf8')) as {
      records: { id: string }[];
      summary: { records: number };
    };
    expect(json.records.map((r) => r.id)).toEqual(['LX-00001', 'LX-00002']);
    expect(json.summary.records).toBe(2);
    expect((await cli(['--root', reg.root, '--workers', '1', '--fail-on', 'never'])).code).toBe(0);
  }, 120_000);

  it('2 for a missing record folder, a bad --workers and a report folder that does not exist', async () => {
    reg = tmpRegistry({
      'stereogate.config.yml': 'recordDirs: [nowhere]\n',
      'compounds/a.yml': rec('LX-00001', 'CCO', 'achiral'),
    });
    const missing = await cli(['--root', reg.root, '--workers', '2']);
    expect(missing.code).toBe(2);
    expect(missing.err).toContain("record folder 'nowhere' not found");
    expect((await cli(['--root', reg.root, '--workers', 'two'])).code).toBe(2);
    const noFolder = await cli([
      '--root',
      reg.root,
      '--workers',
      '1',
      '--output',
      join(reg.root, 'no/r.json'),
    ]);
    expect(noFolder.code).toBe(2);
  }, 60_000);

  it.skipIf(!existsSync('/dev/full'))(
    '2 when the report cannot be written during the run (a full disk)',
    async () => {
      reg = tmpRegistry({ 'compounds/a.yml': rec('LX-00001', 'CCO', 'achiral') });
      const full = await cli([
        '--root',
        reg.root,
        '--workers',
        '1',
        '--format',
        'json',
        '--output',
        '/dev/full',
      ]);
      expect(full.code).toBe(2);
      expect(full.err).toContain('cannot write /dev/full: no space left on the device');
    },
    60_000,
  );
});
