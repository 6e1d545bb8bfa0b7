/**
 * Memory stays flat whatever the input size (bulk audit issue): the pool's own accounting shows that no more
 * than its fixed window of records is ever read ahead or held for ordering, however many records stream through.
 * No timing and no resident-memory figure here (those are in `npm run bench -- bulk-memory`); the window is what
 * bounds memory. The structures are textbook molecules (from memory); the claims are invented.
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { Molecule } from 'openchemlib';
import { DEFAULT_CONFIG } from '../../src/audit/config.js';
import { runBulkAudit } from '../../src/bulk/run.js';
import type { PoolStats } from '../../src/bulk/pool.js';
import { MAX_WORDS, OTHER_WORDS, VocabularyTally, makeVocabulary } from '../../src/bulk/mapping.js';

const dir = mkdtempSync(join(tmpdir(), 'stereogate-memory-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** An SD file of `n` records: a few small molecules, each molfile written once by OpenChemLib and replicated. */
function writeSd(path: string, n: number): void {
  const forms = ['achiral', 'rac', 'single enantiomer', 'meso'];
  const blocks = ['CCO', 'C[C@H](O)CC', 'OC(=O)[C@@H](O)[C@@H](O)C(=O)O', 'CC(C)C'].map((s) =>
    Molecule.fromSmiles(s)
      .toMolfile()
      .replace(/^[^\n]*\n/, ''),
  );
  const parts: string[] = [];
  for (let i = 0; i < n; i++) {
    parts.push(
      `LX-${String(i + 1).padStart(5, '0')}\n${blocks[i % blocks.length]}\n> <FORM>\n${forms[i % forms.length]}\n\n$$$$\n`,
    );
  }
  writeFileSync(path, parts.join(''));
}

describe('bulk audit memory window', () => {
  it('20,000 SD records through 2 workers: read-ahead and ordering buffer stay within the fixed window', async () => {
    const path = join(dir, 'many.sdf');
    const n = 20_000;
    writeSd(path, n);
    let stats: PoolStats | null = null;
    const run = await runBulkAudit({
      inputs: [path],
      mapping: { form: 'FORM' },
      config: { ...DEFAULT_CONFIG },
      workers: 2,
      progress: 'none',
      writers: [],
      batchSize: 16,
      onPoolStats: (s) => (stats = s),
    });
    expect(run.trailer.summary.records).toBe(n);
    const s = stats as unknown as PoolStats;
    expect(s.items).toBe(n);
    // the window is a constant of the pool (batch size x workers x 4), not of the input
    expect(s.window).toBe(16 * 2 * 4);
    expect(s.maxAhead).toBeLessThanOrEqual(s.window);
    expect(s.maxBuffered).toBeLessThanOrEqual(s.window);
    expect(s.maxPending).toBeLessThanOrEqual(16 * 2 * 2);
    expect(s.replaced).toBe(0);
  }, 600_000);

  it('a free-text form column cannot grow the word tally without bound', () => {
    const vocab = makeVocabulary();
    const t = new VocabularyTally();
    for (let i = 0; i < MAX_WORDS + 500; i++) t.add(`note ${i}`, vocab(`note ${i}`));
    const { notUnderstood } = t.toJSON();
    expect(notUnderstood).toHaveLength(MAX_WORDS + 1);
    expect(notUnderstood.find(([w]) => w === OTHER_WORDS)?.[1]).toBe(500);
  });
});
