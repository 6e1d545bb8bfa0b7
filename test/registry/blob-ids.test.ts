/**
 * Blob ids as git computes them (the reference is git itself: `git hash-object`, `git ls-files -s`), and which
 * files git's index may vouch for: clean tracked regular files only.
 */
import { execFileSync } from 'node:child_process';
import { symlinkSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { BlobIds, blobIdOf, gitBlobIds } from '../../src/registry/blob-ids.js';
import { tmpRegistry, type TmpRegistry } from './tmp-registry.js';

let reg: TmpRegistry | null = null;
afterEach(() => {
  reg?.remove();
  reg = null;
});

const git = (cwd: string, ...args: string[]) =>
  execFileSync(
    'git',
    [
      '-c',
      'user.name=Larkspur CI',
      '-c',
      'user.email=ci@larkspur.invalid',
      '-c',
      'commit.gpgsign=false',
      ...args,
    ],
    { cwd, encoding: 'utf8' },
  ).trim();

describe('blob ids', () => {
  it('equal git hash-object for text, empty and binary content', () => {
    reg = tmpRegistry({ 'a.yml': 'id: LX-00001\n', 'empty.yml': '', 'bin.mol': Buffer.from([0, 1, 2, 255]) });
    for (const f of ['a.yml', 'empty.yml', 'bin.mol']) {
      const bytes = execFileSync('cat', [join(reg.root, f)]);
      expect(blobIdOf(bytes), f).toBe(git(reg.root, 'hash-object', f));
    }
  });

  it("come from git's index for clean tracked files only; modified, untracked, links and assume-unchanged are hashed", async () => {
    reg = tmpRegistry({
      'compounds/a.yml': 'id: LX-00001\n',
      'compounds/b.yml': 'id: LX-00002\n',
      'compounds/c.yml': 'id: LX-00003\n',
      'other/d.yml': 'id: LX-00004\n',
    });
    symlinkSync('a.yml', join(reg.root, 'compounds/link.yml'));
    git(reg.root, 'init', '-q');
    git(reg.root, 'add', '-A');
    git(reg.root, 'commit', '-qm', 'registry');
    writeFileSync(join(reg.root, 'compounds/b.yml'), 'id: LX-00002\nname: changed\n');
    git(reg.root, 'update-index', '--assume-unchanged', 'compounds/c.yml');
    writeFileSync(join(reg.root, 'compounds/c.yml'), 'id: LX-00003\nname: changed too\n');
    writeFileSync(join(reg.root, 'compounds/new.yml'), 'id: LX-00005\n');
    const known = await gitBlobIds(reg.root, ['compounds']);
    expect([...known.keys()]).toEqual(['compounds/a.yml']);
    expect(known.get('compounds/a.yml')).toBe(git(reg.root, 'rev-parse', 'HEAD:compounds/a.yml'));
    const ids = new BlobIds(known, (rel) => join(reg!.root, rel));
    for (const f of ['compounds/b.yml', 'compounds/c.yml', 'compounds/new.yml']) {
      expect(ids.of(f), f).toBe(git(reg.root, 'hash-object', f));
    }
    // the link's blob in git is its target path; the index wants the content it leads to
    expect(ids.of('compounds/link.yml')).toBe(ids.of('compounds/a.yml'));
    expect(ids.of('compounds/missing.yml')).toBeNull();
    expect(ids.hashedCount).toBe(5);
  });

  it('a folder in a subfolder of the work tree: paths relative to that folder', async () => {
    reg = tmpRegistry({ 'registry/compounds/a.yml': 'id: LX-00001\n' });
    git(reg.root, 'init', '-q');
    git(reg.root, 'add', '-A');
    git(reg.root, 'commit', '-qm', 'registry');
    const known = await gitBlobIds(join(reg.root, 'registry'), ['compounds']);
    expect([...known.keys()]).toEqual(['compounds/a.yml']);
  });

  it('outside a git work tree: nothing from git, never an exception', async () => {
    reg = tmpRegistry({ 'compounds/a.yml': 'id: LX-00001\n' });
    expect((await gitBlobIds(reg.root, ['compounds'])).size).toBe(0);
  });
});
