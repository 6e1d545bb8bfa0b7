/**
 * Loader: positions, schema problems, JSON records, duplicate ids, unreadable files, molfile path safety.
 * Line numbers are counted by hand from the texts below; the YAML 1.2 and JSON (RFC 8259) syntax rules are the
 * external reference for what is a syntax error.
 */
import { mkdirSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { loadRegistry } from '../../src/registry/load.js';
import { tmpRegistry, type TmpRegistry } from './tmp-registry.js';

let reg: TmpRegistry | null = null;
afterEach(() => {
  reg?.remove();
  reg = null;
});

const GOOD = `id: LX-00001
name: (R)-butan-2-ol
structure:
  smiles: "C[C@@H](O)CC"
stereo:
  form: single-enantiomer
  ee: 99
`;

function load(files: Record<string, string | Buffer>) {
  reg = tmpRegistry(files);
  return loadRegistry(reg.root, { recordDirs: ['compounds'] });
}

describe('record positions and schema problems', () => {
  it('a valid YAML record loads with field positions', () => {
    const { records } = load({ 'compounds/a.yml': GOOD });
    expect(records).toHaveLength(1);
    const r = records[0]!;
    expect(r.problems).toEqual([]);
    expect(r.id).toBe('LX-00001');
    expect(r.record?.stereo.form).toBe('single-enantiomer');
    expect(r.positions.get('stereo.form')).toEqual({ line: 6, column: 3 });
    expect(r.positions.get('structure.smiles')?.line).toBe(4);
    expect(r.sources?.main).toEqual({ field: 'structure', format: 'smiles', text: 'C[C@@H](O)CC' });
  });

  it("a wrong form is a problem at the form's line, with the closest allowed word", () => {
    const text = GOOD.replace('form: single-enantiomer', 'form: racemic');
    const r = load({ 'compounds/a.yml': text }).records[0]!;
    expect(r.record).toBeNull();
    expect(r.id).toBe('LX-00001');
    expect(r.problems).toHaveLength(1);
    expect(r.problems[0]).toMatchObject({ path: 'stereo.form', line: 6, code: 'not-allowed-value' });
    expect(r.problems[0]!.message).toContain("'racemic' is not one of achiral, meso");
    expect(r.problems[0]!.message).toContain("did you mean 'racemate'?");
  });

  it('extra fields, missing fields, out-of-range numbers and list items get their own lines', () => {
    const text = [
      'id: LX-00002', //                1
      'structure:', //                  2
      '  smiles: CC', //                3
      '  molfile: a.mol', //            4
      'stereo:', //                     5
      '  ee: 120', //                   6
      '  colour: red', //               7
      '  components:', //               8
      '    - smiles: C', //             9
      '    - descriptors: "(R)"', //    10
      'waivers:', //                    11
      '  - check: x', //                12
      '    reasn: typo', //             13
      'extra: 1', //                    14
    ].join('\n');
    const r = load({ 'compounds/b.yaml': text }).records[0]!;
    const byPath = Object.fromEntries(r.problems.map((p) => [p.path, p]));
    expect(byPath['stereo.form']).toMatchObject({ line: 5 }); // missing: points at its parent
    expect(byPath['stereo.form']!.message).toContain('required');
    expect(byPath['stereo.ee']).toMatchObject({ line: 6 });
    expect(byPath['stereo.ee']!.message).toContain('at most 100');
    expect(byPath['stereo.colour']).toMatchObject({ line: 7, code: 'unknown-field' });
    expect(byPath['stereo.form']!.code).toBe('missing-field');
    expect(byPath['stereo.ee']!.code).toBe('out-of-range');
    expect(byPath['structure']!.code).toBe('structure-choice');
    expect(byPath['stereo.colour']!.message).toContain('not a field');
    expect(byPath['structure']).toMatchObject({ line: 2 });
    expect(byPath['structure']!.message).toContain('exactly one of smiles or molfile (found both)');
    expect(byPath['stereo.components.1']).toMatchObject({ line: 10 });
    expect(byPath['stereo.components.1']!.message).toContain('found neither');
    expect(byPath['waivers.0.reasn']).toMatchObject({ line: 13 });
    expect(byPath['waivers.0.reasn']!.message).toContain("did you mean 'reason'?");
    expect(byPath['extra']).toMatchObject({ line: 14 });
    // sorted by line
    const lines = r.problems.map((p) => p.line ?? 0);
    expect([...lines].sort((a, b) => a - b)).toEqual(lines);
  });

  it('a number where text is required says so and suggests quotes', () => {
    const r = load({ 'compounds/a.yml': GOOD.replace('id: LX-00001', 'id: 12345') }).records[0]!;
    expect(r.problems[0]).toMatchObject({ path: 'id', line: 1 });
    expect(r.problems[0]!.message).toContain('must be text, found number 12345 (put it in quotes)');
  });

  it('a YAML syntax error is a problem with its line', () => {
    const r = load({ 'compounds/a.yml': 'id: LX-1\nstereo:\n  form: [achiral\nstructure: {smiles: C}\n' })
      .records[0]!;
    expect(r.record).toBeNull();
    expect(r.problems.length).toBeGreaterThan(0);
    expect(r.problems[0]!.message).toMatch(/^not valid YAML\/JSON/);
    expect(r.problems[0]!.code).toBe('yaml-syntax');
    expect(r.problems[0]!.line).toBeGreaterThanOrEqual(3);
  });

  it('a duplicate key is a syntax problem (YAML 1.2 §3.2.1.1: mapping keys are unique)', () => {
    const r = load({ 'compounds/a.yml': `${GOOD}id: LX-00009\n` }).records[0]!;
    expect(r.problems[0]!.message).toContain('not valid YAML/JSON');
    expect(r.problems[0]!.line).toBe(8);
  });

  it('an empty file is a problem', () => {
    const r = load({ 'compounds/a.yml': '\n# nothing\n' }).records[0]!;
    expect(r.problems[0]!.message).toContain('empty');
  });
});

describe('JSON records', () => {
  it('JSON goes through the same parser and keeps lines (tabs allowed, RFC 8259 §2 whitespace)', () => {
    const json =
      '{\n\t"id": "LX-00003",\n\t"structure": {"smiles": "OCC"},\n\t"stereo": {\n\t\t"form": "meso"\n\t}\n}\n';
    const r = load({ 'compounds/c.json': json }).records[0]!;
    expect(r.problems).toEqual([]);
    expect(r.positions.get('stereo.form')?.line).toBe(5);
    expect(r.positions.get('structure.smiles')?.line).toBe(3);
  });

  it('a JSON schema error points at the JSON line', () => {
    const json =
      '{\n  "id": "LX-00003",\n  "structure": {"smiles": "OCC"},\n  "stereo": {"form": "mesoo"}\n}\n';
    const r = load({ 'compounds/c.json': json }).records[0]!;
    expect(r.problems[0]).toMatchObject({ path: 'stereo.form', line: 4 });
    expect(r.problems[0]!.message).toContain("did you mean 'meso'?");
  });
});

describe('registry-wide problems', () => {
  it('a duplicate id is a problem on both records, naming the other file', () => {
    const { records } = load({
      'compounds/a.yml': GOOD,
      'compounds/sub/b.yml': GOOD.replace('ee: 99', 'ee: 98'),
    });
    expect(records.map((r) => r.file)).toEqual(['compounds/a.yml', 'compounds/sub/b.yml']);
    expect(records[0]!.problems[0]).toMatchObject({ path: 'id', line: 1, code: 'duplicate-id' });
    expect(records[0]!.problems[0]!.message).toContain('compounds/sub/b.yml');
    expect(records[1]!.problems[0]!.message).toContain('compounds/a.yml');
  });

  it('binary and non-UTF-8 files are problems, not crashes', () => {
    const { records } = load({
      'compounds/bin.yml': Buffer.from([0x69, 0x64, 0x00, 0x01, 0x02]),
      'compounds/latin1.yml': Buffer.from('id: caf\xe9\n', 'latin1'),
    });
    const msg = Object.fromEntries(records.map((r) => [r.file, r.problems[0]?.message]));
    expect(msg['compounds/bin.yml']).toContain('binary');
    expect(msg['compounds/latin1.yml']).toContain('not valid UTF-8');
  });

  it('a missing record folder is reported', () => {
    reg = tmpRegistry({ 'elsewhere/a.yml': GOOD });
    expect(loadRegistry(reg.root, { recordDirs: ['compounds'] }).missingDirs).toEqual(['compounds']);
  });

  it('only *.yml, *.yaml and *.json are records; hidden folders are skipped', () => {
    const { records } = load({
      'compounds/a.yml': GOOD,
      'compounds/a.mol': 'not a record',
      'compounds/.hidden/x.yml': GOOD,
      'compounds/notes.txt': 'x',
    });
    expect(records.map((r) => r.file)).toEqual(['compounds/a.yml']);
  });
});

describe('molfile paths stay inside the registry', () => {
  const withMolfile = (path: string) => GOOD.replace('  smiles: "C[C@@H](O)CC"', `  molfile: "${path}"`);

  it('a molfile beside the record is read', () => {
    const { records } = load({ 'compounds/a.yml': withMolfile('a.mol'), 'compounds/a.mol': 'MOLTEXT\n' });
    expect(records[0]!.sources?.main).toMatchObject({
      format: 'molfile',
      text: 'MOLTEXT\n',
      file: 'compounds/a.mol',
    });
  });

  it('a path that climbs out with .. is refused', () => {
    const { records } = load({ 'compounds/a.yml': withMolfile('../../outside.mol') });
    expect(records[0]!.sources?.main?.text).toBeNull();
    expect(records[0]!.sources?.main?.error).toContain('leaves the registry folder');
  });

  it('.. that stays inside is fine', () => {
    const { records } = load({
      'compounds/a.yml': withMolfile('../structures/a.mol'),
      'structures/a.mol': 'M\n',
    });
    expect(records[0]!.sources?.main).toMatchObject({ text: 'M\n', file: 'structures/a.mol' });
  });

  it('an absolute path is refused', () => {
    const { records } = load({ 'compounds/a.yml': withMolfile('/etc/passwd') });
    expect(records[0]!.sources?.main?.error).toContain('absolute path');
  });

  it('a symlink that resolves outside the root is refused (realpath)', () => {
    reg = tmpRegistry({ 'compounds/a.yml': withMolfile('link.mol') });
    const outside = join(tmpdir(), `stereogate-outside-${process.pid}.mol`);
    writeFileSync(outside, 'SECRET\n');
    symlinkSync(outside, join(reg.root, 'compounds/link.mol'));
    const r = loadRegistry(reg.root, { recordDirs: ['compounds'] }).records[0]!;
    expect(r.sources?.main?.text).toBeNull();
    expect(r.sources?.main?.error).toContain('link to a place outside');
  });

  it('a symlinked record file or folder pointing outside is not followed', () => {
    reg = tmpRegistry({ 'compounds/a.yml': GOOD });
    const outDir = join(tmpdir(), `stereogate-outdir-${process.pid}`);
    mkdirSync(outDir, { recursive: true });
    writeFileSync(join(outDir, 'x.yml'), GOOD.replace('LX-00001', 'LX-00099'));
    symlinkSync(join(outDir, 'x.yml'), join(reg.root, 'compounds/x.yml'));
    symlinkSync(outDir, join(reg.root, 'compounds/dir'));
    const { records } = loadRegistry(reg.root, { recordDirs: ['compounds'] });
    expect(records.map((r) => r.file)).toEqual(['compounds/a.yml', 'compounds/x.yml']);
    expect(records[1]!.record).toBeNull();
    expect(records[1]!.problems[0]!.message).toContain('outside the registry');
  });

  it('a missing molfile is a source error naming the path', () => {
    const { records } = load({ 'compounds/a.yml': withMolfile('nope.mol') });
    expect(records[0]!.sources?.main?.error).toContain("'nope.mol' does not exist");
  });
});
