/**
 * Fuzz (fast-check, seeded, bounded) through the two audits with the real engine: random YAML/JSON record files
 * through the record audit, corrupt SD and CSV/TSV exports through the bulk audit. Zero uncaught errors, no
 * internal-error finding, and records out == records in. Structures are ordinary molecules; ids follow the
 * invented Larkspur scheme (LX-nnnnn).
 */
import fc from 'fast-check';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { stringify } from 'yaml';
import { describe, expect, it } from 'vitest';
import { runAudit } from '../../src/audit/run.js';
import { tmpRegistry } from '../registry/tmp-registry.js';
import { auditExport } from '../bulk/inline-audit.js';

const SMILES = [
  'CCO',
  'C[C@H](N)C(=O)O',
  'OC(=O)[C@@H](O)[C@H](O)C(=O)O',
  'C/C=C/C',
  'C1CC1(',
  'C[C@@H](O)CC',
];
const FORMS = ['achiral', 'meso', 'racemate', 'single-enantiomer', 'diastereomer-mixture', 'rac', 'unknown'];

/** A record-like value: mostly well-formed, any field may be replaced by any JSON value. */
const recordValue = fc
  .record({
    id: fc.oneof(
      fc.integer({ min: 1, max: 99999 }).map((n) => `LX-${String(n).padStart(5, '0')}`),
      fc.jsonValue(),
    ),
    structure: fc.oneof(
      fc.constantFrom(...SMILES).map((smiles) => ({ smiles })),
      fc.jsonValue(),
    ),
    stereo: fc.oneof(
      fc.record({
        form: fc.oneof(fc.constantFrom(...FORMS), fc.jsonValue()),
        ratio: fc.oneof(fc.constantFrom('50:50', '0:0', '70:30', ':', '1:x'), fc.jsonValue()),
        components: fc.oneof(
          fc.array(
            fc.constantFrom(...SMILES).map((smiles) => ({ smiles })),
            { maxLength: 3 },
          ),
          fc.jsonValue(),
        ),
      }),
      fc.jsonValue(),
    ),
    extra: fc.jsonValue(),
  })
  .map(({ extra, ...r }) => (Math.random() < 0 ? extra : r));

/** The text of a record file: YAML or JSON, sometimes with CR line ends, a tag, or a cut. */
const recordText = fc
  .record({
    value: fc.oneof(recordValue, fc.jsonValue()),
    json: fc.boolean(),
    damage: fc.constantFrom('none', 'cr', 'tag', 'cut', 'tab'),
    at: fc.nat(),
  })
  .map(({ value, json, damage, at }) => {
    let text = json ? (JSON.stringify(value) ?? 'null') : stringify(value);
    const i = text.length === 0 ? 0 : at % text.length;
    if (damage === 'cr') text = text.replace(/\n/g, '\r');
    else if (damage === 'tag') text = text.slice(0, i) + ' !odd ' + text.slice(i);
    else if (damage === 'cut') text = text.slice(0, i);
    else if (damage === 'tab') text = text.slice(0, i) + '\t' + text.slice(i);
    return text;
  });

describe('fuzz: record folders through the record audit', () => {
  it('random record files: no uncaught error, no internal-error finding, one result per file', async () => {
    await fc.assert(
      fc.asyncProperty(fc.array(recordText, { minLength: 1, maxLength: 6 }), async (texts) => {
        const reg = tmpRegistry(Object.fromEntries(texts.map((t, i) => [`compounds/r${i}.yml`, t])));
        try {
          const result = await runAudit({ root: reg.root });
          expect(result.records).toHaveLength(texts.length);
          for (const r of result.records) {
            expect(r.findings.filter((f) => f.check === 'internal-error')).toEqual([]);
          }
        } finally {
          reg.remove();
        }
      }),
      { seed: 5151, numRuns: 40 },
    );
  });
});

const dir = mkdtempSync(join(tmpdir(), 'stereogate-fuzz-'));
let runNo = 0;

const bulk = (name: string, text: string) => auditExport(join(dir, `${++runNo}-${name}`), text);

