/**
 * Per-record limits in the record audit and the bulk audit (issue 10): a record over its time limit gets a
 * record-time-limit finding carrying its id and the line of its structure, and every other record is audited
 * (records out == records in); too many components in one record is a schema finding and only the first 50
 * are read; records stopped in bulk keep their id in every output. Real engine; the structures are ordinary
 * (alanine, ethanol), the claims invented.
 */
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { DEFAULT_CONFIG } from '../../src/audit/config.js';
import { runAudit } from '../../src/audit/run.js';
import { CHECKS } from '../../src/checks/index.js';
import { renderSarif } from '../../src/report/sarif.js';
import { itemId } from '../../src/bulk/audit-item.js';
import { runBulkAudit, timeoutResult } from '../../src/bulk/run.js';
import { csvWriter, jsonWriter, jsonlWriter } from '../../src/bulk/writers.js';
import { tmpRegistry, type TmpRegistry } from '../registry/tmp-registry.js';

let reg: TmpRegistry | null = null;
afterEach(() => {
  reg?.remove();
  reg = null;
});

// 45 copies of L-alanine: under the component cap, but seconds of symmetry work
const heavy = Array(45).fill('C[C@H](N)C(=O)O').join('.');
const rec = (id: string, smiles: string, form = 'single-enantiomer') =>
  `id: ${id}\nname: test\nstructure:\n  smiles: "${smiles}"\nstereo:\n  form: ${form}\n`;

describe('record audit: per-record time limit', () => {
  it('a record over the limit gets a record-time-limit finding; the others are audited', async () => {
    reg = tmpRegistry({
      'compounds/a.yml': rec('LX-00001', 'C[C@H](N)C(=O)O'),
      'compounds/b.yml': `# a salt drawn with many copies\n${rec('LX-00002', heavy)}`,
      'compounds/c.yml': rec('LX-00003', 'CCO', 'achiral'),
    });
    const result = await runAudit({ root: reg.root, budget: { timeMs: 150, memoryMb: 1024 } });
    expect(result.records.map((r) => r.id)).toEqual(['LX-00001', 'LX-00002', 'LX-00003']);
    const stopped = result.records[1]!;
    expect(stopped.findings).toHaveLength(1);
    expect(stopped.findings[0]).toMatchObject({
      check: 'record-time-limit',
      messageId: 'time-limit-exceeded',
      severity: 'error',
      line: 4,
    });
    expect(stopped.findings[0]!.message).toContain('0.15 s time limit');
    expect(stopped.passed).toEqual([]);
    expect(result.records[0]!.passed.length).toBeGreaterThan(0);
    expect(result.records[2]!.passed.map((p) => p.check)).toContain('form-matches-structure');
    expect(result.summary.records).toBe(3);
    // SARIF 2.1.0: every result's ruleId names a rule of the log
    const sarif = JSON.parse(renderSarif(result, CHECKS)) as {
      runs: {
        tool: { driver: { rules: { id: string }[] } };
        results: { ruleId: string; ruleIndex: number }[];
      }[];
    };
    const rules = sarif.runs[0]!.tool.driver.rules.map((r) => r.id);
    const stop = sarif.runs[0]!.results.find((r) => r.ruleId === 'record-time-limit');
    expect(rules[stop!.ruleIndex]).toBe('record-time-limit');
  });

  it('more than 50 components: a schema finding at the list, only the first 50 read', async () => {
    const comps = Array.from({ length: 60 }, () => '    - smiles: "C[C@H](O)[C@@H](O)CC"').join('\n');
    reg = tmpRegistry({
      'compounds/m.yml': `id: LX-00010\nstructure:\n  smiles: "CC(O)C(O)CC"\nstereo:\n  form: diastereomer-mixture\n  components:\n${comps}\n`,
    });
    const result = await runAudit({ root: reg.root });
    const f = result.records[0]!.findings.find((x) => x.messageId === 'too-many-items');
    expect(f).toMatchObject({ check: 'record-schema', line: 6, field: 'stereo.components' });
    expect(f!.message).toContain('60 items, more than the limit of 50');
  });
});

