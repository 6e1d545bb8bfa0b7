import nock from 'nock';
import { describe, expect, it } from 'vitest';
import { CHECKLIST_MARKER, upsertChecklistComment } from '../../src/github/checklist-comment.js';
import { GitHubApiError } from '../../src/github/client.js';
import { API, pr, testClient, useNock } from './support/nock.js';

useNock();

const comments = '/repos/larkspur/registry/issues/7/comments';
const body = `${CHECKLIST_MARKER}\n## stereogate checklist\n- [x] LX-00001`;

describe('upsertChecklistComment', () => {
  it('updates the existing comment found by its marker on a later page, and creates none', async () => {
    const others = Array.from({ length: 100 }, (_, i) => ({
      id: i + 1,
      body: 'looks good',
      user: { login: 'chemist', type: 'User' },
    }));
    nock(API)
      .get(comments)
      .query({ per_page: '100' })
      .reply(200, others, { link: `<${API}${comments}?per_page=100&page=2>; rel="next"` })
      .get(comments)
      .query({ per_page: '100', page: '2' })
      .reply(200, [
        { id: 500, body: `quoting: ${CHECKLIST_MARKER}`, user: { login: 'chemist', type: 'User' } },
        { id: 501, body: `${CHECKLIST_MARKER}\nold`, user: { login: 'github-actions[bot]', type: 'Bot' } },
      ])
      // a person's comment carries the marker: is the token theirs? (an Actions token may not ask)
      .get('/user')
      .reply(403, { message: 'Resource not accessible by integration' })
      .patch('/repos/larkspur/registry/issues/comments/501', { body })
      .reply(200, { id: 501, html_url: 'https://github.test/c/501' });
    const { client } = testClient();
    const done = await upsertChecklistComment(client, pr, body);
    expect(done).toEqual({
      action: 'updated',
      id: 501,
      url: 'https://github.test/c/501',
      removed: 0,
      creates: 0,
    });
  });

  it('creates the comment when none carries the marker', async () => {
    nock(API)
      .get(comments)
      .query(true)
      .reply(200, [{ id: 1, body: 'hello', user: { type: 'User' } }])
      .post(comments, { body })
      .reply(201, { id: 9, html_url: 'https://github.test/c/9' })
      // listed again after creating (an overlapping run may have made one too)
      .get(comments)
      .query(true)
      .reply(200, [
        { id: 1, body: 'hello', user: { type: 'User' } },
        {
          id: 9,
          body,
          html_url: 'https://github.test/c/9',
          user: { login: 'github-actions[bot]', type: 'Bot' },
        },
      ]);
    const { client } = testClient();
    expect((await upsertChecklistComment(client, pr, body)).action).toBe('created');
  });

  it('leaves an identical comment alone', async () => {
    nock(API)
      .get(comments)
      .query(true)
      .reply(200, [{ id: 3, body, user: { type: 'Bot' } }]);
    const { client } = testClient();
    expect((await upsertChecklistComment(client, pr, body)).action).toBe('unchanged');
  });

  it('creates nothing when asked to only update', async () => {
    nock(API).get(comments).query(true).reply(200, []);
    const { client } = testClient();
    expect(await upsertChecklistComment(client, pr, body, { createIfMissing: false })).toEqual({
      action: 'none',
      id: null,
      url: null,
      removed: 0,
      creates: 0,
    });
  });

  it('reports a 403 from a read-only token (pull request from a fork) as an API error, without retrying', async () => {
    nock(API)
      .get(comments)
      .query(true)
      .reply(200, [])
      .post(comments)
      .reply(403, { message: 'Resource not accessible by integration' });
    const { client, waits } = testClient();
    const error = await upsertChecklistComment(client, pr, body).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(GitHubApiError);
    expect((error as GitHubApiError).status).toBe(403);
    expect(waits).toEqual([]);
  });
});
