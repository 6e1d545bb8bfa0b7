/**
 * Registry-wide checks in a bulk audit (issue 14): duplicates, enantiomer pairs and rotation signs within one
 * export, found by the main thread's key index as the records stream past; a split run leaves them "not run" on
 * every record (never passed), and the merge of the shards finds exactly what one run finds. Structures: carvone
 * enantiomers, (R)-(−) and (S)-(+), about ±61° neat (handbook, from memory); claims invented for the test.
 */
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { DEFAULT_CONFIG } from '../../src/audit/config.js';
import { mergeShards } from '../../src/bulk/merge.js';
import { runBulkAudit } from '../../src/bulk/run.js';
import { jsonlWriter } from '../../src/bulk/writers.js';

const dir = mkdtempSync(join(tmpdir(), 'stereogate-registry-bulk-'));
const csv = join(dir, 'export.csv');
writeFileSync(
  csv,
  [
    'REG_NO,SMILES,STEREO,ROT',
    'LX-1,CC1=CC[C@H](CC1=O)C(=C)C,single-enantiomer,-61', // (R)-carvone
    'LX-2,CCO,achiral,',
    'LX-3,CC1=CC[C@@H](CC1=O)C(=C)C,single-enantiomer,-58', // (S)-carvone with the sign of (R): a conflict
    'LX-4,C[C@@H](O)CC,single-enantiomer,',
    'LX-5,C=C(C)[C@@H]1CC=C(C)C(=O)C1,single-enantiomer,', // (R)-carvone again, other atom order: duplicate
    'LX-6,C[C@H](O)CC,single-enantiomer,', // enantiomer of LX-4: a pair, no finding
    'LX-7,OCC,racemate,', // ethanol again under another form
  ].join('\n') + '\n',
);
const mapping = { id: 'REG_NO', structure: 'SMILES', form: 'STEREO', rotation: 'ROT' };

async function run(file: string, shard: { index: number; count: number } | null = null, workers = 1) {
  const r = await runBulkAudit({
    inputs: [csv],
    mapping,
    config: { ...DEFAULT_CONFIG },
    workers,
    shard,
    progress: 'none',
    writers: [jsonlWriter(file)],
  });
  return r.trailer;
}

type Line = {
  kind: string;
  id: string;
  findings: { check: string; messageId: string; data: Record<string, unknown> }[];
  notRun?: { check: string; reason: string }[];
  passed: { check: string }[];
};
const lines = (file: string): Line[] =>
  readFileSync(file, 'utf8')
    .trim()
    .split('\n')
    .map((l) => JSON.parse(l) as Line)
    .filter((l) => l.kind === 'record');
const registryFindings = (file: string) =>
  lines(file).map((l) => [
    l.id,
    l.findings
      .filter((f) => f.check === 'consistent-with-registry')
      .map((f) => `${f.messageId} ${String(f.data.otherId)}`),
  ]);

describe('registry-wide checks in a bulk audit', () => {
  it('finds duplicates, same-sign enantiomers and forms within one export, each on the later record', async () => {
    const single = join(dir, 'single.jsonl');
    const trailer = await run(single);
    expect(registryFindings(single)).toEqual([
      ['LX-1', []],
      ['LX-2', []],
      ['LX-3', ['enantiomer-rotation-same-sign LX-1']],
      ['LX-4', []],
      ['LX-5', ['already-registered LX-1']],
      ['LX-6', []],
      ['LX-7', ['same-structure-different-form LX-2']],
    ]);
    // the pairs once, in the summary; no per-record note for a registered enantiomer
    expect(trailer.registry!.status).toBe('run');
    expect(trailer.registry!.pairs.map((p) => `${p.relation} ${p.first.id} ${p.second.id}`).sort()).toEqual([
      'enantiomers LX-1 LX-3',
      'enantiomers LX-3 LX-5',
      'enantiomers LX-4 LX-6',
      'identical LX-1 LX-5',
      'identical LX-2 LX-7',
    ]);
    expect(trailer.registry!.pairs.filter((p) => p.relation === 'enantiomers')).toHaveLength(3);
    expect(trailer.registry!.pairs.filter((p) => p.relation === 'identical')).toHaveLength(2);
    // never reported as passed per record, never "not run" in one whole run
    for (const l of lines(single)) {
      expect(l.notRun?.map((n) => n.check) ?? []).not.toContain('consistent-with-registry');
    }
  });

  it('one shard: not run, with the reason, on every record; shards merged give exactly one run', async () => {
    const single = join(dir, 'one.jsonl');
    await run(single, null, 2);
    const shards = [1, 2, 3].map((i) => join(dir, `shard-${i}.jsonl`));
    const trailers = [];
    for (let i = 0; i < 3; i++) trailers.push(await run(shards[i]!, { index: i + 1, count: 3 }));
    for (const s of shards) {
      for (const l of lines(s)) {
        expect(l.passed.map((p) => p.check)).not.toContain('consistent-with-registry');
        expect(l.notRun).toContainEqual({
          check: 'consistent-with-registry',
          reason: expect.stringMatching(/one shard \(\d\/3\) of a split run.*stereogate merge/),
        });
      }
    }
    expect(trailers[0]!.registry!.status).toBe('not-run');
    const merged = join(dir, 'merged.jsonl');
    const trailer = await mergeShards([shards[2]!, shards[0]!, shards[1]!], [jsonlWriter(merged)]);
    expect(readFileSync(merged, 'utf8')).toBe(readFileSync(single, 'utf8'));
    expect(trailer.registry!.pairs).toHaveLength(5);
  });
});

describe('stereogate merge takes the configuration of the shard runs (--config)', () => {
  it('a raised severity reaches the registry-wide findings that merge computes', async () => {
    const { run: cli } = await import('../../src/cli/main.js');
    const { memoryIo } = await import('../cli/io.js');
    const shards = [join(dir, 'cfg-1.jsonl'), join(dir, 'cfg-2.jsonl')];
    await run(shards[0], { index: 1, count: 2 });
    await run(shards[1], { index: 2, count: 2 });
    const cfg = join(dir, 'raise.yml');
    writeFileSync(cfg, 'severities:\n  consistent-with-registry: error\n');
    const levels = async (extra: string[], out: string) => {
      const io = memoryIo();
      await cli(['merge', ...shards, '--jsonl', out, '--fail-on', 'never', ...extra], io);
      expect(io.stderr.join('\n')).toBe('');
      return lines(out).flatMap((l) =>
        (l.findings as { check: string; severity?: string }[])
          .filter((f) => f.check === 'consistent-with-registry')
          .map((f) => f.severity),
      );
    };
    const plain = await levels([], join(dir, 'cfg-default.jsonl'));
    const raised = await levels(['--config', cfg], join(dir, 'cfg-raised.jsonl'));
    expect(plain.length).toBeGreaterThan(0);
    expect(plain).not.toEqual(plain.map(() => 'error'));
    expect(raised).toEqual(plain.map(() => 'error'));
  });
});