describe('bulk audit: records stopped by the limit keep their id', () => {
  const dir = mkdtempSync(join(tmpdir(), 'stereogate-limits-'));

  it('inline: the record over the limit is reported under its id in JSON, JSON Lines and CSV', async () => {
    const csv = join(dir, 'in.csv');
    writeFileSync(
      csv,
      `id,smiles,stereo_form\nLX-1,CCO,achiral\nLX-2,${heavy},single enantiomer\nLX-3,CC,achiral\n`,
    );
    const out = { json: join(dir, 'o.json'), jsonl: join(dir, 'o.jsonl'), csv: join(dir, 'o.csv') };
    const run = await runBulkAudit({
      inputs: [csv],
      mapping: {},
      config: { ...DEFAULT_CONFIG },
      workers: 0,
      timeoutMs: 200,
      progress: 'none',
      writers: [jsonWriter(out.json), jsonlWriter(out.jsonl), csvWriter(out.csv)],
    });
    expect(run.trailer.summary.records).toBe(3);
    const json = JSON.parse(readFileSync(out.json, 'utf8')) as {
      records: { id: string; findings: { check: string }[] }[];
    };
    expect(json.records.map((r) => r.id)).toEqual(['LX-1', 'LX-2', 'LX-3']);
    expect(json.records[1]!.findings.map((f) => f.check)).toEqual(['record-time-limit']);
    const lines = readFileSync(out.jsonl, 'utf8').trim().split('\n');
    expect(lines).toHaveLength(4); // three records and the summary
    expect(JSON.parse(lines[1]!).id).toBe('LX-2');
    expect(readFileSync(out.csv, 'utf8')).toMatch(/^"2",[^\n]*,"LX-2",/m);
  });

  it('a record the pool stops (time limit or crashed worker) is reported under the id it would have had', () => {
    const sdItem = {
      source: 'in.sdf',
      record: 7,
      line: 120,
      seq: 7,
      text: 'LX-00077\n  x\n\n  1  0  0  0  0  0  0  0  0  0999 V2000\n    0.0 0.0 0.0 C   0  0\nM  END\n> <REG_NO>\nLX-77-B\n\n',
    };
    expect(itemId(sdItem, {})).toBe('LX-00077');
    expect(itemId(sdItem, { id: 'REG_NO' })).toBe('LX-77-B');
    const csvItem = { source: 'in.csv', record: 3, line: 4, seq: 3, fields: { id: 'LX-3', smiles: 'CC' } };
    expect(itemId(csvItem, {})).toBe('LX-3');
    expect(itemId({ ...csvItem, fields: { smiles: 'CC' } }, {})).toBe('in.csv#3');
    const r = timeoutResult(sdItem, 20_000, null, itemId(sdItem, {}));
    expect(r.id).toBe('LX-00077');
    expect(r.findings[0]!.check).toBe('record-time-limit');
  });
});

describe('smaller record faults (issue 10)', () => {
  it('ratio "0:0" is an error of ratio-and-ee-consistent', async () => {
    reg = tmpRegistry({
      'compounds/r.yml':
        'id: LX-00020\nstructure:\n  smiles: "C[C@H](O)CC"\nstereo:\n  form: racemate\n  ratio: "0:0"\n',
    });
    const result = await runAudit({ root: reg.root });
    const f = result.records[0]!.findings.find((x) => x.field === 'stereo.ratio');
    expect(f).toMatchObject({ check: 'ratio-and-ee-consistent', severity: 'error', line: 6 });
    expect(f!.message).toContain('states no proportion');
  });

  it('an unreadable SMILES holding / gives the SMILES error first, and no cis/trans finding', async () => {
    reg = tmpRegistry({
      'compounds/e.yml':
        'id: LX-00021\nname: (E)-1,2-difluoroethene\nstructure:\n  smiles: "F/C=C/(F"\nstereo:\n  form: single-diastereomer\n  descriptors: "(E)"\n',
    });
    const result = await runAudit({ root: reg.root });
    const findings = result.records[0]!.findings;
    expect(findings[0]).toMatchObject({ check: 'structure-readable', line: 4 });
    expect(findings[0]!.message).toContain("bond symbol before '('");
    expect(findings.filter((f) => f.check === 'descriptors-match-structure')).toEqual([]);
  });
});

describe('structures over a size cap', () => {
  it('300 dot-joined copies: a structure-over-limit finding at once, naming the cap', async () => {
    reg = tmpRegistry({
      'compounds/d.yml': rec('LX-00030', Array(300).fill('C[C@H](N)C(=O)O').join('.')),
    });
    const result = await runAudit({ root: reg.root });
    const f = result.records[0]!.findings.find((x) => x.check === 'structure-readable');
    expect(f).toMatchObject({ messageId: 'structure-over-limit', line: 4, severity: 'error' });
    expect(f!.message).toContain('300 separate components');
    expect(f!.message).toContain('over the limit of 50');
  });
});
