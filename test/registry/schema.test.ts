/**
 * The published schemas against the TypeScript contracts: the record schema's forms are STEREO_FORMS, the config
 * schema covers every AuditConfig key and accepts the defaults; closest-word suggestions.
 */
import { Ajv } from 'ajv';
import { describe, expect, it } from 'vitest';
import recordSchema from '../../schema/record.schema.json' with { type: 'json' };
import configSchema from '../../schema/config.schema.json' with { type: 'json' };
import { STEREO_FORMS } from '../../src/registry/types.js';
import { DEFAULT_CONFIG, DEFAULT_SOURCES } from '../../src/audit/config.js';
import {
  AJV_OPTIONS,
  validateConfigShape,
  validateRecordShape,
  pointerToPath,
} from '../../src/registry/schema.js';
import { closestWord, editDistance } from '../../src/registry/closest.js';

describe('schemas and contracts', () => {
  it('both schemas are valid JSON Schema draft-07 (checked against its meta-schema, json-schema.org)', () => {
    // the audit compiles them without this check (validateSchema: false), so it is made here
    const ajv = new Ajv({ ...AJV_OPTIONS });
    for (const schema of [recordSchema, configSchema]) {
      expect(ajv.validateSchema(schema), JSON.stringify(ajv.errors)).toBe(true);
      expect(() => ajv.compile({ ...schema, $id: `${schema.$id}#test` })).not.toThrow();
    }
    expect(ajv.validateSchema({ type: 'no-such-type' })).toBe(false);
  });

  it('the record schema lists exactly the stereo forms of the TypeScript type', () => {
    expect(recordSchema.properties.stereo.properties.form.enum).toEqual([...STEREO_FORMS]);
  });

  it('the config schema has every AuditConfig key, and the defaults pass it', () => {
    expect(Object.keys(configSchema.properties).sort()).toEqual(Object.keys(DEFAULT_CONFIG).sort());
    expect(validateConfigShape(DEFAULT_CONFIG)).toEqual([]);
  });

  it('every default says where it comes from', () => {
    for (const key of Object.keys(DEFAULT_CONFIG)) {
      expect(DEFAULT_SOURCES[key as keyof typeof DEFAULT_SOURCES]?.length ?? 0).toBeGreaterThan(20);
    }
  });

  it('the issue’s example record passes the schema', () => {
    const example = {
      id: 'LX-00042',
      name: '(2R,3R)-2,3-dihydroxybutanedioic acid',
      structure: { smiles: 'OC(=O)[C@@H](O)[C@H](O)C(=O)O' },
      stereo: {
        form: 'single-enantiomer',
        descriptors: '(2R,3R)',
        ee: 99.5,
        ratio: '50:50',
        components: [{ smiles: 'C', descriptors: '(2R,3S)' }],
        rotation: {
          value: 12.1,
          wavelength_nm: 589,
          temperature_c: 20,
          solvent: 'water',
          concentration: 1.0,
        },
        evidence: ['chiral HPLC', 'X-ray'],
      },
      waivers: [{ check: 'some-check', reason: 'why', approved_by: 'who' }],
    };
    expect(validateRecordShape(example)).toEqual([]);
  });

  it('rejects a record that is not a mapping', () => {
    expect(validateRecordShape(['a'])[0]!.message).toBe(
      'the record: must be a mapping of fields, found a list',
    );
  });

  it('config problems name the field', () => {
    const p = validateConfigShape({ severities: { x: 'loud' }, eeTolerance: -1, extra: 1 });
    const paths = p.map((x) => x.path).sort();
    expect(paths).toEqual(['eeTolerance', 'extra', 'severities.x']);
  });

  it('pointerToPath decodes JSON-pointer escapes (RFC 6901 §4)', () => {
    expect(pointerToPath('/a~1b/c~0d/0')).toBe('a/b.c~d.0');
    expect(pointerToPath('')).toBe('');
  });
});

describe('closestWord', () => {
  it('edit distance (Levenshtein): kitten -> sitting is 3 (classic textbook example, from memory)', () => {
    expect(editDistance('kitten', 'sitting')).toBe(3);
    expect(editDistance('', 'abc')).toBe(3);
  });
  it('suggests near words and prefixes, nothing for far ones', () => {
    const forms = [...STEREO_FORMS];
    expect(closestWord('racemic', forms)).toBe('racemate');
    expect(closestWord('enantiopure', forms)).toBe(null);
    expect(closestWord('single-enantiomers', forms)).toBe('single-enantiomer');
    expect(closestWord('diastereomer', forms)).toBe('diastereomer-mixture');
    expect(closestWord('xyz', forms)).toBe(null);
  });
  it('suggests the form a chemist’s word means (Gold Book: racemate, scalemic), not the nearest spelling', () => {
    const p = validateRecordShape({
      id: 'LX-1',
      structure: { smiles: 'C' },
      stereo: { form: 'enantiopure' },
    });
    expect(p[0]!.message).toContain("did you mean 'single-enantiomer'?");
    const q = validateRecordShape({ id: 'LX-1', structure: { smiles: 'C' }, stereo: { form: 'Scalemic' } });
    expect(q[0]!.message).toContain("did you mean 'enantioenriched'?");
    const c = validateConfigShape({ severities: { x: 'racemic' } });
    expect(c[0]!.message).not.toContain('did you mean');
  });
});
