/**
 * The full folder audit through the worker pool (src/bulk/folder-run.ts) against the in-memory audit
 * (runAudit -> auditRecords) of the same registry: record for record and finding for finding, and every report
 * written as records come (src/report/stream.ts) byte for byte the report rendered from the whole result. On the
 * demo registry (whose checklist the demo prints: 49 records, 18 errors, 4 warnings, 4 notes, 1 accepted by
 * waiver; 6 enantiomer pairs, 2 pairs of identical structures) and on a small registry of awkward files. Real
 * engine and checks; the structures are ordinary (alanine, lactic acid, ethanol), the claims invented.
 */
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runAudit } from '../../src/audit/run.js';
import type { AuditResult } from '../../src/audit/types.js';
import { loadConfig } from '../../src/audit/config.js';
import { CHECKS } from '../../src/checks/index.js';
import { runFolderAudit, type FolderRunResult } from '../../src/bulk/folder-run.js';
import type { FolderRecord } from '../../src/bulk/record-file-audit.js';
import { listRecordFiles, readRecordFolder } from '../../src/bulk/record-files.js';
import { computedText } from '../../src/report/checklist.js';
import { renderJson } from '../../src/report/json.js';
import { renderMarkdown } from '../../src/report/markdown.js';
import { renderSarif } from '../../src/report/sarif.js';
import { fileSink } from '../../src/report/sink.js';
import { streamedReport, type ReportFormat } from '../../src/report/stream.js';
import { renderText } from '../../src/report/text.js';
import { tmpRegistry } from '../registry/tmp-registry.js';
import { makeAuditCommand } from '../../src/cli/commands/audit.js';
import { memoryIo } from '../cli/io.js';

const DEMO = join(import.meta.dirname, '../../fixtures/demo-registry');

async function pooled(
  root: string,
  workers: number,
): Promise<{ records: FolderRecord[]; run: FolderRunResult }> {
  const { config } = loadConfig(root, undefined, undefined);
  const folder = readRecordFolder(root, listRecordFiles(root, config.recordDirs));
  const records: FolderRecord[] = [];
  const run = await runFolderAudit({
    folder,
    config,
    budget: { timeMs: 20_000, memoryMb: 1024 },
    workers,
    json: true,
    progress: 'none',
    onRecord: (r) => void records.push(r),
    checks: CHECKS,
  });
  return { records, run };
}

