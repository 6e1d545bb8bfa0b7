/**
 * The pull-request review through the registry's key index (src/audit/review-against-index.ts) gives what the
 * review over every loaded record gives, on the demo registry with records added and changed as a pull request
 * would: a duplicate, a mirror image, an enantiomer with a rotation of the same sign, a duplicate id, an origin
 * naming a registered record. The reference is the review as it was (src/registry/load.ts + auditRecords with
 * the whole registry), run in the same test; the chemistry of the expected findings is in the check's own tests
 * (test/checks/consistent-with-registry.test.ts).
 */
import { afterEach, describe, expect, it } from 'vitest';
import { existsSync, mkdirSync, readFileSync, rmSync, symlinkSync, unlinkSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { loadConfig } from '../../src/audit/config.js';
import { defaultEngine } from '../../src/audit/engine.js';
import { RECORD_BUDGET } from '../../src/audit/run.js';
import { reviewAgainstIndex } from '../../src/audit/review-against-index.js';
import { CHECKS } from '../../src/checks/index.js';
import type { Io } from '../../src/cli/command.js';
import { makeAuditCommand } from '../../src/cli/commands/audit.js';
import { counts, demoCopy, indexReview, loadedReview, seen, type DemoCopy } from './index-review-support.js';

let demo: DemoCopy | null = null;
afterEach(() => {
  demo?.remove();
  demo = null;
});

/** Records a pull request adds (invented, Larkspur scenario); the comments say what the review should find. */
const ADDED: Record<string, string> = {
  // the same stereoisomer and form as LX-00005, (R)-butan-2-ol: already registered
  'compounds/LX-00300.yml':
    'id: LX-00300\nname: (R)-butan-2-ol, second entry\nstructure:\n  smiles: "C[C@@H](O)CC"\n' +
    'stereo:\n  form: single-enantiomer\n',
  // the mirror image of LX-00005 with a rotation of the same sign, measured alike: one of them is wrong
  'compounds/LX-00301.yml':
    'id: LX-00301\nname: (S)-butan-2-ol\nstructure:\n  smiles: "C[C@H](O)CC"\nstereo:\n  form: single-enantiomer\n' +
    '  rotation:\n    value: -13.0\n    wavelength_nm: 589\n    temperature_c: 20\n    solvent: neat\n',
  // the mirror image of the carvone of LX-00010/11 (a registered enantiomer: a note)
  'compounds/LX-00302.yml':
    'id: LX-00302\nstructure:\n  smiles: "CC1=CC[C@H](CC1=O)C(=C)C"\nstereo:\n  form: single-enantiomer\n',
  // an id already used by the meso-tartaric acid record
  'compounds/extra/LX-00003-copy.yml':
    'id: LX-00003\nstructure:\n  smiles: "OCC(O)CO"\nstereo:\n  form: achiral\n',
  // made from a registered record (origin looks LX-00201 up by id)
  'compounds/LX-00304.yml':
    'id: LX-00304\nstructure:\n  smiles: "C[C@@H](O)c1ccc(Br)cc1"\nstereo:\n  form: single-enantiomer\n' +
    'origin:\n  from: [LX-00201]\n  control: chiral-catalyst\n',
};

function addRecords(d: DemoCopy): string[] {
  for (const [path, text] of Object.entries(ADDED)) {
    const abs = join(d.root, path);
    mkdirSync(join(abs, '..'), { recursive: true });
    writeFileSync(abs, text);
  }
  return Object.keys(ADDED);
}

/**
 * Record files of the demo registry with the records added (49 + 5). One of them, LX-00033, names a molfile that
 * cannot be located, so its row is never cached and it is read on every run.
 */
const FILES = 54;

const ids = (text: string) => [...text.matchAll(/"messageId": "([^"]+)"/g)].map((m) => m[1]);

describe('a review through the key index', () => {
  it('finds what the review over every loaded record finds (duplicate, mirror image, rotation sign, duplicate id)', async () => {
    demo = demoCopy(true);
    const paths = addRecords(demo);
    const reference = await loadedReview(demo.root, paths);
    const viaIndex = await indexReview(demo.root, paths, null);
    expect(viaIndex.seen).toBe(reference);
    expect(viaIndex.seen).toContain('identical to LX-00005');
    // not a vacuous comparison: the registry-wide findings are there
    expect(ids(viaIndex.seen)).toEqual(
      expect.arrayContaining([
        'already-registered',
        'enantiomer-rotation-same-sign',
        'enantiomer-registered',
        'duplicate-id',
      ]),
    );
    expect(viaIndex.result.records.map((r) => r.file)).toEqual([
      'compounds/LX-00300.yml',
      'compounds/LX-00301.yml',
      'compounds/LX-00302.yml',
      'compounds/LX-00304.yml',
      'compounds/extra/LX-00003-copy.yml',
    ]);
    expect(viaIndex.seen).toContain('origin-supports-claim');
  });

  it('cache: written cold, used warm, the same findings; a changed record is the only file read again', async () => {
    demo = demoCopy(true);
    const cache = join(demo.root, '..', `${demo.root.split('/').pop()}-index.json`);
    try {
      const paths = addRecords(demo);
      const cold = await indexReview(demo.root, paths, cache);
      expect(counts(cold.log)).toEqual({ cached: 0, read: FILES });
      expect(cold.log[0]).toContain(`cache written to ${cache}`);
      const warm = await indexReview(demo.root, paths, cache);
      expect(counts(warm.log)).toEqual({ cached: FILES - 1, read: 1 });
      expect(warm.seen).toBe(cold.seen);
      // the one file read again is never cached (LX-00033's molfile lies outside the registry): nothing to write
      expect(warm.log[0]).not.toContain('cache written');
      // the pull request changes LX-00005's rotation sign in the working tree (not committed): its blob id
      // differs from HEAD's, so it is read again, and the review sees the new sign
      const lx5 = join(demo.root, 'compounds/LX-00005.yml');
      writeFileSync(lx5, readFileSync(lx5, 'utf8').replace('value: -13.5', 'value: 13.5'));
      const changed = await indexReview(demo.root, paths, cache);
      expect(counts(changed.log)).toEqual({ cached: FILES - 2, read: 2 });
      expect(changed.log[0]).toContain(`cache written to ${cache}`);
      expect(changed.seen).toBe(await loadedReview(demo.root, paths));
      expect(ids(changed.seen)).not.toContain('enantiomer-rotation-same-sign');
    } finally {
      rmSync(cache, { force: true });
    }
  });

  it('a later pull request with another formula: its partners are described then, from a warm cache', async () => {
    demo = demoCopy(true);
    const cache = join(demo.root, 'index-cache.json');
    addRecords(demo);
    const first = await indexReview(demo.root, ['compounds/LX-00300.yml'], cache);
    expect(first.seen).toBe(await loadedReview(demo.root, ['compounds/LX-00300.yml']));
    const described = (log: string[]) => Number(/(\d+) described/.exec(log[0] ?? '')?.[1]);
    const second = await indexReview(demo.root, ['compounds/LX-00302.yml'], cache);
    expect(counts(second.log)).toEqual({ cached: FILES - 1, read: 1 });
    // the carvones (C10H14O) were light rows after the first review; now they are described and cached
    expect(described(second.log)).toBeGreaterThan(0);
    expect(second.seen).toBe(await loadedReview(demo.root, ['compounds/LX-00302.yml']));
    expect(second.seen).toContain('identical to LX-00010');
    const third = await indexReview(demo.root, ['compounds/LX-00302.yml'], cache);
    expect(described(third.log)).toBeLessThan(described(second.log));
    expect(third.seen).toBe(second.seen);
  });

  it('a corrupt, truncated, stale or foreign cache only costs time: same findings, cache rebuilt', async () => {
    demo = demoCopy(true);
    const cache = join(demo.root, 'index-cache.json');
    const paths = addRecords(demo);
    const reference = await loadedReview(demo.root, paths);
    await indexReview(demo.root, paths, cache);
    const good = readFileSync(cache, 'utf8');
    const cases: [string, string, RegExp][] = [
      ['garbage', 'not json at all {', /not start with a valid header/],
      ['truncated', good.slice(0, Math.floor(good.length / 2)), /incomplete/],
      ['cut after a line', good.slice(0, good.indexOf('\n', good.length / 2) + 1), /incomplete/],
      ['other program', '{"entries": []}', /not a stereogate index cache/],
      [
        'other version',
        good.replace(/"version":"[^"]*"/, '"version":"0.0.0-old"'),
        /another stereogate version/,
      ],
      ['other settings', good.replace(/"axisOrthoMin":\d+/, '"axisOrthoMin":2'), /other settings/],
    ];
    for (const [what, text, reason] of cases) {
      writeFileSync(cache, text);
      const run = await indexReview(demo.root, paths, cache);
      expect(run.seen, what).toBe(reference);
      expect(run.log[0], what).toMatch(reason);
      expect(counts(run.log), what).toEqual({ cached: 0, read: FILES });
      expect(readFileSync(cache, 'utf8'), what).toBe(good);
    }
    // one damaged entry: that file alone is read again
    const lines = good.split('\n');
    const at = lines.findIndex((l) => l.startsWith('compounds/LX-00005.yml\t'));
    lines[at] = '[1,2,3]';
    writeFileSync(cache, lines.join('\n'));
    const patched = await indexReview(demo.root, paths, cache);
    expect(counts(patched.log)).toEqual({ cached: FILES - 2, read: 2 });
    expect(patched.seen).toBe(reference);
    // the cache file cannot be written (a folder stands in its way): the review still runs
    rmSync(cache);
    mkdirSync(join(cache, 'x'), { recursive: true });
    const blocked = await indexReview(demo.root, paths, join(cache, 'x'));
    expect(blocked.seen).toBe(reference);
    expect(blocked.log[0]).toMatch(/cache not written/);
  });

  it('removed and renamed files: a removed record drops out of the index, a renamed one keeps its row', async () => {
    demo = demoCopy(true);
    const cache = join(demo.root, 'index-cache.json');
    const paths = addRecords(demo);
    await indexReview(demo.root, paths, cache);
    // LX-00005 removed: LX-00300 is no longer a duplicate; LX-00011 renamed: read from the cache by its blob id
    demo.git('rm', '-q', 'compounds/LX-00005.yml');
    mkdirSync(join(demo.root, 'compounds/renamed'));
    demo.git('mv', 'compounds/LX-00011.yml', 'compounds/renamed/LX-00011.yml');
    const run = await indexReview(demo.root, paths, cache);
    expect(counts(run.log)).toEqual({ cached: FILES - 2, read: 1 });
    expect(run.seen).toBe(await loadedReview(demo.root, paths));
    expect(run.seen).not.toContain('identical to LX-00005');
    expect(run.seen).toContain('renamed/LX-00011.yml');
    const entries = readFileSync(cache, 'utf8');
    expect(entries).not.toContain('\ncompounds/LX-00005.yml\t');
    expect(entries).toContain('\ncompounds/renamed/LX-00011.yml\t');
  });

  it('a molfile changed in the working tree makes its record be read again', async () => {
    demo = demoCopy(true);
    const cache = join(demo.root, 'index-cache.json');
    const paths = addRecords(demo);
    await indexReview(demo.root, paths, cache);
    const mol = join(demo.root, 'compounds/LX-00010.mol');
    writeFileSync(mol, `${readFileSync(mol, 'utf8')}\n`);
    const run = await indexReview(demo.root, paths, cache);
    expect(counts(run.log)).toEqual({ cached: FILES - 2, read: 2 });
    expect(run.seen).toBe(await loadedReview(demo.root, paths));
    // the molfile itself as a changed path selects the record that uses it
    const byMolfile = await indexReview(demo.root, ['compounds/LX-00010.mol'], cache);
    expect(byMolfile.result.records.map((r) => r.file)).toEqual(['compounds/LX-00010.yml']);
    expect(byMolfile.seen).toBe(await loadedReview(demo.root, ['compounds/LX-00010.mol']));
  });

  it('a damaged stored row of a partner: that record is described again, the same findings', async () => {
    demo = demoCopy(true);
    const cache = join(demo.root, 'index-cache.json');
    const paths = addRecords(demo);
    await indexReview(demo.root, paths, cache);
    const clean = await indexReview(demo.root, paths, cache);
    const described = (log: string[]) => Number(/(\d+) described/.exec(log[0] ?? '')?.[1] ?? NaN);
    const lines = readFileSync(cache, 'utf8').split('\n');
    // LX-00005, (R)-butan-2-ol, is a partner of LX-00300: its keys are stored; damage them
    const at = lines.findIndex((l) => l.startsWith('compounds/LX-00005.yml\t'));
    expect(lines[at]).toContain('"constitution"');
    lines[at] = lines[at]!.replace(/\t\[[^\t]*$/, '\t[1,2]');
    writeFileSync(cache, lines.join('\n'));
    const damaged = await indexReview(demo.root, paths, cache);
    expect(described(damaged.log)).toBe(described(clean.log) + 1);
    expect(damaged.seen).toBe(clean.seen);
    expect(damaged.seen).toContain('identical to LX-00005');
    expect(damaged.seen).toBe(await loadedReview(demo.root, paths));
    // written back whole: the next run describes nothing more
    expect(described((await indexReview(demo.root, paths, cache)).log)).toBe(described(clean.log));
  });

  it('a link out of the registry and a hidden folder: refused and skipped as the walk has them, git work tree or not', async () => {
    for (const withGit of [true, false]) {
      demo = demoCopy(withGit);
      const cache = join(demo.root, 'index-cache.json');
      const paths = addRecords(demo);
      const away = join(demo.root, '..', `${demo.root.split('/').pop()}-outside.yml`);
      writeFileSync(away, 'id: LX-00306\nstructure:\n  smiles: "CCO"\nstereo:\n  form: achiral\n');
      symlinkSync(away, join(demo.root, 'compounds/LX-00306.yml'));
      mkdirSync(join(demo.root, 'compounds/.drafts'));
      writeFileSync(join(demo.root, 'compounds/.drafts/LX-00307.yml'), ADDED['compounds/LX-00300.yml']!);
      const under = [...paths, 'compounds/LX-00306.yml'];
      try {
        const run = await indexReview(demo.root, under, cache);
        expect(run.seen).toBe(await loadedReview(demo.root, under));
        expect(run.seen).toContain('outside the registry folder');
        expect(run.seen).not.toContain('LX-00307');
        const warm = await indexReview(demo.root, under, cache);
        expect(warm.seen).toBe(run.seen);
      } finally {
        rmSync(away, { force: true });
        demo.remove();
        demo = null;
      }
    }
  });

  it('a folder that is no git work tree: blob ids hashed from the bytes, the same cache and findings', async () => {
    demo = demoCopy(false);
    const cache = join(demo.root, 'index-cache.json');
    const paths = addRecords(demo);
    const cold = await indexReview(demo.root, paths, cache);
    const warm = await indexReview(demo.root, paths, cache);
    expect(counts(warm.log)).toEqual({ cached: FILES - 1, read: 1 });
    expect(warm.seen).toBe(cold.seen);
    expect(cold.seen).toBe(await loadedReview(demo.root, paths));
    unlinkSync(join(demo.root, 'compounds/LX-00005.yml'));
    const removed = await indexReview(demo.root, paths, cache);
    expect(counts(removed.log)).toEqual({ cached: FILES - 2, read: 1 });
    expect(removed.seen).toBe(await loadedReview(demo.root, paths));
  });

  it('keyed by the worker pool: the same findings as keyed in this thread', async () => {
    demo = demoCopy(true);
    const paths = addRecords(demo);
    const { config } = loadConfig(demo.root);
    const engine = await defaultEngine({ axisOrthoMin: config.axisOrthoMin });
    const log: string[] = [];
    const pooled = await reviewAgainstIndex({
      realRoot: demo.root,
      paths,
      config,
      checks: CHECKS,
      engine,
      defaultEngine: true,
      budget: RECORD_BUDGET,
      indexCache: null,
      log: (l) => log.push(l),
      workers: 2,
    });
    expect(log[0]).toContain('2 workers');
    expect(seen(pooled!)).toBe(await loadedReview(demo.root, paths));
  });

  it('the CLI: --index-cache keeps the cache, says what it did on standard error, prints the same report', async () => {
    demo = demoCopy(true);
    const paths = addRecords(demo);
    const cache = join(demo.root, 'cache', 'index.json');
    const runCli = async () => {
      const out: string[] = [];
      const err: string[] = [];
      const io: Io = {
        out: (t) => out.push(t),
        err: (t) => err.push(t),
        readFile: (p) => readFileSync(p, 'utf8'),
        isFile: () => false,
        readStdin: () => '',
      };
      const code = await makeAuditCommand().run(
        [...paths, '--root', demo!.root, '--index-cache', cache, '--format', 'json', '--fail-on', 'never'],
        io,
      );
      return { code, out: out.join(''), err: err.join('') };
    };
    const cold = await runCli();
    expect(cold.err).toMatch(/0 from the cache; 54 read;.*cache written to/);
    const warm = await runCli();
    expect(warm.err).toMatch(/53 from the cache; 1 read;/);
    expect(warm.out).toBe(cold.out);
    expect(warm.code).toBe(0);
    expect(ids(warm.out)).toContain('enantiomer-rotation-same-sign');
    await expect(
      makeAuditCommand().run([paths[0]!, '--root', demo.root, '--index-cache', ''], {} as Io),
    ).rejects.toThrow(/--index-cache needs a file name/);
  });

  it('paths naming every record: the full audit, not a review', async () => {
    demo = demoCopy(true);
    const run = await indexReview(demo.root, ['compounds'], null);
    expect(run.result.registry?.reason).toContain('every record with each record before it');
  });

  it('a cache path that would read or replace a record, or that is a folder, is not used: same findings, nothing overwritten', async () => {
    demo = demoCopy(true);
    const paths = addRecords(demo);
    const reference = await loadedReview(demo.root, paths);
    const record = join(demo.root, 'compounds/LX-00005.yml');
    const before = readFileSync(record, 'utf8');
    // the action's input reaches the cache code without the CLI's check: the cache code itself refuses
    const onRecord = await indexReview(demo.root, paths, record);
    expect(onRecord.seen).toBe(reference);
    expect(onRecord.log[0]).toMatch(/cache not used: .*inside the record folder compounds/);
    expect(readFileSync(record, 'utf8')).toBe(before);
    const inFolder = await indexReview(demo.root, paths, join(demo.root, 'compounds', 'cache.json'));
    expect(inFolder.seen).toBe(reference);
    expect(existsSync(join(demo.root, 'compounds', 'cache.json'))).toBe(false);
    const folder = join(demo.root, 'a-folder');
    mkdirSync(folder);
    const onFolder = await indexReview(demo.root, paths, folder);
    expect(onFolder.seen).toBe(reference);
    expect(onFolder.log[0]).toMatch(
      /cache not used: .*not a regular file.*cache not written: .*not a regular file/,
    );
  });
});
