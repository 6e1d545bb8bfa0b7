/**
 * Origins in a bulk export: an origin column names inputs by their ids within the same export (or as SMILES),
 * and each record is judged against them although the workers audit records one at a time. The chemistry is the
 * textbook case of the origin check (from memory): N-acetylation of L-alanine keeps its centre; sodium borohydride
 * reduction of acetophenone gives the racemate. The export and its ids are invented.
 */
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { DEFAULT_CONFIG } from '../../src/audit/config.js';
import { runBulkAudit } from '../../src/bulk/run.js';
import { jsonlWriter } from '../../src/bulk/writers.js';
import { splitOriginEntries } from '../../src/bulk/origins.js';

const dir = mkdtempSync(join(tmpdir(), 'stereogate-bulk-origin-'));
const csv = join(dir, 'larkspur.csv');
// the product comes before its input in the file: the lookup must not depend on the order
writeFileSync(
  csv,
  [
    'REG_NO,SMILES,STEREO,EE,MADE_FROM,CONTROL',
    'LX-7,CC(=O)N[C@H](C)C(=O)O,abs,99,LX-5; CC(=O)OC(C)=O,none', // drawn (R): wrong on purpose
    'LX-6,CC(=O)N[C@@H](C)C(=O)O,abs,99,"LX-5, CC(=O)OC(C)=O",none', // (S): right
    'LX-5,N[C@@H](C)C(=O)O,enantiopure,99.5,,', // L-alanine
    'LX-8,C[C@@H](O)c1ccccc1,abs,,CC(=O)c1ccccc1,none', // NaBH4 product claimed one enantiomer
    'LX-9,CC(O)c1ccccc1,rac,,LX-99,none', // no LX-99 in the export
    'LX-10,CC(O)c1ccccc1,rac,,CC(=O)c1ccccc1,sometimes', // a control word that is not ours
  ].join('\n') + '\n',
);
const mapping = {
  id: 'REG_NO',
  structure: 'SMILES',
  form: 'STEREO',
  ee: 'EE',
  origin: 'MADE_FROM',
  control: 'CONTROL',
};

async function audit(workers: number) {
  const out = join(dir, `out-${workers}.jsonl`);
  await runBulkAudit({
    inputs: [csv],
    mapping,
    config: { ...DEFAULT_CONFIG },
    workers,
    progress: 'none',
    writers: [jsonlWriter(out)],
  });
  const recs = readFileSync(out, 'utf8')
    .trim()
    .split('\n')
    .map(
      (l) => JSON.parse(l) as { kind: string; id: string; findings: { check: string; messageId: string }[] },
    )
    .filter((l) => l.kind === 'record');
  return (id: string) =>
    recs
      .find((r) => r.id === id)!
      .findings.filter((f) => f.check === 'origin-supports-claim' || f.check === 'record-schema')
      .map((f) => `${f.check}/${f.messageId}`);
}

describe('bulk: origin column', () => {
  it('splits origin cells at ; and , but not inside a CXSMILES block', () => {
    expect(splitOriginEntries('LX-5; CC(=O)O, C[C@H](O)CC |&1:1,2|')).toEqual([
      'LX-5',
      'CC(=O)O',
      'C[C@H](O)CC |&1:1,2|',
    ]);
  });
  for (const workers of [0, 2]) {
    it(`judges each record against its inputs looked up in the export (${workers} workers)`, async () => {
      const of = await audit(workers);
      expect(of('LX-7')).toEqual(['origin-supports-claim/carried-enantiomer']);
      expect(of('LX-6')).toEqual([]);
      expect(of('LX-5')).toEqual([]);
      expect(of('LX-8')).toEqual(['origin-supports-claim/no-source-of-bias']);
      expect(of('LX-9')).toEqual(['origin-supports-claim/input-not-found']);
      expect(of('LX-10')).toHaveLength(1);
      expect(of('LX-10')[0]).toMatch(/^record-schema\//);
    });
  }
});
