/**
 * The record files of a registry from git's listings (src/registry/git-files.ts) are those the walk of the
 * folders finds (src/registry/files.ts findRecordFiles, the reference, run on the same tree in the same test),
 * refused files with the same messages; where git cannot say what the walk would find, the answer is "walk".
 */
import { mkdirSync, mkdtempSync, realpathSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { findRecordFiles, relativeTo } from '../../src/registry/files.js';
import { gitRecordFiles } from '../../src/registry/git-files.js';
import { tempRepo, type TempRepo } from '../github/support/git.js';

let repo: TempRepo | null = null;
const outside: string[] = [];
afterEach(() => {
  repo?.dispose();
  repo = null;
  for (const d of outside.splice(0)) rmSync(d, { recursive: true, force: true });
});

const RECORD = (id: string) => `id: ${id}\nstructure:\n  smiles: "CCO"\nstereo:\n  form: achiral\n`;

/** What the walk finds, as the git listing gives it: paths relative to the root, refused files sorted. */
function walked(root: string, dirs: string[]) {
  const found = findRecordFiles(root, dirs);
  const refused = [...found.refused].sort((a, b) => (a.file < b.file ? -1 : 1));
  return { files: found.files.map((abs) => relativeTo(root, abs)), refused };
}

async function listed(root: string, dirs: string[]) {
  const { found } = await gitRecordFiles(root, dirs);
  return (
    found && { files: found.files, refused: [...found.refused].sort((a, b) => (a.file < b.file ? -1 : 1)) }
  );
}

/** A registry with every kind of file the walk treats its own way, committed, then changed in the work tree. */
function mixedRegistry(): TempRepo {
  repo = tempRepo();
  const r = repo;
  const away = realpathSync(mkdtempSync(join(tmpdir(), 'stereogate-outside-')));
  outside.push(away);
  writeFileSync(join(away, 'LX-09000.yml'), RECORD('LX-09000'));
  r.write({
    'compounds/LX-00001.yml': RECORD('LX-00001'),
    'compounds/LX-00002.yaml': RECORD('LX-00002'),
    'compounds/LX-00003.JSON': '{"id": "LX-00003"}\n',
    'compounds/sub/deeper/LX-00004.yml': RECORD('LX-00004'),
    'compounds/.drafts/LX-00005.yml': RECORD('LX-00005'),
    'compounds/node_modules/LX-00006.yml': RECORD('LX-00006'),
    'compounds/notes.txt': 'not a record\n',
    'compounds/gone.yml': RECORD('LX-00007'),
    'compounds/hidden-later.yml': RECORD('LX-00008'),
    'other/LX-00009.yml': RECORD('LX-00009'),
    '.gitignore': 'compounds/ignored.yml\n',
  });
  symlinkSync('LX-00001.yml', join(r.dir, 'compounds/tracked-link.yml'));
  r.commit('registry');
  // the work tree: untracked, ignored, modified, deleted, assume-unchanged, links inside, out and broken
  writeFileSync(join(r.dir, 'compounds/LX-00010.yml'), RECORD('LX-00010'));
  writeFileSync(join(r.dir, 'compounds/ignored.yml'), RECORD('LX-00011'));
  writeFileSync(join(r.dir, 'compounds/LX-00002.yaml'), `${RECORD('LX-00002')}name: changed\n`);
  rmSync(join(r.dir, 'compounds/gone.yml'));
  r.git('update-index', '--assume-unchanged', 'compounds/hidden-later.yml');
  rmSync(join(r.dir, 'compounds/hidden-later.yml'));
  mkdirSync(join(r.dir, 'compounds/new/.cache'), { recursive: true });
  writeFileSync(join(r.dir, 'compounds/new/.cache/LX-00012.yml'), RECORD('LX-00012'));
  writeFileSync(join(r.dir, 'compounds/new/LX-00013.yaml'), RECORD('LX-00013'));
  symlinkSync(join(away, 'LX-09000.yml'), join(r.dir, 'compounds/out-link.yml'));
  symlinkSync('nowhere.yml', join(r.dir, 'compounds/broken-link.yml'));
  symlinkSync('nowhere', join(r.dir, 'compounds/broken-other'));
  return r;
}

describe("record files from git's listing", () => {
  it('are the files the walk finds: untracked and ignored in, deleted out, hidden folders skipped, links as the walk takes them', async () => {
    const r = mixedRegistry();
    const reference = walked(r.dir, ['compounds']);
    // not a vacuous comparison: each kind is there (or not) as the walk has it
    expect(reference.files).toEqual([
      'compounds/LX-00001.yml',
      'compounds/LX-00002.yaml',
      'compounds/LX-00003.JSON',
      'compounds/LX-00010.yml',
      'compounds/ignored.yml',
      'compounds/new/LX-00013.yaml',
      'compounds/sub/deeper/LX-00004.yml',
      'compounds/tracked-link.yml',
    ]);
    expect(reference.refused).toEqual([
      { file: 'compounds/broken-link.yml', message: 'is a broken link' },
      { file: 'compounds/out-link.yml', message: 'is a link to a place outside the registry folder' },
    ]);
    expect(await listed(r.dir, ['compounds'])).toEqual(reference);
    // two record folders, and the root as one
    expect(await listed(r.dir, ['compounds', 'other'])).toEqual(walked(r.dir, ['compounds', 'other']));
    expect(await listed(r.dir, ['.'])).toEqual(walked(r.dir, ['.']));
    // a registry in a folder of the repository: paths relative to the registry root
    expect(await listed(join(r.dir, 'compounds'), ['sub'])).toEqual(
      walked(join(r.dir, 'compounds'), ['sub']),
    );
  });

  it('say "walk" where git cannot tell: a linked folder, a nested repository, a missing or linked record folder, no work tree', async () => {
    const r = mixedRegistry();
    symlinkSync('sub', join(r.dir, 'compounds/alias'));
    expect(await listed(r.dir, ['compounds'])).toBeNull();
    rmSync(join(r.dir, 'compounds/alias'));
    mkdirSync(join(r.dir, 'compounds/vendored'));
    writeFileSync(join(r.dir, 'compounds/vendored/LX-00020.yml'), RECORD('LX-00020'));
    r.git('-C', 'compounds/vendored', 'init', '-q');
    expect(await listed(r.dir, ['compounds'])).toBeNull();
    rmSync(join(r.dir, 'compounds/vendored'), { recursive: true });
    expect(await listed(r.dir, ['compounds'])).toEqual(walked(r.dir, ['compounds']));
    expect(await listed(r.dir, ['compounds', 'absent'])).toBeNull();
    symlinkSync('compounds', join(r.dir, 'linked'));
    expect(await listed(r.dir, ['linked'])).toBeNull();
    const plain = realpathSync(mkdtempSync(join(tmpdir(), 'stereogate-nogit-')));
    outside.push(plain);
    mkdirSync(join(plain, 'compounds'));
    writeFileSync(join(plain, 'compounds/LX-00001.yml'), RECORD('LX-00001'));
    const none = await gitRecordFiles(plain, ['compounds']);
    expect(none.found).toBeNull();
    expect(none.ids.size).toBe(0);
  });
});
