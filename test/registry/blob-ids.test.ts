/**
 * Blob ids as git computes them (the reference is git itself: `git hash-object`, `git ls-files -s`), and which
 * files git's index may vouch for: clean tracked regular files only.
 */
import { mkdtempSync, readFileSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { BlobIds, blobIdOf, gitBlobIds } from '../../src/registry/blob-ids.js';
import { tempRepo, type TempRepo } from '../github/support/git.js';

let repo: TempRepo | null = null;
afterEach(() => {
  repo?.dispose();
  repo = null;
});

/** A git repository holding `files`, committed. */
function committed(files: Record<string, string>): TempRepo {
  repo = tempRepo();
  repo.write(files);
  repo.commit('registry');
  return repo;
}

describe('blob ids', () => {
  it('equal git hash-object for text, empty and binary content', () => {
    const r = committed({ 'a.yml': 'id: LX-00001\n', 'empty.yml': '' });
    writeFileSync(join(r.dir, 'bin.mol'), Buffer.from([0, 1, 2, 255]));
    for (const f of ['a.yml', 'empty.yml', 'bin.mol']) {
      expect(blobIdOf(readFileSync(join(r.dir, f))), f).toBe(r.git('hash-object', f).trim());
    }
  });

  it("come from git's index for clean tracked files only; modified, untracked, links and assume-unchanged are hashed", async () => {
    repo = tempRepo();
    const r = repo;
    r.write({
      'compounds/a.yml': 'id: LX-00001\n',
      'compounds/b.yml': 'id: LX-00002\n',
      'compounds/c.yml': 'id: LX-00003\n',
      'other/d.yml': 'id: LX-00004\n',
    });
    symlinkSync('a.yml', join(r.dir, 'compounds/link.yml'));
    r.commit('registry');
    writeFileSync(join(r.dir, 'compounds/b.yml'), 'id: LX-00002\nname: changed\n');
    r.git('update-index', '--assume-unchanged', 'compounds/c.yml');
    writeFileSync(join(r.dir, 'compounds/c.yml'), 'id: LX-00003\nname: changed too\n');
    writeFileSync(join(r.dir, 'compounds/new.yml'), 'id: LX-00005\n');
    const known = await gitBlobIds(r.dir, ['compounds']);
    expect([...known.keys()]).toEqual(['compounds/a.yml']);
    expect(known.get('compounds/a.yml')).toBe(r.git('rev-parse', 'HEAD:compounds/a.yml').trim());
    const ids = new BlobIds(known, (rel) => join(r.dir, rel));
    for (const f of ['compounds/b.yml', 'compounds/c.yml', 'compounds/new.yml']) {
      expect(ids.of(f), f).toBe(r.git('hash-object', f).trim());
    }
    // the link's blob in git is its target path; the index wants the content it leads to
    expect(ids.of('compounds/link.yml')).toBe(ids.of('compounds/a.yml'));
    expect(ids.of('compounds/missing.yml')).toBeNull();
    expect(ids.hashedCount).toBe(5);
  });

  it('a folder in a subfolder of the work tree: paths relative to that folder', async () => {
    const r = committed({ 'registry/compounds/a.yml': 'id: LX-00001\n' });
    const known = await gitBlobIds(join(r.dir, 'registry'), ['compounds']);
    expect([...known.keys()]).toEqual(['compounds/a.yml']);
  });

  it('outside a git work tree: nothing from git, never an exception', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'stereogate-nogit-'));
    try {
      expect((await gitBlobIds(dir, ['compounds'])).size).toBe(0);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
