/**
 * The bulk audit from the command line: usage errors, exit codes by --fail-on, every output written, the summary
 * table with the mapped and the not-understood form words, the --mapping file, and `stereogate merge` through
 * the CLI entry. The structures are textbook molecules (from memory: (R)/(S)-butan-2-ol, meso-tartaric acid,
 * L-alanine); the Larkspur Chemistry Lab claims attached to them are invented for the test.
 *
 * The `audit` command does not yet hand bulk inputs over to `bulkAudit` (src/cli/commands/audit.ts), so the bulk
 * audit itself is driven through `bulkAudit` and the merge through `run(['merge', …])`.
 */
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { bulkAudit } from '../../src/cli/commands/bulk-audit.js';
import { UsageError } from '../../src/cli/command.js';
import { run } from '../../src/cli/main.js';
import { memoryIo } from '../cli/io.js';

const dir = mkdtempSync(join(tmpdir(), 'stereogate-bulk-cli-'));
const csv = join(dir, 'larkspur.csv');
writeFileSync(
  csv,
  [
    'REG_NO,SMILES,STEREO',
    'LX-00001,C[C@H](O)CC,RAC', // a defined centre drawn for a racemate: recorded as drawn, form says both
    'LX-00002,OC(=O)[C@@H](O)[C@@H](O)C(=O)O,racemic', // meso-tartaric acid: achiral, cannot be a racemate
    'LX-00003,CCO,achiral',
    'LX-00004,C[C@H](N)C(=O)O,enantiopure', // L-alanine
    'LX-00005,CC(O)CC,chiral-ish', // a word no one can map
    'LX-00006,CC(O)CC,mystery', // another
  ].join('\n') + '\n',
);
const clean = join(dir, 'clean.csv');
writeFileSync(
  clean,
  'id,smiles,stereo_form\nLX-00010,CCO,achiral\nLX-00011,C[C@H](N)C(=O)O,single-enantiomer\n',
);
const base = [
  '--map-id',
  'REG_NO',
  '--map-structure',
  'SMILES',
  '--map-form',
  'STEREO',
  '--progress',
  'none',
  '--workers',
  '0',
];

async function usageMessage(args: string[]): Promise<string> {
  const e = await bulkAudit(args, memoryIo()).then(
    () => null,
    (err: unknown) => err,
  );
  expect(e).toBeInstanceOf(UsageError);
  return (e as Error).message;
}

describe('bulk audit command line: usage errors', () => {
  it.each([
    [['--shard', '5/4'], /--shard expects I\/N/],
    [['--shard', '0/4'], /--shard expects I\/N/],
    [['--shard', 'half'], /--shard expects I\/N/],
    [['--form-word', 'rac'], /--form-word expects WORD=FORM/],
    [['--form-word', 'enant.=enantiomeric'], /'enant\.' maps to 'enantiomeric', which is not one of/],
    [['--fail-on', 'sometimes'], /--fail-on must be error, warning or never/],
    [['--workers', 'many'], /--workers expects a whole number/],
    [['--record-timeout', '0'], /--record-timeout expects a positive number/],
    [['--progress', 'loud'], /--progress must be/],
    [['--no-such-option'], /no-such-option/],
    // --format is the record audit's; a bulk audit given it would print its table and ignore it
    [['--format', 'json'], /--format is for record files; .*--jsonl, --json, --csv, --sarif or --html FILE/],
  ])('%j is a usage error', async (extra, message) => {
    expect(await usageMessage([csv, ...base, ...extra])).toMatch(message);
  });

  it('a missing input file, no input at all, a config file that is not there', async () => {
    expect(await usageMessage([join(dir, 'nope.sdf'), ...base])).toMatch(/bulk input .*nope\.sdf not found/);
    expect(await usageMessage([...base])).toMatch(/no bulk input given/);
    expect(await usageMessage([csv, ...base, '--config', join(dir, 'absent.yml')])).toMatch(/absent\.yml/);
  });

  it('a bad --mapping file names the file and the key', async () => {
    const bad = join(dir, 'bad-mapping.yml');
    writeFileSync(bad, 'id: REG_NO\nform: [STEREO]\n');
    expect(await usageMessage([csv, '--mapping', bad])).toMatch(
      /bad-mapping\.yml: 'form' must be a field name/,
    );
    const badWord = join(dir, 'bad-word.yml');
    writeFileSync(badWord, 'vocabulary:\n  enant.: enantiomeric\n');
    expect(await usageMessage([csv, '--mapping', badWord])).toMatch(/'enant\.' maps to 'enantiomeric'/);
    const notYaml = join(dir, 'not-yaml.yml');
    writeFileSync(notYaml, 'id: [unclosed\n');
    expect(await usageMessage([csv, '--mapping', notYaml])).toMatch(/not-yaml\.yml/);
    const unknownKey = join(dir, 'unknown-key.yml');
    writeFileSync(unknownKey, 'identifier: REG_NO\n');
    expect(await usageMessage([csv, '--mapping', unknownKey])).toMatch(
      /unknown-key\.yml: unknown key 'identifier'/,
    );
  });

  it('through the CLI entry a usage error exits 2 with the message and the usage', async () => {
    const io = memoryIo();
    expect(await run(['merge', join(dir, 'absent.jsonl')], io)).toBe(2);
    expect(io.stderr.join('\n')).toMatch(/stereogate merge: shard output .*absent\.jsonl not found/);
    expect(io.stderr.join('\n')).toContain('stereogate merge <shard.jsonl>');
  });
});

