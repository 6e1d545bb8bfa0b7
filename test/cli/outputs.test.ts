/**
 * What the command line says: --version, one clear line for an output path that cannot be written (no raw
 * ENOENT, no usage), the bulk options on a bulk usage error, --verbose, and the bulk summary's rate counting
 * the audit apart from the report writing.
 */
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { run } from '../../src/cli/main.js';
import { summaryTable } from '../../src/cli/commands/bulk-audit.js';
import type { BulkTrailer } from '../../src/bulk/writers.js';
import { memoryIo } from './io.js';

const demo = 'fixtures/demo-registry';
const pkg = JSON.parse(readFileSync('package.json', 'utf8')) as { version: string };

describe('stereogate --version', () => {
  it('prints the package version and exits 0', async () => {
    for (const flag of ['--version', '-V']) {
      const io = memoryIo();
      expect(await run([flag], io)).toBe(0);
      expect(io.stdout.join('')).toBe(`stereogate ${pkg.version}`);
    }
  });
});

describe('--output that cannot be written', () => {
  it('is one clear line and exit 2, checked before the audit runs', async () => {
    const io = memoryIo();
    const code = await run(['audit', '--root', demo, '--output', '/nonexistent-folder/report.md'], io);
    expect(code).toBe(2);
    const err = io.stderr.join('\n');
    expect(err).toBe(
      'stereogate audit: cannot write the report to /nonexistent-folder/report.md: the folder ' +
        '/nonexistent-folder does not exist',
    );
    expect(err).not.toMatch(/ENOENT|Usage:/);
    expect(io.stdout).toEqual([]);
  });
  it('a report path inside a record folder is refused: a record file is never overwritten', async () => {
    const { cpSync } = await import('node:fs');
    const root = mkdtempSync(join(tmpdir(), 'sg-out-rec-'));
    cpSync(demo, root, { recursive: true });
    const record = join(root, 'compounds', 'LX-00006.yml');
    const before = readFileSync(record, 'utf8');
    const io = memoryIo();
    expect(await run(['audit', '--root', root, '--output', record, '--fail-on', 'never'], io)).toBe(2);
    expect(io.stderr.join('')).toMatch(/cannot write the report to .*inside the record folder compounds/);
    expect(readFileSync(record, 'utf8')).toBe(before);
    // outside the record folders (the registry root itself) a report is fine
    const ok = memoryIo();
    expect(
      await run(['audit', '--root', root, '--output', join(root, 'report.txt'), '--fail-on', 'never'], ok),
    ).toBe(0);
  });
  it('a folder given as --output is said to be a folder', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'sg-out-'));
    const io = memoryIo();
    expect(await run(['audit', '--root', demo, '--output', dir], io)).toBe(2);
    expect(io.stderr.join('')).toMatch(/it is a folder$/);
  });
  it('a bulk output in a missing folder is one line too, before any record is read', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'sg-out-'));
    const csv = join(dir, 'x.csv');
    writeFileSync(csv, 'id,smiles\nLX-00001,CCO\n');
    const io = memoryIo();
    const code = await run(['audit', csv, '--progress', 'none', '--html', join(dir, 'no/such/r.html')], io);
    expect(code).toBe(2);
    expect(io.stderr.join('')).toMatch(
      /^stereogate audit: cannot write the --html output to .*: the folder .* does not exist$/,
    );
  });
});

describe('bulk usage errors', () => {
  it('show the bulk options, not the record audit usage', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'sg-bulk-'));
    const csv = join(dir, 'x.csv');
    writeFileSync(csv, 'id,smiles\nLX-00001,CCO\n');
    const io = memoryIo();
    expect(await run(['audit', csv, '--workers', 'many'], io)).toBe(2);
    const err = io.stderr.join('');
    expect(err).toMatch(/^stereogate audit: --workers expects a whole number/);
    expect(err).toContain('--map-structure NAME');
    expect(err).not.toContain('--root DIR           registry root');
  });
});

describe('audit --verbose', () => {
  it('prints each passed check with its evidence; without it one line per clean record', async () => {
    const quiet = memoryIo();
    await run(['audit', '--root', demo, '--fail-on', 'never'], quiet);
    const verbose = memoryIo();
    await run(['audit', '--root', demo, '--fail-on', 'never', '--verbose'], verbose);
    const q = quiet.stdout.join('');
    const v = verbose.stdout.join('');
    expect(v.length).toBeGreaterThan(q.length);
    expect(v).toMatch(/^ {2}✓ structure-readable: /m);
    expect(q).not.toMatch(/^ {2}✓ structure-readable: /m);
    expect(q).toMatch(/^✓ LX-\d{5} {2}\d+ checks passed/m);
    // records with findings come first
    const first = q.split('\n')[0]!;
    expect(first).not.toMatch(/^✓/);
  });
});

describe('bulk summary timing', () => {
  const trailer: BulkTrailer = {
    kind: 'summary',
    summary: { records: 2500, errors: 1, warnings: 0, notes: 0, waived: 0 },
    byCheck: {},
    vocabulary: { mapped: [], notUnderstood: [] },
    caution: 'c',
    tool: { name: 'stereogate', version: 't' },
    shard: null,
  };
  it('gives the audit rate apart from the time the reports took', () => {
    const line = summaryTable(trailer, { seconds: 100, auditSeconds: 20 }).split('\n')[0];
    expect(line).toBe(
      'stereogate bulk audit: 2500 records in 100.0 s (audit 20.0 s, 125 records/s; reports 80.0 s)',
    );
  });
  it('a slow or short run: the rate with one decimal, never "0 records/s"', () => {
    const short = { ...trailer, summary: { ...trailer.summary, records: 1 } };
    expect(summaryTable(short, { seconds: 3.4, auditSeconds: 3.4 }).split('\n')[0]).toBe(
      'stereogate bulk audit: 1 record in 3.4 s (audit 3.4 s, 0.3 records/s)',
    );
  });
});

describe('LICENSE', () => {
  it('is the license package.json declares (MIT; the text of the SPDX "MIT" license)', () => {
    const license = readFileSync('LICENSE', 'utf8');
    expect(JSON.parse(readFileSync('package.json', 'utf8')).license).toBe('MIT');
    expect(license.split('\n')[0]).toBe('MIT License');
    expect(license).toContain('Permission is hereby granted, free of charge, to any person obtaining a copy');
    expect(license).toContain('THE SOFTWARE IS PROVIDED "AS IS", WITHOUT WARRANTY OF ANY KIND');
  });
});

describe('audit --format markdown', () => {
  it('prints the whole checklist (the comment-size summary is for pull requests, not files)', async () => {
    const { mkdtempSync: tmp, writeFileSync: put, mkdirSync: mk } = await import('node:fs');
    const root = tmp(join(tmpdir(), 'sg-md-'));
    mk(join(root, 'compounds'));
    // 300 records of (R)-butan-2-ol declared achiral: one error each, so the checklist passes 60,000 characters
    for (let i = 1; i <= 300; i++) {
      const id = `LX-${String(i).padStart(5, '0')}`;
      put(
        join(root, 'compounds', `${id}.yml`),
        `id: ${id}\nstructure:\n  smiles: "C[C@@H](O)CC"\nstereo:\n  form: achiral\n`,
      );
    }
    const io = memoryIo();
    await run(['audit', '--root', root, '--format', 'markdown', '--fail-on', 'never'], io);
    const md = io.stdout.join('');
    expect(md.length).toBeGreaterThan(60_000);
    expect(md).not.toContain('too long for a comment');
    expect(md.match(/^### LX-\d{5}/gm)).toHaveLength(300);
  }, 120_000);
});
