import nock from 'nock';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { API_FILE_CAP, listChangedFiles } from '../../src/github/changed-files.js';
import { parseNameStatus } from '../../src/github/git-diff.js';
import { tempRepo, type TempRepo } from './support/git.js';
import { API, pr, testClient, useNock } from './support/nock.js';

useNock();

const filesPath = '/repos/larkspur/registry/pulls/7/files';

describe('listChangedFiles through the API', () => {
  it('reads every page, 100 per page, keeping status, previous name and patch', async () => {
    const page1 = Array.from({ length: 100 }, (_, i) => ({
      filename: `compounds/LX-${i}.yaml`,
      status: 'added',
      patch: '@@ -0,0 +1 @@\n+id: x',
    }));
    nock(API)
      .get(filesPath)
      .query({ per_page: '100' })
      .reply(200, page1, { link: `<${API}${filesPath}?per_page=100&page=2>; rel="next"` })
      .get(filesPath)
      .query({ per_page: '100', page: '2' })
      .reply(200, [
        { filename: 'compounds/b.yaml', previous_filename: 'compounds/a.yaml', status: 'renamed' },
      ]);
    const { client } = testClient();
    const listed = await listChangedFiles(client, pr, '/nonexistent');
    expect(listed.source).toBe('api');
    expect(listed.files).toHaveLength(101);
    expect(listed.files[0]).toEqual({
      path: 'compounds/LX-0.yaml',
      status: 'added',
      previousPath: null,
      patch: '@@ -0,0 +1 @@\n+id: x',
    });
    expect(listed.files[100]).toEqual({
      path: 'compounds/b.yaml',
      status: 'renamed',
      previousPath: 'compounds/a.yaml',
      patch: null,
    });
  });
});

describe('listChangedFiles past the API cap, or with the API down', () => {
  let repo: TempRepo;
  let base: string;
  let head: string;
  beforeAll(() => {
    repo = tempRepo();
    repo.write({ 'compounds/LX-00001.yaml': 'id: LX-00001\n', 'compounds/LX-00002.yaml': 'id: LX-00002\n' });
    base = repo.commit('base');
    repo.write({
      'compounds/LX-00001.yaml': 'id: LX-00001\nname: changed\n',
      'compounds/LX-00003.yaml': 'id: LX-00003\n',
    });
    repo.remove('compounds/LX-00002.yaml');
    head = repo.commit('head');
  });
  afterAll(() => repo.dispose());

  // GitHub REST docs, "List pull requests files": "Responses include a maximum of 3000 files."
  it('uses git diff when the API stops at 3,000 files', async () => {
    const full = Array.from({ length: 100 }, (_, i) => ({ filename: `f${i}`, status: 'added' }));
    const scope = nock(API);
    for (let page = 1; page <= API_FILE_CAP / 100; page++) {
      const query = page === 1 ? { per_page: '100' } : { per_page: '100', page: String(page) };
      const link: Record<string, string> =
        page < API_FILE_CAP / 100
          ? { link: `<${API}${filesPath}?per_page=100&page=${page + 1}>; rel="next"` }
          : {};
      scope.get(filesPath).query(query).reply(200, full, link);
    }
    const { client } = testClient();
    const listed = await listChangedFiles(
      client,
      { ...pr, baseSha: base, headSha: head, changedFiles: 3500 },
      repo.dir,
    );
    expect(listed.source).toBe('git');
    expect(listed.reason).toMatch(/3000/);
    expect(listed.files.map((f) => [f.path, f.status])).toEqual([
      ['compounds/LX-00001.yaml', 'modified'],
      ['compounds/LX-00002.yaml', 'removed'],
      ['compounds/LX-00003.yaml', 'added'],
    ]);
  });

  it('uses git diff when the API keeps failing', async () => {
    nock(API).get(filesPath).query(true).times(3).reply(500, {});
    const { client } = testClient();
    const listed = await listChangedFiles(client, { ...pr, baseSha: base, headSha: head }, repo.dir);
    expect(listed.source).toBe('git');
    expect(listed.reason).toMatch(/HTTP 500/);
    expect(listed.files).toHaveLength(3);
  });

  it('refuses a commit id that could pass as a git option', async () => {
    nock(API).get(filesPath).query(true).reply(404, {});
    const { client } = testClient();
    await expect(
      listChangedFiles(client, { ...pr, baseSha: '--output=/tmp/x', headSha: head }, repo.dir),
    ).rejects.toThrow(/not a commit id/);
  });
});

describe('parseNameStatus', () => {
  // git-diff(1), --name-status with -z: renames give the score, then the old and the new path.
  it('reads renames and copies with both paths', () => {
    expect(parseNameStatus('R087\0old.yaml\0new.yaml\0M\0x.mol\0')).toEqual([
      { path: 'new.yaml', status: 'renamed', previousPath: 'old.yaml', patch: null },
      { path: 'x.mol', status: 'modified', previousPath: null, patch: null },
    ]);
  });
});