describe('bulk audit command line: exit codes, outputs, summary', () => {
  it('exit codes follow --fail-on (error by default, warning, never)', async () => {
    expect(await bulkAudit([csv, ...base], memoryIo())).toBe(1);
    expect(await bulkAudit([csv, ...base, '--fail-on', 'never'], memoryIo())).toBe(0);
    expect(await bulkAudit([clean, '--progress', 'none', '--workers', '0'], memoryIo())).toBe(0);
    // the same findings demoted to warnings through the config: pass at --fail-on error, fail at warning
    const config = join(dir, 'warn.yml');
    writeFileSync(config, 'severities:\n  form-matches-structure: warning\n  record-schema: warning\n');
    const demoted = join(dir, 'demoted.csv');
    writeFileSync(demoted, 'id,smiles,stereo_form\nLX-00020,OC(=O)[C@@H](O)[C@@H](O)C(=O)O,racemate\n');
    const args = [demoted, '--progress', 'none', '--workers', '0', '--config', config];
    const io = memoryIo();
    expect(await bulkAudit(args, io)).toBe(0);
    expect(io.stdout.join('\n')).toMatch(/0 errors, [1-9]\d* warnings?/);
    expect(await bulkAudit([...args, '--fail-on', 'warning'], memoryIo())).toBe(1);
  });

  it('writes every output and prints the summary table with mapped and not-understood words', async () => {
    const out = (ext: string) => join(dir, `all.${ext}`);
    const io = memoryIo();
    const code = await bulkAudit(
      [
        csv,
        ...base,
        '--jsonl',
        out('jsonl'),
        '--json',
        out('json'),
        '--csv',
        out('out.csv'),
        '--sarif',
        out('sarif'),
        '--html',
        out('html'),
      ],
      io,
    );
    expect(code).toBe(1);
    const jsonl = readFileSync(out('jsonl'), 'utf8')
      .trim()
      .split('\n')
      .map((l) => JSON.parse(l));
    expect(jsonl.filter((l) => l.kind === 'record').map((l) => l.id)).toEqual([
      'LX-00001',
      'LX-00002',
      'LX-00003',
      'LX-00004',
      'LX-00005',
      'LX-00006',
    ]);
    // bulk outputs carry the facts without the views of `units` and without per-component SMILES
    const meso = jsonl.find((l) => l.id === 'LX-00002');
    expect(meso.computed.units).toHaveLength(2);
    expect(meso.computed.meso).toBe(true);
    expect(meso.computed.stereocenters).toBeUndefined();
    expect(meso.computed.components[0]).toEqual({
      index: 0,
      formula: 'C4H6O6',
      heavyAtoms: 10,
      role: 'parent',
    });
    const json = JSON.parse(readFileSync(out('json'), 'utf8'));
    expect(json.records).toHaveLength(6);
    expect(json.summary).toEqual(jsonl.at(-1).summary);
    const csvOut = readFileSync(out('out.csv'), 'utf8').trim().split('\n');
    expect(csvOut).toHaveLength(7); // header + 6 rows
    expect(csvOut[2]).toContain('"LX-00002"');
    expect(csvOut[2]).toContain('form-matches-structure');
    // SARIF 2.1.0 (OASIS SARIF 2.1.0, section 3.13: a log has version and runs)
    const sarif = JSON.parse(readFileSync(out('sarif'), 'utf8'));
    expect(sarif.version).toBe('2.1.0');
    expect(sarif.runs[0].results.length).toBe(
      json.summary.errors + json.summary.warnings + json.summary.notes,
    );
    const html = readFileSync(out('html'), 'utf8');
    expect(html).toContain('LX-00002');
    expect(io.stderr.join('\n')).toMatch(/HTML report written to .*all\.html/);

    const table = io.stdout.join('\n');
    expect(table).toMatch(/stereogate bulk audit: 6 records/);
    expect(table).toMatch(/form-matches-structure\s+[1-9]/);
    expect(table).toMatch(/legacy form words mapped:\n(.*\n)*\s+"RAC" -> racemate \(1\)/);
    expect(table).toMatch(/"enantiopure" -> single-enantiomer \(1\)/);
    expect(table).toMatch(/form words NOT understood.*\n\s+"chiral-ish" \(1\)\n\s+"mystery" \(1\)/);
    expect(table).toMatch(/^Computed result: .*responsible chemist/m);
  });

  it('--form-word and a --mapping file map legacy words; the command line wins over the file', async () => {
    const mapping = join(dir, 'mapping.yml');
    writeFileSync(
      mapping,
      'id: REG_NO\nstructure: SMILES\nform: STEREO\nvocabulary:\n  chiral-ish: single-enantiomer\n  mystery: racemate\n',
    );
    const io = memoryIo();
    await bulkAudit(
      [csv, '--mapping', mapping, '--form-word', 'mystery=unknown', '--progress', 'none', '--workers', '0'],
      io,
    );
    const table = io.stdout.join('\n');
    expect(table).toMatch(/"chiral-ish" -> single-enantiomer \(1\)/);
    expect(table).toMatch(/"mystery" -> unknown \(1\)/);
    expect(table).not.toMatch(/NOT understood/);
  });
});