/** Every report of the pooled records, streamed through files, against the same report of the whole result. */
async function sameReports(records: FolderRecord[], run: FolderRunResult, whole: AuditResult): Promise<void> {
  const dir = mkdtempSync(join(tmpdir(), 'stereogate-stream-'));
  try {
    const expected: Record<ReportFormat | 'verbose', string> = {
      text: renderText(whole),
      verbose: renderText(whole, { verbose: true }),
      markdown: renderMarkdown(whole, { maxChars: Number.POSITIVE_INFINITY }),
      json: renderJson(whole),
      sarif: renderSarif(whole, CHECKS),
    };
    for (const kind of Object.keys(expected) as (keyof typeof expected)[]) {
      const path = join(dir, kind);
      const format = kind === 'verbose' ? 'text' : kind;
      const known = { tool: whole.tool, caution: whole.caution };
      const report = streamedReport(format, fileSink(path), known, {
        text: { verbose: kind === 'verbose' },
        checks: CHECKS,
      });
      for (const r of records) await report.add(r);
      await report.finish({ ...known, summary: run.summary, registry: run.registry });
      expect(readFileSync(path, 'utf8'), kind).toBe(expected[kind]);
    }
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

function sameRecords(records: FolderRecord[], whole: AuditResult): void {
  expect(records.map((r) => r.result.file)).toEqual(whole.records.map((r) => r.file));
  records.forEach((r, i) => {
    const { computed, ...expected } = whole.records[i]!;
    const { computed: none, ...got } = r.result;
    expect(none).toBeNull();
    expect(got, expected.file).toEqual(expected);
    expect(r.computedLine).toBe(computedText(computed));
    expect(r.computedJson === null ? null : JSON.parse(r.computedJson)).toEqual(
      computed === null ? null : JSON.parse(JSON.stringify(computed)),
    );
  });
}

describe('full folder audit through the worker pool = the in-memory audit', () => {
  it('the demo registry: the same records, findings, registry-wide summary and reports', async () => {
    const whole = await runAudit({ root: DEMO });
    const { records, run } = await pooled(DEMO, 2);
    // the demo's checklist (README): 49 records, 18 errors, 4 warnings, 4 notes, 1 accepted by waiver
    expect(run.summary).toEqual({ records: 49, errors: 18, warnings: 4, notes: 4, waived: 1 });
    expect(run.summary).toEqual(whole.summary);
    const pairs = run.registry!.pairs;
    expect(pairs.filter((p) => p.relation === 'enantiomers')).toHaveLength(6);
    expect(pairs.filter((p) => p.relation === 'identical')).toHaveLength(2);
    expect(run.registry).toEqual(whole.registry);
    expect(run.internalErrors).toBe(false);
    sameRecords(records, whole);
    await sameReports(records, run, whole);
  }, 120_000);

  it('awkward files: duplicate ids, broken YAML, a molfile outside the root, origins by id, a JSON record', async () => {
    const outside = mkdtempSync(join(tmpdir(), 'stereogate-outside-'));
    writeFileSync(join(outside, 'x.mol'), 'not read\n');
    const rec = (id: string, smiles: string, form: string, extra = '') =>
      `id: ${id}\nstructure:\n  smiles: "${smiles}"\nstereo:\n  form: ${form}\n${extra}`;
    const reg = tmpRegistry({
      'stereogate.config.yml': 'recordDirs: [compounds, more]\n',
      // L- and D-alanine registered with the same rotation sign: a registry-wide error on the later one
      'compounds/a.yml': rec(
        'LX-00001',
        'C[C@@H](C(=O)O)N',
        'single-enantiomer',
        '  rotation:\n    value: 14.5\n',
      ),
      'compounds/b.yml': rec(
        'LX-00002',
        'C[C@H](C(=O)O)N',
        'single-enantiomer',
        '  rotation:\n    value: 14.5\n',
      ),
      // the same structure as a.yml, and the same id as d.yml
      'compounds/c.yml': `# copy\n${rec('LX-00004', 'N[C@@H](C)C(=O)O', 'single-enantiomer')}`,
      'compounds/d.yml': rec('LX-00004', 'CCO', 'achiral'),
      'compounds/e.yml': 'id: LX-00005\nstereo:\n  form: [achiral\n',
      'compounds/f.yml': `id: LX-00006\nstructure:\n  molfile: "${join(outside, 'x.mol')}"\nstereo:\n  form: achiral\n`,
      'compounds/g.yml': `id: LX-00007\nstructure:\n  molfile: "../../../x.mol"\nstereo:\n  form: achiral\n`,
      // lactic acid made from a registered input, and from an id that is not registered (a near miss)
      'compounds/h.yml': rec(
        'LX-00008',
        'CC(O)C(=O)O',
        'racemate',
        'origin:\n  from: [LX-00001]\n  control: none\n',
      ),
      'compounds/i.yml': rec(
        'LX-00009',
        'CC(O)C(=O)O',
        'racemate',
        'origin:\n  from: [LX-00011]\n  control: none\n',
      ),
      'compounds/j.json': JSON.stringify({
        id: 'LX-00010',
        structure: { smiles: 'OCC' },
        stereo: { form: 'achiral' },
      }),
      'compounds/k.yml': Buffer.from([0x69, 0x64, 0x3a, 0x20, 0xff, 0xfe, 0x0a]),
      'compounds/l.yml': rec('LX-00012', 'CCO', 'racemic'),
      'more/m.yml': rec('LX-00004', 'C[C@@H](O)C(=O)O', 'single-enantiomer'),
    });
    try {
      const whole = await runAudit({ root: reg.root });
      expect(whole.records).toHaveLength(13);
      // the awkward cases are there: each duplicate id names the other files, the near miss is suggested
      const messages = whole.records.flatMap((r) => r.findings.map((f) => `${r.file}: ${f.messageId}`));
      expect(messages).toEqual(
        expect.arrayContaining([
          'compounds/c.yml: duplicate-id',
          'more/m.yml: duplicate-id',
          'compounds/e.yml: yaml-syntax',
          'compounds/i.yml: input-not-found',
        ]),
      );
      const { records, run } = await pooled(reg.root, 2);
      expect(run.summary).toEqual(whole.summary);
      expect(run.registry).toEqual(whole.registry);
      sameRecords(records, whole);
      await sameReports(records, run, whole);
      // in this thread (--workers 0 of the pool) the same again
      const inline = await pooled(reg.root, 0);
      sameRecords(inline.records, whole);
    } finally {
      reg.remove();
      rmSync(outside, { recursive: true, force: true });
    }
  }, 120_000);

  it('the CLI: --workers 2 prints the checklist the in-thread audit prints, with the same exit code', async () => {
    const run = async (...args: string[]) => {
      const io = memoryIo();
      const code = await makeAuditCommand().run(['--root', DEMO, '--progress', 'none', ...args], io);
      return { code, out: io.stdout.join('') };
    };
    const inThread = await run('--workers', '0');
    const pooledRun = await run('--workers', '2');
    expect(pooledRun.out).toBe(inThread.out);
    expect(pooledRun.out).toContain(
      '49 records audited: 18 errors, 4 warnings, 4 notes, 1 accepted by waiver',
    );
    expect(inThread.code).toBe(1); // errors at the default --fail-on error
    expect(pooledRun.code).toBe(1);
    expect((await run('--workers', '2', '--fail-on', 'never')).code).toBe(0);
  }, 120_000);
});
