import nock from 'nock';
import { describe, expect, it } from 'vitest';
import { INLINE_MARKER, postInlineComments } from '../../src/github/inline-comments.js';
import { API, pr, testClient, useNock } from './support/nock.js';

useNock();

const path = '/repos/larkspur/registry/pulls/7/comments';
const M = INLINE_MARKER;
const a = { path: 'compounds/LX-00001.yaml', line: 6, body: `form is wrong\n${M}` };
const b = { path: 'compounds/LX-00002.yaml', line: 40, body: `ratio is wrong\n${M}` };
const c = { path: 'compounds/LX-00003.yaml', line: 5, body: `descriptors are wrong\n${M}` };
const bot = { login: 'github-actions[bot]', type: 'Bot' };

describe('postInlineComments', () => {
  it('posts on the right side of the head commit; a 422 (line outside the diff) is kept, the rest still posted', async () => {
    nock(API)
      .get(path)
      .query(true)
      .reply(200, [])
      .post(path, { body: a.body, commit_id: pr.headSha, path: a.path, line: 6, side: 'RIGHT' })
      .reply(201, { id: 1 })
      .post(path, (req: { path: string }) => req.path === b.path)
      .reply(422, { message: 'Validation Failed', errors: [{ message: 'line must be part of the diff' }] })
      .post(path, (req: { path: string }) => req.path === c.path)
      .reply(201, { id: 3 })
      .get(path)
      .query(true)
      .reply(200, [
        { id: 1, ...a, user: bot },
        { id: 3, ...c, user: bot },
      ]);
    const { client } = testClient();
    const done = await postInlineComments(client, pr, [a, b, c]);
    expect(done.posted).toEqual([a, c]);
    expect(done.rejected.map((r) => r.comment)).toEqual([b]);
    expect(done.rejected[0]!.message).toContain('Validation Failed');
  });

  it('skips comments already posted with the same path, line and body on an earlier run', async () => {
    nock(API)
      .get(path)
      .query(true)
      .reply(200, [
        { id: 1, path: a.path, line: 6, body: a.body, user: bot },
        { id: 2, path: b.path, line: null, original_line: 40, body: b.body, user: bot }, // outdated: no longer on a line
      ])
      .post(path, (req: { path: string }) => req.path === b.path)
      .reply(201, { id: 3 })
      .get(path)
      .query(true)
      .reply(200, []);
    const { client } = testClient();
    const done = await postInlineComments(client, pr, [a, b]);
    expect(done.alreadyThere).toEqual([a]);
    expect(done.posted).toEqual([b]);
  });

  it('stops at the first 403 and marks the rest as not allowed', async () => {
    nock(API)
      .get(path)
      .query(true)
      .reply(200, [])
      .post(path)
      .reply(403, { message: 'Resource not accessible by integration' });
    const { client } = testClient();
    const done = await postInlineComments(client, pr, [a, b]);
    expect(done.posted).toEqual([]);
    expect(done.notAllowed).toEqual([a, b]);
  });

  it('calls nothing when there is nothing to post', async () => {
    const { client } = testClient();
    expect((await postInlineComments(client, pr, [])).posted).toEqual([]);
  });
});