describe('stereogate merge through the CLI entry', () => {
  it('merges shard outputs into the single-run output, exit code by --fail-on; refuses an incomplete set', async () => {
    const single = join(dir, 'single.jsonl');
    const outs = (stem: string) =>
      ['json', 'csv', 'sarif', 'html'].flatMap((k) => [`--${k}`, join(dir, `${stem}.${k}`)]);
    await bulkAudit([csv, ...base, '--jsonl', single, ...outs('single')], memoryIo());
    const shards = [1, 2].map((i) => join(dir, `shard-${i}.jsonl`));
    for (const [i, p] of shards.entries()) {
      const io = memoryIo();
      await bulkAudit([csv, ...base, '--shard', `${i + 1}/2`, '--jsonl', p], io);
      expect(io.stdout.join('\n')).toMatch(new RegExp(`3 records.*shard ${i + 1}/2`));
    }
    const merged = join(dir, 'merged.jsonl');
    const io = memoryIo();
    expect(await run(['merge', shards[1], shards[0], '--jsonl', merged, ...outs('merged')], io)).toBe(1);
    expect(readFileSync(merged, 'utf8')).toBe(readFileSync(single, 'utf8'));
    // every other output of the merge is byte for byte that of the single run
    for (const k of ['json', 'csv', 'sarif', 'html']) {
      expect(readFileSync(join(dir, `merged.${k}`), 'utf8'), k).toBe(
        readFileSync(join(dir, `single.${k}`), 'utf8'),
      );
    }
    expect(io.stdout.join('\n')).toMatch(/stereogate bulk audit: 6 records/);
    expect(await run(['merge', ...shards, '--fail-on', 'never'], memoryIo())).toBe(0);
    const partial = memoryIo();
    expect(await run(['merge', shards[0]], partial)).toBe(2);
    expect(partial.stderr.join('\n')).toMatch(/shard 2\/2 missing/);
    const garbage = join(dir, 'garbage.jsonl');
    writeFileSync(garbage, 'not json\n');
    const bad = memoryIo();
    expect(await run(['merge', garbage], bad)).toBe(2);
    expect(bad.stderr.join('\n')).toMatch(/garbage\.jsonl:1: not a JSON line/);
  });
});