/** A field of a row, sometimes damaged: a stray quote at its start, a lone CR, the delimiter inside quotes. */
const cell = (base: fc.Arbitrary<string>, delimiter: string) =>
  fc
    .record({ v: base, damage: fc.constantFrom('none', 'none', 'quote', 'cr', 'delim', 'empty', 'dquote') })
    .map(({ v, damage }) => {
      if (damage === 'quote') return `"${v}`;
      if (damage === 'cr') return `${v}\r${v}`;
      if (damage === 'delim') return `"${v}${delimiter}${v}"`;
      if (damage === 'dquote') return `"${v}""x"`;
      if (damage === 'empty') return '';
      return v;
    });

describe('fuzz: corrupt CSV and TSV exports through the bulk audit', () => {
  it('rows with stray quotes, lone CRs, quoted delimiters: records out == rows in', async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.constantFrom(',', '\t'),
        fc.integer({ min: 1, max: 8 }),
        fc.nat(),
        async (delimiter, n, seed) => {
          const rows = fc.sample(
            fc.tuple(
              cell(
                fc.integer({ min: 1, max: 99999 }).map((k) => `LX-${k}`),
                delimiter,
              ),
              cell(fc.constantFrom(...SMILES), delimiter),
              cell(fc.constantFrom(...FORMS), delimiter),
            ),
            { numRuns: n, seed },
          );
          const text =
            [['id', 'smiles', 'stereo_form'], ...rows].map((r) => r.join(delimiter)).join('\n') + '\n';
          const out = await bulk(delimiter === ',' ? 'x.csv' : 'x.tsv', text);
          expect(out.records).toHaveLength(n);
          for (const r of out.records)
            expect(r.findings.filter((f) => f.check === 'internal-error')).toEqual([]);
        },
      ),
      { seed: 5252, numRuns: 40 },
    );
  });
});

// meso-tartaric acid skeleton as a V2000 molfile, without hydrogens (drawn by hand)
const MOL = [
  '',
  '  stereogate',
  '',
  '  4  3  0  0  0  0  0  0  0  0999 V2000',
  '    0.0000    0.0000    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0',
  '    1.2990    0.7500    0.0000 C   0  0  0  0  0  0  0  0  0  0  0  0',
  '    1.2990    2.2500    0.0000 O   0  0  0  0  0  0  0  0  0  0  0  0',
  '    2.5981    0.0000    0.0000 Cl  0  0  0  0  0  0  0  0  0  0  0  0',
  '  1  2  1  0',
  '  2  3  1  1',
  '  2  4  1  0',
  'M  END',
  '> <stereo_form>',
  'racemate',
  '',
];

describe('fuzz: corrupt SD files through the bulk audit', () => {
  it('records with damaged molfile lines and lost $$$$ lines: records out == records in', async () => {
    const damage = fc.record({
      kind: fc.constantFrom('none', 'drop-line', 'edit', 'lose-separator', 'blank-title', 'second-end'),
      line: fc.integer({ min: 4, max: 10 }), // inside the atom and bond blocks
      ch: fc.constantFrom('X', '9', ' ', '-'),
    });
    await fc.assert(
      fc.asyncProperty(fc.array(damage, { minLength: 1, maxLength: 8 }), async (plan) => {
        let text = '';
        plan.forEach((d, i) => {
          const lines = [...MOL];
          lines[0] = d.kind === 'blank-title' ? '' : `LX-${String(i + 1).padStart(5, '0')}`;
          if (d.kind === 'drop-line') lines.splice(d.line, 1);
          if (d.kind === 'edit')
            lines[d.line] = lines[d.line]!.slice(0, 12) + d.ch + lines[d.line]!.slice(13);
          if (d.kind === 'second-end') lines.push('M  END', '');
          text += lines.join('\n') + '\n';
          // a lost $$$$ keeps the records apart only when the next record's counts line is intact
          const nextIntact = i + 1 < plan.length && plan[i + 1]!.kind !== 'drop-line';
          if (!(d.kind === 'lose-separator' && nextIntact)) text += '$$$$\n';
        });
        const out = await bulk('x.sdf', text);
        expect(out.records).toHaveLength(plan.length);
        for (const r of out.records)
          expect(r.findings.filter((f) => f.check === 'internal-error')).toEqual([]);
      }),
      { seed: 5353, numRuns: 40 },
    );
  });
});
