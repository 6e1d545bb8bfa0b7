/**
 * selectRecords against its plain definition (a path names the record file itself, every record file under it
 * as a folder, every record using it as a molfile; '' or '.' names all): the sorted-index lookup must select
 * exactly the same records (property test; our own definition, no outside source).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { normalizePath, selectRecords } from '../../src/audit/select.js';
import { NO_POSITIONS } from '../../src/registry/positions.js';
import type { LoadedRecord } from '../../src/registry/types.js';

const ROOT = '/registry';
const SEGMENTS = ['a', 'a-b', 'a.yml', 'b', 'b.yml', 'x.mol', 'c'];

function record(file: string, molfile: string | null): LoadedRecord {
  return {
    file,
    id: file,
    record: null,
    positions: NO_POSITIONS,
    problems: [],
    origin: { kind: 'file' },
    sources: {
      main: molfile === null ? null : { field: 'structure', format: 'molfile', text: null, file: molfile },
      components: [],
    },
  };
}

/** The definition, record by record. */
function naive(records: readonly LoadedRecord[], paths: readonly string[]): Set<LoadedRecord> {
  const out = new Set<LoadedRecord>();
  for (const given of paths) {
    const p = normalizePath(ROOT, given);
    for (const r of records) {
      if (p === '' || r.file === p || r.file.startsWith(`${p}/`) || r.sources?.main?.file === p) out.add(r);
    }
  }
  return out;
}

const path = fc.array(fc.constantFrom(...SEGMENTS), { minLength: 1, maxLength: 3 }).map((s) => s.join('/'));

describe('selectRecords', () => {
  it('selects what the plain definition selects (property)', () => {
    fc.assert(
      fc.property(
        fc.uniqueArray(path, { minLength: 0, maxLength: 12 }),
        fc.array(fc.option(path, { nil: null }), { minLength: 12, maxLength: 12 }),
        fc.array(fc.oneof(path, fc.constantFrom('', '.', './a', 'a/')), { minLength: 1, maxLength: 4 }),
        (files, molfiles, paths) => {
          const records = files.map((f, i) => record(f, molfiles[i] ?? null));
          const sel = selectRecords(records, ROOT, paths);
          const want = naive(records, paths);
          expect([...sel.selected].map((r) => r.file).sort()).toEqual([...want].map((r) => r.file).sort());
          const unmatched = paths.filter((g) => naive(records, [g]).size === 0);
          expect(sel.unmatched).toEqual(unmatched);
        },
      ),
      { numRuns: 500 },
    );
  });
});
