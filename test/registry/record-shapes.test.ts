/**
 * Record files of any shape never crash the audit (issue 10): a scalar where a mapping belongs is a record-schema
 * finding at its line and the other records are still audited; the schema explanation is total over every JSON
 * value (property test); tags outside plain YAML/JSON are findings; CR-only line ends give real line numbers.
 */
import fc from 'fast-check';
import { stringify } from 'yaml';
import { afterEach, describe, expect, it } from 'vitest';
import { runAudit } from '../../src/audit/run.js';
import { parseRecordText } from '../../src/registry/parse.js';
import { validateConfigShape, validateRecordShape } from '../../src/registry/schema.js';
import { tmpRegistry, type TmpRegistry } from './tmp-registry.js';
import { fakeEngine } from '../audit/fake-engine.js';
import { formCheck } from '../audit/fake-checks.js';

let reg: TmpRegistry | null = null;
afterEach(() => {
  reg?.remove();
  reg = null;
});

const good = 'id: LX-00009\nstructure:\n  smiles: CC\nstereo:\n  form: achiral\n';

describe('a scalar where a mapping belongs', () => {
  it.each([
    ['structure: CCO', 'id: LX-00001\nstructure: CCO\nstereo:\n  form: achiral\n', 'structure', 2],
    ['structure: 12', 'id: LX-00001\nstructure: 12\nstereo:\n  form: achiral\n', 'structure', 2],
    [
      'components: [CCO]',
      'id: LX-00001\nstructure:\n  smiles: CC\nstereo:\n  form: diastereomer-mixture\n  components: [CCO]\n',
      'stereo.components.0',
      6,
    ],
    ['stereo: racemate', 'id: LX-00001\nstructure:\n  smiles: CC\nstereo: racemate\n', 'stereo', 4],
    ['the record is a list', '- LX-00001\n- CC\n', '', 1],
    ['the record is a number', '42\n', '', 1],
  ])(
    '%s: a record-schema finding at its line, the other records audited',
    async (_what, text, path, line) => {
      reg = tmpRegistry({ 'compounds/a.yml': text, 'compounds/b.yml': good });
      const result = await runAudit({ root: reg.root, checks: [formCheck], engine: fakeEngine() });
      expect(result.records).toHaveLength(2);
      const schema = result.records[0]!.findings.filter((f) => f.check === 'record-schema');
      expect(schema.length).toBeGreaterThan(0);
      const at = schema.find((f) => (f.field ?? '') === path);
      expect(at?.line).toBe(line);
      expect(at?.messageId).toBe('wrong-type');
      expect(result.records[1]!.passed.map((p) => p.check)).toEqual(['fake-form']);
    },
  );

  it('says what a structure reference needs', () => {
    const problems = validateRecordShape({ id: 'LX-1', structure: 'CCO', stereo: { form: 'achiral' } });
    expect(problems).toEqual([
      {
        path: 'structure',
        code: 'wrong-type',
        message:
          "structure: must be a mapping of fields, found the text 'CCO' (write it as smiles: … or molfile: … on the next line, indented)",
      },
    ]);
  });
});

describe('the schema explanation is total', () => {
  // fast-check, seeded and bounded: any JSON value, and any value placed at every field of a valid record
  const params = { seed: 1010, numRuns: 400 };
  const fields = ['id', 'name', 'structure', 'stereo', 'waivers'] as const;
  const inner = ['form', 'descriptors', 'ee', 'ratio', 'components', 'rotation', 'evidence'] as const;

  it('random JSON values never throw (record and config schemas)', () => {
    fc.assert(
      fc.property(fc.jsonValue(), (v) => {
        expect(Array.isArray(validateRecordShape(v))).toBe(true);
        expect(Array.isArray(validateConfigShape(v))).toBe(true);
      }),
      params,
    );
  });

  it('a random value in any field of a record never throws, and every problem names a path and says why', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(
          ...fields,
          ...inner.map((k) => `stereo.${k}`),
          'structure.smiles',
          'stereo.components.0',
        ),
        fc.oneof(fc.jsonValue(), fc.anything()),
        (field, v) => {
          const rec: Record<string, unknown> = {
            id: 'LX-1',
            structure: { smiles: 'CC' },
            stereo: { form: 'achiral', components: [{ smiles: 'CC' }] },
          };
          const parts = field.split('.');
          let cur = rec as Record<string, unknown>;
          for (const p of parts.slice(0, -1)) cur = cur[p] as Record<string, unknown>;
          cur[parts[parts.length - 1]!] = v;
          for (const p of validateRecordShape(rec)) {
            expect(typeof p.message).toBe('string');
            expect(p.message.length).toBeGreaterThan(0);
          }
        },
      ),
      params,
    );
  });

  it('random YAML and JSON documents never throw through the record parser', () => {
    fc.assert(
      fc.property(fc.jsonValue(), fc.boolean(), (v, asJson) => {
        const text = asJson ? JSON.stringify(v) : stringify(v);
        const parsed = parseRecordText(text ?? '');
        for (const p of parsed.problems) expect(p.line === null || p.line >= 1).toBe(true);
      }),
      params,
    );
  });
});

describe('YAML beyond plain values', () => {
  it.each([
    ['id: LX-1\nstructure: !foo\n  smiles: CC\nstereo:\n  form: achiral\n', 2, '!foo'],
    ['id: !!binary aGVsbG8=\nstructure:\n  smiles: CC\nstereo:\n  form: achiral\n', 1, '!!binary'],
    ['id: LX-1\nstructure:\n  smiles: CC\nstereo: !!set {form, x}\n', 4, '!!set'],
    ['id: LX-1\nstructure:\n  smiles: !!int CC\nstereo:\n  form: achiral\n', 3, '!!int'],
  ])('an unknown or misused tag is a finding at its line (%#)', (text, line, tag) => {
    const parsed = parseRecordText(text);
    expect(parsed.record).toBeNull();
    expect(parsed.problems).toHaveLength(1);
    expect(parsed.problems[0]).toMatchObject({ code: 'unknown-tag', line });
    expect(parsed.problems[0]!.message).toContain(tag);
  });

  it('core tags (!!str) are plain values', () => {
    const parsed = parseRecordText('id: !!str LX-1\nstructure:\n  smiles: CC\nstereo:\n  form: achiral\n');
    expect(parsed.problems).toEqual([]);
  });

  it('a list as a key is a finding, not a stringified field', () => {
    const parsed = parseRecordText('id: LX-1\nstructure:\n  ? [a, b]\n  : CC\nstereo:\n  form: achiral\n');
    expect(parsed.problems[0]).toMatchObject({ code: 'yaml-syntax', line: 3 });
  });
});

describe('line ends', () => {
  it.each([
    ['CR only', '\r'],
    ['CRLF', '\r\n'],
    ['LF', '\n'],
  ])('%s: the finding points at the line an editor shows', (_name, eol) => {
    const text = ['id: LX-1', 'structure:', '  smiles: CC', 'stereo:', '  form: achirall', ''].join(eol);
    const parsed = parseRecordText(text);
    expect(parsed.problems).toHaveLength(1);
    expect(parsed.problems[0]).toMatchObject({ path: 'stereo.form', line: 5, code: 'not-allowed-value' });
  });
});
